/**
 * Files and their hashes, for every stage: a folder's files as sorted relative paths with forward
 * slashes, SHA-256 of a file read in pieces, and copies that hash what they write. Nothing here is
 * shared between calls except through a HashCache the caller owns and passes.
 */
import { createHash } from 'node:crypto';
import { closeSync, copyFileSync, lstatSync, openSync, readdirSync, readSync, statSync, writeSync } from 'node:fs';
import { join, relative, sep } from 'node:path';

/** Files below `dir`; a symbolic link is listed as an entry and never followed (no loops, nothing outside). */
export function listFiles(dir: string): string[] {
  const found: string[] = [];
  const walk = (folder: string) => {
    for (const entry of readdirSync(folder).sort()) {
      const path = join(folder, entry);
      if (lstatSync(path).isDirectory()) walk(path);
      else found.push(relative(dir, path).split(sep).join('/'));
    }
  };
  walk(dir);
  return found;
}

export const sha256 = (bytes: Buffer | string) => createHash('sha256').update(bytes).digest('hex');

/**
 * Hashes already taken, by path, with the size, modification time and inode the file had then: a
 * file unchanged since (all three equal, the test make and rsync rely on) need not be read again to
 * know its hash. One build owns one cache (ingest fills it, render reads it); nothing is kept
 * process-wide.
 */
export class HashCache {
  private readonly hashed = new Map<string, { sha256: string; size: number; mtimeMs: number; ino: number }>();

  /** The hash of `path` when it was taken from the same file, unchanged since. */
  known(path: string): string | null {
    const entry = this.hashed.get(path);
    if (!entry) return null;
    const stat = statSync(path);
    return entry.size === stat.size && entry.mtimeMs === stat.mtimeMs && entry.ino === stat.ino ? entry.sha256 : null;
  }

  remember(path: string, sha256: string, stat: { size: number; mtimeMs: number; ino: number }): void {
    this.hashed.set(path, { sha256, size: stat.size, mtimeMs: stat.mtimeMs, ino: stat.ino });
  }
}

/**
 * SHA-256 and size of a file read in 8 MB pieces, so a file of gigabytes is never held whole. With a
 * cache, the hash is remembered when the file did not change while it was read.
 */
export function sha256File(path: string, cache?: HashCache): { sha256: string; bytes: number } {
  const before = statSync(path);
  const hash = createHash('sha256');
  const handle = openSync(path, 'r');
  const piece = Buffer.allocUnsafe(8 << 20);
  let bytes = 0;
  try {
    for (let read = readSync(handle, piece, 0, piece.length, bytes); read > 0; read = readSync(handle, piece, 0, piece.length, bytes)) {
      hash.update(piece.subarray(0, read));
      bytes += read;
    }
  } finally {
    closeSync(handle);
  }
  const sha256 = hash.digest('hex');
  const after = statSync(path);
  if (cache && after.size === before.size && after.mtimeMs === before.mtimeMs) cache.remember(path, sha256, after);
  return { sha256, bytes };
}

/**
 * Copies a file and returns the SHA-256 of what was written: a file the cache hashed and unchanged
 * since is copied by the system (its hash is known), any other is copied and hashed in one read
 * (copyWithHash).
 */
export function copyHashed(source: string, target: string, cache: HashCache): string {
  const known = cache.known(source);
  if (known !== null) {
    copyFileSync(source, target);
    return known;
  }
  return copyWithHash(source, target);
}

/** Copies a file in 8 MB pieces and returns the SHA-256 of the bytes written, read once for both. */
export function copyWithHash(source: string, target: string): string {
  const hash = createHash('sha256');
  const input = openSync(source, 'r');
  const output = openSync(target, 'w');
  const piece = Buffer.allocUnsafe(8 << 20);
  try {
    let position = 0;
    for (let read = readSync(input, piece, 0, piece.length, position); read > 0; read = readSync(input, piece, 0, piece.length, position)) {
      const bytes = piece.subarray(0, read);
      hash.update(bytes);
      for (let written = 0; written < read;) written += writeSync(output, bytes, written, read - written);
      position += read;
    }
  } finally {
    closeSync(input);
    closeSync(output);
  }
  return hash.digest('hex');
}
