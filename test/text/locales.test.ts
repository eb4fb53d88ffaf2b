/** The locale catalogues: every language says everything English says, with the same placeholders. */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { LOCALE_CODES } from '../../src/text/locales.ts';
import { configuredKey, fillMessage, formatCount, formatMessage, loadMessages, sizeClassLabel } from '../../src/text/index.ts';

const folder = join(import.meta.dirname, '..', '..', 'content', 'locales');
const locales = readdirSync(folder)
  .filter((name) => name.endsWith('.json'))
  .map((name) => name.slice(0, -5));
const placeholders = (text: string) => [...new Set(text.match(/\{\w+\}/g) ?? [])].sort();

describe('locale catalogues', () => {
  it('are exactly the languages of the registry (src/text/locales.ts), English and French among them', () => {
    expect([...locales].sort()).toEqual([...LOCALE_CODES].sort());
    expect(locales).toEqual(expect.arrayContaining(['en', 'fr']));
  });

  for (const locale of locales.filter((name) => name !== 'en')) {
    it(`${locale}.json has exactly the keys of en.json, each with the same placeholders and some text`, () => {
      const english = loadMessages('en');
      const other = JSON.parse(readFileSync(join(folder, `${locale}.json`), 'utf8')) as Record<string, string>;
      expect(Object.keys(other).sort()).toEqual(Object.keys(english).sort());
      for (const [key, text] of Object.entries(english)) {
        expect(placeholders(other[key] as string), key).toEqual(placeholders(text));
        expect((other[key] as string).trim().length, key).toBeGreaterThan(0);
      }
    });
  }

  it('fr.json puts a no-break space before the high punctuation of French typography', () => {
    const french = loadMessages('fr');
    for (const [key, text] of Object.entries(french)) expect(text, key).not.toMatch(/ [:;?!»]|« /);
  });
});

describe('formatMessage', () => {
  it('formatMessage(messages, key, params) fills every placeholder and throws on a missing one', () => {
    expect(formatMessage(loadMessages('fr'), 'ui.pager.next', { month: 'décembre 2026' })).toBe('Numéro suivant\u00a0: décembre 2026');
    expect(() => formatMessage(loadMessages('en'), 'ui.pager.next')).toThrow(/needs month/);
    // A key from outside the code (a configured band) can still be missing at run time.
    expect(() => formatMessage(loadMessages('en'), configuredKey('no.such.key'))).toThrow(/no message/);
    // A misspelt key in code is a compile error (npm run lint fails if this line compiles).
    // @ts-expect-error: not a catalogue key
    expect(() => formatMessage(loadMessages('en'), 'ui.pager.nxet')).toThrow(/no message/);
  });

  it('fillMessage(template, params) leaves braces inside the values alone', () => {
    expect(fillMessage('{a} and {b}', { a: '{b}', b: 'x' })).toBe('{b} and x');
  });
});

describe('sizeClassLabel', () => {
  it('sizeClassLabel(locale, from, to) groups thousands the way each language does', () => {
    expect(sizeClassLabel('en', 1000, 10000)).toBe('1,000–10,000 ha');
    expect(sizeClassLabel('en', 10000, null)).toBe('over 10,000 ha');
    expect(sizeClassLabel('en', 0, 10, true)).toBe('up to 10 ha');
    // French groups with a narrow no-break space (U+202F), as Intl.NumberFormat('fr') does.
    expect(sizeClassLabel('fr', 10000, null)).toBe('plus de 10\u202f000 ha');
  });
});

describe('formatCount', () => {
  it('formatCount(messages, locale, key, count) takes the plural variant of the count in each language', () => {
    const params = (declining: number) => ({ declining, tested: 80, firstYear: 2018 });
    // French: one plan d'eau (singular verb); English: "1 of 80 … has", "2 of 80 … have".
    expect(formatCount(loadMessages('fr'), 'fr', 'key.trendCount', 1, params(1))).toMatch(
      /^1 plan d'eau sur 80 montre une baisse régulière de sa surface/,
    );
    expect(formatCount(loadMessages('fr'), 'fr', 'key.trendCount', 2, params(2))).toMatch(
      /^2 plans d'eau sur 80 montrent une baisse régulière de leur surface/,
    );
    expect(formatCount(loadMessages('en'), 'en', 'key.trendCount', 1, params(1))).toMatch(/^1 of 80 water bodies shows a steady loss/);
    expect(formatCount(loadMessages('en'), 'en', 'key.trendCount', 79, params(79))).toMatch(/^79 of 80 water bodies show a steady loss/);
    // A key with no variants is used as it is.
    expect(formatCount(loadMessages('en'), 'en', 'ui.pager.next', 1, { month: 'May 2026' })).toBe('Next issue: May 2026');
  });
});

describe('template keys', () => {
  it('every catalogue key a template names (t["…"]) exists: templates are not type-checked, so this test is their check', () => {
    const english = loadMessages('en');
    const root = join(import.meta.dirname, '..', '..', 'templates');
    const templates = (dir: string): string[] =>
      readdirSync(dir, { withFileTypes: true }).flatMap((entry) =>
        entry.isDirectory() ? templates(join(dir, entry.name)) : entry.name.endsWith('.njk') ? [join(dir, entry.name)] : [],
      );
    const named: string[] = [];
    for (const file of templates(root))
      for (const match of readFileSync(file, 'utf8').matchAll(/t\[["']([^"']+)["']\]/g)) named.push(match[1] as string);
    expect(named.length).toBeGreaterThan(50);
    expect(named.filter((key) => !(key in english))).toEqual([]);
  });
});
