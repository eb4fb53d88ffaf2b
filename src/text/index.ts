/**
 * User-facing wording lives in one catalogue per locale (content/locales/<locale>.json) so it can
 * be reviewed and translated in one place. This module imports nothing from src/: every stage may use it.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type english from '../../content/locales/en.json';

export type Messages = Record<string, string>;

/**
 * A key of the catalogues (the English one is the reference; every other has the same keys, which
 * test/text/locales.test.ts checks): a misspelt key is a compile error, not a failed build.
 * Keys made from configuration (a status band's name) go through `configuredKey`.
 */
export type MessageKey = keyof typeof english;

/** A key built from configuration, such as `band.<key>`: checked when the configuration is read (config-band-words), not here. */
export const configuredKey = (key: string) => key as MessageKey;

/** The catalogue key of a configured status band's name. */
export const bandKey = (band: string) => configuredKey(`band.${band}`);

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
export function formatMessage(messages: Messages, key: MessageKey, params: Record<string, string | number> = {}): string {
  const template = messages[key];
  if (template === undefined) throw new RangeError(`no message ${key}`);
  return fillMessage(template, params, key);
}

/**
 * A message whose wording depends on a count: `<key>.<category>` when the catalogue has it, for
 * the count's plural category in the locale (Intl.PluralRules: "one", "other", …), else `<key>`.
 * French puts 0 and 1 in "one", English only 1.
 */
export function formatCount(
  messages: Messages,
  locale: string,
  key: MessageKey,
  count: number,
  params: Record<string, string | number> = {},
): string {
  const variant = `${key}.${new Intl.PluralRules(locale).select(count)}`;
  return formatMessage(messages, messages[variant] === undefined ? key : (variant as MessageKey), params);
}

/** Fills the `{name}` placeholders of a message already looked up (templates look messages up themselves). */
export function fillMessage(template: string, params: Record<string, string | number> = {}, key = template): string {
  if (typeof template !== 'string') throw new RangeError('fillMessage requires a message; is its key in the catalogue?');
  return template.replace(/\{(\w+)\}/g, (_, name: string) => {
    const value = params[name];
    if (value === undefined) throw new RangeError(`message ${key} needs ${name}`);
    return String(value);
  });
}

/**
 * The name of a size class of water bodies by reference area, e.g. "10–100 ha", "over 1,000 ha",
 * and, when `upToFromZero` is set, "up to 10 ha" for a class that starts at 0.
 */
export function sizeClassLabel(locale: string, fromHa: number, toHa: number | null, upToFromZero = false): string {
  const messages = loadMessages(locale);
  const ha = (value: number) => new Intl.NumberFormat(locale, { maximumFractionDigits: 20 }).format(value);
  if (toHa === null) return formatMessage(messages, 'sizeClass.over', { from: ha(fromHa) });
  if (fromHa === 0 && upToFromZero) return formatMessage(messages, 'sizeClass.upTo', { to: ha(toHa) });
  return formatMessage(messages, 'sizeClass.range', { from: ha(fromHa), to: ha(toHa) });
}

/** `t(key, params)` for one locale: the catalogue looked up once. */
export function translator(locale: string): (key: MessageKey, params?: Record<string, string | number>) => string {
  const messages = loadMessages(locale);
  return (key, params) => formatMessage(messages, key, params);
}

/** The placeholder foreword `limnopress init` and `new-issue` write, in one language (ingest refuses it in an issue that is not a draft). */
export const placeholderForeword = (locale: string) => `${formatMessage(loadMessages(locale), 'init.foreword')}\n`;
