/**
 * The narrow variant of a chart, for screens under 40rem: the same marks and data on a plot 240
 * units wide (narrower for bars along names), every legend below the plot and larger type, so that shown at phone width (about 330
 * CSS px of a 360 px screen) no text is drawn smaller than 11 CSS px. The wide chart shrunk to that
 * width drew its smallest text at 3.4–6.4 px (measured in Chromium on the example, 4 December 2026).
 *
 * Labels drawn on the plot (text layers: names on a map, a value beside a bar) are left out of the
 * narrow drawing: at that width they collide, and each is in the chart's data table below it.
 */
import type { TopLevelSpec } from 'vega-lite';

/** Plot width of the narrow variant, in chart units. */
export const NARROW_WIDTH = 240;
/** Font size of every text in the narrow variant, in chart units (shown at about 0.85 of it). */
export const NARROW_FONT = 14;

type Json = unknown;

const isTextLayer = (layer: Json) => {
  const mark = (layer as { mark?: Json } | null)?.mark;
  return mark === 'text' || (typeof mark === 'object' && (mark as { type?: Json } | null)?.type === 'text');
};

function narrowed(node: Json, key: string | null): Json {
  if (Array.isArray(node))
    return (key === 'layer' ? node.filter((layer) => !isTextLayer(layer)) : node).map((item) => narrowed(item, null));
  if (!node || typeof node !== 'object') return node;
  const out: Record<string, Json> = {};
  for (const [name, value] of Object.entries(node as Record<string, Json>)) {
    // Data is never touched: only layout.
    if (name === 'data' || name === 'values') out[name] = value;
    else if (name === 'width' && typeof value === 'number' && value > NARROW_WIDTH) out[name] = NARROW_WIDTH;
    else if (name === 'legend' && value && typeof value === 'object')
      out[name] = { ...(narrowed(value, name) as object), orient: 'bottom', direction: 'vertical', labelLimit: NARROW_WIDTH };
    else if (name === 'fontSize' && typeof value === 'number') out[name] = Math.max(value, NARROW_FONT);
    else out[name] = narrowed(value, name);
  }
  // A text mark without its own size gets the narrow one.
  if (key === 'mark' && out.type === 'text' && out.fontSize === undefined) out.fontSize = NARROW_FONT;
  return out;
}

/** The narrow plot's least height: a 40-character axis title at NARROW_FONT. */
export const NARROW_MIN_HEIGHT = 320;
/** The narrow plot width of bars along a nominal axis, whose names take the rest of the width. */
export const NARROW_BAR_WIDTH = 160;
/** A map's narrow width; its height follows from its shape. */
export const NARROW_MAP_WIDTH = 240;

export function narrowSpec(spec: TopLevelSpec): TopLevelSpec {
  const out = narrowed(spec, null) as Record<string, Json>;
  const original = spec as unknown as Record<string, Json>;
  out.padding = 8;
  // A plot at least as tall as its vertical axis title at the narrow size (about 40 characters),
  // which would otherwise stretch the drawing with empty space above and below the plot.
  if (typeof original.height === 'number' && !original.projection) out.height = Math.max(original.height, NARROW_MIN_HEIGHT);
  // Bars along a nominal axis (a height by step) leave room beside the plot for their names.
  if (original.height && typeof original.height === 'object' && 'step' in (original.height as object)) out.width = NARROW_BAR_WIDTH;
  // A map keeps its shape: narrower, and shorter by the same factor.
  if (original.projection && typeof original.width === 'number' && typeof original.height === 'number') {
    out.width = NARROW_MAP_WIDTH;
    out.height = Math.round((NARROW_MAP_WIDTH * original.height) / original.width);
  }
  const config = (out.config ?? {}) as Record<string, Record<string, Json> | Json>;
  const part = (name: string) => (config[name] && typeof config[name] === 'object' ? (config[name] as Record<string, Json>) : {});
  out.config = {
    ...config,
    axis: { ...part('axis'), labelFontSize: NARROW_FONT, titleFontSize: NARROW_FONT, labelLimit: NARROW_WIDTH },
    legend: {
      ...part('legend'),
      labelFontSize: NARROW_FONT,
      titleFontSize: NARROW_FONT,
      orient: 'bottom',
      labelLimit: NARROW_WIDTH,
      // Several legends below the plot stack one above the other, not side by side.
      layout: { bottom: { direction: 'vertical', anchor: 'start' } },
    },
    header: { ...part('header'), labelFontSize: NARROW_FONT, titleFontSize: NARROW_FONT },
    title: { ...part('title'), fontSize: NARROW_FONT + 1, subtitleFontSize: NARROW_FONT },
    text: { ...part('text'), fontSize: NARROW_FONT },
  };
  return out as unknown as TopLevelSpec;
}
