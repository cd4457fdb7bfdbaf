import { describe, expect, it } from 'vitest';
import { parseModel, Model } from '../../src/model/model.js';
import { convertModelUnits } from '../../src/model/convert.js';
import { ModelError } from '../../src/errors.js';
import { TERM_KINDS } from '../../src/terms/table.js';
import { checkGradient } from '../../src/testing/index.js';
import { EVERY_KIND, SPEC_WATER } from '../fixtures/models.js';

describe('parseModel', () => {
  it('reads the spec example from text and from an object alike', () => {
    const a = parseModel(JSON.stringify(SPEC_WATER));
    const b = parseModel(SPEC_WATER);
    expect(a.atomCount).toBe(3);
    expect(a.kinds).toEqual(['harmonic-bond', 'harmonic-angle']);
    expect(a.energy(a.coordinates)).toBe(b.energy(b.coordinates));
  });

  it('fills default masses from the standard atomic weights (spec: O 15.999, H 1.008)', () => {
    const m = parseModel(SPEC_WATER);
    expect(Array.from(m.masses)).toEqual([15.999, 1.008, 1.008]);
  });

  it('refuses a bad model with a ModelError naming the place', () => {
    const bad = structuredClone(SPEC_WATER) as any;
    bad.terms[2].atoms[2] = 40;
    expect(() => parseModel(bad)).toThrow(ModelError);
    expect(() => parseModel(bad)).toThrow('terms[2].atoms[2]: index 40 is out of range (model has 3 atoms)');
  });

  it('hands out fresh coordinate arrays', () => {
    const m = parseModel(SPEC_WATER);
    const x = m.coordinates;
    x[0] = 99;
    expect(m.coordinates[0]).toBe(0);
    expect(x).toBeInstanceOf(Float64Array);
    expect(x.length).toBe(9);
  });
});

describe('energy and breakdown', () => {
  const model = parseModel(EVERY_KIND);
  const x = model.coordinates;

  it('has all ten kinds, and the total is the sum of byKind', () => {
    expect(model.kinds).toEqual(TERM_KINDS);
    const { total, byKind } = model.breakdown(x);
    const sum = Object.values(byKind).reduce((s, e) => s + (e as number), 0);
    expect(total).toBe(sum);
    expect(model.energy(x)).toBeCloseTo(total, 12);
    for (const kind of TERM_KINDS) expect(byKind[kind]).toBeGreaterThanOrEqual(0);
  });

  it('overwrites the gradient rather than adding to it', () => {
    const g1 = new Float64Array(x.length);
    model.energy(x, g1);
    const g2 = new Float64Array(x.length).fill(123);
    model.energy(x, g2);
    expect(Array.from(g2)).toEqual(Array.from(g1));
  });

  it('does not modify x', () => {
    const y = x.slice();
    model.energy(y, new Float64Array(y.length));
    expect(Array.from(y)).toEqual(Array.from(x));
  });

  it('gives an exact gradient (checked numerically with strainwise/testing)', () => {
    const r = checkGradient((y, g) => model.energy(y, g), x);
    expect(r.ok).toBe(true);
    expect(r.maxRelError).toBeLessThan(1e-9);
  });

  it('per-term energies add up to the per-kind energies', () => {
    const per = model.termEnergies(x);
    const { byKind } = model.breakdown(x);
    model.tables.forEach((t, i) => {
      expect(per[i].reduce((s, e) => s + e, 0)).toBeCloseTo(byKind[t.kind] as number, 12);
    });
  });
});

describe('toJSON', () => {
  it('round-trips: parse(toJSON()) is the same model', () => {
    const m = parseModel(EVERY_KIND);
    const again = parseModel(JSON.stringify(m.toJSON()));
    expect(again.toJSON()).toEqual(m.toJSON());
    expect(again.energy(again.coordinates)).toBe(m.energy(m.coordinates));
  });

  it('writes coordinates from x, which read back to the same doubles', () => {
    const m = parseModel(SPEC_WATER);
    const x = m.coordinates.map((v, i) => v + Math.PI * 1e-3 * (i + 1));
    const back = parseModel(JSON.stringify(m.toJSON(x)));
    expect(Array.from(back.coordinates)).toEqual(Array.from(x));
  });

  it('keeps metadata and title with equal values', () => {
    const file = { ...structuredClone(SPEC_WATER), title: 't', metadata: { a: [1, { b: null }], 'odd key': true } };
    expect(parseModel(file).toJSON()).toEqual(file);
  });

  it('is a deep copy', () => {
    const m = parseModel(SPEC_WATER);
    const j = m.toJSON();
    (j.terms[0] as any).k = 0;
    expect((m.toJSON().terms[0] as any).k).toBe(1100);
  });
});

describe('units', () => {
  it('one model in Å/kcal and in nm/kJ gives the same energies after conversion (1 kcal = 4.184 kJ, 1 nm = 10 Å: exact by definition)', () => {
    const a = parseModel(EVERY_KIND);
    const b = parseModel(convertModelUnits(a.toJSON(), { length: 'nanometer', energy: 'kJ/mol' }));
    expect(b.units).toEqual({ length: 'nanometer', energy: 'kJ/mol' });
    const ea = a.breakdown(a.coordinates);
    const eb = b.breakdown(b.coordinates);
    for (const kind of a.kinds) {
      expect((eb.byKind[kind] as number) / 4.184).toBeCloseTo(ea.byKind[kind] as number, 10);
    }
    const ga = new Float64Array(3 * a.atomCount);
    const gb = new Float64Array(3 * b.atomCount);
    a.energy(a.coordinates, ga);
    b.energy(b.coordinates, gb);
    // gradient: kJ/mol/nm = 4.184 kcal/mol / 0.1 Å → gb = ga · 41.84
    for (let i = 0; i < ga.length; i++) expect(gb[i]).toBeCloseTo(ga[i] * 41.84, 8);
  });

  it('an empty model has zero energy', () => {
    const m = parseModel({ ...structuredClone(SPEC_WATER), terms: [] });
    const g = new Float64Array(9).fill(1);
    expect(m.energy(m.coordinates, g)).toBe(0);
    expect(Array.from(g)).toEqual(new Array(9).fill(0));
    expect(m.kinds).toEqual([]);
    expect(m).toBeInstanceOf(Model);
  });
});
