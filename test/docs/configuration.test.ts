/** docs/configuration.md is the schema's own account of bulletin.json: current, and every key described. */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { configurationMarkdown, settingRows } from '../../scripts/docs/configuration.ts';

describe('docs/configuration.md', () => {
  it('is what npm run docs:configuration makes from the schema today', () => {
    const committed = readFileSync(join(import.meta.dirname, '..', '..', 'docs', 'configuration.md'), 'utf8');
    expect(committed, 'run npm run docs:configuration').toBe(configurationMarkdown());
  });

  it('describes every setting, and lists the ones a reader could only find in error hints before', () => {
    const rows = settingRows();
    expect(rows.filter((row) => row.meaning === '').map((row) => row.key)).toEqual([]);
    for (const key of [
      'grid.cellDegrees',
      'grid.minBodies',
      'trends.falseDiscoveryRate',
      'trends.minMonths',
      'validation.qualityWindowDays',
    ])
      expect(rows.map((row) => row.key)).toContain(key);
  });
});
