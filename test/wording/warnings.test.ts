import { say } from '../../src/common/problemMessages.ts';
import { describe, expect, it } from 'vitest';
import type { Problem } from '../../src/ingest/index.ts';
import { warningText } from '../../src/wording/warnings.ts';

const above: Problem = {
  severity: 'warning',
  code: 'area-above-reference',
  file: 'data/surface-area.csv',
  line: 12,
  column: 'water_area_ha',
  value: '9000.5',
  expected: 'at most 1.5 × the reference area (4500.25 ha)',
  message: say('area-above-reference'),
  params: { reference: 4500.25 },
};

describe('warningText', () => {
  it('warningText(problem, locale) words a warning in the page language, numbers in its format, the value found as it was', () => {
    expect(warningText(above, 'en')).toMatchObject({
      lang: 'en',
      text: 'warning data/surface-area.csv:12 [water_area_ha]: the water area is far above the reference area: check the units or the inventory (found "9000.5"; expected at most 1.5 × the reference area (4,500.25 ha))',
    });
    const french = warningText(above, 'fr');
    expect(french.lang).toBe('fr');
    expect(french.text).toBe(
      'avertissement data/surface-area.csv:12 [water_area_ha]\u00a0: la surface en eau dépasse de loin la surface de référence\u00a0: vérifiez les unités ou l\u2019inventaire (trouvé «\u00a09000.5\u00a0»\u00a0; attendu au plus 1,5 × la surface de référence (4\u202f500,25 ha))',
    );
  });

  it('warningText keeps the input check English line, marked en, for a warning the catalogue has no sentence for', () => {
    const other: Problem = {
      severity: 'warning',
      code: 'value-out-of-range', // a code whose warning has no sentence in the catalogue
      file: 'bulletin.json',
      line: 0,
      column: 'x',
      value: 'y',
      expected: 'z',
      message: say('value-out-of-range'),
      params: {},
    };
    expect(warningText(other, 'fr')).toMatchObject({
      lang: 'en',
      text: 'warning bulletin.json [x]: the value is out of range (found "y"; expected z)',
    });
  });
});
