/** The reported kind names of src/model/kinds.ts (spec: `lennard-jones` and `coulomb` in byKind). */
import { describe, expect, it } from 'vitest';
import { isNonbondedKind, NONBONDED_KINDS } from '../../src/model/kinds.js';
import { TERM_KINDS } from '../../src/terms/table.js';

describe('energy kinds', () => {
  it('the nonbonded kinds are the spec’s two names, and no term kind is one of them', () => {
    expect(NONBONDED_KINDS).toEqual(['lennard-jones', 'coulomb']);
    for (const kind of NONBONDED_KINDS) expect(isNonbondedKind(kind)).toBe(true);
    for (const kind of TERM_KINDS) expect(isNonbondedKind(kind)).toBe(false);
  });
});
