/**
 * The methods the model's figures rest on, by id. Each figure names its method; the data & methods
 * page prints the written method of each, from the locale's catalogue (`method.<id>`), so every
 * number on the site can be traced to a written rule.
 */
import { formatMessage, loadMessages } from '../text/index.ts';

export const METHOD_IDS = [
  'filling-ratio',
  'gap-filling',
  'fixed-set',
  'status',
  'deficit',
  'size-class-loss',
  'grid',
  'trend-bodies',
  'trend-region',
  'change-point',
  'quality-medians',
  'quality-classes',
  'trophic',
  'who-levels',
  'validation',
  'storage',
  'rainfall',
  'evidence',
] as const;

export type MethodId = (typeof METHOD_IDS)[number];

/** Every method written out in one locale, in the order above. */
export function methodTexts(locale: string): Record<MethodId, string> {
  const messages = loadMessages(locale);
  return Object.fromEntries(METHOD_IDS.map((id) => [id, formatMessage(messages, `method.${id}`)])) as Record<MethodId, string>;
}
