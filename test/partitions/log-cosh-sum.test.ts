import { describe, expect, it } from 'vitest';
import { LogCoshSum, oddZeta } from '../../src/core/counting/log-cosh-sum.js';

/** log cosh(x + iy) (real, imaginary), principal branch, directly. */
function logCosh(x: number, y: number): [number, number] {
  const re = Math.cosh(x) * Math.cos(y);
  const im = Math.sinh(x) * Math.sin(y);
  return [0.5 * Math.log(re * re + im * im), Math.atan2(im, re)];
}

describe('LogCoshSum: Σ_{a<=k<=b} log cosh(kτ/2) as a power series', () => {
  it('β(2n) = Σ_{j odd} j^{−2n}: closed forms (n <= 6) and the sum (n >= 7) agree with direct sums', () => {
    // β(2) = π²/8 and β(4) = π⁴/96 (DLMF 25.6.1 with (1 − 2^{−s})); the others against the sum
    // over odd j < 2e6 plus its integral tail J^{1−s}/(2(s − 1)) (error < 1e-18 for s >= 4).
    expect(Math.abs(oddZeta(2) - Math.PI ** 2 / 8)).toBeLessThan(1e-15);
    expect(Math.abs(oddZeta(4) - Math.PI ** 4 / 96)).toBeLessThan(1e-15);
    for (let s = 4; s <= 30; s += 2) {
      const J = 2_000_001;
      let direct = J ** (1 - s) / (2 * (s - 1));
      for (let j = J - 2; j >= 1; j -= 2) direct += j ** -s;
      // Two roundings of the result plus the direct sum's own (1e6 additions, largest last).
      expect(Math.abs(oddZeta(s) - direct) / direct, `s=${s}`).toBeLessThan(5e-16);
    }
  });

  it('values, derivatives and complex shifts agree with direct sums over k', () => {
    for (const [a, b] of [[1, 500], [7, 3000], [150, 450]] as const) {
      const series = new LogCoshSum(a, b);
      const direct = (t: number, y: number) => {
        let re = 0;
        let im = 0;
        for (let k = a; k <= b; k++) {
          const [r, i] = logCosh((k * t) / 2, (k * y) / 2);
          const [r0] = logCosh((k * t) / 2, 0);
          re += r - r0;
          im += i;
        }
        return [re, im];
      };
      for (const bt of [0, 0.3, 1, 1.25]) {
        const t = bt / (b + 1);
        let value = 0;
        let d1 = 0;
        let d2 = 0;
        for (let k = a; k <= b; k++) {
          value += logCosh((k * t) / 2, 0)[0];
          d1 += (k / 2) * Math.tanh((k * t) / 2);
          d2 += (k * k) / (4 * Math.cosh((k * t) / 2) ** 2);
        }
        expect(Math.abs(series.value(t) - value)).toBeLessThan(1e-13 * Math.max(1, value));
        const [s1, s2] = series.derivatives(t);
        expect(Math.abs(s1 - d1)).toBeLessThan(1e-13 * Math.max(1, d1));
        expect(Math.abs(s2 - d2)).toBeLessThan(1e-13 * d2);
        for (const yb of [0.1, 0.5, 1.5]) {
          const y = yb / b;
          const [sr, si] = series.shift(t, y);
          const [dr, di] = direct(t, y);
          // Each log cosh has an imaginary part below π/2 here (|ky/2| < π/2), so no branch jumps.
          expect(Math.abs(sr - dr), `[${a}, ${b}] bt=${bt} yb=${yb}`).toBeLessThan(1e-12 * Math.max(1, Math.abs(dr)));
          expect(Math.abs(si - di)).toBeLessThan(1e-12 * Math.max(1, Math.abs(di)));
        }
      }
    }
  });

  it('differences C(t1) − C(t2) are formed without cancellation', () => {
    const series = new LogCoshSum(1, 20_000);
    const t2 = 1e-5;
    for (const rel of [1e-3, 1e-6, 1e-9]) {
      const t1 = t2 * (1 + rel);
      // d/dt C = C'(t): the difference is C'·Δt + C''·Δt²/2 + ... to relative 1e-10 here.
      const [d1, d2] = series.derivatives(t2);
      const dt = t1 - t2;
      const expected = d1 * dt + (d2 * dt * dt) / 2;
      expect(Math.abs(series.difference(t1, t2) - expected) / expected, `rel=${rel}`).toBeLessThan(1e-3 * rel + 1e-13);
    }
  });

  it('declines nodes beyond its reach', () => {
    const series = new LogCoshSum(1, 1000, 0.5);
    expect(Number.isNaN(series.shift(0, (0.6 * Math.PI) / 1000)[0])).toBe(true);
    expect(Number.isNaN(series.shift(0, (0.4 * Math.PI) / 1000)[0])).toBe(false);
  });
});
