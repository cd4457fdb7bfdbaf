import fc from 'fast-check';
import { describe, expect, expectTypeOf, it } from 'vitest';
import type { ElementSymbol } from '../../src/elements.js';
import { ModelError } from '../../src/errors.js';
import type {
  AtomRecord,
  ConstraintRecord,
  ModelFile,
  NonbondedRecord,
  TermRecord,
  TermRecordOf,
} from '../../src/model/schema.js';
import { TERM_SCHEMAS } from '../../src/model/schema.js';
import type { TermKind } from '../../src/terms/table.js';
import type { Units } from '../../src/units.js';
import { readModelFile } from '../../src/model/validate.js';
import { KIND_LAYOUTS, TERM_KINDS } from '../../src/terms/table.js';
import {
  allKindsAngstrom,
  allKindsNanometer,
  chain,
  edited,
  expectModelError,
  type Loose,
  SPEC_EXAMPLE_TEXT,
  specExample,
} from './fixtures.js';

/** The expected result of reading `m`: the same, with constraint lengths filled in. */
function withLengths(m: Loose, lengths: number[]): Loose {
  return edited(m, (x) => {
    (x.constraints ?? []).forEach((c: Loose, i: number) => {
      if (c.length === undefined) c.length = lengths[i];
    });
  });
}

describe('valid models', () => {
  it('reads the spec example, as text and as an object, unchanged', () => {
    const fromText = readModelFile(SPEC_EXAMPLE_TEXT);
    expect(fromText).toEqual(JSON.parse(SPEC_EXAMPLE_TEXT));
    expect(readModelFile(specExample())).toEqual(fromText);
    expect(fromText.atoms[1].mass).toBe(1.008);
    expect(fromText.atoms[0].mass).toBeUndefined();
  });

  it('reads a model of all ten kinds in ångström and kcal/mol', () => {
    const m = allKindsAngstrom();
    const file = readModelFile(m);
    expect(new Set(file.terms.map((t) => t.kind))).toEqual(new Set(TERM_KINDS));
    // Atoms 0 (0,0,0) and 4 (3,4,0): distance 5 exactly (3-4-5 triangle).
    expect(file).toEqual(withLengths(m, [5]));
    expect(readModelFile(JSON.stringify(m, null, 2))).toEqual(file);
  });

  it('reads a model of all ten kinds in nanometre and kJ/mol', () => {
    const m = allKindsNanometer();
    const file = readModelFile(m);
    expect(new Set(file.terms.map((t) => t.kind))).toEqual(new Set(TERM_KINDS));
    expect(file.units).toEqual({ length: 'nanometer', energy: 'kJ/mol' });
    // Atoms 0 (0,0,0) and 4 (0.3,0.4,0): distance 0.5 (to rounding).
    expect(file.constraints?.[0].length).toBeCloseTo(0.5, 15);
    expect(readModelFile(JSON.stringify(m))).toEqual(file);
  });

  it('accepts empty atoms and terms', () => {
    const m = edited(specExample(), (x) => {
      x.atoms = [];
      x.coordinates = [];
      x.terms = [];
      delete x.bonds;
    });
    expect(readModelFile(m)).toEqual(m);
  });

  it('reads a 31-atom chain', () => {
    const file = readModelFile(chain());
    expect(file.atoms).toHaveLength(31);
    expect(file.terms).toHaveLength(59);
  });

  it('types the records from the schema', () => {
    const file: ModelFile = readModelFile(allKindsAngstrom());
    const term = file.terms[0];
    if (term.kind === 'harmonic-bond') {
      const pair: [number, number] = term.atoms;
      expect(pair).toEqual([0, 1]);
      expect(term.k + term.r0).toBe(621.53);
    } else {
      expect.unreachable('terms[0] is a harmonic bond');
    }
  });

  it('infers precise types, with no any (checked by tsc)', () => {
    expectTypeOf<ModelFile>().not.toBeAny();
    expectTypeOf<ModelFile['units']>().toEqualTypeOf<{ length: Units['length']; energy: Units['energy'] }>();
    expectTypeOf<AtomRecord>().toEqualTypeOf<{ element: ElementSymbol; name?: string; mass?: number; charge?: number; type?: string }>();
    expectTypeOf<TermRecord['kind']>().toEqualTypeOf<TermKind>();
    expectTypeOf<TermRecordOf<'harmonic-bond'>>().toEqualTypeOf<{ kind: 'harmonic-bond'; atoms: [number, number]; k: number; r0: number }>();
    expectTypeOf<TermRecordOf<'ryckaert-bellemans'>['c']>().toEqualTypeOf<[number, number, number, number, number, number]>();
    expectTypeOf<TermRecordOf<'position-restraint'>>().toEqualTypeOf<{
      kind: 'position-restraint';
      atoms: [number];
      k: number;
      x0: [number, number, number];
      flat?: number;
    }>();
    expectTypeOf<ConstraintRecord>().toEqualTypeOf<{ kind: 'fixed-distance'; atoms: [number, number]; length?: number }>();
    expectTypeOf<NonNullable<NonbondedRecord['cutoff']>>().toEqualTypeOf<number>();
    expectTypeOf<ModelFile['coordinates'][number]>().toEqualTypeOf<[number, number, number]>();
    expectTypeOf<NonNullable<ModelFile['metadata']>[string]>().not.toBeAny();
  });

  it('has one schema per kind, with the atom count of the kernels', () => {
    for (const kind of TERM_KINDS) {
      const atoms = [0, 1, 2, 3].slice(0, KIND_LAYOUTS[kind].arity);
      const wrong = [0, 1, 2, 3, 4].slice(0, KIND_LAYOUTS[kind].arity + 1);
      const shape = TERM_SCHEMAS[kind].shape;
      expect(shape.atoms.safeParse(atoms).success, kind).toBe(true);
      expect(shape.atoms.safeParse(wrong).success, kind).toBe(false);
    }
  });
});

describe('normalisation', () => {
  it('fills in a missing constraint length with the distance in coordinates', () => {
    const m = edited(chain(), (x) => {
      x.coordinates[7] = [10.5 + 3, 4, 12];
      x.constraints = [
        { kind: 'fixed-distance', atoms: [0, 1] },
        { kind: 'fixed-distance', atoms: [3, 4], length: 1.2 },
        { kind: 'fixed-distance', atoms: [6, 7] },
      ];
    });
    const file = readModelFile(m);
    // Hand-checked: atoms 0-1 are 1.5 apart; atom 6 at (9,0,0), atom 7 at (13.5,4,12):
    // sqrt(4.5² + 4² + 12²) = sqrt(20.25 + 16 + 144) = sqrt(180.25) = 13.4257...
    expect(file.constraints).toEqual([
      { kind: 'fixed-distance', atoms: [0, 1], length: 1.5 },
      { kind: 'fixed-distance', atoms: [3, 4], length: 1.2 },
      { kind: 'fixed-distance', atoms: [6, 7], length: Math.sqrt(180.25) },
    ]);
    expect(Object.keys(file.constraints?.[0] ?? {})).toEqual(['kind', 'atoms', 'length']);
    expect(m.constraints[0].length).toBeUndefined();
  });

  it('leaves every other optional field as given (no defaults filled in)', () => {
    const file = readModelFile(allKindsAngstrom());
    expect(file.terms[9]).toEqual({ kind: 'position-restraint', atoms: [2], k: 5, x0: [2, 1.5, 0] });
    expect('flat' in file.terms[9]).toBe(false);
    expect('charge' in readModelFile(specExample()).atoms[0]).toBe(false);
    expect('mass' in readModelFile(specExample()).atoms[0]).toBe(false);
  });

  it('returns a deep copy: later changes on either side do not reach the other', () => {
    const m = allKindsAngstrom();
    const file = readModelFile(m);
    const snapshot = structuredClone(file);
    m.coordinates[0][0] = 99;
    m.terms[0].k = 1;
    m.metadata.nested.list.push('more');
    m.atoms.push({ element: 'C' });
    expect(file).toEqual(snapshot);
    file.terms[1] = { kind: 'harmonic-bond', atoms: [0, 1], k: 0, r0: 0 };
    file.metadata!.source = 'changed';
    expect(m.terms[1].kind).toBe('morse-bond');
    expect(m.metadata.source).toBe('hand-made');
  });

  it('keeps metadata of any nesting with equal values', () => {
    const metadata = {
      '': 0,
      'a b': { 'c-d': [[[[{ e: null }]]]], f: [true, false, -0.5, 1e-300, 'ü'] },
      list: [[], {}, [{}], ''],
      __proto__note: 'not special',
    };
    const m = edited(specExample(), (x) => {
      x.metadata = metadata;
    });
    const file = readModelFile(m);
    expect(file.metadata).toEqual(metadata);
    expect(file.metadata).not.toBe(m.metadata);
    expect(readModelFile(JSON.stringify(m)).metadata).toEqual(metadata);
  });

  it('keeps a metadata key "__proto__" from text as an own key', () => {
    const text = JSON.stringify(specExample()).replace(/}$/, ', "metadata": {"__proto__": {"polluted": true}, "x": 1}}');
    const file = readModelFile(text);
    const metadata = file.metadata as Record<string, unknown>;
    expect(Object.keys(metadata)).toEqual(['__proto__', 'x']);
    expect(Object.getOwnPropertyDescriptor(metadata, '__proto__')?.value).toEqual({ polluted: true });
    expect(Object.getPrototypeOf(metadata)).toBe(Object.prototype);
    expect(({} as { polluted?: unknown }).polluted).toBeUndefined();
  });

  it('accepts objects with a null prototype as input and returns plain objects', () => {
    const m = specExample();
    const bare = Object.assign(Object.create(null) as Loose, m);
    const file = readModelFile(bare);
    expect(Object.getPrototypeOf(file)).toBe(Object.prototype);
    expect(file).toEqual(m);
  });
});

describe('robustness', () => {
  it('throws only ModelError for any JSON value', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (value) => {
        expect(() => readModelFile(value)).toThrow(ModelError);
        expect(() => readModelFile(JSON.stringify(value))).toThrow(ModelError);
      }),
      { numRuns: 200 },
    );
  });

  it('either reads or throws a ModelError when any one place of a valid model is replaced', () => {
    const base = allKindsAngstrom();
    const paths: (string | number)[][] = [];
    const collect = (v: unknown, path: (string | number)[]) => {
      paths.push(path);
      if (Array.isArray(v)) v.forEach((x, i) => collect(x, [...path, i]));
      else if (v !== null && typeof v === 'object') for (const [k, x] of Object.entries(v)) collect(x, [...path, k]);
    };
    collect(base, []);
    fc.assert(
      fc.property(fc.constantFrom(...paths.filter((p) => p.length > 0)), fc.jsonValue({ maxDepth: 2 }), (path, replacement) => {
        const m = edited(base, (x) => {
          let node = x;
          for (const seg of path.slice(0, -1)) node = node[seg];
          node[path[path.length - 1]] = replacement;
        });
        try {
          const file = readModelFile(m);
          expect(file.format).toBe('strainwise-model');
        } catch (e) {
          expect(e).toBeInstanceOf(ModelError);
          expect((e as ModelError).message).not.toMatch(/Invalid input|undefined is not|Cannot read/);
        }
      }),
      { numRuns: 500 },
    );
  });

  it('gives up cleanly on an object nested too deeply', () => {
    let deep: unknown = [];
    for (let i = 0; i < 200_000; i++) deep = [deep];
    expectModelError(() => readModelFile({ ...specExample(), metadata: { deep } }), 'the input is nested too deeply to read');
  });
});
