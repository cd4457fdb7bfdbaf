#!/usr/bin/env node
/**
 * Entry point of the `strainwise` command (built to `dist/cli.js`).
 * @module
 */
import { run } from './run.js';

process.exitCode = run(process.argv.slice(2));
