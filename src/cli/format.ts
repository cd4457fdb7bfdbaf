/**
 * Plain-text tables and number formatting for the human-readable output.
 * @module
 */
import type { Units } from '../units.js';

/** Short unit labels: `Å` / `nm`, `kcal/mol` / `kJ/mol`. */
export function unitLabels(units: Units): { length: string; energy: string; force: string } {
  const length = units.length === 'angstrom' ? 'Å' : 'nm';
  return { length, energy: units.energy, force: `${units.energy}/${length}` };
}

/** A number with `digits` significant digits, plain or in exponent form when very large or small. */
export function num(value: number, digits = 6): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const a = Math.abs(value);
  if (a >= 1e-4 && a < 1e7) {
    const decimals = Math.max(0, digits - 1 - Math.floor(Math.log10(a)));
    return value.toFixed(Math.min(decimals, 12));
  }
  return value.toExponential(digits - 1);
}

/**
 * Lay out rows as columns: the first row is the header, `align` says per
 * column whether it is left (`l`) or right (`r`) aligned. Columns are
 * separated by two spaces; a dashed rule goes under the header.
 */
export function table(rows: readonly (readonly string[])[], align: string): string {
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => [...(r[c] ?? '')].length)));
  const line = (r: readonly string[]) =>
    r
      .map((cell, c) => {
        const pad = ' '.repeat(widths[c] - [...cell].length);
        return align[c] === 'r' ? pad + cell : cell + pad;
      })
      .join('  ')
      .trimEnd();
  const rule = widths.map((w) => '-'.repeat(w)).join('  ');
  return [line(rows[0]), rule, ...rows.slice(1).map(line)].join('\n');
}
