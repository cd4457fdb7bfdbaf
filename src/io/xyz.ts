/**
 * XYZ text (the plain multi-frame format: atom count, a comment line, then
 * one `Element x y z` line per atom), for results and trajectories.
 * @module
 */

/**
 * One XYZ frame for atoms with symbols `elements` at `x` (flat, 3N). The
 * comment is put on one line (line breaks become spaces). Coordinates are
 * written with JavaScript's shortest round-trip form, so they read back to
 * the same doubles.
 */
export function xyzFrame(elements: readonly string[], x: Float64Array, comment = ''): string {
  const lines = [String(elements.length), comment.replace(/[\r\n]+/g, ' ')];
  for (let a = 0; a < elements.length; a++) {
    lines.push(`${elements[a]} ${x[3 * a]} ${x[3 * a + 1]} ${x[3 * a + 2]}`);
  }
  return lines.join('\n') + '\n';
}
