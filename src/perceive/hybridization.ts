/**
 * Hybridization from element, neighbours and bond orders, as a generic
 * force field types atoms. Rules, first match wins:
 *
 * 1. H, the halogens, the noble gases, metals and any element not listed in
 *    rule 7, and atoms with no neighbours → `none`.
 * 2. An aromatic atom → `aromatic`.
 * 3. Four or more neighbours → `sp3` (ammonium N, sulfone S, phosphate P).
 * 4. A triple bond, or two or more double bonds on B, C, N or O → `sp`
 *    (nitrile C and N, acetylene, CO₂ carbon, allene centre). Two or more
 *    double bonds on a heavier atom (SO₂ S) → `sp2`.
 * 5. One double bond, or an order-1.5 bond outside an aromatic ring → `sp2`.
 * 6. Only single bonds: neutral B with three neighbours and C⁺ → `sp2`; N
 *    with at most three neighbours, bonded to an atom that has a double,
 *    triple or aromatic bond (amide, aniline, enamine N) → `sp2`
 *    (conjugated, planar); everything else → `sp3`. O and S next to a
 *    π system (ester O, phenol O) stay `sp3`.
 * 7. The elements with rules: B, C, N, O, Si, P, S, Ge, As, Se, Sn, Sb, Te.
 * @module
 */
import type { NeighbourLists } from './graph.js';
import type { Hybridization } from './types.js';

const TYPED = new Set(['B', 'C', 'N', 'O', 'Si', 'P', 'S', 'Ge', 'As', 'Se', 'Sn', 'Sb', 'Te']);
const SECOND_ROW = new Set(['B', 'C', 'N', 'O']);

/**
 * Each atom's hybridization by the rules of the module comment. `orders`
 * per bond (1, 1.5, 2, 3, aromatic bonds already 1.5); `aromaticAtoms` and
 * `aromaticBonds` as from aromaticity perception. Internal to perceive/.
 * Never throws.
 */
export function assignHybridization(
  elements: readonly string[],
  lists: NeighbourLists,
  orders: Float64Array,
  charges: Int32Array,
  aromaticAtoms: Uint8Array,
  aromaticBonds: Uint8Array,
): Hybridization[] {
  const n = elements.length;
  const { start, neighbours, bondOf } = lists;
  // Whether each atom has a multiple or aromatic bond.
  const pi = new Uint8Array(n);
  for (let a = 0; a < n; a++) {
    for (let s = start[a]; s < start[a + 1]; s++) {
      if (orders[bondOf[s]] !== 1 || aromaticBonds[bondOf[s]]) pi[a] = 1;
    }
  }
  const out = new Array<Hybridization>(n);
  for (let a = 0; a < n; a++) {
    const e = elements[a];
    const d = start[a + 1] - start[a];
    if (!TYPED.has(e) || d === 0) {
      out[a] = 'none';
      continue;
    }
    if (aromaticAtoms[a]) {
      out[a] = 'aromatic';
      continue;
    }
    if (d >= 4) {
      out[a] = 'sp3';
      continue;
    }
    let doubles = 0;
    let triples = 0;
    let partial = 0;
    let conjugated = false;
    for (let s = start[a]; s < start[a + 1]; s++) {
      const o = orders[bondOf[s]];
      if (o === 2) doubles++;
      else if (o === 3) triples++;
      else if (o === 1.5) partial++;
      else if (pi[neighbours[s]]) conjugated = true;
    }
    if (triples > 0 || (doubles >= 2 && SECOND_ROW.has(e))) out[a] = 'sp';
    else if (doubles >= 1 || partial > 0) out[a] = 'sp2';
    else if ((e === 'B' && d === 3 && charges[a] === 0) || (e === 'C' && charges[a] === 1)) out[a] = 'sp2';
    else if (e === 'N' && conjugated) out[a] = 'sp2';
    else out[a] = 'sp3';
  }
  return out;
}
