/**
 * Bidirectional isolation for text from the inputs (names, titles): a text that holds right-to-left
 * letters or bidi control characters is wrapped in FIRST STRONG ISOLATE … POP DIRECTIONAL ISOLATE
 * (Unicode Standard Annex #9, §2.7), so it can neither reorder the words around it nor leave an
 * override open (a PDI closes every embedding and override opened after its isolate). Other text is
 * returned unchanged.
 */
const BIDI_SENSITIVE =
  /[\u0590-\u08ff\ufb1d-\ufdff\ufe70-\ufeff\u200e\u200f\u061c\u202a-\u202e\u2066-\u2069]|\ud802[\udc00-\udfff]|\ud83a[\udc00-\udfff]/;

export function isolateBidi(text: string): string {
  return BIDI_SENSITIVE.test(text) ? `\u2068${text}\u2069` : text;
}
