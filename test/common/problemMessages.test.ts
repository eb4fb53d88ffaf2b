/** The words of every problem come from one catalogue (src/common/problemMessages.ts), filled by name. */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { PROBLEM_MESSAGES, say, type ProblemMessageId } from '../../src/common/problemMessages.ts';

const SRC = join(import.meta.dirname, '..', '..', 'src');
const sources = (dir: string): string[] =>
  readdirSync(dir, { withFileTypes: true }).flatMap((entry) =>
    entry.isDirectory() ? sources(join(dir, entry.name)) : entry.name.endsWith('.ts') ? [readFileSync(join(dir, entry.name), 'utf8')] : [],
  );

/** `say` without its compile-time check of the figures, to call it for every id in a loop. */
const loose = say as (id: ProblemMessageId, params?: Record<string, string>) => string;

describe('problem messages', () => {
  it('say(id, params) fills each placeholder by name, however often it appears', () => {
    expect(say('file-too-large', { size: 2048, limit: 1024 })).toBe('the file is 2048 bytes, above the limit of 1024 for this kind');
    expect(say('content-untranslated', { locale: 'fr' })).toBe('no fr translation: the fr pages show this text in the first language');
    expect(say('file-missing')).toBe('the file does not exist');
    // A figure that holds braces is printed as it is, not read as a placeholder.
    expect(say('issue-twice', { other: 'archive/{x}' })).toBe('the same issue and revision is also in archive/{x}');
  });

  it('a misspelt id or a missing figure does not compile', () => {
    // @ts-expect-error: no such id in the catalogue.
    expect(() => say('file-missng')).toThrow();
    // @ts-expect-error: file-too-large needs its size and limit.
    expect(say('file-too-large', { size: 1 })).toContain('undefined');
  });

  it('every message is one line of lower-case words, filled completely when its figures are given', () => {
    for (const [id, text] of Object.entries(PROBLEM_MESSAGES)) {
      expect(text, id).not.toMatch(/[\n\r]/);
      expect(text, id).not.toMatch(/\.$/);
      const names = [...text.matchAll(/\{(\w+)\}/g)].map((match) => match[1] as string);
      const filled = loose(id as ProblemMessageId, Object.fromEntries(names.map((name) => [name, 'X'])));
      expect(filled, id).not.toMatch(/\{\w+\}/);
    }
  });

  it('every message is used in src/, and no reader writes a problem message inline', () => {
    const code = sources(SRC).filter((text) => !text.includes('export const PROBLEM_MESSAGES'));
    const all = code.join('\n');
    const unused = Object.keys(PROBLEM_MESSAGES).filter((id) => !all.includes(`'${id}'`));
    expect(unused).toEqual([]);
    // The type forbids it; this says where, should a cast ever slip in.
    const inline = code.flatMap((text) => [...text.matchAll(/\bmessage: ['`"][^'`"]*['`"]/g)].map((match) => match[0]));
    expect(inline).toEqual([]);
  });
});
