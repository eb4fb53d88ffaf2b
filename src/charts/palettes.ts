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

/**
 * ColorBrewer BrBG, 5 classes (Brewer, Harrower & Pennsylvania State University, colorbrewer2.org):
 * brown for less water than usual, blue-green for more, a near-white middle.
 */
export const BROWN_BLUE_GREEN_5 = ['#a6611a', '#dfc27d', '#f5f5f5', '#80cdc1', '#018571'] as const;

/** ColorBrewer YlGnBu, 5 classes, light to dark: sequential counts. */
export const YELLOW_GREEN_BLUE_5 = ['#ffffcc', '#a1dab4', '#41b6c4', '#2c7fb8', '#253494'] as const;

/** Neutral marks: text-grade grey (5.4:1 on white) and a light grey fill for "no data". */
export const GREY = '#595959';
export const NO_DATA_FILL = '#e8e8e8';
export const OUTLINE = '#333333';

/** The one font for every chart, SVG and PNG alike (Debian's fonts-dejavu-core). */
export const CHART_FONT = 'DejaVu Sans';
