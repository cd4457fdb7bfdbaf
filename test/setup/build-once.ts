/**
 * The command-line tests run the built `dist/cli.js` as a user would. Build
 * it once before the tests when it is missing (CI builds first anyway).
 */
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';

export default function setup(): void {
  if (!existsSync('dist/cli.js')) {
    execFileSync('npm', ['run', 'build'], { stdio: 'inherit' });
  }
}
