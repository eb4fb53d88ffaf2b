/**
 * Colours, each from a published palette designed to survive colour-vision deficiency. Marks that
 * carry meaning are also told apart by position, shape, outline or text, never by colour alone.
 */

/** Okabe & Ito (2008), "Color Universal Design": categorical colours. */
export const OKABE_ITO = {
  blue: '#0072B2',
  vermillion: '#D55E00',
  bluishGreen: '#009E73',
  orange: '#E69F00',
  skyBlue: '#56B4E9',
  reddishPurple: '#CC79A7',
  yellow: '#F0E442',
  black: '#000000',
} as const;

/** Status colours: this project's own palette, checked for colour-vision deficiency (common/statusColours.ts). */
export { STATUS_COLOURS_5 } from '../common/statusColours.ts';

/** ColorBrewer YlGnBu, 5 classes, light to dark: sequential counts. */
export const YELLOW_GREEN_BLUE_5 = ['#ffffcc', '#a1dab4', '#41b6c4', '#2c7fb8', '#253494'] as const;

/** Neutral marks: text-grade grey (5.4:1 on white) and a light grey fill for "no data". */
export const GREY = '#595959';
export { NOT_STATED_FILL as NO_DATA_FILL } from '../common/statusColours.ts';
export const OUTLINE = '#333333';

/** The one font for every chart, SVG and PNG alike (Debian's fonts-dejavu-core). */
export const CHART_FONT = 'DejaVu Sans';
