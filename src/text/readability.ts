/**
 * Flesch-Kincaid grade level (Kincaid, Fishburne, Rogers & Chissom 1975, Research Branch Report
 * 8-75, US Naval Technical Training Command): 0.39 × words per sentence + 11.8 × syllables per
 * word − 15.59.
 *
 * Syllables are counted by a rule of thumb (common practice, no source): groups of consecutive
 * vowels (a e i o u y), minus a silent final "e" (but not "-le"), at least one per word. A word
 * written with digits ("63%", "2018–2022") counts as one word of two syllables. Sentences end at
 * ".", "!" or "?" followed by a space or the end.
 */
export function fleschKincaidGrade(text: string): number {
  const sentences = Math.max(1, text.split(/[.!?](?:\s|$)/).filter((part) => part.trim() !== '').length);
  const words = text
    .split(/\s+/)
    .map((word) => word.replace(/^[^\p{L}\p{N}]+|[^\p{L}\p{N}%]+$/gu, ''))
    .filter((word) => word !== '');
  if (words.length === 0) return 0;
  const syllables = words.reduce((sum, word) => sum + syllablesOf(word), 0);
  return 0.39 * (words.length / sentences) + 11.8 * (syllables / words.length) - 15.59;
}

export function syllablesOf(word: string): number {
  if (/\d/.test(word)) return 2;
  const lower = word.toLowerCase().replace(/[^a-z]/g, '');
  if (lower === '') return 1;
  let count = (lower.match(/[aeiouy]+/g) ?? []).length;
  if (lower.length > 2 && lower.endsWith('e') && !lower.endsWith('le') && !/[aeiouy]e$/.test(lower)) count--;
  return Math.max(1, count);
}
