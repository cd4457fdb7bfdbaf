/**
 * `npm start`: the main job on the embedded example — read the model, show
 * its energy table and most strained terms, and prove its gradient against
 * numerical derivatives.
 * @module
 */
import { checkGradientCommand, formatEnergyReport } from '../cli/commands.js';
import { energyReport } from '../analysis/report.js';
import { parseModel } from '../model/model.js';
import { relaxModel } from '../model/relax.js';
import { num } from '../cli/format.js';
import { DEMO_MODEL } from './model.js';

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
process.exitCode = check.status === 0 && relaxed.converged ? 0 : 1;
