/**
 * The demo's structure: an invented scenario — a user of a web structure editor has
 * sketched 2-(4-chlorophenyl)ethanol flat (every bond drawn 1.5 Å long, hydrogens
 * where they fit, a little depth noise) and asks for a clean-up. A MOL (V2000) file,
 * written by strainwise's own writer from the sketch's coordinates.
 * @module
 */

/** The sketch as MOL file text. */
export const DEMO_SKETCH = `sketch 7: chlorophenyl ethanol, drawn flat
  strainws          3D

 19 19  0  0  0  0  0  0  0  0999 V2000
    1.5000    0.0000    0.0773 C   0  0  0  0  0  0  0  0  0  0  0  0
    0.7500    1.2990    0.0169 C   0  0  0  0  0  0  0  0  0  0  0  0
   -0.7500    1.2990   -0.0999 C   0  0  0  0  0  0  0  0  0  0  0  0
   -1.5000    0.0000    0.1162 C   0  0  0  0  0  0  0  0  0  0  0  0
   -0.7500   -1.2990   -0.0549 C   0  0  0  0  0  0  0  0  0  0  0  0
    0.7500   -1.2990   -0.0430 C   0  0  0  0  0  0  0  0  0  0  0  0
    3.0000    0.0000    0.1122 C   0  0  0  0  0  0  0  0  0  0  0  0
    3.7500    1.3000   -0.1065 C   0  0  0  0  0  0  0  0  0  0  0  0
    5.2500    1.3000    0.0297 O   0  0  0  0  0  0  0  0  0  0  0  0
   -3.0000    0.0000    0.0669 Cl  0  0  0  0  0  0  0  0  0  0  0  0
    1.5000    2.5981   -0.1189 H   0  0  0  0  0  0  0  0  0  0  0  0
   -1.5000    2.5981    0.0915 H   0  0  0  0  0  0  0  0  0  0  0  0
   -1.5000   -2.5981   -0.0031 H   0  0  0  0  0  0  0  0  0  0  0  0
    1.5000   -2.5981   -0.0874 H   0  0  0  0  0  0  0  0  0  0  0  0
    3.5000   -1.4000    0.1195 H   0  0  0  0  0  0  0  0  0  0  0  0
    2.5000   -1.2000   -0.0719 H   0  0  0  0  0  0  0  0  0  0  0  0
    3.2000    2.6000   -0.0237 H   0  0  0  0  0  0  0  0  0  0  0  0
    4.3000    2.6000    0.1035 H   0  0  0  0  0  0  0  0  0  0  0  0
    5.9000    2.6000   -0.1142 H   0  0  0  0  0  0  0  0  0  0  0  0
  1  2  2  0
  1  6  1  0
  1  7  1  0
  2  3  1  0
  2 11  1  0
  3  4  2  0
  3 12  1  0
  4  5  1  0
  4 10  1  0
  5  6  2  0
  5 13  1  0
  6 14  1  0
  7  8  1  0
  7 15  1  0
  7 16  1  0
  8  9  1  0
  8 17  1  0
  8 18  1  0
  9 19  1  0
M  END
`;
