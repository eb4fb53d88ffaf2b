import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { copyHashed, copyWithHash, HashCache, sha256File } from '../../src/common/files.ts';

// The reference hash is node:crypto's SHA-256 of the whole file read at once.
const sha256Of = (path: string) => createHash('sha256').update(readFileSync(path)).digest('hex');

describe('files and hashes', () => {
  const dir = mkdtempSync(join(tmpdir(), 'limnopress-files-'));
  // Over one 8 MB piece, so the piecewise reads and writes are exercised.
  const big = Buffer.alloc(9 * (1 << 20) + 123, 7);
  big.write('limnopress', 5_000_000);

  it('sha256File and copyWithHash hash in pieces what a one-shot hash gives, and copyWithHash copies the bytes', () => {
    const source = join(dir, 'big.bin');
    writeFileSync(source, big);
    expect(sha256File(source)).toEqual({ sha256: sha256Of(source), bytes: big.length });
    const target = join(dir, 'copy.bin');
    expect(copyWithHash(source, target)).toBe(sha256Of(source));
    expect(readFileSync(target).equals(big)).toBe(true);
  });

  it('copyHashed reuses the hash of an unchanged file and hashes a changed one again', () => {
    const source = join(dir, 'input.csv');
    writeFileSync(source, 'a,b\n1,2\n');
    const cache = new HashCache();
    const before = sha256File(source, cache).sha256;
    expect(cache.known(source)).toBe(before);
    expect(copyHashed(source, join(dir, 'out-1.csv'), cache)).toBe(before);
    writeFileSync(source, 'a,b\n1,2\n3,4\n'); // changed after it was hashed
    expect(cache.known(source)).toBeNull();
    const after = copyHashed(source, join(dir, 'out-2.csv'), cache);
    expect(after).toBe(sha256Of(source));
    expect(after).not.toBe(before);
    expect(readFileSync(join(dir, 'out-2.csv'), 'utf8')).toBe('a,b\n1,2\n3,4\n');
  });

  it('a hash taken without a cache is remembered nowhere: another cache knows nothing of it', () => {
    const source = join(dir, 'alone.csv');
    writeFileSync(source, 'x\n');
    sha256File(source);
    expect(new HashCache().known(source)).toBeNull();
  });
});
