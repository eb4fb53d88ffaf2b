/**
 * The input check's warnings as the site shows them, in the page's language: the catalogue's
 * `warning.<code>` sentence filled with the figures the check gave (Problem.params), numbers in
 * the language's format. A warning without a sentence in the catalogue keeps the check's own
 * English line and says so (lang 'en').
 */
import { formatProblem, problemPlace, type Problem } from '../ingest/index.ts';
import { fillMessage, loadMessages } from '../text/index.ts';

export interface ShownWarning extends Problem {
  text: string;
  /** Language of `text`. */
  lang: string;
}

export function warningText(problem: Problem, locale: string): ShownWarning {
  const messages = loadMessages(locale);
  const sentence = messages[`warning.${problem.code}`];
  if (sentence === undefined || problem.params === undefined || problem.severity !== 'warning')
    return { ...problem, text: formatProblem(problem), lang: 'en' };
  const numbers = new Intl.NumberFormat(locale, { maximumFractionDigits: 6 });
  const params = Object.fromEntries(
    Object.entries(problem.params).map(([name, value]) => [name, typeof value === 'number' ? numbers.format(value) : value]),
  );
  const message = fillMessage(sentence, { ...params, value: problem.value }, `warning.${problem.code}`);
  return {
    ...problem,
    text: fillMessage(
      messages['warning.where'] as string,
      { where: problemPlace(problem), column: problem.column ? ` [${problem.column}]` : '', message },
      'warning.where',
    ),
    lang: locale,
  };
}
