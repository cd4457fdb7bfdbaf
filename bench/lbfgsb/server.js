// Energy server for bench/lbfgsb/compare.py: builds one molecule-like model
// (bench/molecule-like.js) and answers, on stdin/stdout, binary requests:
// 3N little-endian doubles in → 1 + 3N doubles out (energy, then gradient).
// The first line written is the model's start coordinates as JSON.
import { moleculeLikeModel } from '../molecule-like.js';
import { parseModel } from '../../dist/index.js';

const [carbons, seed] = process.argv.slice(2).map(Number);
const model = parseModel(moleculeLikeModel({ carbons, seed }));
const n = 3 * model.atomCount;
process.stdout.write(JSON.stringify(Array.from(model.coordinates)) + '\n');
const x = new Float64Array(n);
const out = new Float64Array(n + 1);
const g = out.subarray(1);
let pending = Buffer.alloc(0);
process.stdin.on('data', (chunk) => {
  pending = Buffer.concat([pending, chunk]);
  while (pending.length >= 8 * n) {
    for (let i = 0; i < n; i++) x[i] = pending.readDoubleLE(8 * i);
    pending = pending.subarray(8 * n);
    out[0] = model.energy(x, g);
    process.stdout.write(Buffer.from(out.buffer.slice(0)));
  }
});
