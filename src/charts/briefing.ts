/**
 * The one-page briefing of an issue, in one language: an A4 PDF with the title and date, the status
 * map and the recent months as vector drawings (the same SVG the pages inline), the headline, the
 * key messages, the cautions and the address of the full issue. Fonts are the system's DejaVu Sans,
 * embedded (subset); the creation date is the publication date, so a rebuild gives the same
 * bytes. Everything past the page's end is left out rather than spilling onto a second page: the
 * link at the foot always fits, and says where the rest is.
 */
import { existsSync } from 'node:fs';
import PDFDocument from 'pdfkit';
import SVGtoPDF from 'svg-to-pdfkit';
import { translator } from '../text/index.ts';
import type { BulletinModel } from '../wording/index.ts';
import type { RenderedChart } from './render.ts';

/** Debian's fonts-dejavu-core, which the charts' PNGs use too. */
export const BRIEFING_FONTS = {
  regular: '/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf',
  bold: '/usr/share/fonts/truetype/dejavu/DejaVuSans-Bold.ttf',
};

const PAGE = { width: 595.28, height: 841.89, margin: 42 };
const INK = '#1f2a30';
const MUTED = '#4a5860';

export function briefingPdf(model: BulletinModel, charts: Record<string, RenderedChart>, pageUrl: string): Promise<Buffer> {
  for (const path of Object.values(BRIEFING_FONTS))
    if (!existsSync(path)) throw new Error(`the briefing PDF needs the font ${path} (Debian package fonts-dejavu-core)`);
  const t = translator(model.meta.locale);
  const published = new Date(`${model.meta.published}T00:00:00Z`);
  const doc = new PDFDocument({
    size: 'A4',
    margin: PAGE.margin,
    autoFirstPage: true,
    lang: model.meta.locale,
    displayTitle: true,
    info: {
      Title: `${model.meta.title}: ${model.meta.monthName}`,
      Subject: model.headline,
      Creator: `limnopress ${model.meta.toolVersion}`,
      Producer: 'limnopress',
      CreationDate: published,
      ModDate: published,
    },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  doc.registerFont('body', BRIEFING_FONTS.regular);
  doc.registerFont('bold', BRIEFING_FONTS.bold);
  const left = PAGE.margin;
  const width = PAGE.width - 2 * PAGE.margin;

  doc.font('bold').fontSize(18).fillColor(INK).text(model.meta.title, left, PAGE.margin, { width });
  doc
    .font('body')
    .fontSize(10.5)
    .fillColor(MUTED)
    .text(`${model.meta.region} · ${model.meta.monthName} · ${t('briefing.published', { date: model.meta.publishedName })}`, { width });
  doc.moveDown(0.6);
  doc.font('bold').fontSize(12).fillColor(INK).text(model.headline, { width });
  doc.moveDown(0.6);

  // The picture: the status map on the left, the recent months on the right, as vectors.
  const top = doc.y;
  const gap = 14;
  const drawn = [charts['bodies-map'], charts['recent-months']].filter((chart): chart is RenderedChart => Boolean(chart));
  const columns = [0.56 * (width - gap), 0.44 * (width - gap)];
  let bottom = top;
  drawn.forEach((chart, k) => {
    const viewBox = /viewBox="0 0 ([\d.]+) ([\d.]+)"/.exec(chart.svg);
    const boxWidth = columns[k] as number;
    const boxHeight = viewBox ? (boxWidth * Number(viewBox[2])) / Number(viewBox[1]) : boxWidth;
    const x = k === 0 ? left : left + (columns[0] as number) + gap;
    // Without its own width and height, the drawing scales from its viewBox into the box.
    const fitted = chart.svg.replace(
      /^<svg\b([^>]*)>/,
      (tag, attributes: string) => `<svg${attributes.replace(/\s(?:width|height)="[^"]*"/g, '')}>`,
    );
    SVGtoPDF(doc, fitted, x, top, {
      width: boxWidth,
      height: boxHeight,
      assumePt: true,
      preserveAspectRatio: 'xMinYMin meet',
      fontCallback: (_family: string, bold: boolean) => (bold ? 'bold' : 'body'),
    });
    doc
      .font('body')
      .fontSize(8.5)
      .fillColor(MUTED)
      .text(chart.title, x, top + boxHeight + 3, { width: boxWidth });
    bottom = Math.max(bottom, doc.y);
  });
  doc.x = left;
  doc.y = bottom + 10;

  // The foot is reserved first, so the link to the full issue is always on the page.
  const footText = t('briefing.link', { url: pageUrl });
  doc.font('body').fontSize(9.5);
  const footHeight = doc.heightOfString(footText, { width }) + 6;
  const limit = PAGE.height - PAGE.margin - footHeight;
  /** Writes a block only if it fits above the foot; false once one does not. */
  const fits = (text: string, font: 'body' | 'bold', size: number) => {
    doc.font(font).fontSize(size);
    if (doc.y + doc.heightOfString(text, { width }) > limit) return false;
    doc.fillColor(INK).text(text, left, doc.y, { width });
    return true;
  };

  const cautions = [
    ...new Set([
      ...model.notices.filter((notice) => notice.kind === 'caution').map((notice) => notice.text),
      ...(model.quality ? [model.cautions.algae] : []),
    ]),
  ];
  let room = fits(t('briefing.keyMessages'), 'bold', 12);
  for (const message of model.keyMessages) {
    if (!room) break;
    doc.moveDown(0.25);
    room = fits(`•  ${message.text}`, 'body', 10);
  }
  if (room && cautions.length > 0) {
    doc.moveDown(0.6);
    room = fits(t('briefing.cautions'), 'bold', 12);
    for (const caution of cautions) {
      if (!room) break;
      doc.moveDown(0.25);
      room = fits(caution, 'body', 9.5);
    }
  }
  doc
    .font('body')
    .fontSize(9.5)
    .fillColor(MUTED)
    .text(footText, left, PAGE.height - PAGE.margin - footHeight, { width, link: pageUrl, underline: false });
  doc.end();
  return done;
}
