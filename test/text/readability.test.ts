import { describe, expect, it } from 'vitest';
import { fleschKincaidGrade, syllablesOf } from '../../src/text/readability.ts';

describe('fleschKincaidGrade', () => {
  it('fleschKincaidGrade(text) applies the Kincaid et al. (1975) coefficients, by hand', () => {
    // 6 words, 1 sentence, 6 syllables: 0.39 × 6 + 11.8 × 1 − 15.59 = −1.45.
    expect(fleschKincaidGrade('The cat sat on the mat.')).toBeCloseTo(-1.45, 10);
    // 2 sentences of 4 words, syllables 1+1+2+1 and 1+1+1+3 = 11: 0.39 × 4 + 11.8 × 11/8 − 15.59 = 2.195.
    expect(fleschKincaidGrade('Dry lakes hold water. We see it daily.')).toBeCloseTo(0.39 * 4 + (11.8 * 11) / 8 - 15.59, 10);
  });

  it('syllablesOf(word) counts vowel groups, drops a silent final e, and counts numbers as two', () => {
    expect(['water', 'reservoir', 'lake', 'table', 'the', 'algae', '63%', 'chlorophyll-a'].map(syllablesOf)).toEqual([
      2, 3, 1, 2, 1, 2, 2, 4,
    ]);
  });
});
