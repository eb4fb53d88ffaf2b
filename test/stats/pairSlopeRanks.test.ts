import { describe, expect, it } from 'vitest';
import { pairSlopeRanks } from '../../src/stats/pairSlopeRanks.ts';
import { sensSlope } from '../../src/stats/sensSlope.ts';

/** xorshift32: the test's own seeded generator (no clock, no Math.random). */
function generator(seed: number) {
  let state = seed >>> 0 || 1;
  return () => {
    state ^= state << 13;
    state ^= state >>> 17;
    state ^= state << 5;
    return (state >>> 0) / 4294967296;
  };
}

/** The definition: every slope made and sorted. */
function sortedSlopes(t: Float64Array, y: Float64Array): number[] {
  const all: number[] = [];
  for (let i = 0; i < t.length; i++)
    for (let j = i + 1; j < t.length; j++) all.push(((y[j] as number) - (y[i] as number)) / ((t[j] as number) - (t[i] as number)));
  return all.sort((a, b) => a - b);
}

const kinds: Record<string, (k: number, random: () => number, slope: number) => number> = {
  'rounded to one decimal (many ties)': (k, random, slope) => Math.round(10 * (slope * k + random())) / 10,
  'three levels only': (_k, random) => Math.round(random() * 2),
  'all equal': () => 5,
  continuous: (k, random, slope) => slope * k + random(),
  'a trend far larger than the noise': (k, random) => 1000 * k + random() * 1e-6,
  'large values with tiny differences': (k, random) => 1e9 + Math.round(random() * 4) * 1e-6 + k * 1e-7,
};

describe('pairSlopeRanks', () => {
  for (const [name, make] of Object.entries(kinds)) {
    it(`pairSlopeRanks(t, y, n, ranks) equals a full sort of the slopes: ${name}`, () => {
      const random = generator(name.length * 7919);
      let answered = 0;
      for (let trial = 0; trial < 60; trial++) {
        const n = 20 + Math.floor(random() * 260);
        // Monthly decimal years from 2010, as the bulletin passes them: large times, small steps.
        const t = Float64Array.from({ length: n }, (_, k) => (2010 * 12 + k) / 12);
        const slope = (random() - 0.5) * 0.1;
        const y = Float64Array.from({ length: n }, (_, k) => make(k, random, slope));
        const all = sortedSlopes(t, y);
        const count = all.length;
        const ranks = [
          ...new Set([Math.floor(count * 0.3), Math.floor((count - 1) / 2), Math.ceil((count - 1) / 2), Math.floor(count * 0.7)]),
        ].sort((a, b) => a - b);
        const found = pairSlopeRanks(t, y, n, ranks);
        if (found === null) continue;
        answered++;
        // === rather than Object.is: −0 and +0 are equal slopes, and a sort may place either first.
        ranks.forEach((rank, k) => expect(found[k] === all[rank], `n=${n} rank ${rank}: ${found[k]} against ${all[rank]}`).toBe(true));
      }
      // It gives up only rarely (the fallback makes every slope): at least 9 in 10 answered here.
      expect(answered).toBeGreaterThanOrEqual(54);
    });
  }

  it('pairSlopeRanks gives up (null) rather than guess when times repeat', () => {
    const t = Float64Array.from([1, 2, 2, 3, 4, 5]);
    const y = Float64Array.from([1, 3, 2, 5, 4, 6]);
    expect(pairSlopeRanks(t, y, 6, [7])).toBeNull();
  });

  it('sensSlope(times, values) is the same with and without pairSlopeRanks on a long tied series', () => {
    const random = generator(42);
    const n = 360;
    const times = Float64Array.from({ length: n }, (_, k) => 2000 + k / 12);
    const values = Float64Array.from({ length: n }, (_, k) => Math.round(10 * (0.01 * k + random() * 3)) / 10);
    const all = sortedSlopes(times, values);
    const result = sensSlope(times, values);
    // By hand from the sorted slopes: N = 64,620, so the median is the mean of ranks 32,309 and 32,310 (0-based).
    expect(all.length).toBe(64_620);
    expect(result.slope).toBe(((all[32_309] as number) + (all[32_310] as number)) / 2);
  });
});
