/**
 * The status colours: this project's own diverging palette from dark brown (much less water than
 * usual) through a grey-blue middle (close to usual) to deep blue (much more), and the checks any
 * palette must pass (colourVision.ts): every two status colours at least MIN_STATUS_DISTANCE apart
 * (CIE76 ΔE*ab) with full colour vision and simulated deuteranopia and protanopia (Machado et al.
 * 2009), and every one at least MIN_BACKGROUND_DISTANCE from the page white and from the "not
 * stated" grey, which maps also hatch or mark with a cross so that no status looks like no data.
 * The limits are this project's choice (a ΔE*ab of about 2.3 is often quoted as just noticeable,
 * from memory; classes on a map need many times that).
 */
import { colourDistance, type Vision } from './colourVision.ts';

export const STATUS_COLOURS_5 = ['#6b3207', '#c98b2e', '#b8c4c9', '#5aa9c9', '#17456e'] as const;
/** The fill of "not stated" and "no data" (with a hatch or a cross on maps). */
export const NOT_STATED_FILL = '#e8e8e8';
export const PAGE_WHITE = '#ffffff';
export const MIN_STATUS_DISTANCE = 20;
export const MIN_BACKGROUND_DISTANCE = 12;
const VISIONS: Vision[] = ['normal', 'deuteranopia', 'protanopia'];

/** One colour per band: the band's own `colour` when configured, else the default palette spread over the bands. */
export function statusColours(bands: Array<{ colour?: string | undefined }>): string[] {
  const palette = STATUS_COLOURS_5;
  return bands.map((band, k) => band.colour ?? (palette[Math.round((k * (palette.length - 1)) / Math.max(1, bands.length - 1))] as string));
}

/** The pairs of a palette that fall below the limits, worded for a warning; empty when it passes. */
export function paletteShortfalls(colours: string[]): string[] {
  const found: string[] = [];
  for (const vision of VISIONS) {
    for (let i = 0; i < colours.length; i++) {
      for (let j = i + 1; j < colours.length; j++) {
        const distance = colourDistance(colours[i] as string, colours[j] as string, vision);
        if (distance < MIN_STATUS_DISTANCE)
          found.push(
            `${colours[i]} and ${colours[j]} differ by ΔE ${distance.toFixed(1)} (${vision}; at least ${MIN_STATUS_DISTANCE} wanted)`,
          );
      }
      for (const background of [PAGE_WHITE, NOT_STATED_FILL]) {
        const distance = colourDistance(colours[i] as string, background, vision);
        if (distance < MIN_BACKGROUND_DISTANCE)
          found.push(
            `${colours[i]} is ΔE ${distance.toFixed(1)} from ${background === PAGE_WHITE ? 'the page white' : 'the "not stated" grey'} (${vision}; at least ${MIN_BACKGROUND_DISTANCE} wanted)`,
          );
      }
    }
  }
  return found;
}
