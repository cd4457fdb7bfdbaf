/** Mode animation: frame count, atom count, the amplitude at the turning point, and the check of options. */
import { describe, expect, it } from 'vitest';
import { modeAnimation } from '../../src/vibrations/animate.js';

function frames(text: string): number[][][] {
  const lines = text.trimEnd().split('\n');
  const out: number[][][] = [];
  for (let i = 0; i < lines.length; ) {
    const n = Number(lines[i]);
    out.push(lines.slice(i + 2, i + 2 + n).map((l) => l.split(' ').slice(1).map(Number)));
    i += n + 2;
  }
  return out;
}

describe('modeAnimation', () => {
  const x = Float64Array.of(0, 0, 0, 1, 0, 0, 0, 1, 0);
  const d = Float64Array.of(0, 0, 2, 0, 0, -1, 0, 0, 0.5);
  it('20 frames of N atoms; a quarter period in, the atom that moves most is `amplitude` away; frame 1 is the structure', () => {
    const text = modeAnimation(['O', 'H', 'H'], x, d, { amplitude: 0.3, comment: 'mode 1' });
    const f = frames(text);
    expect(f.length).toBe(20);
    f.forEach((fr) => expect(fr.length).toBe(3));
    expect(f[0]).toEqual([[0, 0, 0], [1, 0, 0], [0, 1, 0]]);
    expect(f[5][0][2]).toBeCloseTo(0.3, 14); // sin(2π·5/20) = 1
    expect(f[5][1][2]).toBeCloseTo(-0.15, 14);
    expect(f[15][0][2]).toBeCloseTo(-0.3, 14);
    expect(text.split('\n')[1]).toBe('mode 1 frame 1/20');
  });

  it('refuses bad options', () => {
    expect(() => modeAnimation(['O'], Float64Array.of(0, 0, 0), Float64Array.of(1, 0, 0), { amplitude: -1 })).toThrow(
      'modeAnimation: amplitude: expected a finite number ≥ 0, got -1',
    );
    expect(() => modeAnimation(['O'], Float64Array.of(0, 0, 0), Float64Array.of(1, 0, 0), { amplitude: 1, frames: 0 })).toThrow(
      'modeAnimation: frames: expected a whole number ≥ 1, got 0',
    );
    expect(() => modeAnimation(['O'], Float64Array.of(0, 0), Float64Array.of(1, 0, 0), { amplitude: 1 })).toThrow(RangeError);
  });
});
