/** The bulletin model on the small test bulletin: each figure kind checked by hand. */
import { describe, expect, it } from 'vitest';
import { loadBulletin } from '../../src/ingest/index.ts';
import { issueFigures } from '../../src/model/index.ts';
import { buildModel, wordModel } from '../../src/wording/index.ts';
import { EXAMPLE } from '../support/exampleSite.ts';
import { miniFiles, writeMini, type MiniFiles } from '../support/miniBulletin.ts';

async function modelOf(changes: Partial<Record<keyof MiniFiles, string>> = {}) {
  const { inputs, problems } = await loadBulletin(writeMini(changes));
  if (!inputs)
    throw new Error(
      problems
        .sorted()
        .map((p) => `${p.file}:${p.line} ${p.message}`)
        .join('\n'),
    );
  return buildModel(inputs, problems.warnings, 'test');
}

const base = miniFiles();

describe('buildModel on the small bulletin', () => {
  it('a region mostly under cloud in the bulletin month gets caveats, not figures', async () => {
    const area = base['area.csv']
      .replace(/A,2020-06,([\d.]+),0\.95,3/, 'A,2020-06,$1,0.2,3')
      .replace(/B,2020-06,([\d.]+),0\.9,2/, 'B,2020-06,$1,0.1,2');
    const model = await modelOf({ 'area.csv': area });
    expect(model.surfaceWater.region.status).toEqual({ kind: 'low-coverage', coverageShare: 0, thresholdShare: 0.5 });
    expect(model.keyMessages.map((message) => message.id)).not.toContain('region');
    expect(model.headline).toBe(
      'No regional figure is given for June 2020: clouds hid too much of the region (0% seen, at least 50% needed).',
    );
    expect(model.notices[0]).toEqual({ kind: 'notice', text: model.headline });
  });

  it('grid cells group bodies by location; a cell with fewer bodies than the minimum shows no anomaly', async () => {
    const model = await modelOf();
    // Both bodies (10.1° E 50.1° N and 10.2° E 50.2° N) fall in the 0.25° cell with corner 10° E, 50° N.
    expect(model.grid.cells).toHaveLength(1);
    expect(model.grid.cells[0]).toMatchObject({ west: 10, south: 50, size: 0.25, bodies: 2, status: { kind: 'stated' } });
    const lonely = await modelOf({
      'bodies.csv': base['bodies.csv'].replace('B,Two Reservoir,R1,10.2,50.2', 'B,Two Reservoir,R1,10.6,50.2'),
    });
    expect(lonely.grid.cells.map((cell) => cell.status.kind)).toEqual(['too-few-bodies', 'too-few-bodies']);
  });

  it('a monthly median from fewer than quality.minValidPixels valid pixels is no value, and is counted', async () => {
    const base = miniFiles()['quality.csv'];
    // A's 2020-06 rows rest on 150 pixels; with 40 they fall below the default of 100.
    const quality = base.replace(/^(A,2020-06,chlorophyll_a,.*),150$/m, '$1,40');
    const model = await modelOf({ 'quality.csv': quality });
    const chlorophyll = model.quality?.parameters.find((entry) => entry.parameter === 'chlorophyll_a');
    expect(chlorophyll?.bodiesThisMonth).toBe(0);
    expect(chlorophyll?.fewPixelsThisMonth).toBe(1);
    // No value this month, so no Carlson index; the 2019 annual mean still gives the OECD class.
    expect(model.quality?.trophic.bodies[0]).toMatchObject({ chlorophyll: null, index: null, carlsonClass: null, annualMonths: 12 });
    // The same row counts again when the setting allows it.
    const config = JSON.parse(miniFiles()['bulletin.json']);
    config.quality = { minValidPixels: 30 };
    const allowed = await modelOf({ 'quality.csv': quality, 'bulletin.json': JSON.stringify(config) });
    expect(allowed.quality?.parameters.find((entry) => entry.parameter === 'chlorophyll_a')?.bodiesThisMonth).toBe(1);
  });

  it('water quality: trophic state, OECD class, WHO levels and size-class quantiles, by hand', async () => {
    const quality = (await modelOf()).quality;
    // Only A (10 ha) has quality rows; its chlorophyll-a median is 4 µg/L every month.
    // Carlson: 10·(6 − (2.04 − 0.68·ln 4)/ln 2) = 10·(6 − 1.58310) = 44.169, between 40 and 50: mesotrophic on Carlson's scale.
    // OECD, on the mean of the last complete year (2019: twelve months of 4 µg/L): 2.5 < 4 ≤ 8 → mesotrophic.
    expect(quality?.trophic.year).toBe(2019);
    expect(quality?.trophic.bodies).toEqual([
      {
        id: 'A',
        chlorophyll: 4,
        index: expect.closeTo(44.169, 3),
        carlsonClass: 'mesotrophic',
        annualMean: 4,
        annualMonths: 12,
        trophicClass: 'mesotrophic',
      },
    ]);
    expect(quality?.who).toEqual({
      bodiesWithValue: 1,
      levels: [
        { level: 10, bodiesAbove: 0, sharePercent: 0 },
        { level: 50, bodiesAbove: 0, sharePercent: 0 },
      ],
    });
    const chlorophyll = quality?.parameters.find((entry) => entry.parameter === 'chlorophyll_a');
    // A is 10 ha: the 10–100 ha class ([10, 100)); one body, so every percentile is 4.
    expect(chlorophyll?.bySizeClass.find((entry) => entry.label === '10–100 ha')).toMatchObject({ bodies: 1, p10: 4, p50: 4, p90: 4 });
    expect(chlorophyll?.bySizeClass.find((entry) => entry.label === '1–5 ha')).toMatchObject({ bodies: 0, p50: null });
    // Plain and area-weighted medians agree with one body.
    expect(chlorophyll?.monthly.at(-1)).toMatchObject({ bodies: 1, median: 4, weightedMedian: 4 });
  });

  it('validation matches field samples to their month, or to the neighbouring month within the window', async () => {
    const quality = base['quality.csv']
      .split('\n')
      .filter((row) => !row.startsWith('A,2019-08,chlorophyll_a'))
      .join('\n');
    const field = `${base['field.csv']}A,2019-08-03,chlorophyll_a,5.0,ug/L\nA,2019-08-20,chlorophyll_a,9.0,ug/L\n`;
    const model = await modelOf({ 'quality.csv': quality, 'field.csv': field });
    const chlorophyll = model.validation.find((entry) => entry.parameter === 'chlorophyll_a');
    // 2019-05-14 → May (satellite 4); 2019-08-03 is 2 days into August, which has no value → July (4);
    // 2019-08-20 is 11 days from August's end and 19 from its start: no match.
    expect(chlorophyll?.pairs.map((pair) => [pair.date, pair.field, pair.satellite])).toEqual([
      ['2019-05-14', 4.2, 4],
      ['2019-08-03', 5, 4],
    ]);
    // Bias = mean(4 − 4.2, 4 − 5) = −0.6; RMSE = √((0.04 + 1)/2) = 0.72111.
    expect(chlorophyll?.agreement.bias).toBeCloseTo(-0.6, 12);
    expect(chlorophyll?.agreement.rootMeanSquareError).toBeCloseTo(0.72111, 5);
  });
});

describe('pages of their own', () => {
  it('site.maxBodyPages keeps the largest flagged bodies and says how many were left out', async () => {
    const bodies = miniFiles()['bodies.csv'].replace('A,Lake One,R1,10.1,50.1,10,lake,no', 'A,Lake One,R1,10.1,50.1,10,lake,yes');
    const config = JSON.parse(miniFiles()['bulletin.json']);
    config.site.maxBodyPages = 1;
    const model = await modelOf({ 'bodies.csv': bodies, 'bulletin.json': JSON.stringify(config) });
    // A (10 ha) and B (200 ha) are both flagged; with a cap of 1 only B, the larger, gets a page.
    expect(model.monitored.map((entry) => entry.id)).toEqual(['B']);
    expect(model.notices.map((notice) => notice.text)).toContain(
      '2 water bodies are flagged for a page of their own; the 1 largest have one. All of them are in the tables.',
    );
  });
});

describe('the wording stage in a second language', () => {
  it('wordModel(inputs, figures, …, { locale }) equals the model built from scratch in that language, sharing the figures', async () => {
    const { inputs, problems } = await loadBulletin(EXAMPLE);
    if (!inputs) throw new Error('example does not load');
    const figures = issueFigures(inputs);
    const before = JSON.stringify(figures);
    const english = wordModel(inputs, figures, problems.warnings, 'test', { locale: 'en' });
    const scratch = buildModel(inputs, problems.warnings, 'test', { locale: 'fr' });
    const shared = wordModel(inputs, figures, problems.warnings, 'test', { locale: 'fr' });
    expect(JSON.stringify(shared)).toBe(JSON.stringify(scratch));
    // Wording leaves the figures as they were, and they hold no words of either language.
    expect(JSON.stringify(figures)).toBe(before);
    expect(before).not.toMatch(/10,000 ha|10\u202f000 ha|over |plus de /);
    expect(Object.keys(figures.surface.sizeClasses[0] ?? {})).not.toContain('name');
    // Shared by reference, not copied: a second language adds words, not another copy of the figures.
    expect(shared.bodyStatus).toBe(english.bodyStatus);
    expect(shared.trends).toBe(english.trends);
    expect(shared.grid).toBe(english.grid);
    // The words differ.
    expect(shared.surfaceWater.sizeClasses.map((entry) => entry.name)).toContain('plus de 10\u202f000 ha');
    expect(english.surfaceWater.sizeClasses.map((entry) => entry.name)).toContain('over 10,000 ha');
  });
});

describe('no value is null', () => {
  /**
   * Paths (indices folded) of every stand-in for "no value" in the model: a number that is NaN or
   * infinite, or a text that is empty or a dash (formatting prints a dash; the model holds null).
   */
  const notFinite = (model: unknown) => {
    const found = new Set<string>();
    const walk = (value: unknown, path: string) => {
      if (typeof value === 'number' && !Number.isFinite(value)) found.add(path);
      else if (typeof value === 'string' && ['', '-', '–', '—'].includes(value.trim())) found.add(`${path} = "${value}"`);
      else if (Array.isArray(value)) for (const item of value) walk(item, `${path}[]`);
      else if (value && typeof value === 'object') for (const [key, item] of Object.entries(value)) walk(item, `${path}.${key}`);
    };
    walk(model, 'model');
    return [...found];
  };

  it('the model holds no NaN, Infinity, empty text or dash, so null is its only "no value" and JSON never turns one into null unnoticed (the example, and a month nobody saw)', async () => {
    const { inputs, problems } = await loadBulletin(EXAMPLE);
    if (!inputs) throw new Error('example does not load');
    expect(notFinite(buildModel(inputs, problems.warnings, 'test'))).toEqual([]);
    const area = miniFiles()['area.csv'].replace(/^(A|B),2020-06,[^,]*,[^,]*,(\d*)$/gm, '$1,2020-06,,0,$2');
    expect(notFinite(await modelOf({ 'area.csv': area }))).toEqual([]);
  });
});

describe('the share actually seen', () => {
  it('weights each body’s observed share by its reference area, and counts a body without a row as unseen', async () => {
    // June 2020: A (10 ha) seen 0.95, B (200 ha) seen 0.9 → (9.5 + 180) / 210 = 90.238 %.
    expect((await modelOf()).seenShare).toBeCloseTo((0.95 * 10 + 0.9 * 200) / 210, 12);
    // Without B's June row: 9.5 / 210 = 4.524 %.
    const area = miniFiles()['area.csv'].replace(/^B,2020-06,.*\n/m, '');
    expect((await modelOf({ 'area.csv': area })).seenShare).toBeCloseTo(9.5 / 210, 12);
  });
});
