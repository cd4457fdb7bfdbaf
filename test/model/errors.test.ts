/**
 * Every way a model file can be refused, with the exact message.
 * Messages follow ../shared/spec/model-file.md ("Errors": one message naming
 * the place) and the wording agreed for this reader.
 */

import { describe, expect, it } from 'vitest';
import { ModelError } from '../../src/errors.js';
import { readModelFile } from '../../src/model/validate.js';
import { allKindsAngstrom, chain, edited, expectModelError, type Loose, specExample } from './fixtures.js';

const KNOWN_KINDS =
  'harmonic-bond, morse-bond, harmonic-angle, cosine-angle, urey-bradley, periodic-dihedral, ryckaert-bellemans, harmonic-improper, position-restraint, distance-restraint, cosine-series-angle, periodic-angle, inversion';
const TOP_KEYS = 'format, version, units, atoms, coordinates, terms, bonds, nonbonded, frozen, constraints, title, metadata';
const RANGE_40 = 'index 40 is out of range (model has 31 atoms)';

type Case = [name: string, base: () => Loose, change: (m: Loose) => void, message: string];

function runCases(cases: readonly Case[]): void {
  for (const [name, base, change, message] of cases) {
    it(name, () => {
      const model = edited(base(), change);
      expectModelError(() => readModelFile(model), message);
      // The same model as JSON text is refused the same way, unless it holds non-JSON values.
      let text: string | undefined;
      try {
        text = JSON.stringify(model);
      } catch {
        text = undefined;
      }
      if (text !== undefined && JSON.stringify(JSON.parse(text)) === text && !message.includes('JSON data')) {
        expectModelError(() => readModelFile(text), message);
      }
    });
  }
}

describe('the examples of the brief, word for word', () => {
  runCases([
    ['index out of range', chain, (m) => { m.terms[12] = { kind: 'harmonic-angle', atoms: [12, 13, 40], k: 60, theta0: 180 }; }, `terms[12].atoms[2]: ${RANGE_40}`],
    ['unknown kind', chain, (m) => { m.terms[3].kind = 'harmonic-bend'; }, `terms[3].kind: unknown kind "harmonic-bend" (known: ${KNOWN_KINDS})`],
    ['wrong atom count', chain, (m) => { m.terms[0] = { kind: 'harmonic-angle', atoms: [0, 1], k: 1, theta0: 90 }; }, 'terms[0].atoms: harmonic-angle needs 3 atoms, got 2'],
    ['repeated atom', chain, (m) => { m.terms[0].atoms = [0, 0]; }, 'terms[0].atoms[1]: atom 0 is repeated in this term'],
    ['negative k', chain, (m) => { m.terms[2].k = -5; }, 'terms[2].k: expected a finite number ≥ 0, got -5'],
    ['missing r0', chain, (m) => { delete m.terms[2].r0; }, 'terms[2]: missing required field "r0"'],
    ['unknown key r_0', chain, (m) => { m.terms[2].r_0 = m.terms[2].r0; delete m.terms[2].r0; }, 'terms[2]: unknown key "r_0" (allowed: kind, atoms, k, r0)'],
    ['n not an integer', allKindsAngstrom, (m) => { m.terms[1] = { kind: 'periodic-dihedral', atoms: [0, 1, 2, 3], k: 1, n: 2.5, phase: 0 }; }, 'terms[1].n: expected an integer ≥ 1, got 2.5'],
    ['unknown length unit', chain, (m) => { m.units.length = 'bohr'; }, 'units.length: unknown length unit "bohr" (known: angstrom, nanometer)'],
    ['unknown element', chain, (m) => { m.atoms[4].element = 'CL'; }, 'atoms[4].element: unknown element "CL" (elements are case-sensitive, e.g. Cl)'],
    ['mass not positive', chain, (m) => { m.atoms[2].mass = 0; }, 'atoms[2].mass: expected a mass in dalton (a finite number > 0), got 0'],
    ['no standard atomic weight', chain, (m) => { m.atoms[7].element = 'Tc'; }, 'atoms[7]: element Tc has no standard atomic weight; give "mass"'],
    ['too few coordinate rows', chain, (m) => { m.coordinates.pop(); }, 'coordinates: expected 31 rows (one per atom), got 30'],
    ['short coordinate row', chain, (m) => { m.coordinates[3] = [4.5, 0]; }, 'coordinates[3]: expected [x, y, z], got 2 numbers'],
    ['bond listed twice', chain, (m) => { m.bonds[1] = [2, 7]; m.bonds[5] = [7, 2]; }, 'bonds[5]: bond 7-2 is listed twice (first at bonds[1])'],
    ['bond listed twice, same order', chain, (m) => { m.bonds[1] = [2, 7]; m.bonds[5] = [2, 7]; }, 'bonds[5]: bond 2-7 is listed twice (first at bonds[1])'],
    ['missing terms', chain, (m) => { delete m.terms; }, 'missing required key "terms"'],
  ]);
});

describe('top level', () => {
  it('must be an object', () => {
    expectModelError(() => readModelFile([]), 'expected a JSON object at the top level, got an array');
    expectModelError(() => readModelFile('[]'), 'expected a JSON object at the top level, got an array');
    expectModelError(() => readModelFile('5'), 'expected a JSON object at the top level, got 5');
    expectModelError(() => readModelFile(null), 'expected a JSON object at the top level, got null');
    expectModelError(() => readModelFile('"model"'), 'expected a JSON object at the top level, got "model"');
    expectModelError(() => readModelFile(undefined), 'expected JSON data, got undefined');
  });

  runCases([
    ...['format', 'version', 'units', 'atoms', 'coordinates', 'terms'].map(
      (key): Case => [`requires "${key}"`, specExample, (m) => { delete m[key]; }, `missing required key "${key}"`],
    ),
    ['refuses an unknown key', specExample, (m) => { m.Title = 'x'; }, `unknown key "Title" (allowed: ${TOP_KEYS})`],
    ['format exactly', specExample, (m) => { m.format = 'strainwise-model-2'; }, 'format: expected "strainwise-model", got "strainwise-model-2"'],
    ['format a string', specExample, (m) => { m.format = 1; }, 'format: expected "strainwise-model", got 1'],
    ['version 1 only', specExample, (m) => { m.version = 2; }, 'version: unknown version 2 (known: 1)'],
    ['version a number', specExample, (m) => { m.version = '1'; }, 'version: expected the number 1 (known versions: 1), got "1"'],
    ['version 1.0 is 1', specExample, (m) => { m.version = 1.5; }, 'version: unknown version 1.5 (known: 1)'],
    ['title a string', specExample, (m) => { m.title = 5; }, 'title: expected a string, got 5'],
    ['metadata not an array', specExample, (m) => { m.metadata = []; }, 'metadata: expected a JSON object, got an array'],
    ['metadata not null', specExample, (m) => { m.metadata = null; }, 'metadata: expected a JSON object, got null'],
    ['metadata not a string', specExample, (m) => { m.metadata = 'x'; }, 'metadata: expected a JSON object, got "x"'],
  ]);
});

describe('units', () => {
  runCases([
    ['energy unit', specExample, (m) => { m.units.energy = 'eV'; }, 'units.energy: unknown energy unit "eV" (known: kcal/mol, kJ/mol)'],
    ['energy unit is case-sensitive', specExample, (m) => { m.units.energy = 'kj/mol'; }, 'units.energy: unknown energy unit "kj/mol" (known: kcal/mol, kJ/mol)'],
    ['length required', specExample, (m) => { delete m.units.length; }, 'units: missing required field "length"'],
    ['energy required', specExample, (m) => { delete m.units.energy; }, 'units: missing required field "energy"'],
    ['length a name', specExample, (m) => { m.units.length = 10; }, 'units.length: expected a length unit (known: angstrom, nanometer), got 10'],
    ['energy a name', specExample, (m) => { m.units.energy = null; }, 'units.energy: expected an energy unit (known: kcal/mol, kJ/mol), got null'],
    ['an object', specExample, (m) => { m.units = 'angstrom'; }, 'units: expected an object with "length" and "energy", got "angstrom"'],
    ['no other keys', specExample, (m) => { m.units.time = 'ps'; }, 'units: unknown key "time" (allowed: length, energy)'],
  ]);
});

describe('atoms', () => {
  runCases([
    ['an array', specExample, (m) => { m.atoms = {}; }, 'atoms: expected an array of atom records, got an object'],
    ['records are objects', specExample, (m) => { m.atoms[1] = 'H'; }, 'atoms[1]: expected an atom record (an object with "element"), got "H"'],
    ['element required', specExample, (m) => { delete m.atoms[1].element; }, 'atoms[1]: missing required field "element"'],
    ['lower-case element', specExample, (m) => { m.atoms[0].element = 'o'; }, 'atoms[0].element: unknown element "o" (elements are case-sensitive, e.g. O)'],
    ['not an element at all', specExample, (m) => { m.atoms[0].element = 'Xx'; }, 'atoms[0].element: unknown element "Xx" (expected a chemical symbol as written in the periodic table, e.g. C, Cl)'],
    ['deuterium symbol', specExample, (m) => { m.atoms[1].element = 'D'; }, 'atoms[1].element: unknown element "D" (write an isotope as its element, here "H", with its own "mass")'],
    ['element a string', specExample, (m) => { m.atoms[0].element = 8; }, 'atoms[0].element: expected a chemical symbol such as "C" or "Cl", got 8'],
    ['negative mass', specExample, (m) => { m.atoms[1].mass = -1; }, 'atoms[1].mass: expected a mass in dalton (a finite number > 0), got -1'],
    ['mass a number', specExample, (m) => { m.atoms[1].mass = '1.008'; }, 'atoms[1].mass: expected a mass in dalton (a finite number > 0), got "1.008"'],
    ['charge a number', specExample, (m) => { m.atoms[0].charge = '-0.8'; }, 'atoms[0].charge: expected a charge in elementary charges (a finite number), got "-0.8"'],
    ['name a string', specExample, (m) => { m.atoms[0].name = 1; }, 'atoms[0].name: expected a string, got 1'],
    ['type a string', specExample, (m) => { m.atoms[0].type = true; }, 'atoms[0].type: expected a string, got true'],
    ['no other keys', specExample, (m) => { m.atoms[0].symbol = 'O'; }, 'atoms[0]: unknown key "symbol" (allowed: element, name, mass, charge, type)'],
    ['Pm needs a mass', specExample, (m) => { m.atoms[2].element = 'Pm'; }, 'atoms[2]: element Pm has no standard atomic weight; give "mass"'],
    ['Og needs a mass', specExample, (m) => { m.atoms[2].element = 'Og'; }, 'atoms[2]: element Og has no standard atomic weight; give "mass"'],
  ]);

  it('accepts an element without a standard weight when a mass is given, and U without one', () => {
    expect(readModelFile(edited(specExample(), (m) => { m.atoms[2] = { element: 'Tc', mass: 98.906 }; })).atoms[2]).toEqual({ element: 'Tc', mass: 98.906 });
    expect(() => readModelFile(edited(specExample(), (m) => { m.atoms[2] = { element: 'U' }; }))).not.toThrow();
  });
});

describe('coordinates', () => {
  runCases([
    ['an array', specExample, (m) => { m.coordinates = {}; }, 'coordinates: expected an array of [x, y, z] rows, got an object'],
    ['too many rows', specExample, (m) => { m.coordinates.push([1, 1, 1]); }, 'coordinates: expected 3 rows (one per atom), got 4'],
    ['one row for one atom', specExample, (m) => { m.atoms = [m.atoms[0]]; m.coordinates = []; m.terms = []; delete m.bonds; }, 'coordinates: expected 1 row (one per atom), got 0'],
    ['a row of four', specExample, (m) => { m.coordinates[1].push(0); }, 'coordinates[1]: expected [x, y, z], got 4 numbers'],
    ['a row of one', specExample, (m) => { m.coordinates[1] = [0]; }, 'coordinates[1]: expected [x, y, z], got 1 number'],
    ['a row with a string, wrong length', specExample, (m) => { m.coordinates[1] = ['0', 1]; }, 'coordinates[1]: expected [x, y, z], got 2 values'],
    ['a row not an array', specExample, (m) => { m.coordinates[2] = '0 0 0'; }, 'coordinates[2]: expected [x, y, z], got "0 0 0"'],
    ['a string number', specExample, (m) => { m.coordinates[2][1] = '0.93'; }, 'coordinates[2][1]: expected a finite number, got "0.93"'],
    ['null', specExample, (m) => { m.coordinates[0][2] = null; }, 'coordinates[0][2]: expected a finite number, got null'],
    ['NaN (not JSON)', specExample, (m) => { m.coordinates[0][2] = Number.NaN; }, 'coordinates[0][2]: expected JSON data, got NaN'],
    ['Infinity (not JSON)', specExample, (m) => { m.coordinates[0][0] = -Infinity; }, 'coordinates[0][0]: expected JSON data, got -Infinity'],
    ['a typed array (not JSON)', specExample, (m) => { m.coordinates = new Float64Array(9); }, 'coordinates: expected JSON data, got a Float64Array'],
  ]);

  it('refuses a number too large for a double in the text, with line and column', () => {
    const text = JSON.stringify(specExample(), null, 2).replace('0.96', '1e999');
    const line = text.split('\n').findIndex((l) => l.includes('1e999'));
    const column = text.split('\n')[line].indexOf('1e999') + 1;
    expectModelError(() => readModelFile(text), `line ${line + 1}, column ${column}: number 1e999 is too large (beyond the range of a double)`);
  });
});

describe('bonds', () => {
  runCases([
    ['an array', specExample, (m) => { m.bonds = 5; }, 'bonds: expected an array of [i, j] atom pairs, got 5'],
    ['pairs', specExample, (m) => { m.bonds[0] = [0, 1, 2]; }, 'bonds[0]: expected a pair of atom indices [i, j], got 3 numbers'],
    ['pairs are arrays', specExample, (m) => { m.bonds[0] = '0-1'; }, 'bonds[0]: expected a pair of atom indices [i, j], got "0-1"'],
    ['integer indices', specExample, (m) => { m.bonds[0] = [1.5, 0]; }, 'bonds[0][0]: expected an atom index (an integer ≥ 0), got 1.5'],
    ['non-negative indices', specExample, (m) => { m.bonds[1] = [0, -1]; }, 'bonds[1][1]: expected an atom index (an integer ≥ 0), got -1'],
    ['in range', chain, (m) => { m.bonds[0] = [0, 40]; }, `bonds[0][1]: ${RANGE_40}`],
    ['distinct atoms', chain, (m) => { m.bonds[2] = [4, 4]; }, 'bonds[2]: a bond needs two different atoms, got 4-4'],
  ]);
});

describe('terms', () => {
  // Parameters of each kind, from the table of ../shared/spec/model-file.md.
  const PARAMS: Record<string, string[]> = {
    'harmonic-bond': ['k', 'r0'],
    'morse-bond': ['D', 'a', 'r0'],
    'harmonic-angle': ['k', 'theta0'],
    'cosine-angle': ['k', 'theta0'],
    'urey-bradley': ['k', 's0'],
    'periodic-dihedral': ['k', 'n', 'phase'],
    'ryckaert-bellemans': ['c'],
    'harmonic-improper': ['k', 'xi0'],
    'position-restraint': ['k', 'x0', 'flat'],
    'distance-restraint': ['k', 'lower', 'upper'],
    // extensions, docs/model-file.md
    'cosine-series-angle': ['k', 'theta0'],
    'periodic-angle': ['k', 'n', 'theta0'],
    inversion: ['k', 'omega0'],
  };
  const ARITY: Record<string, number> = {
    'harmonic-bond': 2, 'morse-bond': 2, 'harmonic-angle': 3, 'cosine-angle': 3, 'urey-bradley': 3,
    'periodic-dihedral': 4, 'ryckaert-bellemans': 4, 'harmonic-improper': 4, 'position-restraint': 1, 'distance-restraint': 2,
    'cosine-series-angle': 3, 'periodic-angle': 3, inversion: 4,
  };
  const model = allKindsAngstrom();
  const termIndex = (kind: string) => (model.terms as Loose[]).findIndex((t) => t.kind === kind);

  for (const kind of Object.keys(PARAMS)) {
    const t = termIndex(kind);
    const required = PARAMS[kind].filter((p) => p !== 'flat');
    runCases([
      ...required.map(
        (p): Case => [`${kind} requires ${p}`, allKindsAngstrom, (m) => { delete m.terms[t][p]; }, `terms[${t}]: missing required field "${p}"`],
      ),
      [`${kind} requires atoms`, allKindsAngstrom, (m) => { delete m.terms[t].atoms; }, `terms[${t}]: missing required field "atoms"`],
      [`${kind} refuses an unknown key`, allKindsAngstrom, (m) => { m.terms[t].K = 1; }, `terms[${t}]: unknown key "K" (allowed: kind, atoms, ${PARAMS[kind].join(', ')})`],
      [
        `${kind} needs ${ARITY[kind]} atoms`,
        allKindsAngstrom,
        (m) => { m.terms[t].atoms = [0, 1, 2, 3, 4].slice(0, ARITY[kind] + 1); },
        `terms[${t}].atoms: ${kind} needs ${ARITY[kind]} atom${ARITY[kind] === 1 ? '' : 's'}, got ${ARITY[kind] + 1}`,
      ],
      [
        `${kind} atoms are an array`,
        allKindsAngstrom,
        (m) => { m.terms[t].atoms = 0; },
        `terms[${t}].atoms: ${kind} needs an array of ${ARITY[kind]} atom ${ARITY[kind] === 1 ? 'index' : 'indices'}, got 0`,
      ],
    ]);
  }

  runCases([
    ['kind required', allKindsAngstrom, (m) => { delete m.terms[0].kind; }, 'terms[0]: missing required field "kind"'],
    ['kind a string', allKindsAngstrom, (m) => { m.terms[0].kind = 1; }, `terms[0].kind: expected a term kind (known: ${KNOWN_KINDS}), got 1`],
    ['kind case-sensitive', allKindsAngstrom, (m) => { m.terms[0].kind = 'Harmonic-Bond'; }, `terms[0].kind: unknown kind "Harmonic-Bond" (known: ${KNOWN_KINDS})`],
    ['a term is an object', allKindsAngstrom, (m) => { m.terms[0] = 7; }, 'terms[0]: expected a term (an object with "kind"), got 7'],
    ['a term is not an array', allKindsAngstrom, (m) => { m.terms[0] = []; }, 'terms[0]: expected a term (an object with "kind"), got an array'],
    ['terms an array', allKindsAngstrom, (m) => { m.terms = {}; }, 'terms: expected an array of terms, got an object'],
    ['integer atom index', allKindsAngstrom, (m) => { m.terms[0].atoms = [0, 1.5]; }, 'terms[0].atoms[1]: expected an atom index (an integer ≥ 0), got 1.5'],
    ['atom index a number', allKindsAngstrom, (m) => { m.terms[0].atoms = ['0', 1]; }, 'terms[0].atoms[0]: expected an atom index (an integer ≥ 0), got "0"'],
    ['negative atom index', allKindsAngstrom, (m) => { m.terms[2].atoms = [0, -1, 2]; }, 'terms[2].atoms[1]: expected an atom index (an integer ≥ 0), got -1'],
    ['index just out of range', allKindsAngstrom, (m) => { m.terms[5].atoms = [0, 1, 2, 5]; }, 'terms[5].atoms[3]: index 5 is out of range (model has 5 atoms)'],
    ['repeat in a torsion', allKindsAngstrom, (m) => { m.terms[5].atoms = [0, 1, 2, 1]; }, 'terms[5].atoms[3]: atom 1 is repeated in this term'],
    ['k a number', allKindsAngstrom, (m) => { m.terms[0].k = '620'; }, 'terms[0].k: expected a finite number ≥ 0, got "620"'],
    ['r0 ≥ 0', allKindsAngstrom, (m) => { m.terms[0].r0 = -1.53; }, 'terms[0].r0: expected a finite number ≥ 0, got -1.53'],
    ['Morse D ≥ 0', allKindsAngstrom, (m) => { m.terms[1].D = -88; }, 'terms[1].D: expected a finite number ≥ 0, got -88'],
    ['Morse a ≥ 0', allKindsAngstrom, (m) => { m.terms[1].a = -1; }, 'terms[1].a: expected a finite number ≥ 0, got -1'],
    ['theta0 ≤ 180', allKindsAngstrom, (m) => { m.terms[2].theta0 = 190; }, 'terms[2].theta0: expected an angle in degrees in [0, 180], got 190'],
    ['theta0 ≥ 0', allKindsAngstrom, (m) => { m.terms[3].theta0 = -0.5; }, 'terms[3].theta0: expected an angle in degrees in [0, 180], got -0.5'],
    ['cosine-angle k ≥ 0', allKindsAngstrom, (m) => { m.terms[3].k = -60; }, 'terms[3].k: expected a finite number ≥ 0, got -60'],
    ['s0 ≥ 0', allKindsAngstrom, (m) => { m.terms[4].s0 = -2.5; }, 'terms[4].s0: expected a finite number ≥ 0, got -2.5'],
    ['n ≥ 1', allKindsAngstrom, (m) => { m.terms[5].n = 0; }, 'terms[5].n: expected an integer ≥ 1, got 0'],
    ['phase a number', allKindsAngstrom, (m) => { m.terms[5].phase = '180'; }, 'terms[5].phase: expected a finite number (an angle in degrees), got "180"'],
    ['torsion k a number', allKindsAngstrom, (m) => { m.terms[5].k = null; }, 'terms[5].k: expected a finite number, got null'],
    ['c of 6, not 5', allKindsAngstrom, (m) => { m.terms[6].c = [1, 2, 3, 4, 5]; }, 'terms[6].c: expected an array of exactly 6 finite numbers (C0..C5), got 5 numbers'],
    ['c of 6, not 7', allKindsAngstrom, (m) => { m.terms[6].c.push(0); }, 'terms[6].c: expected an array of exactly 6 finite numbers (C0..C5), got 7 numbers'],
    ['c an array', allKindsAngstrom, (m) => { m.terms[6].c = 1; }, 'terms[6].c: expected an array of exactly 6 finite numbers (C0..C5), got 1'],
    ['c numbers', allKindsAngstrom, (m) => { m.terms[6].c[2] = 'x'; }, 'terms[6].c[2]: expected a finite number, got "x"'],
    ['improper k ≥ 0', allKindsAngstrom, (m) => { m.terms[7].k = -10; }, 'terms[7].k: expected a finite number ≥ 0, got -10'],
    ['xi0 a number', allKindsAngstrom, (m) => { m.terms[7].xi0 = false; }, 'terms[7].xi0: expected a finite number (an angle in degrees), got false'],
    ['x0 of 3', allKindsAngstrom, (m) => { m.terms[8].x0 = [3.5, 1.4]; }, 'terms[8].x0: expected [x, y, z] (an array of 3 finite numbers), got 2 numbers'],
    ['x0 an array', allKindsAngstrom, (m) => { m.terms[8].x0 = { x: 1 }; }, 'terms[8].x0: expected [x, y, z] (an array of 3 finite numbers), got an object'],
    ['x0 numbers', allKindsAngstrom, (m) => { m.terms[8].x0[0] = '3.5'; }, 'terms[8].x0[0]: expected a finite number, got "3.5"'],
    ['flat ≥ 0', allKindsAngstrom, (m) => { m.terms[8].flat = -0.2; }, 'terms[8].flat: expected a finite number ≥ 0, got -0.2'],
    ['position-restraint one atom', allKindsAngstrom, (m) => { m.terms[8].atoms = []; }, 'terms[8].atoms: position-restraint needs 1 atom, got 0'],
    ['lower ≤ upper', allKindsAngstrom, (m) => { m.terms[10].lower = 2.5; m.terms[10].upper = 2; }, 'terms[10]: distance-restraint needs lower ≤ upper, got lower 2.5 > upper 2'],
    ['lower a number', allKindsAngstrom, (m) => { m.terms[10].lower = 'near'; }, 'terms[10].lower: expected a finite number, got "near"'],
    ['restraint k ≥ 0', allKindsAngstrom, (m) => { m.terms[10].k = -3; }, 'terms[10].k: expected a finite number ≥ 0, got -3'],
    ['Infinity (not JSON)', allKindsAngstrom, (m) => { m.terms[0].k = Infinity; }, 'terms[0].k: expected JSON data, got Infinity'],
  ]);

  it('accepts the edges of the ranges: theta0 0 and 180, lower = upper, k 0, negative torsion k', () => {
    const m = edited(allKindsAngstrom(), (x) => {
      x.terms[2].theta0 = 0;
      x.terms[3].theta0 = 180;
      x.terms[10].lower = 3.5;
      x.terms[10].upper = 3.5;
      x.terms[0].k = 0;
      x.terms[5].k = -5;
      x.terms[5].phase = -720;
    });
    expect(readModelFile(m).terms).toEqual(m.terms);
  });
});

describe('nonbonded', () => {
  const nb = allKindsAngstrom;
  runCases([
    ['rmin one per atom', chain, (m) => { m.nonbonded = { lennardJones: { rmin: Array(30).fill(3.8), epsilon: Array(31).fill(0.1), combination: 'geometric' } }; }, 'nonbonded.lennardJones.rmin: expected 31 values (one per atom), got 30'],
    ['epsilon one per atom', nb, (m) => { m.nonbonded.lennardJones.epsilon.push(0.1); }, 'nonbonded.lennardJones.epsilon: expected 5 values (one per atom), got 6'],
    ['rmin > 0', nb, (m) => { m.nonbonded.lennardJones.rmin[2] = 0; }, 'nonbonded.lennardJones.rmin[2]: expected a finite number > 0, got 0'],
    ['epsilon ≥ 0', nb, (m) => { m.nonbonded.lennardJones.epsilon[0] = -0.1; }, 'nonbonded.lennardJones.epsilon[0]: expected a finite number ≥ 0, got -0.1'],
    ['rmin an array', nb, (m) => { m.nonbonded.lennardJones.rmin = 3.8; }, 'nonbonded.lennardJones.rmin: expected an array of one rmin per atom, got 3.8'],
    ['combination known', nb, (m) => { m.nonbonded.lennardJones.combination = 'arithmetic'; }, 'nonbonded.lennardJones.combination: unknown combination rule "arithmetic" (known: geometric, lorentz-berthelot)'],
    ['combination required', nb, (m) => { delete m.nonbonded.lennardJones.combination; }, 'nonbonded.lennardJones: missing required field "combination"'],
    ['rmin required', nb, (m) => { delete m.nonbonded.lennardJones.rmin; }, 'nonbonded.lennardJones: missing required field "rmin"'],
    ['lennardJones keys', nb, (m) => { m.nonbonded.lennardJones.sigma = [1]; }, 'nonbonded.lennardJones: unknown key "sigma" (allowed: rmin, epsilon, combination)'],
    ['dielectric > 0', nb, (m) => { m.nonbonded.coulomb.dielectric = 0; }, 'nonbonded.coulomb.dielectric: expected a finite number > 0, got 0'],
    ['dielectric required', nb, (m) => { m.nonbonded.coulomb = {}; }, 'nonbonded.coulomb: missing required field "dielectric"'],
    ['bondSeparation an integer', nb, (m) => { m.nonbonded.exclusions.bondSeparation = 1.5; }, 'nonbonded.exclusions.bondSeparation: expected an integer ≥ 0, got 1.5'],
    ['bondSeparation ≥ 0', nb, (m) => { m.nonbonded.exclusions.bondSeparation = -1; }, 'nonbonded.exclusions.bondSeparation: expected an integer ≥ 0, got -1'],
    ['scale14 ≥ 0', nb, (m) => { m.nonbonded.exclusions.scale14.coulomb = -1; }, 'nonbonded.exclusions.scale14.coulomb: expected a finite number ≥ 0, got -1'],
    ['scale14 keys', nb, (m) => { m.nonbonded.exclusions.scale14.lj = 1; }, 'nonbonded.exclusions.scale14: unknown key "lj" (allowed: lennardJones, coulomb)'],
    ['exclusions keys', nb, (m) => { m.nonbonded.exclusions.scale13 = 0; }, 'nonbonded.exclusions: unknown key "scale13" (allowed: bondSeparation, scale14)'],
    ['cutoff > 0', nb, (m) => { m.nonbonded.cutoff = 0; }, 'nonbonded.cutoff: expected null or a finite number > 0, got 0'],
    ['cutoff a number', nb, (m) => { m.nonbonded.cutoff = '9'; }, 'nonbonded.cutoff: expected null or a finite number > 0, got "9"'],
    ['nonbonded keys', nb, (m) => { m.nonbonded.lj = {}; }, 'nonbonded: unknown key "lj" (allowed: lennardJones, coulomb, exclusions, cutoff)'],
    ['nonbonded an object', nb, (m) => { m.nonbonded = []; }, 'nonbonded: expected an object, got an array'],
  ]);

  it('makes every part optional', () => {
    for (const nonbonded of [{}, { cutoff: null }, { coulomb: { dielectric: 1 } }, { exclusions: {} }, { exclusions: { scale14: { coulomb: 0.5 } } }]) {
      expect(readModelFile(edited(allKindsAngstrom(), (m) => { m.nonbonded = nonbonded; })).nonbonded).toEqual(nonbonded);
    }
  });
});

describe('frozen and constraints', () => {
  const fd = (i: number, j: number, length?: number) => ({ kind: 'fixed-distance', atoms: [i, j], ...(length === undefined ? {} : { length }) });
  runCases([
    ['frozen an array', chain, (m) => { m.frozen = 3; }, 'frozen: expected an array of atom indices, got 3'],
    ['frozen indices', chain, (m) => { m.frozen = ['a']; }, 'frozen[0]: expected an atom index (an integer ≥ 0), got "a"'],
    ['frozen in range', chain, (m) => { m.frozen = [0, 1, 40]; }, `frozen[2]: ${RANGE_40}`],
    ['frozen distinct', chain, (m) => { m.frozen = [0, 5, 6, 5]; }, 'frozen[3]: atom 5 is listed twice (first at frozen[1])'],
    ['constraints an array', chain, (m) => { m.constraints = {}; }, 'constraints: expected an array of constraints, got an object'],
    ['constraint an object', chain, (m) => { m.constraints = [[0, 1]]; }, 'constraints[0]: expected a constraint (an object with "kind"), got an array'],
    ['constraint kind known', chain, (m) => { m.constraints = [{ ...fd(0, 1), kind: 'fixed-angle' }]; }, 'constraints[0].kind: unknown constraint kind "fixed-angle" (known: fixed-distance)'],
    ['constraint kind required', chain, (m) => { m.constraints = [{ atoms: [0, 1] }]; }, 'constraints[0]: missing required field "kind"'],
    ['constraint atoms required', chain, (m) => { m.constraints = [{ kind: 'fixed-distance' }]; }, 'constraints[0]: missing required field "atoms"'],
    ['constraint two atoms', chain, (m) => { m.constraints = [{ kind: 'fixed-distance', atoms: [0, 1, 2] }]; }, 'constraints[0].atoms: fixed-distance needs 2 atoms, got 3'],
    ['constraint atoms distinct', chain, (m) => { m.constraints = [fd(3, 3)]; }, 'constraints[0].atoms[1]: atom 3 is repeated in this constraint'],
    ['constraint atoms in range', chain, (m) => { m.constraints = [fd(3, 40)]; }, `constraints[0].atoms[1]: ${RANGE_40}`],
    ['constraint length > 0', chain, (m) => { m.constraints = [fd(3, 4, 0)]; }, 'constraints[0].length: expected a finite number > 0, got 0'],
    ['constraint keys', chain, (m) => { m.constraints = [{ ...fd(3, 4), tolerance: 1e-8 }]; }, 'constraints[0]: unknown key "tolerance" (allowed: kind, atoms, length)'],
    ['a pair constrained twice', chain, (m) => { m.constraints = [fd(0, 1), fd(2, 7), fd(3, 4), fd(5, 6), fd(7, 2)]; }, 'constraints[4]: pair 7-2 is constrained twice (first at constraints[1])'],
    ['between two frozen atoms', chain, (m) => { m.frozen = [5, 3]; m.constraints = [fd(3, 5)]; }, 'constraints[0]: atoms 3 and 5 are both frozen; a constraint between two frozen atoms is not allowed'],
    ['coincident atoms, no length', chain, (m) => { m.coordinates[5] = [4.5, 0, 0]; m.constraints = [fd(3, 5)]; }, 'constraints[0]: atoms 3 and 5 are at the same position, so "length" cannot default to their distance; give "length"'],
  ]);

  it('accepts coincident atoms when the length is given, and one frozen atom', () => {
    const m = edited(chain(), (x) => {
      x.coordinates[5] = [4.5, 0, 0];
      x.frozen = [3];
      x.constraints = [fd(3, 5, 1.5)];
    });
    expect(readModelFile(m).constraints).toEqual([fd(3, 5, 1.5)]);
  });
});

describe('objects that are not JSON data', () => {
  runCases([
    ['a function', specExample, (m) => { m.metadata = { hook: () => 0 }; }, 'metadata.hook: expected JSON data, got a function'],
    ['undefined', specExample, (m) => { m.title = undefined; }, 'title: expected JSON data, got undefined'],
    ['a class instance', specExample, (m) => { m.atoms[0] = new (class Atom { element = 'O'; })(); }, 'atoms[0]: expected JSON data, got an Atom'],
    ['a Date in metadata', specExample, (m) => { m.metadata = { made: { on: new Date(0) } }; }, 'metadata.made.on: expected JSON data, got a Date'],
    ['a key needing quotes', specExample, (m) => { m.metadata = { 'made on': Number.NaN }; }, 'metadata["made on"]: expected JSON data, got NaN'],
  ]);
});

describe('which problem is reported', () => {
  it('reports the first in document order, schema and cross-field alike', () => {
    expectModelError(
      () => readModelFile(edited(chain(), (m) => { m.terms[1].atoms = [1, 40]; m.terms[3].k = -1; })),
      `terms[1].atoms[1]: ${RANGE_40}`,
    );
    expectModelError(
      () => readModelFile(edited(chain(), (m) => { m.terms[1].k = -1; m.terms[3].atoms = [3, 40]; })),
      'terms[1].k: expected a finite number ≥ 0, got -1',
    );
    expectModelError(
      () => readModelFile(edited(chain(), (m) => { m.atoms[30].element = 'Q'; m.coordinates.pop(); })),
      'atoms[30].element: unknown element "Q" (expected a chemical symbol as written in the periodic table, e.g. C, Cl)',
    );
  });

  it('orders keys within an object as written', () => {
    const early = { kind: 'harmonic-bond', r_0: 1, atoms: [0, 1], k: -1, r0: 1 };
    const late = { kind: 'harmonic-bond', atoms: [0, 1], k: -1, r0: 1, r_0: 1 };
    expectModelError(() => readModelFile(edited(chain(), (m) => { m.terms[0] = early; })), 'terms[0]: unknown key "r_0" (allowed: kind, atoms, k, r0)');
    expectModelError(() => readModelFile(edited(chain(), (m) => { m.terms[0] = late; })), 'terms[0].k: expected a finite number ≥ 0, got -1');
    // A missing field is placed at the end of its object.
    expectModelError(
      () => readModelFile(edited(chain(), (m) => { m.terms[0] = { kind: 'harmonic-bond', atoms: [0, 1], r0: 'x' }; })),
      'terms[0].r0: expected a finite number ≥ 0, got "x"',
    );
  });

  it('reports a wrong atom count before what is wrong inside the list', () => {
    expectModelError(() => readModelFile(edited(chain(), (m) => { m.terms[0].atoms = [0, 0, 40]; })), 'terms[0].atoms: harmonic-bond needs 2 atoms, got 3');
  });

  it('reports format, then version, before anything else', () => {
    const broken = (m: Loose) => { m.terms[0].k = -1; m.atoms[0].element = 'X'; };
    const formatLast = edited(chain(), (m) => { broken(m); delete m.format; m.format = 'other'; });
    expectModelError(() => readModelFile(formatLast), 'format: expected "strainwise-model", got "other"');
    const versionLast = edited(chain(), (m) => { broken(m); delete m.version; m.version = 3; });
    expectModelError(() => readModelFile(versionLast), 'version: unknown version 3 (known: 1)');
    const noFormat = edited(chain(), (m) => { broken(m); delete m.format; });
    expectModelError(() => readModelFile(noFormat), 'missing required key "format"');
  });

  it('reports a JSON syntax error before anything about the model', () => {
    expectModelError(() => readModelFile('{"format": "x",, }'), 'line 1, column 16: expected a key in double quotes');
  });

  it('throws a ModelError with place and detail separated', () => {
    const e = expectModelError(
      () => readModelFile(edited(chain(), (m) => { m.terms[12].atoms = [12, 40]; })),
      `terms[12].atoms[1]: ${RANGE_40}`,
    );
    expect(e).toBeInstanceOf(ModelError);
    expect(e.name).toBe('ModelError');
    expect(e.place).toBe('terms[12].atoms[1]');
    expect(e.detail).toBe(RANGE_40);
    const top = expectModelError(() => readModelFile(edited(chain(), (m) => { delete m.atoms; })), 'missing required key "atoms"');
    expect(top.place).toBe('');
  });

  it('reports a duplicated key in the text, at the top level and nested', () => {
    expectModelError(() => readModelFile('{"format": "strainwise-model", "format": "strainwise-model"}'), 'duplicated key "format"');
    const text = JSON.stringify(chain()).replace('"k":300,', '"k":300,"k":301,');
    expectModelError(() => readModelFile(text), 'terms[0]: duplicated key "k"');
  });

  it('refuses a "__proto__" key as unknown, without touching any prototype', () => {
    const text = JSON.stringify(specExample()).replace('{"format"', '{"__proto__": {"polluted": true}, "format"');
    expectModelError(() => readModelFile(text), `unknown key "__proto__" (allowed: ${TOP_KEYS})`);
    expect(({} as { polluted?: unknown }).polluted).toBeUndefined();
  });
});
