import { describe, expect, it } from 'vitest';
import { evidenceFor } from '../../src/model/evidence.ts';

describe('evidenceFor', () => {
  it('evidenceFor(p) follows the table of Muff et al. (2022) at its bounds', () => {
    expect([0.0001, 0.001, 0.009, 0.01, 0.049, 0.05, 0.099, 0.1, 0.8].map(evidenceFor)).toEqual([
      'very-strong',
      'strong',
      'strong',
      'moderate',
      'moderate',
      'weak',
      'weak',
      'little',
      'little',
    ]);
  });
});
