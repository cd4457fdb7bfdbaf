/**
 * Perception: bonds from coordinates, bond orders from valence and
 * geometry, and the full bonded topology (angles, torsions, out-of-plane
 * centres, 1-4 pairs, rings, aromaticity, hybridization). Re-exports only.
 * @module
 */
export { perceiveBonds, DEFAULT_BOND_TOLERANCE, HYDROGEN_PAIR_TOLERANCE } from './bonds.js';
export type { BondPerceptionOptions } from './bonds.js';
export { perceiveBondOrders, MULTIPLE_BOND_RATIO, TRIPLE_BOND_RATIO } from './bond-orders.js';
export { covalentRadius, COVALENT_RADIUS_ELEMENTS } from './covalent-radii.js';
export { perceiveTopology } from './topology.js';
export type { TopologyInput } from './topology.js';
export type { Topology, Hybridization } from './types.js';
