/**
 * The preview card (1200 × 630, the size link previews expect): title, month, and the
 * headline figure with its status words, drawn as SVG in the chart font and turned into PNG.
 */
import type { BulletinModel } from '../wording/index.ts';
import { translator, bandKey } from '../text/index.ts';
import { escapeXml } from '../text/escape.ts';
import { formatPercent } from '../text/format.ts';
import { CHART_FONT, OKABE_ITO } from './palettes.ts';

export const CARD_WIDTH = 1200;
export const CARD_HEIGHT = 630;

/** Greedy line breaking by an average glyph width (0.55 em for DejaVu Sans, measured by eye: common practice). */
function wrap(text: string, size: number, width: number): string[] {
  const perLine = Math.max(10, Math.floor(width / (size * 0.55)));
  const lines: string[] = [];
  let line = '';
  // Breaks at ordinary spaces only: a no-break space (French "habituelle : …") holds its words together.
  for (const word of text.split(/[ \t\n]+/)) {
    if (line && (line + ' ' + word).length > perLine) {
      lines.push(line);
      line = word;
    } else line = line ? `${line} ${word}` : word;
  }
  if (line) lines.push(line);
  return lines;
}

export function cardSvg(model: BulletinModel): string {
  const t = translator(model.meta.locale);
  const status = model.surfaceWater.region.status;
  const figure = status.kind === 'stated' ? formatPercent(model.meta.locale, status.percentOfBaseline) : '–';
  const words = status.kind === 'stated' ? t('card.stated', { band: t(bandKey(status.bandKey)) }) : t('card.none');
  const title = wrap(model.meta.title, 54, 1080).slice(0, 2);
  // The status words on up to two lines (French ones are longer); the figure moves up to make room.
  const wordLines = wrap(words, 40, 1080).slice(0, 2);
  const lift = (wordLines.length - 1) * 48;
  const text = (x: number, y: number, size: number, content: string, weight = 'normal', fill = '#1a1a1a') =>
    `<text x="${x}" y="${y}" font-family="${CHART_FONT}" font-size="${size}" font-weight="${weight}" fill="${fill}">${escapeXml(content)}</text>`;
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${CARD_WIDTH}" height="${CARD_HEIGHT}" viewBox="0 0 ${CARD_WIDTH} ${CARD_HEIGHT}">`,
    `<rect width="${CARD_WIDTH}" height="${CARD_HEIGHT}" fill="#ffffff"/>`,
    `<rect width="${CARD_WIDTH}" height="18" fill="${OKABE_ITO.blue}"/>`,
    ...title.map((line, k) => text(60, 110 + k * 64, 54, line, 'bold')),
    text(60, 110 + title.length * 64 + 10, 34, `${model.meta.region} · ${model.meta.monthName}`, 'normal', '#404040'),
    text(60, 470 - lift, 150, figure, 'bold', OKABE_ITO.blue),
    ...wordLines.map((line, k) => text(60, 540 - lift + k * 48, 40, line)),
    text(60, 600, 24, model.meta.publisher, 'normal', '#404040'),
    '</svg>',
  ].join('\n');
}
