/**
 * The `strainwise` command line. Thin: parse arguments, call the library,
 * print. Exit status: 0 success, 1 the work ran but failed, 2 bad input or
 * usage (one line on stderr, nothing on stdout).
 * @module
 */
import { extname } from 'node:path';
import { parseArgs, type ParseArgsConfig } from 'node:util';
import { structureFormatFor } from '../io/structure-format.js';
import { checkGradientCommand, energyCommand, type CommandOutput } from './commands.js';
import { InputError, UsageError } from './errors.js';
import { loadInput, type LoadedInput } from './io.js';
import { parametrizeCommand } from './parametrize.js';
import { METHODS, minimizeCommand, writerFor } from './minimize.js';
import { animationChoice, modesCommand } from './modes.js';

const VERSION = '0.1.0';

const HELP = `strainwise ${VERSION}: bonded molecular-mechanics energies and exact gradients

usage:
  strainwise energy FILE [--json]          energy per kind, forces, most strained terms
  strainwise check-gradient FILE [--json]  analytic gradient against numerical derivatives
  strainwise minimize FILE -o OUT [--method lbfgs|cg|sd|fire] [--max-force X]
             [--max-iterations N] [--trajectory T.xyz --every K] [--json]
                                           relax the structure; OUT is .json (model), .pdb, .xyz, .sdf or .mol
  strainwise parametrize FILE -o OUT.json [--json]
                                           perceive a structure file's topology, assign generic parameters
  strainwise modes FILE [--temperature T] [--max-force X] [--animate K|all -o OUT.xyz] [--json]
                                           normal modes, wavenumbers (cm⁻¹), harmonic thermochemistry
  strainwise --help | --version

FILE is a model file (format "strainwise-model", version 1; see docs/model-file.md) or a
structure file (.pdb, .xyz, .sdf, .mol), which gets generic parameters first: those are for
clean-up and rough geometry, not quantitative energies.
--json prints one JSON document on stdout; messages go to stderr.
exit status: 0 success, 1 ran but failed (a wrong gradient, no convergence), 2 bad input or usage.
--max-force is in the model's units (default 0.01 kcal/mol/Å, converted); for modes it is the
stationary-point threshold (a warning on stderr above it). --temperature is in K (default 298.15).
`;

type Command = (args: readonly string[]) => CommandOutput;

/** A command that reads one model file and takes only `--json`. */
/** Say on stderr what a structure-file input became (generic parameters, which structure of several). */
function noteInput(file: string, input: LoadedInput): void {
  const s = input.structure;
  if (s === undefined) return;
  if (s.count > 1) process.stderr.write(`strainwise: ${file}: holds ${s.count} structures; the first is used\n`);
  for (const note of s.structure.notes) process.stderr.write(`strainwise: ${file}: ${note}\n`);
  process.stderr.write(
    `strainwise: ${file}: ${s.generated.perceivedBonds ? 'bonds perceived from coordinates; ' : ''}generic parameters assigned (for clean-up and rough geometry, not quantitative energies)\n`,
  );
}

function modelCommand(name: string, run: (model: LoadedInput['model'], json: boolean) => CommandOutput): Command {
  return (args) => {
    const { values, positionals } = parse(args, { json: { type: 'boolean' } });
    if (positionals.length !== 1) {
      throw new UsageError(`${name} needs exactly one FILE, got ${positionals.length === 0 ? 'none' : positionals.length}`);
    }
    const input = loadInput(positionals[0]);
    noteInput(positionals[0], input);
    return run(input.model, values.json === true);
  };
}

/** A number option's value: `positive` a finite number > 0, `count` a whole number ≥ 0; undefined when not given. */
function numberOption(name: string, text: string | undefined, kind: 'positive' | 'count'): number | undefined {
  if (text === undefined) return undefined;
  const value = Number(text);
  const good = text.trim() !== '' && Number.isFinite(value) && (kind === 'positive' ? value > 0 : Number.isInteger(value) && value >= 0);
  if (!good) {
    throw new UsageError(`${name}: expected ${kind === 'positive' ? 'a number > 0' : 'a whole number ≥ 0'}, got "${text}"`);
  }
  return value;
}

const minimize: Command = (args) => {
  const { values, positionals } = parse(args, {
    json: { type: 'boolean' },
    output: { type: 'string', short: 'o' },
    method: { type: 'string' },
    'max-force': { type: 'string' },
    'max-iterations': { type: 'string' },
    trajectory: { type: 'string' },
    every: { type: 'string' },
  });
  if (positionals.length !== 1) {
    throw new UsageError(`minimize needs exactly one FILE, got ${positionals.length === 0 ? 'none' : positionals.length}`);
  }
  const output = values.output as string | undefined;
  if (output === undefined) throw new UsageError('minimize needs -o OUT (the file to write)');
  writerFor(output);
  const method = (values.method as string | undefined) ?? 'lbfgs';
  if (!(METHODS as readonly string[]).includes(method)) {
    throw new UsageError(`--method: unknown method "${method}" (known: ${METHODS.join(', ')})`);
  }
  const every = numberOption('--every', values.every as string | undefined, 'count') ?? 1;
  if (every < 1) throw new UsageError('--every: expected a whole number ≥ 1, got "0"');
  const input = loadInput(positionals[0]);
  noteInput(positionals[0], input);
  return minimizeCommand(
    input,
    {
      file: positionals[0],
      output,
      method: method as (typeof METHODS)[number],
      maxForce: numberOption('--max-force', values['max-force'] as string | undefined, 'positive'),
      maxIterations: numberOption('--max-iterations', values['max-iterations'] as string | undefined, 'count') ?? 10000,
      json: values.json === true,
      trajectory: values.trajectory as string | undefined,
      every,
    },
    process.stderr,
  );
};

const modes: Command = (args) => {
  const { values, positionals } = parse(args, {
    json: { type: 'boolean' },
    temperature: { type: 'string' },
    'max-force': { type: 'string' },
    animate: { type: 'string' },
    output: { type: 'string', short: 'o' },
  });
  if (positionals.length !== 1) {
    throw new UsageError(`modes needs exactly one FILE, got ${positionals.length === 0 ? 'none' : positionals.length}`);
  }
  const output = values.output as string | undefined;
  const animate = animationChoice(values.animate as string | undefined, output);
  const temperature = numberOption('--temperature', values.temperature as string | undefined, 'positive');
  const maxForce = numberOption('--max-force', values['max-force'] as string | undefined, 'positive');
  const input = loadInput(positionals[0]);
  noteInput(positionals[0], input);
  const model = input.model;
  return modesCommand(
    model,
    { file: positionals[0], json: values.json === true, temperature, maxForce, animate, output },
    (line) => process.stderr.write(line + '\n'),
  );
};

const COMMANDS: Record<string, Command> = {
  energy: modelCommand('energy', energyCommand),
  'check-gradient': modelCommand('check-gradient', checkGradientCommand),
  minimize,
  modes,
  parametrize: (args) => {
    const { values, positionals } = parse(args, { json: { type: 'boolean' }, output: { type: 'string', short: 'o' } });
    if (positionals.length !== 1) {
      throw new UsageError(`parametrize needs exactly one FILE, got ${positionals.length === 0 ? 'none' : positionals.length}`);
    }
    const output = values.output as string | undefined;
    if (output === undefined) throw new UsageError('parametrize needs -o OUT.json (the model file to write)');
    if (extname(output).toLowerCase() !== '.json') throw new UsageError(`-o ${output}: parametrize writes a model file (.json)`);
    if (structureFormatFor(positionals[0]) === undefined) {
      throw new UsageError(`parametrize reads a structure file (.pdb, .xyz, .sdf, .mol), got "${positionals[0]}"`);
    }
    const input = loadInput(positionals[0]);
    noteInput(positionals[0], input);
    return parametrizeCommand(input, { file: positionals[0], output, json: values.json === true });
  },
};

function parse<const O extends NonNullable<ParseArgsConfig['options']>>(args: readonly string[], options: O) {
  try {
    return parseArgs({ args: [...args], options, allowPositionals: true, strict: true });
  } catch (e) {
    // node's messages look like "Unknown option '--jsn'. To specify a positional ..."; keep the first sentence.
    const message = (e as Error).message.split(/\.\s/)[0].replace(/\.$/, '');
    throw new UsageError(message.charAt(0).toLowerCase() + message.slice(1));
  }
}

/** Run the command line on `argv` (without node and script); returns the exit status. */
export function run(argv: readonly string[], out = process.stdout, err = process.stderr): number {
  try {
    const [name, ...rest] = argv;
    if (name === undefined || name === '--help' || name === '-h' || name === 'help') {
      if (name === undefined) {
        err.write(HELP);
        return 2;
      }
      out.write(HELP);
      return 0;
    }
    if (name === '--version') {
      out.write(`${VERSION}\n`);
      return 0;
    }
    const command = COMMANDS[name];
    if (command === undefined) {
      throw new UsageError(`unknown command "${name}" (commands: ${Object.keys(COMMANDS).join(', ')}; see --help)`);
    }
    if (rest.includes('--help') || rest.includes('-h')) {
      out.write(HELP);
      return 0;
    }
    const result = command(rest);
    out.write(result.stdout);
    return result.status;
  } catch (e) {
    if (e instanceof InputError) {
      err.write(`strainwise: ${e.file}: ${oneLine(e.message)}\n`);
      return 2;
    }
    if (e instanceof UsageError) {
      err.write(`strainwise: ${oneLine(e.message)}\n`);
      return 2;
    }
    err.write(`strainwise: internal error: ${oneLine(e instanceof Error ? e.message : String(e))} (please report this)\n`);
    return 2;
  }
}

function oneLine(s: string): string {
  return s.replace(/\s*\n\s*/g, ' ');
}
