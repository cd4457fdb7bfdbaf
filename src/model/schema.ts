/**
 * The schema of the model file (format `strainwise-model`, version 1), and
 * the TypeScript types of its records, inferred from it.
 *
 * Objects are strict everywhere (an unknown key is refused) except inside
 * `metadata`, which is any JSON object. Every issue carries a message that
 * says what was expected and what came instead (`expected a finite number
 * ≥ 0, got -5`). Rules that span fields — atom indices in range, atoms
 * repeated within a term, counts against the number of atoms, `lower ≤
 * upper`, pairs listed twice — are not here; `readModelFile` checks them
 * after this schema. Defaults are not filled in by the schema: an optional
 * field left out stays out (see {@link MODEL_DEFAULTS}).
 * @module
 */

import { z } from 'zod';
import { ELEMENT_SYMBOLS } from '../elements.js';
import { TERM_KINDS, type TermKind } from '../terms/table.js';
import type { EnergyUnit, LengthUnit } from '../units.js';
import { describeValue } from './json.js';

/** The value of the `format` key. */
export const MODEL_FORMAT = 'strainwise-model';
/** The model-file versions this reader knows. */
export const MODEL_VERSIONS: readonly number[] = [1];

/** The defaults of the optional fields, as the spec names them. */
export const MODEL_DEFAULTS = {
  /** `atoms[].charge`, elementary charges. */
  charge: 0,
  /** `position-restraint` `flat`, length. */
  flat: 0,
  /** `nonbonded.exclusions.bondSeparation`. */
  bondSeparation: 2,
  /** `nonbonded.exclusions.scale14.lennardJones` and `.coulomb`. */
  scale14: 1,
  /** `nonbonded.cutoff`: none, all pairs. */
  cutoff: null,
} as const;

/** The one constraint kind of version 1. */
export const CONSTRAINT_KINDS = ['fixed-distance'] as const;

/** Lennard-Jones combination rules. */
export const COMBINATION_RULES = ['geometric', 'lorentz-berthelot'] as const;

// ---------------------------------------------------------------------------
// Message helpers

type Issue = { readonly code?: string; readonly input?: unknown };

/** Every issue of the schema it is attached to reads `expected WHAT, got VALUE`. */
function expected(what: string) {
  return { error: (issue: Issue) => `expected ${what}, got ${describeValue(issue.input)}` };
}

/** `2 numbers`, `1 number`, or `3 values` when not all entries are numbers. */
function countOf(list: readonly unknown[]): string {
  const noun = list.every((v) => typeof v === 'number') ? 'number' : 'value';
  return `${list.length} ${noun}${list.length === 1 ? '' : 's'}`;
}

/** `expected LIST, got 2 numbers` for an array of the wrong length; `got VALUE` otherwise. */
function expectedList(what: string) {
  return {
    error: (issue: Issue) =>
      `expected ${what}, got ${Array.isArray(issue.input) ? countOf(issue.input) : describeValue(issue.input)}`,
  };
}

/** A strict object whose own issues are `expected WHAT, got …` and `unknown key "x" (allowed: …)`. */
function strictRecord<T extends z.core.$ZodLooseShape>(what: string, shape: T) {
  const allowed = Object.keys(shape).join(', ');
  return z.strictObject(shape, {
    error: (issue: Issue & { keys?: readonly string[] }) =>
      issue.code === 'unrecognized_keys' && issue.keys
        ? `unknown key ${JSON.stringify(issue.keys[0])} (allowed: ${allowed})`
        : `expected ${what}, got ${describeValue(issue.input)}`,
  });
}

/** One of a fixed set of names: `unknown WHAT "x" (known: a, b)` for a string, else `expected a WHAT (known: …), got …`. */
function nameFrom<const T extends readonly [string, ...string[]]>(what: string, names: T) {
  const known = names.join(', ');
  return z.enum(names, {
    error: (issue: Issue) =>
      typeof issue.input === 'string'
        ? `unknown ${what} ${describeValue(issue.input)} (known: ${known})`
        : `expected ${article(what)} ${what} (known: ${known}), got ${describeValue(issue.input)}`,
  });
}

function article(word: string): string {
  return /^[aeiou]/i.test(word) ? 'an' : 'a';
}

// ---------------------------------------------------------------------------
// Numbers

const finite = (what = 'a finite number') => z.number(expected(what));
const atLeast = (min: number, what = `a finite number ≥ ${min}`) => z.number(expected(what)).min(min, expected(what));
const above = (min: number, what = `a finite number > ${min}`) => z.number(expected(what)).gt(min, expected(what));
const integerAtLeast = (min: number) => {
  const what = `an integer ≥ ${min}`;
  return z.number(expected(what)).int(expected(what)).min(min, expected(what));
};
const angleDegrees = () => finite('a finite number (an angle in degrees)');
const theta0 = () => {
  const what = 'an angle in degrees in [0, 180]';
  return z.number(expected(what)).min(0, expected(what)).max(180, expected(what));
};

const openTheta0 = () => {
  const what = 'an angle in degrees in (0, 180) (for a linear angle use periodic-angle with n 1 and theta0 180)';
  return z.number(expected(what)).gt(0, expected(what)).lt(180, expected(what));
};
const omega0 = () => {
  const what = 'an angle in degrees in [0, 90]';
  return z.number(expected(what)).min(0, expected(what)).max(90, expected(what));
};

/** A 0-based atom index; whether it is in range is checked against the atom count later. */
const atomIndex = () => {
  const what = 'an atom index (an integer ≥ 0)';
  return z.number(expected(what)).int(expected(what)).min(0, expected(what));
};

/** Exactly `n` atom indices, with `needs n atoms, got m` for another count. */
function atomList<const N extends 1 | 2 | 3 | 4>(owner: string, n: N) {
  const noun = n === 1 ? 'atom' : 'atoms';
  const items = Array.from({ length: n }, atomIndex) as unknown as IndexTuple<N>;
  return z.tuple(items, {
    error: (issue: Issue) =>
      Array.isArray(issue.input)
        ? `${owner} needs ${n} ${noun}, got ${issue.input.length}`
        : `${owner} needs an array of ${n} atom ${n === 1 ? 'index' : 'indices'}, got ${describeValue(issue.input)}`,
  });
}

type Index = ReturnType<typeof atomIndex>;
type IndexTuple<N extends number> = N extends 1
  ? [Index]
  : N extends 2
    ? [Index, Index]
    : N extends 3
      ? [Index, Index, Index]
      : [Index, Index, Index, Index];

/** `[x, y, z]`: three finite numbers. */
const vector3 = (what: string) => z.tuple([finite(), finite(), finite()], expectedList(what));

// ---------------------------------------------------------------------------
// Units, atoms

// The same lists as LENGTH_UNITS and ENERGY_UNITS, as tuples for the enum (checked at compile time below).
const LENGTH_NAMES = ['angstrom', 'nanometer'] as const;
const ENERGY_NAMES = ['kcal/mol', 'kJ/mol'] as const;

const unitsSchema = strictRecord('an object with "length" and "energy"', {
  length: nameFrom('length unit', LENGTH_NAMES),
  energy: nameFrom('energy unit', ENERGY_NAMES),
});

const elementSchema = z.enum(ELEMENT_SYMBOLS, {
  error: (issue: Issue) => {
    const input = issue.input;
    if (typeof input !== 'string') {
      return `expected a chemical symbol such as "C" or "Cl", got ${describeValue(input)}`;
    }
    const shown = describeValue(input);
    if (input === 'D' || input === 'T') {
      return `unknown element ${shown} (write an isotope as its element, here "H", with its own "mass")`;
    }
    const match = ELEMENT_SYMBOLS.find((s) => s.toLowerCase() === input.toLowerCase());
    if (match !== undefined) {
      return `unknown element ${shown} (elements are case-sensitive, e.g. ${match})`;
    }
    return `unknown element ${shown} (expected a chemical symbol as written in the periodic table, e.g. C, Cl)`;
  },
});

/** One `atoms[]` entry. */
export const atomRecordSchema = strictRecord('an atom record (an object with "element")', {
  element: elementSchema,
  name: z.string(expected('a string')).optional(),
  mass: above(0, 'a mass in dalton (a finite number > 0)').optional(),
  charge: finite('a charge in elementary charges (a finite number)').optional(),
  type: z.string(expected('a string')).optional(),
});

// ---------------------------------------------------------------------------
// Terms

const term = <K extends TermKind, S extends z.core.$ZodLooseShape>(kind: K, shape: S) =>
  strictRecord('a term (an object with "kind")', { kind: z.literal(kind), ...shape });

/** The schema of each term kind, keyed by kind. */
export const TERM_SCHEMAS = {
  'harmonic-bond': term('harmonic-bond', {
    atoms: atomList('harmonic-bond', 2),
    k: atLeast(0),
    r0: atLeast(0),
  }),
  'morse-bond': term('morse-bond', {
    atoms: atomList('morse-bond', 2),
    D: atLeast(0),
    a: atLeast(0),
    r0: atLeast(0),
  }),
  'harmonic-angle': term('harmonic-angle', {
    atoms: atomList('harmonic-angle', 3),
    k: atLeast(0),
    theta0: theta0(),
  }),
  'cosine-angle': term('cosine-angle', {
    atoms: atomList('cosine-angle', 3),
    k: atLeast(0),
    theta0: theta0(),
  }),
  'urey-bradley': term('urey-bradley', {
    atoms: atomList('urey-bradley', 3),
    k: atLeast(0),
    s0: atLeast(0),
  }),
  'periodic-dihedral': term('periodic-dihedral', {
    atoms: atomList('periodic-dihedral', 4),
    k: finite(),
    n: integerAtLeast(1),
    phase: angleDegrees(),
  }),
  'ryckaert-bellemans': term('ryckaert-bellemans', {
    atoms: atomList('ryckaert-bellemans', 4),
    c: z.tuple(
      [finite(), finite(), finite(), finite(), finite(), finite()],
      expectedList('an array of exactly 6 finite numbers (C0..C5)'),
    ),
  }),
  'harmonic-improper': term('harmonic-improper', {
    atoms: atomList('harmonic-improper', 4),
    k: atLeast(0),
    xi0: angleDegrees(),
  }),
  'position-restraint': term('position-restraint', {
    atoms: atomList('position-restraint', 1),
    k: atLeast(0),
    x0: vector3('[x, y, z] (an array of 3 finite numbers)'),
    flat: atLeast(0).optional(),
  }),
  'distance-restraint': term('distance-restraint', {
    atoms: atomList('distance-restraint', 2),
    k: atLeast(0),
    lower: finite(),
    upper: finite(),
  }),
  'cosine-series-angle': term('cosine-series-angle', {
    atoms: atomList('cosine-series-angle', 3),
    k: atLeast(0),
    theta0: openTheta0(),
  }),
  'periodic-angle': term('periodic-angle', {
    atoms: atomList('periodic-angle', 3),
    k: atLeast(0),
    n: integerAtLeast(1),
    theta0: theta0(),
  }),
  inversion: term('inversion', {
    atoms: atomList('inversion', 4),
    k: atLeast(0),
    omega0: omega0(),
  }),
} as const satisfies Record<TermKind, z.ZodType>;

const KNOWN_KINDS = TERM_KINDS.join(', ');

/** One `terms[]` entry, discriminated by `kind`. */
export const termRecordSchema = z.discriminatedUnion(
  'kind',
  [
    TERM_SCHEMAS['harmonic-bond'],
    TERM_SCHEMAS['morse-bond'],
    TERM_SCHEMAS['harmonic-angle'],
    TERM_SCHEMAS['cosine-angle'],
    TERM_SCHEMAS['urey-bradley'],
    TERM_SCHEMAS['periodic-dihedral'],
    TERM_SCHEMAS['ryckaert-bellemans'],
    TERM_SCHEMAS['harmonic-improper'],
    TERM_SCHEMAS['position-restraint'],
    TERM_SCHEMAS['distance-restraint'],
    TERM_SCHEMAS['cosine-series-angle'],
    TERM_SCHEMAS['periodic-angle'],
    TERM_SCHEMAS.inversion,
  ],
  {
    error: (issue: Issue) => {
      const input = issue.input;
      if (issue.code !== 'invalid_union' || input === null || typeof input !== 'object' || Array.isArray(input)) {
        return `expected a term (an object with "kind"), got ${describeValue(input)}`;
      }
      const kind = (input as { kind?: unknown }).kind;
      // A missing "kind" is reported as a missing field by the reader, which sees the key is absent.
      return typeof kind === 'string'
        ? `unknown kind ${describeValue(kind)} (known: ${KNOWN_KINDS})`
        : `expected a term kind (known: ${KNOWN_KINDS}), got ${describeValue(kind)}`;
    },
  },
);

// ---------------------------------------------------------------------------
// Nonbonded, constraints, the file

const lennardJonesSchema = strictRecord('an object with "rmin", "epsilon" and "combination"', {
  rmin: z.array(above(0), expected('an array of one rmin per atom')),
  epsilon: z.array(atLeast(0), expected('an array of one epsilon per atom')),
  combination: nameFrom('combination rule', COMBINATION_RULES),
});

/** The optional `nonbonded` block. */
export const nonbondedRecordSchema = strictRecord('an object', {
  lennardJones: lennardJonesSchema.optional(),
  coulomb: strictRecord('an object with "dielectric"', { dielectric: above(0) }).optional(),
  exclusions: strictRecord('an object', {
    bondSeparation: integerAtLeast(0).optional(),
    scale14: strictRecord('an object', {
      lennardJones: atLeast(0).optional(),
      coulomb: atLeast(0).optional(),
    }).optional(),
  }).optional(),
  cutoff: above(0, 'null or a finite number > 0').nullable().optional(),
});

/** One `constraints[]` entry. */
export const constraintRecordSchema = strictRecord('a constraint (an object with "kind")', {
  kind: nameFrom('constraint kind', CONSTRAINT_KINDS),
  atoms: atomList('fixed-distance', 2),
  length: above(0).optional(),
});

const versionSchema = z.literal(1, {
  error: (issue: Issue) =>
    typeof issue.input === 'number'
      ? `unknown version ${describeValue(issue.input)} (known: ${MODEL_VERSIONS.join(', ')})`
      : `expected the number 1 (known versions: ${MODEL_VERSIONS.join(', ')}), got ${describeValue(issue.input)}`,
});

/** The whole model file. Cross-field rules are checked by `readModelFile`, not here. */
export const modelFileSchema = strictRecord('a JSON object at the top level', {
  format: z.literal(MODEL_FORMAT, expected(JSON.stringify(MODEL_FORMAT))),
  version: versionSchema,
  units: unitsSchema,
  atoms: z.array(atomRecordSchema, expected('an array of atom records')),
  coordinates: z.array(vector3('[x, y, z]'), expected('an array of [x, y, z] rows')),
  terms: z.array(termRecordSchema, expected('an array of terms')),
  bonds: z.array(z.tuple([atomIndex(), atomIndex()], expectedList('a pair of atom indices [i, j]')), expected('an array of [i, j] atom pairs')).optional(),
  nonbonded: nonbondedRecordSchema.optional(),
  frozen: z.array(atomIndex(), expected('an array of atom indices')).optional(),
  constraints: z.array(constraintRecordSchema, expected('an array of constraints')).optional(),
  title: z.string(expected('a string')).optional(),
  metadata: z.record(z.string(), z.json(), expected('a JSON object')).optional(),
});

/** A model file, as read and validated. */
export type ModelFile = z.infer<typeof modelFileSchema>;
/** One `atoms[]` entry. */
export type AtomRecord = z.infer<typeof atomRecordSchema>;
/** One `terms[]` entry: a union of one record type per kind, discriminated by `kind`. */
export type TermRecord = z.infer<typeof termRecordSchema>;
/** The record type of one term kind, e.g. `TermRecordOf<'harmonic-bond'>`. */
export type TermRecordOf<K extends TermKind> = Extract<TermRecord, { kind: K }>;
/** The `nonbonded` block. */
export type NonbondedRecord = z.infer<typeof nonbondedRecordSchema>;
/** One `constraints[]` entry. */
export type ConstraintRecord = z.infer<typeof constraintRecordSchema>;
/** The `metadata` object: any JSON object. */
export type ModelMetadata = NonNullable<ModelFile['metadata']>;

// Compile-time checks: the schema's kinds and units are exactly those of the kernels and of src/units.ts.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const kindsMatch: Same<TermRecord['kind'], TermKind> = true;
const lengthsMatch: Same<(typeof LENGTH_NAMES)[number], LengthUnit> = true;
const energiesMatch: Same<(typeof ENERGY_NAMES)[number], EnergyUnit> = true;
void [kindsMatch, lengthsMatch, energiesMatch];
