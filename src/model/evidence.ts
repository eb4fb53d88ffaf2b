/**
 * Words for statistical evidence. One table maps a p value to the strength of evidence against "no
 * trend", following the evidence-based wording of Muff, Nilsen, O'Hara & Nater (2022), "Rewriting
 * results sections in the language of evidence", Trends in Ecology & Evolution 37, 203–210 (bounds
 * recalled from the paper). The words describe the strength of evidence, never the probability
 * that a statement is true: a p value is not such a probability.
 */
export type EvidenceKey = 'very-strong' | 'strong' | 'moderate' | 'weak' | 'little';

export const EVIDENCE_TABLE: ReadonlyArray<{ key: EvidenceKey; below: number }> = [
  { key: 'very-strong', below: 0.001 },
  { key: 'strong', below: 0.01 },
  { key: 'moderate', below: 0.05 },
  { key: 'weak', below: 0.1 },
  { key: 'little', below: Number.POSITIVE_INFINITY },
];

export function evidenceFor(p: number): EvidenceKey {
  for (const row of EVIDENCE_TABLE) if (p < row.below) return row.key;
  return 'little';
}
