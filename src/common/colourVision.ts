/**
 * How far apart colours look, for people with full colour vision and with the two common red–green
 * deficiencies, to check a status palette before it is used.
 *
 * Simulation: Machado, Oliveira & Fernandes (2009), "A physiologically-based model for simulation
 * of color vision deficiency", IEEE TVCG 15(6): 1291–1298, doi:10.1109/TVCG.2009.113; the
 * matrices for severity 1.0 (protanopia, deuteranopia) from the paper's supplementary page, as
 * reproduced by the colorspacious library (checked against it), applied to linear sRGB. Distance:
 * CIE 1976 ΔE*ab in CIELAB (D65), from IEC 61966-2-1 sRGB.
 */

export type Vision = 'normal' | 'deuteranopia' | 'protanopia';

const MACHADO_2009: Record<Exclude<Vision, 'normal'>, number[][]> = {
  protanopia: [
    [0.152286, 1.052583, -0.204868],
    [0.114503, 0.786281, 0.099216],
    [-0.003882, -0.048116, 1.051998],
  ],
  deuteranopia: [
    [0.367322, 0.860646, -0.227968],
    [0.280085, 0.672501, 0.047413],
    [-0.01182, 0.04294, 0.968881],
  ],
};

/** '#rrggbb' to sRGB components in [0, 1]; throws on anything else. */
export function parseHex(colour: string): [number, number, number] {
  const match = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(colour);
  if (!match) throw new RangeError(`not a #rrggbb colour: ${colour}`);
  return [parseInt(match[1] as string, 16) / 255, parseInt(match[2] as string, 16) / 255, parseInt(match[3] as string, 16) / 255];
}

const toLinear = (c: number) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4);

/** Linear sRGB as seen with a deficiency (clipped to the gamut). */
export function simulate(linear: [number, number, number], vision: Vision): [number, number, number] {
  if (vision === 'normal') return linear;
  const m = MACHADO_2009[vision];
  return m.map((row) =>
    Math.min(1, Math.max(0, (row[0] as number) * linear[0] + (row[1] as number) * linear[1] + (row[2] as number) * linear[2])),
  ) as [number, number, number];
}

/** CIELAB (D65) of linear sRGB. */
function lab([r, g, b]: [number, number, number]): [number, number, number] {
  const x = (0.4124 * r + 0.3576 * g + 0.1805 * b) / 0.95047;
  const y = 0.2126 * r + 0.7152 * g + 0.0722 * b;
  const z = (0.0193 * r + 0.1192 * g + 0.9505 * b) / 1.08883;
  const f = (t: number) => (t > (6 / 29) ** 3 ? Math.cbrt(t) : t / (3 * (6 / 29) ** 2) + 4 / 29);
  return [116 * f(y) - 16, 500 * (f(x) - f(y)), 200 * (f(y) - f(z))];
}

/** CIE76 ΔE*ab between two '#rrggbb' colours as seen with `vision`. */
export function colourDistance(a: string, b: string, vision: Vision = 'normal'): number {
  const [la, aa, ba] = lab(simulate(parseHex(a).map(toLinear) as [number, number, number], vision));
  const [lb, ab, bb] = lab(simulate(parseHex(b).map(toLinear) as [number, number, number], vision));
  return Math.hypot(la - lb, aa - ab, ba - bb);
}

/** WCAG 2.x contrast ratio of two '#rrggbb' colours. */
export function contrastRatio(a: string, b: string): number {
  const luminance = (colour: string) => {
    const [r, g, bl] = parseHex(colour).map(toLinear) as [number, number, number];
    return 0.2126 * r + 0.7152 * g + 0.0722 * bl;
  };
  const [high, low] = [luminance(a), luminance(b)].sort((x, y) => y - x) as [number, number];
  return (high + 0.05) / (low + 0.05);
}

/** The smallest distance between any two colours of a set, over the visions given. */
export function smallestDistance(colours: string[], visions: Vision[] = ['normal', 'deuteranopia', 'protanopia']): number {
  let smallest = Infinity;
  for (const vision of visions)
    for (let i = 0; i < colours.length; i++)
      for (let j = i + 1; j < colours.length; j++)
        smallest = Math.min(smallest, colourDistance(colours[i] as string, colours[j] as string, vision));
  return smallest;
}
