/**
 * `npm start`: the main job on the embedded example — read the model, show
 * its energy table and most strained terms, and prove its gradient against
 * numerical derivatives.
 * @module
 */
import { checkGradientCommand, formatEnergyReport } from '../cli/commands.js';
import { energyReport } from '../analysis/report.js';
import { parseModel } from '../model/model.js';
import { DEMO_MODEL } from './model.js';

const model = parseModel(DEMO_MODEL);
const out = process.stdout;
out.write('strainwise demo: the energy of a small invented molecule, term by term\n\n');
out.write(formatEnergyReport(model, energyReport(model)));
out.write('\nstrainwise demo: is the analytic gradient exact?\n\n');
const check = checkGradientCommand(model, false);
out.write(check.stdout);
process.exitCode = check.status;
