/**
 * Words that fit the region (src/wording/region.ts): what the key messages call the water
 * bodies, read from the inventory, and the cautions naming the agency's authorities while still
 * deferring to them, in both languages.
 */
import { describe, expect, it } from 'vitest';
import { cautionTexts, waterBodiesKey, waterBodiesWord } from '../../src/wording/region.ts';
import { translator } from '../../src/text/index.ts';
import { configSchema } from '../../src/ingest/config.ts';

const kinds = (...list: string[]) => list.map((kind) => ({ kind }));

describe('waterBodiesWord', () => {
  it('auto reads the inventory: reservoirs only, lakes only, both, or anything else', () => {
    expect(waterBodiesWord('auto', kinds('reservoir', ' Reservoir ', 'RESERVOIR'))).toBe('reservoirs');
    expect(waterBodiesWord('auto', kinds('lake', 'Lake'))).toBe('lakes');
    expect(waterBodiesWord('auto', kinds('lake', 'reservoir'))).toBe('lakes-and-reservoirs');
    expect(waterBodiesWord('auto', kinds('lake', 'reservoir', 'pond'))).toBe('water-bodies');
    expect(waterBodiesWord('auto', kinds('lake', ''))).toBe('water-bodies');
    expect(waterBodiesWord('auto', [])).toBe('water-bodies');
  });

  it('a configured word wins over the inventory, and every word has its catalogue entry in both languages', () => {
    expect(waterBodiesWord('lakes-and-reservoirs', kinds('reservoir'))).toBe('lakes-and-reservoirs');
    const words = {
      en: ['lakes', 'reservoirs', 'lakes and reservoirs', 'water bodies'],
      fr: ['lacs', 'retenues', 'lacs et retenues', "plans d'eau"],
    };
    for (const [locale, expected] of Object.entries(words)) {
      const t = translator(locale);
      expect((['lakes', 'reservoirs', 'lakes-and-reservoirs', 'water-bodies'] as const).map((word) => t(waterBodiesKey(word)))).toEqual(
        expected,
      );
    }
  });
});

describe('cautionTexts', () => {
  const wording = (extra: Record<string, string>) => configSchema.shape.wording.parse(extra);

  it('without names, the cautions send readers to their local authorities in general words', () => {
    const { algae, lowWater } = cautionTexts(wording({}), 'en', translator('en'));
    expect(algae).toContain('Your local health authority decides on bathing and drinking-water safety; follow its advice.');
    expect(lowWater).toContain('follow your local health and water authorities.');
  });

  it('with names, they name the authorities and still defer to them, in English and French', () => {
    const named = wording({ healthAuthority: 'Orvel Health Office', waterAuthority: 'Orvel Water Board' });
    const en = cautionTexts(named, 'en', translator('en'));
    expect(en.algae).toContain(
      'Your local health authority, Orvel Health Office, decides on bathing and drinking-water safety; follow its advice.',
    );
    // Intl.ListFormat joins the names as the language does ("A and B", "A et B").
    expect(en.lowWater).toContain('follow your local health and water authorities: Orvel Health Office and Orvel Water Board.');
    const fr = cautionTexts(named, 'fr', translator('fr'));
    expect(fr.algae).toContain("L'autorité sanitaire locale, Orvel Health Office, décide");
    expect(fr.lowWater).toContain('de votre secteur\u00a0: Orvel Health Office et Orvel Water Board.');
  });

  it('one authority named for both is named once', () => {
    const same = cautionTexts(wording({ healthAuthority: 'Orvel Office', waterAuthority: 'Orvel Office' }), 'en', translator('en'));
    expect(same.lowWater).toMatch(/authorities: Orvel Office\.$/);
  });
});
