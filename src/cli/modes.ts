/**
 * `strainwise modes FILE`: harmonic normal modes, wavenumbers and
 * vibrational thermochemistry; optionally an XYZ animation of modes.
 * @module
 */
import { extname } from 'node:path';
import { writeFileWhole } from '../io/write-file.js';
import type { Model } from '../model/model.js';
import { angstromPer } from '../units.js';
import { modeAnimation } from '../vibrations/animate.js';
import { vibrationalAnalysis, type VibrationalAnalysis } from '../vibrations/model-modes.js';
import { CAUTION, type CommandOutput } from './commands.js';
import { InputError, UsageError } from './errors.js';
import { num, table, unitLabels } from './format.js';

/** The largest atom displacement of an animation, Å (converted to the model's length unit). */
export const ANIMATION_AMPLITUDE_ANGSTROM = 0.3;
/** Frames per mode in an animation (one period of a sine). */
export const ANIMATION_FRAMES = 20;

/** Parsed options of the command. */
export interface ModesArguments {
  readonly file: string;
  readonly json: boolean;
  /** K. */
  readonly temperature?: number;
  /** Stationary-point threshold, model units. */
  readonly maxForce?: number;
  /** `--animate`: a mode number (1-based over the listed wavenumbers) or `all`. */
  readonly animate?: number | 'all';
  /** `-o`, the XYZ file of the animation. */
  readonly output?: string;
}

/** Check `--animate` and `-o` together before any work; returns the parsed mode choice. */
export function animationChoice(animate: string | undefined, output: string | undefined): number | 'all' | undefined {
  if (animate === undefined) {
    if (output !== undefined) throw new UsageError('-o is the file of --animate; give --animate K (a mode number or "all") with it');
    return undefined;
  }
  if (output === undefined) throw new UsageError('--animate needs -o OUT.xyz (the file to write)');
  if (extname(output).toLowerCase() !== '.xyz') throw new UsageError(`-o ${output}: an animation is written as .xyz`);
  if (animate === 'all') return 'all';
  const k = Number(animate);
  if (animate.trim() === '' || !Number.isInteger(k) || k < 1) {
    throw new UsageError(`--animate: expected a mode number ≥ 1 or "all", got "${animate}"`);
  }
  return k;
}

/** Run the command; `warn` gets one line (no newline) for each warning, for stderr. */
export function modesCommand(model: Model, args: ModesArguments, warn: (line: string) => void): CommandOutput {
  let analysis: VibrationalAnalysis;
  try {
    analysis = vibrationalAnalysis(model, { temperature: args.temperature, maxForce: args.maxForce });
  } catch (e) {
    if (e instanceof RangeError) throw new InputError(args.file, e.message);
    throw e;
  }
  const { modes, stationary } = analysis;
  const u = unitLabels(model.units);
  if (args.animate !== undefined) checkModeNumber(args.animate, modes.frequencies.length);
  if (!stationary.stationary) {
    warn(
      `strainwise: warning: ${args.file}: not at a stationary point (largest force ${num(stationary.maxForce, 4)} ${u.force} ` +
        `on atom ${stationary.maxForceAtom}, above ${Number(stationary.threshold.toPrecision(6))}); minimize it first, these modes are not those of a minimum or saddle`,
    );
  }
  if (args.animate !== undefined && args.output !== undefined) writeAnimation(model, analysis, args.animate, args.output);
  if (args.json) {
    const t = analysis.thermo;
    const doc = {
      frequencies: Array.from(modes.frequencies),
      zeroModes: modes.zeroModes,
      maxForce: stationary.maxForce,
      maxForceAtom: stationary.maxForceAtom,
      stationary: stationary.stationary,
      stationaryThreshold: stationary.threshold,
      linear: modes.linear,
      imaginaryCount: modes.imaginaryCount,
      reducedMasses: Array.from(modes.reducedMasses),
      forceConstants: Array.from(modes.forceConstants),
      temperature: t.temperature,
      populations: Array.from(t.populations, (p) => (Number.isNaN(p) ? null : p)),
      thermo: {
        zeroPointEnergy: t.zeroPointEnergy,
        enthalpy: t.enthalpy,
        entropy: t.entropy,
        freeEnergy: t.freeEnergy,
        includedModes: t.includedModes,
        excludedModes: t.excludedModes,
      },
      units: model.units,
      ...(args.output !== undefined ? { animation: args.output } : {}),
    };
    return { stdout: JSON.stringify(doc, null, 2) + '\n', status: 0 };
  }
  return { stdout: formatModes(model, analysis, args), status: 0 };
}

function checkModeNumber(choice: number | 'all', count: number): void {
  if (count === 0) throw new UsageError('--animate: the model has no vibrations to animate');
  if (choice !== 'all' && choice > count) {
    throw new UsageError(`--animate: there is no mode ${choice} (the model has ${count}; give 1 to ${count} or "all")`);
  }
}

function writeAnimation(model: Model, analysis: VibrationalAnalysis, choice: number | 'all', output: string): void {
  const count = analysis.modes.frequencies.length;
  const elements = model.atoms.map((a) => a.element);
  const amplitude = ANIMATION_AMPLITUDE_ANGSTROM / angstromPer(model.units.length);
  const which = choice === 'all' ? Array.from({ length: count }, (_, i) => i) : [choice - 1];
  const text = which
    .map((i) =>
      modeAnimation(elements, analysis.x, analysis.modes.modes[i], {
        amplitude,
        frames: ANIMATION_FRAMES,
        comment: `mode ${i + 1} ${num(analysis.modes.frequencies[i], 6)} cm-1`,
      }),
    )
    .join('');
  try {
    writeFileWhole(output, text);
  } catch (e) {
    throw new InputError(output, `cannot be written (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
}

function formatModes(model: Model, a: VibrationalAnalysis, args: ModesArguments): string {
  const u = unitLabels(model.units);
  const { modes, thermo: t } = a;
  const lines: string[] = [];
  const title = model.title ? `${model.title}: ` : '';
  const removed = a.projectRigid
    ? `${modes.zeroModes} rigid motions removed${modes.linear ? ', linear' : modes.atomCount > 1 ? ', non-linear' : ''}`
    : 'no rigid motions removed: position restraints tie the model to space';
  lines.push(`${title}${model.atomCount} atoms, ${modes.frequencies.length} vibrations (${removed})`);
  if (modes.frequencies.length > 0) {
    lines.push('');
    const flag = modes.imaginaryCount > 0;
    const rows: string[][] = [
      ['mode', 'wavenumber (cm⁻¹)', 'reduced mass (Da)', `force constant (${u.energy}/${u.length}²)`, `in v = 0 at ${t.temperature} K`],
    ];
    if (flag) rows[0].push('');
    modes.frequencies.forEach((nu, i) => {
      const p = t.populations[i];
      rows.push([
        String(i + 1),
        nu.toFixed(2),
        num(modes.reducedMasses[i], 5),
        num(modes.forceConstants[i], 5),
        Number.isNaN(p) ? '—' : p.toFixed(5),
        ...(flag ? [nu < 0 ? 'imaginary' : ''] : []),
      ]);
    });
    lines.push(table(rows, 'rrrrrl'));
    lines.push('');
    lines.push(`harmonic vibrational thermochemistry at ${t.temperature} K, per mol:`);
    const trows: string[][] = [
      ['quantity', 'value', 'unit'],
      ['zero-point energy', num(t.zeroPointEnergy, 7), u.energy],
      ['enthalpy (zero-point included)', num(t.enthalpy, 7), u.energy],
      ['entropy', num(t.entropy, 7), `${u.energy}/K`],
      ['free energy H − TS', num(t.freeEnergy, 7), u.energy],
    ];
    lines.push(table(trows, 'lrl'));
    if (t.note) lines.push(`(${t.note})`);
  }
  lines.push('');
  lines.push(`largest force: ${num(a.stationary.maxForce, 4)} ${u.force}${a.stationary.stationary ? '' : ' — NOT a stationary point'}`);
  if (args.output !== undefined) lines.push(`animation written: ${args.output}`);
  lines.push('');
  lines.push(CAUTION);
  return lines.join('\n') + '\n';
}
