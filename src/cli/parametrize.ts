/**
 * `strainwise parametrize FILE -o OUT.json`: a structure file's perceived
 * topology and generic parameters, written as a model file to inspect and edit.
 * @module
 */
import { writeFileWhole } from '../io/write-file.js';
import { GENERIC_CAUTION } from '../params/assign.js';
import type { CommandOutput } from './commands.js';
import { InputError } from './errors.js';
import type { LoadedInput } from './io.js';
import { table } from './format.js';

/** Parsed options of the command. */
export interface ParametrizeArguments {
  readonly file: string;
  readonly output: string;
  readonly json: boolean;
}

/** What was perceived and assigned, as counts (the `--json` document's fields). */
export function parametrizeSummary(input: LoadedInput): Record<string, unknown> {
  const s = input.structure;
  if (s === undefined) throw new Error('parametrizeSummary needs a structure input');
  const { topology, file } = s.generated;
  const types: Record<string, number> = {};
  for (const atom of file.atoms) types[atom.type ?? ''] = (types[atom.type ?? ''] ?? 0) + 1;
  const terms: Record<string, number> = {};
  for (const term of file.terms) terms[term.kind] = (terms[term.kind] ?? 0) + 1;
  let aromatic = 0;
  for (let a = 0; a < topology.atomCount; a++) aromatic += topology.aromaticAtoms[a];
  return {
    atoms: topology.atomCount,
    bonds: topology.bonds.length / 2,
    perceivedBonds: s.generated.perceivedBonds,
    perceivedOrders: s.generated.perceivedOrders,
    rings: topology.rings.map((r) => r.length),
    aromaticAtoms: aromatic,
    angles: topology.angles.length / 3,
    torsions: topology.torsions.length / 4,
    types,
    terms,
    caution: GENERIC_CAUTION,
  };
}

/** Run the command: write the model file whole, report what it holds. */
export function parametrizeCommand(input: LoadedInput, args: ParametrizeArguments): CommandOutput {
  const generated = input.structure?.generated;
  if (generated === undefined) throw new InputError(args.file, 'is not a structure file');
  try {
    writeFileWhole(args.output, JSON.stringify(generated.file, null, 2) + '\n');
  } catch (e) {
    throw new InputError(args.output, `cannot be written (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
  const summary = parametrizeSummary(input);
  if (args.json) return { stdout: JSON.stringify({ ...summary, output: args.output }, null, 2) + '\n', status: 0 };
  const rings = summary.rings as number[];
  const lines = [
    `${summary.atoms} atoms, ${summary.bonds} bonds (${summary.perceivedBonds ? 'perceived from coordinates' : 'from the file'}; orders ${summary.perceivedOrders ? 'perceived' : 'from the file'})`,
    `${rings.length} ring${rings.length === 1 ? '' : 's'}${rings.length ? ` (sizes ${rings.join(', ')})` : ''}, ${summary.aromaticAtoms} aromatic atoms, ${summary.angles} angles, ${summary.torsions} torsions`,
    `atom types: ${Object.entries(summary.types as Record<string, number>).map(([t, n]) => `${t} ×${n}`).join(', ')}`,
    '',
    table([['kind', 'terms'], ...Object.entries(summary.terms as Record<string, number>).map(([k, n]) => [k, String(n)])], 'lr'),
    '',
    `caution: ${GENERIC_CAUTION}; for real work use a validated force field.`,
    `written: ${args.output}`,
  ];
  return { stdout: lines.join('\n') + '\n', status: 0 };
}
