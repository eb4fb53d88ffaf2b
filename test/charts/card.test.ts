/**
 * The preview card: 1200 × 630, not blank, and its text drawn in a real font: the same SVG rendered
 * by a process that sees no fonts at all (an empty fontconfig) must give different pixels.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';
import { CARD_HEIGHT, CARD_WIDTH, cardSvg } from '../../src/charts/card.ts';
import { svgToPng } from '../../src/charts/render.ts';
import { loadBulletin } from '../../src/ingest/index.ts';
import { buildModel } from '../../src/wording/index.ts';
import { formatPercent } from '../../src/text/format.ts';
import { EXAMPLE } from '../support/exampleSite.ts';

let svg: string;
let headline: string;
let png: Buffer;
let frenchSvg: string;

beforeAll(async () => {
  const { inputs, problems } = await loadBulletin(EXAMPLE);
  if (!inputs) throw new Error('the example does not load');
  const model = buildModel(inputs, problems.warnings, 'test');
  svg = cardSvg(model);
  const region = model.surfaceWater.region.status;
  if (region.kind !== 'stated') throw new Error('the example states its region');
  headline = formatPercent('en', region.percentOfBaseline);
  frenchSvg = cardSvg(buildModel(inputs, problems.warnings, 'test', { locale: 'fr' }));
  png = await svgToPng(svg);
});

/** Renders SVG to PNG in a child process whose fontconfig knows no font directory. */
function renderWithoutFonts(source: string): Buffer {
  const folder = mkdtempSync(join(tmpdir(), 'limnopress-nofonts-'));
  writeFileSync(join(folder, 'fonts.conf'), '<?xml version="1.0"?>\n<fontconfig><cachedir>' + folder + '</cachedir></fontconfig>\n');
  writeFileSync(join(folder, 'card.svg'), source);
  const script = `require('sharp')(${JSON.stringify(join(folder, 'card.svg'))}).png().toFile(${JSON.stringify(join(folder, 'card.png'))}).then(() => process.exit(0), (e) => { console.error(e); process.exit(1); })`;
  const result = spawnSync(process.execPath, ['-e', script], {
    env: { ...process.env, FONTCONFIG_FILE: join(folder, 'fonts.conf') },
    encoding: 'utf8',
  });
  if (result.status !== 0) throw new Error(result.stderr);
  return readFileSync(join(folder, 'card.png'));
}

describe('preview card', () => {
  it('cardSvg → PNG is 1200 × 630 and not blank', async () => {
    const meta = await sharp(png).metadata();
    expect([meta.width, meta.height]).toEqual([CARD_WIDTH, CARD_HEIGHT]);
    const stats = await sharp(png).stats();
    // A blank card has a standard deviation of 0 in every channel; text and the figure make it large.
    for (const channel of stats.channels.slice(0, 3)) expect(channel.stdev).toBeGreaterThan(20);
  });

  it('the card carries the title and headline figure, escaped', () => {
    expect(svg).toContain('Velduran Lakeland Water Bulletin');
    // The headline is the model's percent of usual, as the overview prints it.
    expect(svg).toContain(`>${headline}<`);
    expect(svg).toContain('Velduran Basin Water Office (an invented agency)');
  });

  it('the French card wraps its longer status words and keeps every glyph inside the card', async () => {
    expect(frenchSvg).toContain('>de la surface en eau habituelle\u00a0: bien plus bas</text>');
    expect(frenchSvg).toContain(">que d'habitude</text>");
    // Rendered: the right margin (x ≥ 1150, below the top bar) stays white, so no line runs off the card.
    const { data, info } = await sharp(await svgToPng(frenchSvg))
      .removeAlpha()
      .raw()
      .toBuffer({ resolveWithObject: true });
    let inked = 0;
    for (let y = 20; y < info.height; y++)
      for (let x = 1150; x < info.width; x++) if ((data[(y * info.width + x) * 3] as number) < 200) inked++;
    expect(inked).toBe(0);
  });

  it('the text is drawn with a font: a render with no fonts differs', async () => {
    const withoutFonts = renderWithoutFonts(svg);
    const a = await sharp(png).raw().toBuffer();
    const b = await sharp(withoutFonts).raw().toBuffer();
    expect(a.length).toBe(b.length);
    let differing = 0;
    for (let k = 0; k < a.length; k++) if (a[k] !== b[k]) differing++;
    expect(differing).toBeGreaterThan(1000);
  });
});
