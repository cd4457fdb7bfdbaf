/**
 * Multi-frame XYZ text that swings a structure along a normal mode, for
 * viewing.
 * @module
 */
import { xyzFrame } from '../io/xyz.js';

/** Options of {@link modeAnimation}. */
export interface ModeAnimationOptions {
  /** Frames per period (default 20). */
  readonly frames?: number;
  /** The largest displacement of any atom at the turning points, in the coordinates' length unit (required). */
  readonly amplitude: number;
  /** Comment of every frame; the frame number is appended. */
  readonly comment?: string;
}

/**
 * One period of a swing along `displacement` (flat, 3N, any length; only
 * its direction matters): frame f of F is x + s · sin(2π f / F) · d, with
 * s chosen so that the atom that moves most moves `amplitude` at the
 * turning points. Returns the frames as XYZ text (see `xyzFrame`).
 * @throws RangeError when `frames` is not a whole number ≥ 1, `amplitude`
 *   not finite and ≥ 0, or the lengths do not fit.
 */
export function modeAnimation(
  elements: readonly string[],
  x: Float64Array,
  displacement: Float64Array,
  options: ModeAnimationOptions,
): string {
  const frames = options.frames ?? 20;
  if (!Number.isInteger(frames) || frames < 1) throw new RangeError(`modeAnimation: frames: expected a whole number ≥ 1, got ${frames}`);
  if (!(Number.isFinite(options.amplitude) && options.amplitude >= 0)) {
    throw new RangeError(`modeAnimation: amplitude: expected a finite number ≥ 0, got ${options.amplitude}`);
  }
  const n = 3 * elements.length;
  if (x.length !== n || displacement.length !== n) {
    throw new RangeError(`modeAnimation: expected 3N = ${n} coordinates and displacements, got ${x.length} and ${displacement.length}`);
  }
  let largest = 0;
  for (let a = 0; a < elements.length; a++) {
    largest = Math.max(largest, Math.hypot(displacement[3 * a], displacement[3 * a + 1], displacement[3 * a + 2]));
  }
  const scale = largest > 0 ? options.amplitude / largest : 0;
  const y = new Float64Array(n);
  const parts: string[] = [];
  for (let f = 0; f < frames; f++) {
    const s = scale * Math.sin((2 * Math.PI * f) / frames);
    for (let c = 0; c < n; c++) y[c] = x[c] + s * displacement[c];
    parts.push(xyzFrame(elements, y, `${options.comment ?? ''}${options.comment ? ' ' : ''}frame ${f + 1}/${frames}`));
  }
  return parts.join('');
}
