/**
 * Colour distances with simulated colour-vision deficiency (src/common/colourVision.ts) and the
 * status palette's checks (src/common/statusColours.ts).
 */
import { describe, expect, it } from 'vitest';
import { colourDistance, contrastRatio, simulate, smallestDistance } from '../../src/common/colourVision.ts';
import { MIN_STATUS_DISTANCE, paletteShortfalls, STATUS_COLOURS_5, statusColours } from '../../src/common/statusColours.ts';
import { loadBulletin } from '../../src/ingest/index.ts';
import { MINI_CONFIG, writeMini } from '../support/miniBulletin.ts';

describe('colour vision', () => {
  it('applies the Machado et al. (2009) severity-1.0 matrices to linear sRGB', () => {
    // Machado, Oliveira & Fernandes (2009), supplementary matrices, as in colorspacious's cvd.py:
    // deuteranopia row sums 1.000000, 1.000000 and 1.000001; first column 0.367322, 0.280085, −0.011820.
    expect(simulate([1, 0, 0], 'deuteranopia')).toEqual([0.367322, 0.280085, 0]);
    expect(simulate([0, 1, 0], 'protanopia')).toEqual([1, 0.786281, 0]);
    // Grey stays grey (each row sums to 1), to rounding of the published six decimals.
    for (const [r, g, b] of [simulate([0.5, 0.5, 0.5], 'deuteranopia'), simulate([0.5, 0.5, 0.5], 'protanopia')]) {
      expect(r).toBeCloseTo(0.5, 5);
      expect(g).toBeCloseTo(0.5, 5);
      expect(b).toBeCloseTo(0.5, 5);
    }
  });

  it('measures CIE76 distances in CIELAB (D65)', () => {
    // White is L* 100, black L* 0: ΔE 100 (the definition of L*).
    // (to 4 decimals: the sRGB matrix's four-decimal coefficients put white's X/Xn at 1.00003)
    expect(colourDistance('#ffffff', '#000000')).toBeCloseTo(100, 4);
    // sRGB red is L* 53.24, a* 80.09, b* 67.20 (the usual published value; from memory): its distance from black is |Lab|.
    expect(colourDistance('#ff0000', '#000000')).toBeCloseTo(Math.hypot(53.24, 80.09, 67.2), 0);
    // Red and green, far apart for most readers, come close with deuteranopia: the point of simulating.
    expect(colourDistance('#d62728', '#2ca02c', 'deuteranopia')).toBeLessThan(colourDistance('#d62728', '#2ca02c') / 2);
  });

  it('gives WCAG 2.x contrast ratios', () => {
    // WCAG 2.x: black on white is 21:1; #767676 on white about 4.54:1 (the lightest grey to pass AA; from memory).
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 9);
    expect(contrastRatio('#767676', '#ffffff')).toBeCloseTo(4.54, 2);
  });
});

describe('status colours', () => {
  it('keeps the default palette apart for every reader, and apart from the page and "not stated"', () => {
    expect(paletteShortfalls([...STATUS_COLOURS_5])).toEqual([]);
    expect(smallestDistance([...STATUS_COLOURS_5])).toBeGreaterThanOrEqual(MIN_STATUS_DISTANCE);
  });

  it('fails the palette used before, whose near-white middle looked like an empty cell', () => {
    const shortfalls = paletteShortfalls(['#a6611a', '#dfc27d', '#f5f5f5', '#80cdc1', '#018571']);
    expect(shortfalls.some((line) => line.includes('#f5f5f5') && line.includes('page white'))).toBe(true);
    expect(shortfalls.some((line) => line.includes('#f5f5f5') && line.includes('"not stated" grey'))).toBe(true);
  });

  it("spreads the default over any number of bands and keeps a band's own colour", () => {
    expect(statusColours([{}, {}, {}])).toEqual([STATUS_COLOURS_5[0], STATUS_COLOURS_5[2], STATUS_COLOURS_5[4]]);
    expect(statusColours([{ colour: '#123456' }, {}])).toEqual(['#123456', STATUS_COLOURS_5[4]]);
  });

  it('warns in check when configured colours are hard to tell apart, naming the configuration line', async () => {
    const bands = [
      { key: 'lower', fromPercent: null, colour: '#d62728' },
      { key: 'near', fromPercent: 90, colour: '#2ca02c' },
      { key: 'higher', fromPercent: 110, colour: '#1f4e8c' },
    ];
    const { problems } = await loadBulletin(
      writeMini({ 'bulletin.json': JSON.stringify({ ...MINI_CONFIG, statusBands: bands }, null, 2) }),
    );
    const warning = problems.warnings.find((problem) => problem.code === 'status-colours-close');
    expect(warning?.message).toContain('deuteranopia');
    expect(warning?.column).toBe('statusBands');
    expect(warning?.line).toBeGreaterThan(1);
  });
});
