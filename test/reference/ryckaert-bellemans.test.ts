/**
 * Ryckaert–Bellemans butane torsion, E = Σ C_m cos^m ψ with ψ = φ − 180°
 * (polymer convention, ψ = 0 at trans). Coefficients C0..C5 = 9.28, 12.16,
 * −13.12, −3.06, 26.24, −31.5 kJ/mol (Ryckaert & Bellemans, Faraday Discuss.
 * Chem. Soc. 66 (1978) 95 — from memory).
 */
import { describe, expect, it } from 'vitest';
import { evaluate, singleTerm } from '../helpers/terms.js';

const C = [9.28, 12.16, -13.12, -3.06, 26.24, -31.5]; // kJ/mol (Ryckaert & Bellemans 1978 — from memory)
const rb = singleTerm('ryckaert-bellemans', C);

// Planar chains in the xz plane (exact by construction): trans and cis.
const TRANS = new Float64Array([1.44, 0, -0.51, 0, 0, 0, 0, 0, 1.53, -1.44, 0, 2.04]);
const CIS = new Float64Array([1.44, 0, -0.51, 0, 0, 0, 0, 0, 1.53, 1.44, 0, 2.04]);

describe('Ryckaert–Bellemans butane torsion', () => {
  it('trans (φ = 180°, ψ = 0): E = Σ C_m = 0, a minimum (zero gradient)', () => {
    const { energy, gradient } = evaluate(rb, TRANS);
    expect(Math.abs(energy)).toBeLessThanOrEqual(1e-12);
    expect(Math.max(...Array.from(gradient, Math.abs))).toBeLessThanOrEqual(1e-12);
  });

  it('cis (φ = 0°, ψ = 180°): E = C0 − C1 + C2 − C3 + C4 − C5 = 44.8 kJ/mol', () => {
    const alternating = C[0] - C[1] + C[2] - C[3] + C[4] - C[5];
    expect(alternating).toBeCloseTo(44.8, 12);
    const { energy, gradient } = evaluate(rb, CIS);
    expect(energy).toBeCloseTo(alternating, 12);
    expect(Math.max(...Array.from(gradient, Math.abs))).toBeLessThanOrEqual(1e-12);
  });
});
