/**
 * Covalent radii table (src/perceive/covalent-radii.ts). Values from memory
 * of Cordero et al., Dalton Trans. 2008, 2832–2838 (recalled, not read).
 */
import { describe, expect, it } from 'vitest';
import { COVALENT_RADIUS_ELEMENTS, covalentRadius } from '../../src/perceive/covalent-radii.js';
import { isElement } from '../../src/elements.js';

describe('covalentRadius', () => {
  it('has the recalled values for the organic elements (Cordero et al. 2008, from memory)', () => {
    const expected: Record<string, number> = { H: 0.31, B: 0.84, C: 0.76, N: 0.71, O: 0.66, F: 0.57, Si: 1.11, P: 1.07, S: 1.05, Cl: 1.02, Br: 1.2, I: 1.39 };
    for (const [e, r] of Object.entries(expected)) expect(covalentRadius(e)).toBe(r);
  });
  it('is undefined for unknown symbols and wrong case', () => {
    expect(covalentRadius('Xx')).toBeUndefined();
    expect(covalentRadius('CL')).toBeUndefined();
    expect(covalentRadius('He')).toBeUndefined();
  });
  it('lists only real element symbols, each with a radius between 0.3 and 2.5 Å', () => {
    for (const e of COVALENT_RADIUS_ELEMENTS) {
      expect(isElement(e)).toBe(true);
      expect(covalentRadius(e)).toBeGreaterThanOrEqual(0.3);
      expect(covalentRadius(e)).toBeLessThanOrEqual(2.5);
    }
    expect(COVALENT_RADIUS_ELEMENTS.length).toBeGreaterThan(60);
  });
});
