/**
 * The commands: each takes its parsed arguments, calls the library, and
 * returns what to print and the exit status. No physics here.
 * @module
 */
import { checkModelGradient } from '../analysis/gradient-check.js';
import { energyReport, type EnergyReport } from '../analysis/report.js';
import { isNonbondedKind } from '../model/kinds.js';
import type { Model } from '../model/model.js';
import { num, table, unitLabels } from './format.js';

/** What a command produced: text for stdout and the exit status. */
export interface CommandOutput {
  readonly stdout: string;
  readonly status: 0 | 1;
}

/** The caution printed under human-readable results. */
export const CAUTION =
  'Note: these numbers are only as good as the parameters and the classical model behind them; ' +
  'for published work use a validated force field and its own software.';

function atomLabel(model: Model, a: number): string {
  const atom = model.atoms[a];
  return atom.name ? `${a} (${atom.name})` : `${a} (${atom.element})`;
}

/** `strainwise energy FILE`. */
export function energyCommand(model: Model, json: boolean): CommandOutput {
  const report = energyReport(model);
  if (json) {
    const doc = {
      total: report.total,
      byKind: report.byKind,
      gradient: report.gradient,
      units: report.units,
      termCounts: report.termCounts,
      maxForce: report.maxForce,
      maxForceAtom: report.maxForceAtom,
      rmsForce: report.rmsForce,
      strained: report.strained,
    };
    return { stdout: JSON.stringify(doc, null, 2) + '\n', status: 0 };
  }
  return { stdout: formatEnergyReport(model, report), status: 0 };
}

/** The human-readable energy table. */
export function formatEnergyReport(model: Model, report: EnergyReport): string {
  const u = unitLabels(model.units);
  const lines: string[] = [];
  const title = model.title ? `${model.title}: ` : '';
  lines.push(`${title}${model.atomCount} atoms, ${model.termCount} terms; energies in ${u.energy}, lengths in ${u.length}, angles in degrees`);
  lines.push('');
  const rows: string[][] = [['kind', 'terms', `energy (${u.energy})`]];
  for (const kind of model.kinds) {
    const count = String(report.termCounts[kind] ?? 0);
    rows.push([kind, isNonbondedKind(kind) ? `${count} pairs` : count, num(report.byKind[kind] ?? 0, 8)]);
  }
  rows.push(['total', String(model.termCount), num(report.total, 8)]);
  lines.push(table(rows, 'lrr'));
  lines.push('');
  if (model.atomCount > 0) {
    lines.push(`largest force: ${num(report.maxForce)} ${u.force} on atom ${atomLabel(model, report.maxForceAtom)}`);
    lines.push(`rms force:     ${num(report.rmsForce)} ${u.force}`);
  }
  if (report.strained.length > 0) {
    lines.push('');
    lines.push('most strained terms:');
    const srows: string[][] = [['term', 'kind', 'atoms', `energy (${u.energy})`, 'value', 'reference', 'off by']];
    for (const s of report.strained) {
      const unit = s.quantity === 'distance' || s.quantity === 'displacement' ? ` ${u.length}` : '°';
      srows.push([
        `#${s.term}`,
        s.kind,
        s.atoms.join('-'),
        num(s.energy),
        num(s.value, 5) + unit,
        s.reference === null ? '—' : num(s.reference, 5) + unit,
        s.deviation === null ? '—' : (s.deviation >= 0 ? '+' : '') + num(s.deviation, 3) + unit,
      ]);
    }
    lines.push(table(srows, 'lllrrrr'));
  }
  lines.push('');
  lines.push(CAUTION);
  return lines.join('\n') + '\n';
}

/** `strainwise check-gradient FILE`. */
export function checkGradientCommand(model: Model, json: boolean): CommandOutput {
  const { check, worst } = checkModelGradient(model);
  const ok = check.ok;
  const status = ok ? 0 : 1;
  if (json) {
    const doc = {
      maxAbsError: check.maxAbsError,
      maxRelError: check.maxRelError,
      worst,
      ok,
      tolerance: check.tolerance,
      coordinates: 3 * model.atomCount,
      evaluations: check.evaluations,
    };
    return { stdout: JSON.stringify(doc, null, 2) + '\n', status };
  }
  const u = unitLabels(model.units);
  const lines: string[] = [];
  lines.push(`analytic gradient against numerical derivatives (fourth-order central differences), ${3 * model.atomCount} coordinates`);
  lines.push(`largest absolute error: ${num(check.maxAbsError, 3)} ${u.force}`);
  lines.push(`largest relative error: ${num(check.maxRelError, 3)} (limit ${num(check.tolerance, 1)}; relative to max(1, largest gradient component))`);
  if (worst !== null && check.worst !== null) {
    lines.push(
      `worst coordinate: atom ${atomLabel(model, worst.atom)} ${worst.axis}, analytic ${num(check.worst.analytic, 10)}, ` +
        `numerical ${num(check.worst.numerical, 10)} (${worst.kind} terms)`,
    );
  }
  lines.push(ok ? 'result: gradient correct' : 'result: GRADIENT WRONG');
  return { stdout: lines.join('\n') + '\n', status };
}
