/**
 * The one-page briefing PDF (src/charts/briefing.ts), read back with pdfjs-dist (Mozilla's PDF
 * reader): one A4 page, its text present, every font embedded, the same bytes on every run.
 */
import { describe, expect, it } from 'vitest';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { loadBulletin } from '../../src/ingest/index.ts';
import { buildModel, type BulletinModel } from '../../src/wording/index.ts';
import { briefingPdf } from '../../src/charts/briefing.ts';
import { renderChart, type RenderedChart } from '../../src/charts/render.ts';
import { bodiesMapChart } from '../../src/charts/maps.ts';
import { recentMonthsChart } from '../../src/charts/surfaceWaterCharts.ts';
import { writeMini } from '../support/miniBulletin.ts';

const URL_OF_ISSUE = 'https://bulletin.example.org/issues/2020-06/';

async function miniModel(): Promise<BulletinModel> {
  const { inputs, problems } = await loadBulletin(writeMini());
  if (!inputs) throw new Error(JSON.stringify(problems.errors));
  return buildModel(inputs, problems.warnings, 'test');
}

async function chartsOf(model: BulletinModel): Promise<Record<string, RenderedChart>> {
  return {
    'bodies-map': await renderChart(bodiesMapChart(model)),
    'recent-months': await renderChart(recentMonthsChart(model)),
  };
}

/** Page count, A4 size and text of a PDF as pdfjs reads it. */
async function readBack(pdf: Buffer) {
  const document = await getDocument({ data: new Uint8Array(pdf), useSystemFonts: false, isEvalSupported: false }).promise;
  const page = await document.getPage(1);
  const content = await page.getTextContent();
  const text = content.items.map((item) => ('str' in item ? item.str : '')).join(' ');
  const [, , width, height] = page.view;
  const pages = document.numPages;
  await document.destroy();
  return { pages, width, height, text: text.replace(/\s+/g, ' ') };
}

/** Every font dictionary of the file and whether it carries its font program (FontFile2: TrueType). */
function fonts(pdf: Buffer) {
  const raw = pdf.toString('latin1');
  return { descriptors: (raw.match(/\/Type \/FontDescriptor/g) ?? []).length, embedded: (raw.match(/\/FontFile2 /g) ?? []).length };
}

describe('briefingPdf', () => {
  it('writes one A4 page with the title, the headline, the key messages and the link, fonts embedded, the same bytes twice', async () => {
    const model = await miniModel();
    const charts = await chartsOf(model);
    const pdf = await briefingPdf(model, charts, URL_OF_ISSUE);
    const read = await readBack(pdf);
    expect(read.pages).toBe(1);
    // A4 in PostScript points (ISO 216: 210 × 297 mm).
    expect(read.width).toBeCloseTo(595.28, 1);
    expect(read.height).toBeCloseTo(841.89, 1);
    expect(read.text).toContain(model.meta.title);
    expect(read.text).toContain(model.meta.monthName);
    expect(read.text).toContain(URL_OF_ISSUE);
    // The headline's first words (a long sentence wraps over lines, which the reader joins with spaces).
    expect(read.text).toContain(model.headline.split(' ').slice(0, 4).join(' '));
    expect(model.keyMessages.length).toBeGreaterThan(0);
    expect(read.text).toContain('Key messages');
    const { descriptors, embedded } = fonts(pdf);
    expect(descriptors).toBeGreaterThanOrEqual(2);
    expect(embedded).toBe(descriptors);
    expect((await briefingPdf(model, charts, URL_OF_ISSUE)).equals(pdf)).toBe(true);
  });

  it('stays on one page with far more key messages than fit, and keeps the link to the full issue', async () => {
    const model = await miniModel();
    const many = Array.from({ length: 60 }, (_, k) => ({
      ...(model.keyMessages[0] as BulletinModel['keyMessages'][number]),
      text: `Message ${k + 1}: ${'a long sentence that wraps over the width of the page '.repeat(3)}`,
    }));
    const pdf = await briefingPdf({ ...model, keyMessages: many }, await chartsOf(model), URL_OF_ISSUE);
    const read = await readBack(pdf);
    expect(read.pages).toBe(1);
    expect(read.text).toContain('Message 1:');
    expect(read.text).not.toContain('Message 60:');
    expect(read.text).toContain(URL_OF_ISSUE);
  });
});
