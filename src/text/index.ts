/**
 * User-facing wording lives in one catalogue per locale (content/locales/<locale>.json) so it can
 * be reviewed and translated in one place. This module imports nothing from src/: every stage may use it.
 */
import { AsyncLocalStorage } from 'node:async_hooks';
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

/**
 * A bulletin folder's own wording (content/locales/<locale>.json in the folder), by locale: entries
 * that replace or add to the tool's catalogue for that folder's issue (read and checked by
 * ingest/wording.ts).
 */
export type WordingLayer = Readonly<Record<string, Readonly<Messages>>>;

const NO_LAYER: WordingLayer = Object.freeze({});
const toolCache = new Map<string, Messages>();
const layeredCache = new WeakMap<WordingLayer, Map<string, Messages>>();
/**
 * The layer in force for the work `withWording` runs: every lookup below it (the model's words,
 * the charts, the page data) sees the issue's own wording without each function taking it as an
 * argument. Scoped to that work and its promises, never process-wide, so two issues (or two
 * builds in one process) with different words cannot see each other's.
 */
const scope = new AsyncLocalStorage<WordingLayer>();

/** Runs `work` (and everything it awaits) with `layer` over the tool's catalogue. */
export function withWording<T>(layer: WordingLayer | undefined, work: () => T): T {
  return scope.run(layer ?? NO_LAYER, work);
}

/** The tool's own catalogue of a locale, without any bulletin folder's wording. */
export function toolMessages(locale: string): Messages {
  let messages = toolCache.get(locale);
  if (!messages) {
    const url = new URL(`../../content/locales/${locale}.json`, import.meta.url);
    messages = JSON.parse(readFileSync(fileURLToPath(url), 'utf8')) as Messages;
    toolCache.set(locale, messages);
  }
  return messages;
}

/** The tool's catalogue of a locale with `layer`'s entries for that locale over it. */
export function layeredMessages(locale: string, layer: WordingLayer): Messages {
  const own = layer[locale];
  if (own === undefined || Object.keys(own).length === 0) return toolMessages(locale);
  let byLocale = layeredCache.get(layer);
  if (!byLocale) layeredCache.set(layer, (byLocale = new Map()));
  let messages = byLocale.get(locale);
  if (!messages) byLocale.set(locale, (messages = { ...toolMessages(locale), ...own }));
  return messages;
}

/** The catalogue of a locale as the current work sees it: the tool's, with the issue's own wording over it (see withWording). */
export function loadMessages(locale: string): Messages {
  return layeredMessages(locale, scope.getStore() ?? NO_LAYER);
}

/** The `{name}` placeholders of a message, in order of first use. */
export function placeholdersOf(template: string): string[] {
  return [...new Set([...template.matchAll(/\{(\w+)\}/g)].map((match) => match[1] as string))];
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
export const placeholderForeword = (locale: string) => `${formatMessage(toolMessages(locale), 'init.foreword')}\n`;
