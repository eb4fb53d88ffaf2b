/**
 * User-facing wording lives in one catalogue per locale (content/locales/<locale>.json) so it can
 * be reviewed and translated in one place. This module imports nothing from src/: every stage may use it.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export type Messages = Record<string, string>;

const cache = new Map<string, Messages>();

export function loadMessages(locale: string): Messages {
  let messages = cache.get(locale);
  if (!messages) {
    const url = new URL(`../../content/locales/${locale}.json`, import.meta.url);
    messages = JSON.parse(readFileSync(fileURLToPath(url), 'utf8')) as Messages;
    cache.set(locale, messages);
  }
  return messages;
}

/** Fills `{name}` placeholders; a missing key or placeholder is a programming error and throws. */
export function formatMessage(messages: Messages, key: string, params: Record<string, string | number> = {}): string {
  const template = messages[key];
  if (template === undefined) throw new RangeError(`no message ${key}`);
  return template.replace(/\{(\w+)\}/g, (_, name: string) => {
    const value = params[name];
    if (value === undefined) throw new RangeError(`message ${key} needs ${name}`);
    return String(value);
  });
}
