/**
 * PCHIP (src/stats/pchip.ts) against scipy.interpolate.PchipInterpolator on the same knots
 * (test/fixtures/pchip-reference.json, written by scripts/reference/pchip_reference.py), against
 * basin shapes whose volume is known in closed form, and for the properties a storage curve needs:
 * monotone on monotone data, and area → level → area round trips within 1e-9.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { Linear, Pchip } from '../../src/stats/pchip.ts';
import { mulberry32 } from '../../scripts/random.ts';

const reference = JSON.parse(readFileSync(join(import.meta.dirname, '..', 'fixtures', 'pchip-reference.json'), 'utf8')) as {
  cases: Array<{ name: string; x: number[]; y: number[]; at: number[]; values: number[]; slopes: number[] }>;
};

describe('Pchip against scipy.interpolate.PchipInterpolator', () => {
  it.each(reference.cases.map((entry) => [entry.name, entry] as const))('%s: slopes and values to 1e-12', (_, entry) => {
    const interpolant = new Pchip(entry.x, entry.y);
    const scale = Math.max(1, ...entry.y.map(Math.abs));
    entry.slopes.forEach((slope, k) =>
      expect(Math.abs((interpolant.d[k] as number) - slope)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(slope))),
    );
    entry.at.forEach((at, k) => expect(Math.abs(interpolant.at(at) - (entry.values[k] as number))).toBeLessThanOrEqual(1e-12 * scale));
  });
});

/**
 * The error bound used below, derived for cubic Hermite interpolation with inexact slopes: on a
 * segment of width Δ, p − f = (Hermite with exact slopes − f) + Δ·h10(t)·e_k + Δ·h11(t)·e_k+1,
 * where e are the slope errors at the two knots and |h10|, |h11| ≤ 4/27 (their maxima at t = 1/3
 * and 2/3). The first term is f⁗(ξ)(x − x_k)²(x − x_k+1)²/4! and vanishes for polynomials of
 * degree 3 or less, which every function below is. So |p − f| ≤ (4/27)·Δ·(|e_k| + |e_k+1|), plus
 * rounding (1e-12 relative allowed).
 */
function hermiteBound(interpolant: Pchip, derivative: (x: number) => number, at: number, size: number): number {
  const k = interpolant.segment(at);
  const width = (interpolant.x[k + 1] as number) - (interpolant.x[k] as number);
  const e0 = Math.abs((interpolant.d[k] as number) - derivative(interpolant.x[k] as number));
  const e1 = Math.abs((interpolant.d[k + 1] as number) - derivative(interpolant.x[k + 1] as number));
  return (4 / 27) * width * (e0 + e1) + 1e-12 * size;
}

describe('Pchip on basins of known shape', () => {
  // A truncated cone (a basin with straight sloping sides): radius r at the bottom, R(h) = r + s·h
  // at depth h above it. Area π R², volume π h (R² + R r + r²) / 3 (the frustum's volume).
  const r = 300;
  const s = 40;
  const coneArea = (h: number) => Math.PI * (r + s * h) ** 2;
  const coneVolume = (h: number) => (Math.PI * h * ((r + s * h) ** 2 + (r + s * h) * r + r * r)) / 3;
  const coneAreaSlope = (h: number) => 2 * Math.PI * s * (r + s * h);
  const coneVolumeSlope = (h: number) => coneArea(h);
  // A paraboloid r² = a·h: area π a h, volume π a h² / 2.
  const a = 5_000;
  const paraboloidArea = (h: number) => Math.PI * a * h;
  const paraboloidVolume = (h: number) => (Math.PI * a * h * h) / 2;
  const levels = [0, 2, 5, 9, 14, 20];
  const between = Array.from({ length: 97 }, (_, k) => 0.2 + (k * 19.6) / 96);

  it("interpolates a truncated cone's area and volume between coarse survey levels within the Hermite bound", () => {
    const area = new Pchip(levels, levels.map(coneArea));
    const volume = new Pchip(levels, levels.map(coneVolume));
    for (const h of between) {
      expect(Math.abs(area.at(h) - coneArea(h))).toBeLessThanOrEqual(hermiteBound(area, coneAreaSlope, h, coneArea(20)));
      expect(Math.abs(volume.at(h) - coneVolume(h))).toBeLessThanOrEqual(hermiteBound(volume, coneVolumeSlope, h, coneVolume(20)));
    }
  });

  it("turns a paraboloid's area into its volume through the level, within the bound (area is linear in level, so exact)", () => {
    const area = new Pchip(levels, levels.map(paraboloidArea));
    const volume = new Pchip(levels, levels.map(paraboloidVolume));
    for (const h of between) {
      const observed = paraboloidArea(h);
      const level = area.inverse(observed);
      // A straight line is reproduced exactly: the level comes back to rounding.
      expect(Math.abs(level - h)).toBeLessThanOrEqual(1e-9 * 20);
      const bound = hermiteBound(volume, (x) => Math.PI * a * x, level, paraboloidVolume(20));
      expect(Math.abs(volume.at(level) - paraboloidVolume(h))).toBeLessThanOrEqual(bound);
    }
  });
});

describe('Pchip properties', () => {
  it('never decreases on data that never decrease, and never leaves the range of the knots between them (300 random curves)', () => {
    const random = mulberry32(20261202);
    const faults: string[] = [];
    for (let run = 0; run < 300; run++) {
      const n = 2 + Math.floor(random() * 12);
      const x: number[] = [];
      const y: number[] = [];
      let xs = 0;
      let ys = 0;
      for (let k = 0; k < n; k++) {
        xs += 0.05 + random() * 5;
        ys += random() < 0.2 ? 0 : random() ** 3 * 50;
        x.push(xs);
        y.push(ys);
      }
      const interpolant = new Pchip(x, y);
      let before = -Infinity;
      for (let step = 0; step <= 400; step++) {
        const at = (x[0] as number) + (((x[n - 1] as number) - (x[0] as number)) * step) / 400;
        const value = interpolant.at(at);
        const k = interpolant.segment(at);
        if (value < before - 1e-9 * Math.max(1, Math.abs(before))) faults.push(`run ${run}: falls at ${at}`);
        if (value < (y[k] as number) - 1e-9 || value > (y[k + 1] as number) + 1e-9) faults.push(`run ${run}: leaves its knots at ${at}`);
        before = value;
      }
    }
    expect(faults).toEqual([]);
  });

  it('returns the level of an area (inverse) so that area → level → area comes back within 1e-9 relative, with PCHIP and linear', () => {
    const random = mulberry32(7);
    for (let run = 0; run < 100; run++) {
      const levels: number[] = [];
      const areas: number[] = [];
      let level = 100;
      let area = random() * 10;
      for (let k = 0; k < 8; k++) {
        level += 0.5 + random() * 3;
        area += 1 + random() * 400;
        levels.push(level);
        areas.push(area);
      }
      for (const curve of [new Pchip(levels, areas), new Linear(levels, areas)]) {
        for (let step = 0; step <= 50; step++) {
          const target = (areas[0] as number) + (((areas[7] as number) - (areas[0] as number)) * step) / 50;
          const back = curve.at(curve.inverse(target));
          expect(Math.abs(back - target)).toBeLessThanOrEqual(1e-9 * target);
        }
      }
    }
  });

  it('refuses knots that do not rise, and clamps outside the knots', () => {
    expect(() => new Pchip([0, 1, 1], [0, 1, 2])).toThrow(RangeError);
    expect(() => new Pchip([0], [0])).toThrow(RangeError);
    const curve = new Pchip([0, 1, 2], [10, 20, 40]);
    expect(curve.at(-5)).toBe(10);
    expect(curve.at(7)).toBe(40);
    expect(curve.inverse(5)).toBe(0);
    expect(curve.inverse(50)).toBe(2);
    // A flat stretch (straight walls): the lowest level with that area. The curve meets the flat
    // with zero slope, so the level is ill-conditioned there (an area within rounding of 20 spans
    // about 1e-8 of level): six decimals, while the area round trip stays exact.
    const walls = new Pchip([0, 1, 2, 3], [10, 20, 20, 30]);
    expect(walls.inverse(20)).toBeCloseTo(1, 6);
    expect(walls.at(walls.inverse(20))).toBeCloseTo(20, 9);
  });
});
