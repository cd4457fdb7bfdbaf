/**
 * `npm start`: the main job on embedded examples — a hand-written model's
 * energy table, most strained terms and gradient proof; then a sketched
 * structure taken the whole way: perceived topology, generic parameters,
 * relaxed geometry, energies before and after.
 * @module
 */
import { checkGradientCommand, formatEnergyReport } from '../cli/commands.js';
import { energyReport } from '../analysis/report.js';
import { parseModel } from '../model/model.js';
import { relaxModel } from '../model/relax.js';
import { num, table } from '../cli/format.js';
import { DEMO_MODEL } from './model.js';
import { DEMO_SKETCH } from './sketch.js';
import { readMol } from '../io/sdf.js';
import { modelFromStructure } from '../params/from-structure.js';
import { genericAtomTypes } from '../params/atom-types.js';
import { bendAngle, distance } from '../terms/measure.js';
import { GENERIC_CAUTION } from '../params/assign.js';

const model = parseModel(DEMO_MODEL);
const out = process.stdout;
out.write('strainwise demo: the energy of a small invented molecule, term by term\n\n');
out.write(formatEnergyReport(model, energyReport(model)));
out.write('\nstrainwise demo: is the analytic gradient exact?\n\n');
const check = checkGradientCommand(model, false);
out.write(check.stdout);

out.write('\nstrainwise demo: relaxing it (L-BFGS, largest force to 0.01 kcal/mol/Å)\n\n');
const relaxed = relaxModel(model);
out.write(
  `${relaxed.converged ? 'converged' : 'NOT converged'} after ${relaxed.iterations} steps, ${relaxed.evaluations} energy evaluations: ` +
    `energy ${num(relaxed.initialEnergy, 8)} → ${num(relaxed.energy, 8)} kcal/mol, largest force ${num(relaxed.maxForce, 3)} kcal/mol/Å\n`,
);
out.write('(the illustrative parameters make this a toy: for real structures use a validated force field)\n');

// Part 2: a structure file with nothing else supplied.
out.write('\nstrainwise demo: cleaning up a sketch (a MOL file drawn flat in a structure editor)\n\n');
const sketch = readMol(DEMO_SKETCH)[0];
const generated = modelFromStructure(sketch);
const t = generated.topology;
const types = genericAtomTypes(t);
const typeCounts = new Map<string, number>();
for (const label of types) typeCounts.set(label, (typeCounts.get(label) ?? 0) + 1);
let aromatic = 0;
for (let a = 0; a < t.atomCount; a++) aromatic += t.aromaticAtoms[a];
out.write(`topology: ${t.atomCount} atoms, ${t.bonds.length / 2} bonds, ${t.rings.length} ring (${aromatic} aromatic atoms), `);
out.write(`${t.angles.length / 3} angles, ${t.torsions.length / 4} torsions, ${t.impropers.length / 4} out-of-plane centres, ${t.pairs14.length / 2} 1-4 pairs\n`);
out.write(`atom types: ${[...typeCounts].map(([label, n]) => `${label} ×${n}`).join(', ')}\n`);
const termCounts = new Map<string, number>();
for (const term of generated.file.terms) termCounts.set(term.kind, (termCounts.get(term.kind) ?? 0) + 1);
out.write(`parameters: ${[...termCounts].map(([kind, n]) => `${n} ${kind}`).join(', ')}, and Lennard-Jones pairs\n`);
const cleaned = parseModel(generated.file);
const tidy = relaxModel(cleaned);
out.write(`\nrelaxed: ${tidy.converged ? 'converged' : 'NOT converged'} after ${tidy.iterations} steps, ${tidy.evaluations} energy evaluations\n`);
const rows: string[][] = [['kind', 'before', 'after']];
for (const kind of cleaned.kinds) rows.push([kind, num(tidy.before.byKind[kind] ?? 0, 8), num(tidy.after.byKind[kind] ?? 0, 8)]);
rows.push(['total (kcal/mol)', num(tidy.initialEnergy, 8), num(tidy.energy, 8)]);
out.write(table(rows, 'lrr') + '\n');
const x0 = cleaned.coordinates;
const ring = t.rings[0];
const ringMean = (x: Float64Array) => ring.reduce((sum, a, k) => sum + distance(x, a, ring[(k + 1) % ring.length]), 0) / ring.length;
const deg = (x: Float64Array, i: number, j: number, k: number) => (bendAngle(x, i, j, k) * 180) / Math.PI;
out.write(`ring C–C mean ${num(ringMean(x0), 4)} → ${num(ringMean(tidy.x), 4)} Å; C–Cl ${num(distance(x0, 3, 9), 4)} → ${num(distance(tidy.x, 3, 9), 4)} Å; `);
out.write(`C–C–O ${num(deg(x0, 6, 7, 8), 4)} → ${num(deg(tidy.x, 6, 7, 8), 4)}°; O–H ${num(distance(x0, 8, 18), 4)} → ${num(distance(tidy.x, 8, 18), 4)} Å\n`);
out.write(`(${GENERIC_CAUTION}; \`strainwise minimize sketch.mol -o clean.sdf\` does the same from the command line)\n`);
process.exitCode = check.status === 0 && relaxed.converged && tidy.converged ? 0 : 1;
