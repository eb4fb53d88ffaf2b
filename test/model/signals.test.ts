/**
 * The analysis finds the signals put into the invented example on purpose
 * (example-bulletin/README.md, "Signals put in on purpose"). These are checks of the analysis on
 * invented data, not check values from outside: the expected directions are by construction.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { loadBulletin } from '../../src/ingest/index.ts';
import { buildModel, type BulletinModel } from '../../src/wording/index.ts';
import { fleschKincaidGrade } from '../../src/text/readability.ts';
import { EXAMPLE } from '../support/exampleSite.ts';

const DECLINING = ['WB044', 'WB047', 'WB059', 'WB062', 'WB065', 'WB068', 'WB071', 'WB074', 'WB077', 'WB080'];
let model: BulletinModel;

beforeAll(async () => {
  const { inputs, problems } = await loadBulletin(EXAMPLE);
  if (!inputs)
    throw new Error(
      problems
        .sorted()
        .map((p) => p.message)
        .join('\n'),
    );
  model = buildModel(inputs, problems.warnings, 'test');
});

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)] as number;

describe('the example region', () => {
  it('finds the multi-year decline of the Corlas Flats reservoirs after the Benjamini-Hochberg adjustment', () => {
    const entries = new Map(model.trends.bodies.entries.map((entry) => [entry.id, entry]));
    for (const id of DECLINING) expect(entries.get(id)?.direction, id).toBe('decline');
    const slope = (ids: string[]) => median(ids.map((id) => entries.get(id)?.test?.slopePerYear ?? Number.NaN));
    const others = model.trends.bodies.entries.filter((entry) => !DECLINING.includes(entry.id) && entry.test).map((entry) => entry.id);
    // Injected: −3.5 points a year on top of what every body shares.
    expect(slope(DECLINING) - slope(others)).toBeLessThan(-2.5);
  });

  it('finds the dry spell: every month from March 2025 below the baseline median, the bulletin month much lower than usual', () => {
    const region = model.surfaceWater.region;
    expect(region.status.kind === 'stated' && region.status.bandKey).toBe('much-lower');
    const envelope = model.surfaceWater.regionEnvelope;
    const spell = region.series.filter((row) => row.month >= 2025 * 12 + 2 && row.fillingPercent !== null);
    expect(spell.length).toBeGreaterThan(12);
    for (const row of spell) expect(row.fillingPercent as number).toBeLessThan(envelope[row.month % 12]?.median as number);
  });

  it('finds chlorophyll-a rising in bodies over 100 ha in the dry season, and not in small bodies', () => {
    const chlorophyll = model.quality?.parameters.find((entry) => entry.parameter === 'chlorophyll_a');
    const dryLarge = chlorophyll?.seasonal.find((entry) => entry.season === 'dry' && entry.sizeClass === 'over 100 ha');
    expect(dryLarge?.slopePerYear).toBeGreaterThan(0.5);
    expect(dryLarge?.p).toBeLessThan(0.01);
    const drySmall = chlorophyll?.seasonal.find((entry) => entry.season === 'dry' && entry.sizeClass === '1–5 ha');
    expect(drySmall?.p).toBeGreaterThan(0.05);
  });

  it('finds turbidity higher in the rainy months November–March than in June–September', () => {
    const turbidity = model.quality?.parameters.find((entry) => entry.parameter === 'turbidity');
    const byMonths = (months: number[]) =>
      median(
        (turbidity?.monthly ?? [])
          .filter((row) => months.includes((row.month % 12) + 1) && row.median !== null)
          .map((row) => row.median as number),
      );
    expect(byMonths([11, 12, 1, 2, 3]) / byMonths([6, 7, 8, 9])).toBeGreaterThan(1.5);
  });

  it('finds the seasonal filling cycle: most bodies are found seasonal (so get the seasonal slope), and April is fuller than October', () => {
    const seasonal = model.trends.bodies.entries.filter((entry) => entry.test && entry.test.seasonalityP < 0.05).length;
    expect(seasonal).toBeGreaterThan(model.trends.bodies.tested / 2);
    const envelope = model.surfaceWater.regionEnvelope;
    expect(envelope[3]?.median as number).toBeGreaterThan(envelope[9]?.median as number);
  });

  it('gives 3 to 6 key messages, each at most grade 9 on the Flesch-Kincaid scale and with its figure and link', () => {
    expect(model.keyMessages.length).toBeGreaterThanOrEqual(3);
    expect(model.keyMessages.length).toBeLessThanOrEqual(6);
    for (const message of model.keyMessages) {
      expect(fleschKincaidGrade(message.text), message.text).toBeLessThanOrEqual(9);
      expect(Number.isFinite(message.figure.value)).toBe(true);
      expect(Object.keys(model.methods)).toContain(message.figure.method);
      expect(message.link).toMatch(/^[a-z-]+\/#[a-z-]+$/);
    }
  });

  it('carries the caveats and cautions: baseline period, short baseline, optical limits, estimate not toxin test, authorities', () => {
    const text = model.notices.map((notice) => notice.text).join('\n');
    expect(text).toContain('baseline period 2018–2022');
    expect(text).toContain('short baseline');
    expect(text).toContain('cannot see through cloud');
    expect(text).toContain('not a test for toxins');
    expect(text).toContain('local health authority');
    // The example names its (invented) authorities in bulletin.json "wording"; the cautions name them and defer to them.
    expect(model.cautions.algae).toContain('Your local health authority, Velduran Basin Health Office, decides');
    expect(model.cautions.lowWater).toContain('authorities: Velduran Basin Health Office and Velduran Basin Water Office.');
    // Lakes, reservoirs and ponds in the inventory: the key message says "water bodies", not "lakes and reservoirs".
    expect(model.keyMessages.find((message) => message.id === 'region')?.text).toContain('the area covered by water in water bodies was');
    // The baseline is never called a normal: the word appears only to say that it is not one.
    const everything = [text, ...model.keyMessages.map((message) => message.text), ...Object.values(model.methods)].join('\n');
    expect(everything.replace(/not a long-term normal/g, '')).not.toMatch(/\bnormal\b/i);
  });
});
