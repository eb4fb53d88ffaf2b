/**
 * Words that fit the region: what its water bodies are called, and whom the cautions send
 * readers to. Defaults come from the inventory; `wording` in bulletin.json overrides them.
 */
import type { BulletinConfig } from '../ingest/config.ts';
import type { WaterBody } from '../ingest/index.ts';
import { configuredKey, type MessageKey } from '../text/index.ts';

export type WaterBodiesWord = Exclude<BulletinConfig['wording']['waterBodies'], 'auto'>;

/**
 * What the region's water bodies are called: the configured word, or with `auto` the one the
 * inventory's `kind` column supports (case and surrounding spaces ignored): every body a
 * reservoir → reservoirs, every body a lake → lakes, only those two → lakes and reservoirs,
 * any other kind (a pond, a wetland, an empty cell) → water bodies.
 */
export function waterBodiesWord(
  setting: BulletinConfig['wording']['waterBodies'],
  bodies: readonly Pick<WaterBody, 'kind'>[],
): WaterBodiesWord {
  if (setting !== 'auto') return setting;
  const kinds = new Set(bodies.map((body) => body.kind.trim().toLowerCase()));
  if (kinds.size === 0) return 'water-bodies';
  if ([...kinds].every((kind) => kind === 'reservoir')) return 'reservoirs';
  if ([...kinds].every((kind) => kind === 'lake')) return 'lakes';
  if ([...kinds].every((kind) => kind === 'lake' || kind === 'reservoir')) return 'lakes-and-reservoirs';
  return 'water-bodies';
}

export const waterBodiesKey = (word: WaterBodiesWord): MessageKey => configuredKey(`words.waterBodies.${word}`);

/** The cautions in the language, naming the configured authorities where there are some. */
export function cautionTexts(
  wording: BulletinConfig['wording'],
  locale: string,
  t: (key: MessageKey, params?: Record<string, string | number>) => string,
): { algae: string; lowWater: string } {
  const authorities = [...new Set([wording.healthAuthority, wording.waterAuthority].filter((name): name is string => Boolean(name)))];
  return {
    algae: wording.healthAuthority ? t('caution.algae.named', { health: wording.healthAuthority }) : t('caution.algae'),
    lowWater:
      authorities.length > 0
        ? t('caution.lowWater.named', { authorities: new Intl.ListFormat(locale, { type: 'conjunction' }).format(authorities) })
        : t('caution.lowWater'),
  };
}
