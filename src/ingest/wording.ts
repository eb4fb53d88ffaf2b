/**
 * A bulletin folder's own wording: content/locales/<locale>.json, a JSON object of catalogue keys
 * and the words the agency wants in their place ("band.below-usual": "below what is usual here").
 * It is layered over the tool's catalogue for that folder's issue only (text/index.ts withWording).
 *
 * Checked here, so that `check` finds what would otherwise stop `build`:
 * - every key is a key of the tool's catalogue, or `band.<key>` of a configured status band;
 * - every value is one line of text that uses only the placeholders the tool's message fills;
 * - every configured status band has words in every configured language (tool's or the folder's).
 * Warnings: a file for a language the issue does not publish, a key reworded in one language but
 * not another, a plural message reworded without its variants, a placeholder left out.
 */
import { say, type ProblemText } from '../common/problemMessages.ts';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { BulletinConfig } from './config.ts';
import { didYouMean, jsonErrorLine, lineOfPath } from './config.ts';
import { ConfinementError, resolveInside } from './confine.ts';
import { isLink } from '../common/paths.ts';
import type { ProblemList } from './problems.ts';
import { bandKey, layeredMessages, placeholdersOf, toolMessages, type Messages, type WordingLayer } from '../text/index.ts';
import { LOCALE_CODES } from '../text/locales.ts';

/** Where a bulletin folder keeps its own wording, one file per language. */
export const WORDING_FOLDER = 'content/locales';

/** Longest reworded message, in characters: a paragraph, never a page. */
export const MAX_WORDING_LENGTH = 2000;

const wordingPath = (locale: string) => `${WORDING_FOLDER}/${locale}.json`;

/** Reads and checks a folder's own wording; the layer holds only files without errors. */
export function readWording(
  root: string,
  config: BulletinConfig,
  problems: ProblemList,
  label: (path: string) => string,
  /** bulletin.json's text, to point at a status band's own line. */
  configText = '',
): WordingLayer {
  const layer: Record<string, Messages> = {};
  const texts: Record<string, string> = {};
  const bands = new Set(config.statusBands.map((band) => bandKey(band.key) as string));
  for (const locale of LOCALE_CODES) {
    const path = wordingPath(locale);
    if (!existsSync(join(root, path)) && !isLink(join(root, path))) continue;
    const file = label(path);
    const error = (line: number, column: string, value: string, expected: string, message: ProblemText) =>
      problems.error({ code: 'wording-invalid', file, line, column, value, expected, message });
    let text: string;
    try {
      const bytes = readFileSync(resolveInside(root, path, 'content'));
      text = new TextDecoder('utf-8', { fatal: true }).decode(bytes).replace(/^\uFEFF/, '');
    } catch (caught) {
      if (caught instanceof ConfinementError) error(0, '', '', caught.expected, caught.message);
      else if (caught instanceof TypeError) error(0, '', '', 'UTF-8 text', say('file-not-utf8-convert'));
      else throw caught;
      continue;
    }
    let raw: unknown;
    try {
      raw = JSON.parse(text);
    } catch (caught) {
      const message = caught instanceof Error ? caught.message : String(caught);
      error(jsonErrorLine(text, caught), '', '', 'valid JSON', say('wording-not-json', { detail: message }));
      continue;
    }
    if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) {
      error(1, '', '', 'a JSON object of catalogue keys and their words', say('wording-not-object'));
      continue;
    }
    if (!config.locales.includes(locale as (typeof config.locales)[number])) {
      problems.warning({
        code: 'wording-unused',
        file,
        line: 0,
        column: '',
        value: locale,
        expected: `a language of "locales" in bulletin.json (${config.locales.join(', ')})`,
        message: say('wording-unused'),
      });
      continue;
    }
    const tool = toolMessages(locale);
    const known = Object.keys(tool);
    const own: Messages = {};
    let failed = false;
    for (const [key, value] of Object.entries(raw as Record<string, unknown>)) {
      const line = lineOfPath(text, [key]);
      const original = tool[key as keyof Messages] as string | undefined;
      if (original === undefined && !bands.has(key)) {
        const suggestion = didYouMean(key, [...known, ...bands]);
        error(
          line,
          key,
          key,
          suggestion
            ? `did you mean "${suggestion}"?`
            : "a key of the tool's catalogue (content/locales/ of the tool) or band.<key> of a configured status band",
          say('wording-unknown-key'),
        );
        failed = true;
        continue;
      }
      if (typeof value !== 'string' || value.trim() === '' || value.length > MAX_WORDING_LENGTH || /[\u0000-\u001f\u007f]/.test(value)) {
        error(
          line,
          key,
          typeof value === 'string' ? value.slice(0, 80) : JSON.stringify(value),
          `one line of text of 1 to ${MAX_WORDING_LENGTH} characters`,
          say('wording-not-text'),
        );
        failed = true;
        continue;
      }
      const allowed = original === undefined ? [] : placeholdersOf(original);
      const extra = placeholdersOf(value).filter((name) => !allowed.includes(name));
      if (extra.length > 0) {
        error(
          line,
          key,
          extra.map((name) => `{${name}}`).join(' '),
          allowed.length > 0 ? `only the placeholders ${allowed.map((name) => `{${name}}`).join(' ')}` : 'no placeholders',
          say('wording-extra-placeholder'),
        );
        failed = true;
        continue;
      }
      const dropped = allowed.filter((name) => !value.includes(`{${name}}`));
      if (dropped.length > 0)
        problems.warning({
          code: 'wording-drops-placeholder',
          file,
          line,
          column: key,
          value: dropped.map((name) => `{${name}}`).join(' '),
          expected: `the words keep ${allowed.map((name) => `{${name}}`).join(' ')}`,
          message: say('wording-drops-placeholder'),
        });
      own[key as keyof Messages] = value;
    }
    // A plural message has variants (key.one, key.two…) chosen by count: rewording only the base leaves them in the tool's words.
    for (const key of Object.keys(own)) {
      const variants = known.filter(
        (other) => other.startsWith(`${key}.`) && /^(zero|one|two|few|many|other)$/.test(other.slice(key.length + 1)),
      );
      const missing = variants.filter((variant) => own[variant as keyof Messages] === undefined);
      if (missing.length > 0)
        problems.warning({
          code: 'wording-plural-variants',
          file,
          line: lineOfPath(text, [key]),
          column: key,
          value: missing.join(', '),
          expected: `words for ${missing.join(', ')} too`,
          message: say('wording-plural-forms'),
        });
    }
    texts[locale] = text;
    if (!failed) layer[locale] = own;
  }
  // The same key reworded in one language but left in the tool's words in another.
  const published = config.locales.filter((locale) => layer[locale] !== undefined);
  for (const locale of published) {
    for (const key of Object.keys(layer[locale] as Messages)) {
      const others = config.locales.filter((other) => other !== locale && (layer[other] ?? {})[key as keyof Messages] === undefined);
      if (others.length === 0) continue;
      problems.warning({
        code: 'wording-one-language',
        file: label(wordingPath(locale)),
        line: lineOfPath(texts[locale] as string, [key]),
        column: key,
        value: others.join(', '),
        expected: others.map((other) => wordingPath(other)).join(', ') + ` with ${key}`,
        message: say('wording-one-language'),
      });
    }
  }
  // Every configured band has words in every language of the issue.
  for (const locale of config.locales) {
    const messages = layeredMessages(locale, layer);
    for (const [k, band] of config.statusBands.entries()) {
      if (messages[bandKey(band.key)] !== undefined) continue;
      problems.error({
        code: 'config-band-words',
        file: label('bulletin.json'),
        line: lineOfPath(configText, ['statusBands', k, 'key']),
        column: 'statusBands',
        value: band.key,
        expected: `words for band.${band.key} in ${wordingPath(locale)} of the bulletin folder`,
        message: say('config-band-words', { locale }),
      });
    }
  }
  return layer;
}
