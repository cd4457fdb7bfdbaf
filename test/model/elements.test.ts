import { describe, expect, it } from 'vitest';
import { ELEMENT_SYMBOLS, ELEMENTS, findElement, isElement, standardAtomicWeight } from '../../src/elements.js';

describe('element symbols', () => {
  it('lists the 118 elements from H to Og, each once, in order of atomic number', () => {
    expect(ELEMENT_SYMBOLS).toHaveLength(118);
    expect(new Set(ELEMENT_SYMBOLS).size).toBe(118);
    expect(ELEMENT_SYMBOLS[0]).toBe('H');
    expect(ELEMENT_SYMBOLS[5]).toBe('C');
    expect(ELEMENT_SYMBOLS[16]).toBe('Cl');
    expect(ELEMENT_SYMBOLS[91]).toBe('U');
    expect(ELEMENT_SYMBOLS[117]).toBe('Og');
    ELEMENTS.forEach((e, i) => {
      expect(e.atomicNumber).toBe(i + 1);
      expect(e.symbol).toBe(ELEMENT_SYMBOLS[i]);
      expect(e.symbol).toMatch(/^[A-Z][a-z]?$/);
    });
  });

  it('is case-sensitive and knows nothing but symbols', () => {
    expect(isElement('Cl')).toBe(true);
    expect(isElement('C')).toBe(true);
    for (const bad of ['CL', 'cl', 'c', 'D', 'T', '', ' C', 'C ', 'Xx', 'constructor', '__proto__', 'toString', 6, null, undefined]) {
      expect(isElement(bad)).toBe(false);
    }
    expect(findElement('Fe')?.atomicNumber).toBe(26);
    expect(findElement('FE')).toBeUndefined();
    expect(findElement('hasOwnProperty')).toBeUndefined();
  });
});

describe('standard atomic weights', () => {
  it('match the values the spec lists', () => {
    // Source: ../shared/spec/model-file.md, atoms[].mass default.
    expect(standardAtomicWeight('H')).toBe(1.008);
    expect(standardAtomicWeight('C')).toBe(12.011);
    expect(standardAtomicWeight('N')).toBe(14.007);
    expect(standardAtomicWeight('O')).toBe(15.999);
    expect(standardAtomicWeight('S')).toBe(32.06);
    expect(standardAtomicWeight('Cl')).toBe(35.45);
  });

  it('are missing exactly for the elements with no standard atomic weight', () => {
    // Source: the spec names Tc; the rest are the elements without a stable
    // isotope of characteristic terrestrial composition (Tc, Pm, Po–Ac, Np on),
    // with Th, Pa and U the exceptions that have one.
    const none = new Set(['Tc', 'Pm', 'Po', 'At', 'Rn', 'Fr', 'Ra', 'Ac', ...ELEMENT_SYMBOLS.slice(92)]);
    for (const e of ELEMENTS) {
      if (none.has(e.symbol)) {
        expect(e.standardAtomicWeight, e.symbol).toBeNull();
        expect(standardAtomicWeight(e.symbol)).toBeUndefined();
      } else {
        expect(e.standardAtomicWeight, e.symbol).toBeTypeOf('number');
        expect(standardAtomicWeight(e.symbol)).toBe(e.standardAtomicWeight);
      }
    }
    expect(standardAtomicWeight('Th')).toBeTypeOf('number');
    expect(standardAtomicWeight('Pa')).toBeTypeOf('number');
    expect(standardAtomicWeight('U')).toBeTypeOf('number');
    expect(standardAtomicWeight('Xx')).toBeUndefined();
    expect(standardAtomicWeight('__proto__')).toBeUndefined();
  });

  it('rise with atomic number except at the four well-known inversions', () => {
    // Source: the periodic table's known weight inversions Ar/K, Co/Ni, Te/I, Th/Pa.
    // A misplaced entry in the table would break this ordering.
    const inversions: string[] = [];
    for (let z = 1; z < ELEMENTS.length; z++) {
      const a = ELEMENTS[z - 1].standardAtomicWeight;
      const b = ELEMENTS[z].standardAtomicWeight;
      if (a !== null && b !== null && b < a) inversions.push(`${ELEMENTS[z - 1].symbol}/${ELEMENTS[z].symbol}`);
    }
    expect(inversions).toEqual(['Ar/K', 'Co/Ni', 'Te/I', 'Th/Pa']);
  });

  it('lie between Z and 2.7 Z dalton', () => {
    // Source: every nucleus has at least as many nucleons as protons, and at
    // most about 1.6 neutrons per proton among the naturally occurring elements.
    for (const e of ELEMENTS) {
      if (e.standardAtomicWeight === null) continue;
      expect(e.standardAtomicWeight, e.symbol).toBeGreaterThanOrEqual(e.atomicNumber);
      expect(e.standardAtomicWeight, e.symbol).toBeLessThan(2.7 * e.atomicNumber);
    }
  });
});
