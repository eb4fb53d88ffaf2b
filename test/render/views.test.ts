/**
 * The page views and the site files, as functions of a model: properties that hold for any
 * inputs (every row as wide as its columns, no "undefined" or "NaN" printed, missing figures as
 * "–", user text passed as text), checked on the small test bulletin and on variants of it.
 */
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadBulletin } from '../../src/ingest/index.ts';
import { buildModel, type BulletinModel } from '../../src/wording/index.ts';
import { bodyView, changesSince, paginate, revisedFigures, subRegionView, views, type TableView } from '../../src/render/views.ts';
import { printedEarlier } from '../../src/wording/revisions.ts';
import { recentMonthsChart, regionalSeriesChart } from '../../src/charts/surfaceWaterCharts.ts';
import { prefixOf, siteFiles, siteLocales, siteUrl } from '../../src/render/siteFiles.ts';
import { translator } from '../../src/text/index.ts';
import { MINI_CONFIG, miniFiles, writeMini } from '../support/miniBulletin.ts';

async function miniModel(changes: Parameters<typeof writeMini>[0] = {}, locale = 'en'): Promise<BulletinModel> {
  const { inputs, problems } = await loadBulletin(writeMini(changes));
  if (!inputs) throw new Error(JSON.stringify(problems.errors));
  return buildModel(inputs, problems.warnings, 'test', { locale });
}

function allTables(view: ReturnType<typeof views>): TableView[] {
  return [
    ...Object.values(view.surface),
    ...view.trendTables,
    ...(view.quality ? [...Object.values(view.quality.byParameter), ...view.quality.others] : []),
    ...view.validationTables,
  ];
}

function expectWellFormed(tables: TableView[]): void {
  for (const table of tables) {
    expect(table.caption.length, table.id).toBeGreaterThan(0);
    for (const row of table.rows) {
      expect(row, table.id).toHaveLength(table.columns.length);
      for (const cell of row) expect(String(cell), table.id).not.toMatch(/undefined|NaN|null|\[object/);
    }
  }
}

describe('views', () => {
  it('gives every page its named tables, each row as wide as its columns and nothing unprinted, in both languages', async () => {
    for (const locale of ['en', 'fr']) {
      const view = views(await miniModel({}, locale));
      expect(Object.keys(view.surface)).toEqual(['status', 'subRegions', 'sizeClasses', 'grid']);
      expect(view.quality && Object.keys(view.quality.byParameter)).toEqual(['chlorophyll_a', 'turbidity']);
      expect(view.trendTables.map((table) => table.id)).toEqual(['region', 'sub-region-trends', 'declines', 'rises']);
      expectWellFormed(allTables(view));
    }
  });

  it('prints a figure that cannot be stated as "–" (a bulletin month nobody saw)', async () => {
    const files = miniFiles();
    // Every body barely seen in the bulletin month: observed share 0.05 for 2020-06, far below the configured 0.6.
    const area = files['area.csv']
      .split('\n')
      .map((line) => (line.includes(',2020-06,') ? line.replace(/,([0-9.]+),(\d+)$/, ',0.05,$2') : line))
      .join('\n');
    const model = await miniModel({ 'area.csv': area });
    expect(model.surfaceWater.region.status.kind).not.toBe('stated');
    const view = views(model);
    expectWellFormed(allTables(view));
    const status = Object.fromEntries(view.surface.status.rows.map(([name, value]) => [name, value]));
    const t = translator('en');
    for (const label of [t('view.baselineMedian'), t('view.percentOfMedian'), t('view.standardized')])
      expect(status[label], label).toBe('–');
    expect(status[t('ui.status')]).toBe(t('view.notStated.lowCoverage'));
    expect(view.figures.percentOfBaseline).toBe('–');
  });

  it('has no quality tables without quality data, and no validation table without field data', async () => {
    const config = structuredClone(MINI_CONFIG) as Record<string, unknown> & { inputs: Record<string, unknown> };
    delete config.inputs.quality;
    delete config.inputs.field;
    delete config.inputs.distribution;
    const view = views(await miniModel({ 'bulletin.json': JSON.stringify(config) }));
    expect(view.quality).toBeNull();
    expect(view.validationTables).toEqual([]);
  });

  it('passes user text through as text: markup in a name stays characters for the templates to escape', async () => {
    const files = miniFiles();
    const bodies = files['bodies.csv'].split('\n');
    bodies[1] = (bodies[1] as string).replace(/^([^,]+),([^,]+),/, '$1,"<b>Lake</b> & co",');
    const model = await miniModel({ 'bodies.csv': bodies.join('\n') });
    const body = bodyView(model, 0);
    expect(JSON.stringify(body)).toContain('<b>Lake</b> & co');
    expect(JSON.stringify(body)).not.toContain('&lt;');
    const subRegion = subRegionView(model, model.surfaceWater.subRegions[0]?.id as string);
    expect(subRegion.bodies.map((entry) => entry.name)).toContain('<b>Lake</b> & co');
    for (const row of subRegion.summary) for (const cell of row) expect(cell).not.toMatch(/undefined|NaN|null/);
  });

  it('paginate cuts a list into pages of the given size with their paths, the first at the base', () => {
    const pages = paginate(
      Array.from({ length: 45 }, (_, k) => k),
      '/x/',
      20,
    );
    expect(pages.map((page) => page.bodies.length)).toEqual([20, 20, 5]);
    expect(pages.map((page) => page.href)).toEqual(['/x/', '/x/page-2/', '/x/page-3/']);
    expect(pages.map((page) => [page.first, page.last])).toEqual([
      [1, 20],
      [21, 40],
      [41, 45],
    ]);
  });
});

describe('site files', () => {
  it('prefixOf puts the site language at the root and every other under /<locale>', () => {
    expect(prefixOf('en', 'en')).toBe('');
    expect(prefixOf('fr', 'en')).toBe('/fr');
    expect(siteLocales(['fr', 'en', 'fr'], 'en')).toEqual(['en', 'fr']);
    expect(siteUrl('https://example.org/bulletin/', '/issues/2020-06/')).toBe('https://example.org/bulletin/issues/2020-06/');
  });

  it('writes one Atom and one JSON feed per language, a sitemap of the pages with their language versions, and manifests', async () => {
    const english = await miniModel({}, 'en');
    const french = { ...(await miniModel({}, 'fr')) };
    french.meta = { ...french.meta, issuePath: `/fr${french.meta.issuePath}` };
    const site = mkdtempSync(join(tmpdir(), 'limnopress-sitefiles-'));
    for (const page of ['issues/2020-06/index.html', 'fr/issues/2020-06/index.html', 'index.html', 'fr/index.html']) {
      mkdirSync(join(site, page, '..'), { recursive: true });
      writeFileSync(join(site, page), '<!doctype html>');
    }
    const files = siteFiles([english, french], site, new Map(), 'en');
    const byPath = new Map(files.map((file) => [file.path, String(file.content)]));
    expect([...byPath.keys()].filter((path) => /feed\.(xml|json)$/.test(path)).sort()).toEqual([
      'feed.json',
      'feed.xml',
      'fr/feed.json',
      'fr/feed.xml',
    ]);
    // Feeds are well-formed data: the JSON parses, and the Atom names its entry's issue page.
    expect(JSON.parse(byPath.get('fr/feed.json') as string).items).toHaveLength(1);
    expect(byPath.get('feed.xml')).toContain('/issues/2020-06/');
    const sitemap = byPath.get('sitemap.xml') as string;
    expect(sitemap.match(/<url>/g)).toHaveLength(4);
    expect(sitemap).toContain('hreflang="fr"');
    expect([...byPath.keys()]).toContain('manifest.json');
  });
});

describe('revised figures', () => {
  it('lists a month an earlier issue printed with another value, and nothing when the values print the same', async () => {
    const current = await miniModel();
    const may = current.surfaceWater.region.series.find((row) => row.month === 2020 * 12 + 4);
    if (!may || may.fillingPercent === null) throw new Error('the mini bulletin has May 2020');
    // An earlier issue for May 2020 that printed 3 points less than this issue now gives.
    const earlier = structuredClone(current);
    earlier.meta = { ...earlier.meta, month: '2020-05', monthName: 'May 2020', revision: 1 };
    earlier.surfaceWater.region.status = {
      ...(earlier.surfaceWater.region.status as object),
      kind: 'stated',
      fillingPercent: may.fillingPercent - 3,
    } as typeof earlier.surfaceWater.region.status;
    // Its sub-regions and size classes printed what this issue gives them for May: no revision there.
    for (const group of [...earlier.surfaceWater.subRegions, ...earlier.surfaceWater.sizeClasses]) {
      const value = group.series.find((row) => row.month === 2020 * 12 + 4)?.fillingPercent ?? null;
      group.status =
        value === null
          ? { kind: 'low-coverage', coverageShare: 0, thresholdShare: 0.5 }
          : ({ ...(group.status as object), kind: 'stated', fillingPercent: value } as typeof group.status);
    }
    const revised = printedEarlier(current, [earlier]);
    expect(revised).toEqual([
      {
        figure: { kind: 'region', id: current.surfaceWater.region.id, name: current.surfaceWater.region.name },
        month: '2020-05',
        printedPercent: may.fillingPercent - 3,
        nowPercent: may.fillingPercent,
        issueMonthName: 'May 2020',
        revision: 1,
      },
    ]);
    const table = revisedFigures({ ...current, revised });
    expect(table?.rows).toHaveLength(1);
    expect(table?.rows[0]?.slice(0, 2)).toEqual([current.meta.region, 'May 2020']);
    expect(revisedFigures(current)).toBeNull();
    // The charts' tables say it beside the month, in a column only tables with revisions carry.
    for (const chart of [regionalSeriesChart, recentMonthsChart]) {
      const { columns, rows } = chart({ ...current, revised }).table;
      expect(columns[columns.length - 1]).toBe('Printed earlier');
      const may = rows.find((row) => row[0] === '2020-05');
      expect(may?.[may.length - 1]).toBe(
        `revised from ${new Intl.NumberFormat('en', { style: 'percent', minimumFractionDigits: 1, maximumFractionDigits: 1 }).format(revised[0]!.printedPercent / 100)} in the May 2020 issue`,
      );
      expect(rows.filter((row) => row[row.length - 1] !== '')).toHaveLength(1);
      expect(chart(current).table.columns).not.toContain('Printed earlier');
    }
    // A sub-region's figure revised is listed too, by its name, and stays out of the region's charts.
    const group = current.surfaceWater.subRegions[0]!;
    const groupMay = group.series.find((row) => row.month === 2020 * 12 + 4)?.fillingPercent;
    if (groupMay === null || groupMay === undefined) throw new Error('the mini bulletin has a sub-region figure for May 2020');
    const both = structuredClone(earlier);
    const thenGroup = both.surfaceWater.subRegions[0]!;
    thenGroup.status = { ...(thenGroup.status as object), kind: 'stated', fillingPercent: groupMay + 2 } as typeof thenGroup.status;
    const withGroup = printedEarlier(current, [both]);
    expect(withGroup.map((entry) => [entry.figure.kind, entry.figure.name, entry.printedPercent])).toEqual([
      ['region', current.surfaceWater.region.name, may.fillingPercent - 3],
      ['sub-region', group.name, groupMay + 2],
    ]);
    expect(revisedFigures({ ...current, revised: withGroup })?.rows.map((row) => row[0])).toEqual([current.meta.region, group.name]);
    expect(regionalSeriesChart({ ...current, revised: withGroup }).table.rows.filter((row) => row[row.length - 1] !== '')).toHaveLength(1);
    // A size class whose bounds were reconfigured is another group: no revision against it.
    const moved = structuredClone(earlier);
    const thenClass = moved.surfaceWater.sizeClasses[0]!;
    thenClass.fromHa += 1;
    thenClass.status = { ...(thenClass.status as object), kind: 'stated', fillingPercent: -50 } as typeof thenClass.status;
    expect(printedEarlier(current, [moved]).map((entry) => entry.figure.kind)).toEqual(['region']);
    // The same value to one decimal is no revision.
    (earlier.surfaceWater.region.status as { fillingPercent: number }).fillingPercent = may.fillingPercent + 0.01;
    expect(printedEarlier(current, [earlier])).toEqual([]);
    // A later issue is never compared with.
    expect(printedEarlier(earlier, [current])).toEqual([]);
  });
});

describe('changes since the previous issue', () => {
  it('lists the region, a sub-region and a large body whose status differs, with links, and nothing that stayed', async () => {
    const current = await miniModel();
    const t = translator('en');
    expect(changesSince(current, null)).toBeNull();
    // The same model as its own previous issue: nothing changed.
    const same = changesSince(current, structuredClone(current));
    expect(same?.rows).toEqual([]);
    const previous = structuredClone(current);
    previous.meta = { ...previous.meta, monthName: 'April 2020', issuePath: '/issues/2020-04/' };
    previous.surfaceWater.region.status = { kind: 'low-coverage', coverageShare: 0.1, thresholdShare: 0.5 };
    const largest = [...current.bodies.keys()].sort(
      (a, b) => (current.bodies[b]?.referenceHa ?? 0) - (current.bodies[a]?.referenceHa ?? 0) || a - b,
    )[0] as number;
    previous.bodyStatus[largest] = { kind: 'low-coverage', coverageShare: 0.1, thresholdShare: 0.5 };
    const changes = changesSince(current, previous);
    expect(changes?.month).toBe('April 2020');
    expect(changes?.href).toBe('/issues/2020-04/');
    const names = changes?.rows.map((row) => row.name);
    expect(names?.[0]).toBe(current.meta.region);
    expect(changes?.rows[0]?.from).toBe(t('view.notStated.lowCoverage'));
    expect(changes?.rows[0]?.href).toBe(`${current.meta.issuePath}surface-water/#status`);
    expect(names).toContain(current.bodies[largest]?.name);
    expect(changes?.rows.find((row) => row.name === current.bodies[largest]?.name)?.from).toBe(t('view.body.lowCoverage'));
    // Only what differs is listed.
    for (const row of changes?.rows ?? []) expect(row.from).not.toBe(row.to);
  });
});

describe('the overview figures', () => {
  it('prints each number from the model field it names, at the precision shown (the example, both languages)', async () => {
    const { EXAMPLE } = await import('../support/exampleSite.ts');
    const { inputs, problems } = await loadBulletin(EXAMPLE);
    if (!inputs) throw new Error('the example does not load');
    for (const locale of ['en', 'fr']) {
      const model = JSON.parse(JSON.stringify(buildModel(inputs, problems.warnings, 'test', { locale }))) as BulletinModel;
      const region = model.surfaceWater.region.status;
      if (region.kind !== 'stated') throw new Error('the example states its region');
      const own = model.bodyStatus;
      // Each tile and the model fields (as in the JSON download) its numbers come from, in order.
      const sources: Record<string, number[]> = {
        percentOfBaseline: [
          region.percentOfBaseline,
          region.range.percentOfBaselineLow as number,
          region.range.percentOfBaselineHigh as number,
        ],
        // Shares (0–1) in the model, printed as percents.
        coverage: [100 * region.coverageShare],
        seen: [100 * model.seenShare],
        declines: [model.trends.bodies.declining, model.trends.bodies.tested],
        shifted: [model.trends.bodies.shiftedDown, model.trends.bodies.tested],
        unstated: [
          own.filter((entry) => entry.kind !== 'stated').length,
          own.length,
          own.filter((entry) => entry.kind === 'low-coverage').length,
          own.filter((entry) => entry.kind === 'short-baseline').length,
        ],
        deficit: [model.surfaceWater.region.deficit.months],
      };
      const figures = views(model).figures as unknown as Record<string, string>;
      for (const [name, values] of Object.entries(sources)) {
        const text = (figures[name] as string).replace(/\u202f|\u00a0/g, ' ');
        // Numbers as printed (a decimal comma in French); a year beside a month name is a date, not a figure.
        const numbers = [...text.matchAll(/(?<![\p{L}\d])(\d[\d ,.]*\d|\d)(?![\p{L}\d])/gu)]
          .map((match) => (match[1] as string).trim())
          .filter((token) => !/^(19|20)\d\d$/.test(token));
        // The range is left out when it rounds to the figure itself: then only the figure is printed.
        expect(numbers.length, `${locale} ${name}: "${text}"`).toBeGreaterThan(0);
        numbers.forEach((token, k) => {
          const normal = locale === 'fr' ? token.replace(/ /g, '').replace(',', '.') : token.replace(/,/g, '');
          const decimals = normal.includes('.') ? (normal.split('.')[1] as string).length : 0;
          expect(
            Math.abs(Number(normal) - (values[k] as number)),
            `${locale} ${name}: ${token} in "${text}" against ${values[k]}`,
          ).toBeLessThanOrEqual(0.5 * 10 ** -decimals + 1e-9);
        });
      }
    }
  });
});
