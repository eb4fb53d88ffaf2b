/** The list of problem codes is the list in use: no code listed that no reader reports, no warning sentence for a code that does not exist. */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { PROBLEM_CODES } from '../../src/common/problemCodes.ts';
import { loadMessages } from '../../src/text/index.ts';

const SRC = join(import.meta.dirname, '..', '..', 'src');
const sources = (dir: string): string[] =>
  readdirSync(dir, { withFileTypes: true }).flatMap((entry) =>
    entry.isDirectory() ? sources(join(dir, entry.name)) : entry.name.endsWith('.ts') ? [readFileSync(join(dir, entry.name), 'utf8')] : [],
  );

describe('problem codes', () => {
  const code = sources(SRC)
    .filter((text) => !text.includes('export const PROBLEM_CODES'))
    .join('\n');

  it('every listed code is reported somewhere in src/', () => {
    const unused = Object.keys(PROBLEM_CODES).filter((name) => !code.includes(`'${name}'`));
    expect(unused).toEqual([]);
  });

  it('every warning sentence of the catalogues belongs to a listed code', () => {
    for (const locale of ['en', 'fr']) {
      const orphans = Object.keys(loadMessages(locale))
        .filter((key) => key.startsWith('warning.') && key !== 'warning.where')
        .map((key) => key.slice('warning.'.length))
        .filter((name) => !(name in PROBLEM_CODES));
      expect(orphans, locale).toEqual([]);
    }
  });
});
