/**
 * `strainwise minimize FILE -o OUT`: relax a model and write the result.
 * @module
 */
import { extname } from 'node:path';
import { ModelError } from '../errors.js';
import { writeFileWhole } from '../io/write-file.js';
import { structureFormatFor } from '../io/structure-format.js';
import { xyzFrame } from '../io/xyz.js';
import type { Model } from '../model/model.js';
import { structureOfModel } from '../params/from-structure.js';
import { relaxModel, type RelaxResult } from '../model/relax.js';
import type { MinimizeOptions } from '../optimize/minimize.js';
import { defaultMaxForce } from '../units.js';
import type { CommandOutput } from './commands.js';
import { InputError, UsageError } from './errors.js';
import type { LoadedInput } from './io.js';
import { num, table, unitLabels } from './format.js';

/** The methods `--method` accepts. */
export const METHODS = ['lbfgs', 'cg', 'sd', 'fire'] as const;

/** Writes the result: the model (or the structure read) with coordinates x. */
type Writer = (input: LoadedInput, x: Float64Array) => string;

const MODEL_WRITER: Writer = (input, x) => JSON.stringify(input.model.toJSON(x), null, 2) + '\n';
const KNOWN = '.json, .pdb, .xyz, .sdf, .mol';

/** Parsed options of the command. */
export interface MinimizeArguments {
  readonly file: string;
  readonly output: string;
  readonly method: (typeof METHODS)[number];
  readonly maxForce?: number;
  readonly maxIterations: number;
  readonly json: boolean;
  readonly trajectory?: string;
  readonly every: number;
}

/**
 * Check the output extension before any work; returns its writer. `.json`
 * writes the model file; `.pdb`, `.xyz`, `.sdf`, `.mol` write a structure:
 * the structure read (every record kept, new coordinates) when the input was
 * a structure file, else one made from the model (elements, names,
 * connectivity; coordinates in Å).
 */
export function writerFor(output: string): Writer {
  const ext = extname(output).toLowerCase();
  if (ext === '.json') return MODEL_WRITER;
  const format = structureFormatFor(output);
  if (format === undefined) {
    throw new UsageError(`-o ${output}: cannot write "${ext || '(no extension)'}" files (known: ${KNOWN})`);
  }
  return (input, x) =>
    input.structure !== undefined
      ? format.write(input.structure.structure, x)
      : format.write(structureOfModel(input.model, x));
}

/** Run the command; progress goes to `progress` (stderr) when it is a terminal. */
export function minimizeCommand(
  input: LoadedInput,
  args: MinimizeArguments,
  progress: NodeJS.WriteStream | undefined,
): CommandOutput {
  const writer = writerFor(args.output);
  const model = input.model;
  if (args.trajectory !== undefined && extname(args.trajectory).toLowerCase() !== '.xyz') {
    throw new UsageError(`--trajectory ${args.trajectory}: a trajectory is written as .xyz`);
  }
  const elements = model.atoms.map((a) => a.element);
  const frames: string[] = [];
  const tty = progress !== undefined && progress.isTTY === true;
  const u = unitLabels(model.units);
  const options: MinimizeOptions = {
    method: args.method,
    maxForce: args.maxForce ?? defaultMaxForce(model.units),
    maxIterations: args.maxIterations,
    onIteration: (info) => {
      if (args.trajectory !== undefined && info.iteration % args.every === 0) {
        frames.push(xyzFrame(elements, info.x, `iteration ${info.iteration} energy ${info.energy}`));
      }
      if (tty) {
        progress.write(
          `\r  iteration ${info.iteration}  energy ${num(info.energy, 10)} ${u.energy}  largest force ${num(info.maxForce, 4)} ${u.force}   `,
        );
      }
    },
  };
  let result: RelaxResult;
  try {
    result = relaxModel(model, options);
  } catch (e) {
    if (e instanceof ModelError) throw new InputError(args.file, e.message);
    throw e;
  } finally {
    if (tty) progress.write('\n');
  }
  try {
    let text: string;
    try {
      text = writer(input, result.x);
    } catch (e) {
      // a value that does not fit the format's columns (e.g. PDB's 8.3): nothing is written
      throw new InputError(args.output, `cannot be written: ${(e as Error).message}`);
    }
    writeFileWhole(args.output, text);
    if (args.trajectory !== undefined) {
      frames.push(xyzFrame(elements, result.x, `final energy ${result.energy}`));
      writeFileWhole(args.trajectory, frames.join(''));
    }
  } catch (e) {
    throw new InputError(args.output, `cannot be written (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
  const status = result.converged ? 0 : 1;
  if (args.json) {
    const doc = {
      converged: result.converged,
      reason: result.reason,
      method: result.method,
      iterations: result.iterations,
      evaluations: result.evaluations,
      initialEnergy: result.initialEnergy,
      finalEnergy: result.energy,
      maxForce: result.maxForce,
      rmsForce: result.rmsForce,
      output: args.output,
      byKind: { before: result.before.byKind, after: result.after.byKind },
      units: model.units,
    };
    return { stdout: JSON.stringify(doc, null, 2) + '\n', status };
  }
  return { stdout: formatRelaxResult(model, result, args), status };
}

function formatRelaxResult(model: Model, r: RelaxResult, args: MinimizeArguments): string {
  const u = unitLabels(model.units);
  const lines: string[] = [];
  const criterion = args.maxForce ?? defaultMaxForce(model.units);
  lines.push(
    r.converged
      ? `converged (${r.reason}: largest force ${num(r.maxForce, 4)} ≤ ${num(criterion, 4)} ${u.force}) with ${r.method} after ${r.iterations} steps, ${r.evaluations} energy evaluations`
      : `NOT converged (${r.reason}) with ${r.method} after ${r.iterations} steps, ${r.evaluations} energy evaluations; largest force ${num(r.maxForce, 4)} ${u.force}, asked for ≤ ${num(criterion, 4)}`,
  );
  lines.push('');
  const rows: string[][] = [['kind', `before (${u.energy})`, `after (${u.energy})`, 'change']];
  for (const kind of model.kinds) {
    const b = r.before.byKind[kind] ?? 0;
    const a = r.after.byKind[kind] ?? 0;
    rows.push([kind, num(b, 8), num(a, 8), num(a - b, 6)]);
  }
  rows.push(['total', num(r.initialEnergy, 8), num(r.energy, 8), num(r.energy - r.initialEnergy, 6)]);
  lines.push(table(rows, 'lrrr'));
  lines.push('');
  lines.push(`rms force: ${num(r.rmsForce, 4)} ${u.force}`);
  lines.push(`written: ${args.output}${args.trajectory ? `, trajectory: ${args.trajectory}` : ''}`);
  return lines.join('\n') + '\n';
}
