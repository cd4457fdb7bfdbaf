/**
 * Triatomics with closed-form harmonic wavenumbers for the simple valence
 * force field (bond curvature k_r for each bond, angle curvature k_θ, no
 * cross terms), from the GF method (Wilson, Decius & Cross, Molecular
 * Vibrations, 1955) as worked out for XY2 in Herzberg, Infrared and Raman
 * Spectra of Polyatomic Molecules, 1945 — formulas from memory. With
 * k_δ = k_θ / r², 2α the bond angle, m_X the central mass:
 *
 * bent XY2, symmetric block (A1): λ1 + λ2 = (1 + 2 (m_Y/m_X) cos²α) k_r/m_Y + 2 (1 + 2 (m_Y/m_X) sin²α) k_δ/m_Y,
 *                                  λ1 λ2 = 2 (1 + 2 m_Y/m_X) k_r k_δ / m_Y²;
 *   antisymmetric stretch (B2):    λ3 = (1 + 2 (m_Y/m_X) sin²α) k_r / m_Y.
 * linear XY2: λ_sym = k_r / m_Y, λ_asym = (1 + 2 m_Y/m_X) k_r / m_Y, bend (twice) λ = 2 (1 + 2 m_Y/m_X) k_δ / m_Y.
 *
 * Wavenumber ν̃ = √λ · 108.591… cm⁻¹ for λ in kcal/mol/Å²/Da (CODATA 2018 constants).
 */
import { describe, expect, it } from 'vitest';
import { parseModel } from '../../src/model/model.js';
import { wavenumberPerRootCurvature } from '../../src/units.js';
import { vibrationalAnalysis } from '../../src/vibrations/model-modes.js';
import { carbonDioxide, waterAtMinimum } from '../vibrations/models.js';

const KCAL_A = { length: 'angstrom', energy: 'kcal/mol' } as const;
const toWavenumber = (lambda: number) => Math.sqrt(lambda) * wavenumberPerRootCurvature(KCAL_A);

describe('bent XY2 (the spec water model at its minimum) against the valence-force-field formulas', () => {
  it('3 vibrations, 6 zero modes, each wavenumber within 1e-6 relative', () => {
    const [kr, kt, r, angle] = [1100, 100, 0.9572, (104.52 * Math.PI) / 180];
    const [mX, mY] = [15.999, 1.008]; // the model's masses: O default (IUPAC abridged), H as written
    const a = angle / 2;
    const kd = kt / (r * r);
    const sum = ((1 + ((2 * mY) / mX) * Math.cos(a) ** 2) * kr) / mY + (2 * (1 + ((2 * mY) / mX) * Math.sin(a) ** 2) * kd) / mY;
    const product = (2 * (1 + (2 * mY) / mX) * kr * kd) / (mY * mY);
    const disc = Math.sqrt(sum * sum - 4 * product);
    const expected = [toWavenumber((sum - disc) / 2), toWavenumber((sum + disc) / 2), toWavenumber(((1 + ((2 * mY) / mX) * Math.sin(a) ** 2) * kr) / mY)].sort(
      (p, q) => p - q,
    );
    const { modes, stationary } = vibrationalAnalysis(parseModel(waterAtMinimum()));
    expect(stationary.stationary).toBe(true);
    expect(modes.zeroModes).toBe(6);
    expect(modes.linear).toBe(false);
    expect(modes.frequencies.length).toBe(3);
    expected.forEach((nu, i) => expect(Math.abs(modes.frequencies[i] / nu - 1)).toBeLessThan(1e-6));
  });
});

describe('linear XY2 (a CO2-like model) against the valence-force-field formulas', () => {
  it('4 vibrations (the bend twice), 5 zero modes, each within 1e-6 relative', () => {
    const [kr, r, kt] = [1600, 1.16, 60];
    const [mX, mY] = [12.011, 15.999];
    const kd = kt / (r * r);
    const bend = toWavenumber((2 * (1 + (2 * mY) / mX) * kd) / mY);
    const expected = [bend, bend, toWavenumber(kr / mY), toWavenumber(((1 + (2 * mY) / mX) * kr) / mY)].sort((p, q) => p - q);
    const { modes } = vibrationalAnalysis(parseModel(carbonDioxide(kr, r, kt)));
    expect(modes.linear).toBe(true);
    expect(modes.zeroModes).toBe(5);
    expect(modes.frequencies.length).toBe(4);
    expected.forEach((nu, i) => expect(Math.abs(modes.frequencies[i] / nu - 1)).toBeLessThan(1e-6));
  });
});
