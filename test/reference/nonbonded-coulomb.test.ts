/**
 * The Coulomb constant and Coulomb pairs against outside values: the
 * model-file spec's C = 332.0637 kcal·Å/(mol·e²) = 138.935458 kJ·nm/(mol·e²),
 * and e²/(4π ε0) · N_A from CODATA 2018 (e = 1.602176634e-19 C and
 * N_A = 6.02214076e23 /mol exact; ε0 = 8.8541878128e-12 F/m, relative
 * standard uncertainty 1.5e-10).
 */
import { describe, expect, it } from 'vitest';
import { parseModel } from '../../src/model/model.js';
import { AVOGADRO, COULOMB_KJ_NM, coulombConstant, KJ_PER_KCAL } from '../../src/units.js';

const E = 1.602176634e-19; // C, CODATA 2018 (exact)
const EPSILON0 = 8.8541878128e-12; // F/m, CODATA 2018

/** |a − b| ≤ half a unit in the last digit given: b written with `decimals` decimals. */
function agreesToDigits(a: number, b: number, decimals: number): void {
  expect(Math.abs(a - b)).toBeLessThanOrEqual(0.5 * Math.pow(10, -decimals) * (1 + 1e-9));
}

describe('the Coulomb constant', () => {
  it('the spec’s two values agree to the digits they carry: 138.935458 × 10 / 4.184 rounds to 332.0637', () => {
    const kcalAngstrom = coulombConstant({ length: 'angstrom', energy: 'kcal/mol' });
    expect(kcalAngstrom).toBe((COULOMB_KJ_NM * 10) / KJ_PER_KCAL);
    agreesToDigits(kcalAngstrom, 332.0637, 4);
    // And back: 332.0637 × 4.184 / 10 = 138.9354521, within 332.0637's rounding (±5e-5 → ±2.1e-5) of 138.935458.
    expect(Math.abs((332.0637 * KJ_PER_KCAL) / 10 - 138.935458)).toBeLessThanOrEqual((0.5e-4 * KJ_PER_KCAL) / 10);
  });

  it('CODATA 2018: e²/(4π ε0) · N_A = 138.935458 kJ·nm/mol and 332.0637 kcal·Å/mol to the spec’s digits', () => {
    const jouleMetre = ((E * E) / (4 * Math.PI * EPSILON0)) * AVOGADRO; // J·m/mol
    const kjNm = jouleMetre * 1e-3 * 1e9;
    agreesToDigits(kjNm, 138.935458, 6);
    agreesToDigits((kjNm * 10) / KJ_PER_KCAL, 332.0637, 4);
    expect(Math.abs(kjNm - COULOMB_KJ_NM) / kjNm).toBeLessThan(5e-9);
  });

  it('in all four unit pairs (derived by 1 kcal = 4.184 kJ and 1 nm = 10 Å, both exact)', () => {
    expect(coulombConstant({ length: 'nanometer', energy: 'kJ/mol' })).toBe(138.935458);
    expect(coulombConstant({ length: 'angstrom', energy: 'kJ/mol' })).toBeCloseTo(1389.35458, 9);
    expect(coulombConstant({ length: 'nanometer', energy: 'kcal/mol' })).toBeCloseTo(138.935458 / 4.184, 12);
    expect(coulombConstant({ length: 'angstrom', energy: 'kcal/mol' })).toBeCloseTo(1389.35458 / 4.184, 11);
  });
});

describe('two unit charges', () => {
  const model = (length: 'angstrom' | 'nanometer', energy: 'kcal/mol' | 'kJ/mol', r: number, dielectric = 1) =>
    parseModel({
      format: 'strainwise-model',
      version: 1,
      units: { length, energy },
      atoms: [
        { element: 'Na', charge: 1 },
        { element: 'Na', charge: 1 },
      ],
      coordinates: [
        [0, 0, 0],
        [0, 0, r],
      ],
      terms: [],
      nonbonded: { coulomb: { dielectric } },
    });
  it('at 1 Å: 332.0637 kcal/mol (spec), and 1389.35458 kJ/mol at 0.1 nm', () => {
    const a = model('angstrom', 'kcal/mol', 1);
    agreesToDigits(a.energy(a.coordinates), 332.0637, 4);
    const b = model('nanometer', 'kJ/mol', 0.1);
    expect(b.energy(b.coordinates)).toBeCloseTo(1389.35458, 8);
    expect(b.breakdown(b.coordinates).byKind).toEqual({ coulomb: b.energy(b.coordinates) });
  });
  it('falls as 1/r and as 1/dielectric; the force is C q q / r² pushing them apart', () => {
    const m = model('angstrom', 'kcal/mol', 4, 2);
    const g = new Float64Array(6);
    const e = m.energy(m.coordinates, g);
    const C = coulombConstant({ length: 'angstrom', energy: 'kcal/mol' });
    expect(e).toBeCloseTo(C / 8, 12);
    expect(g[5]).toBeCloseTo(-C / (2 * 16), 12);
    expect(g[2]).toBe(-g[5]);
  });
});
