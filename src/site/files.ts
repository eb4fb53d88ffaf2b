/** Walking a built site: its files as sorted relative paths with forward slashes, and their hashes. */
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
 * Hashes taken in this process, by path, with the size, modification time and inode the file had
 * then: a file unchanged since (all three equal, the test make and rsync rely on) need not be read
 * again to know its hash.
 */
const hashed = new Map<string, { sha256: string; size: number; mtimeMs: number; ino: number }>();

/** SHA-256 and size of a file read in 8 MB pieces, so a file of gigabytes is never held whole. */
export function sha256File(path: string): { sha256: string; bytes: number } {
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
  if (after.size === before.size && after.mtimeMs === before.mtimeMs) hashed.set(path, { sha256, size: after.size, mtimeMs: after.mtimeMs, ino: after.ino });
  return { sha256, bytes };
}

/**
 * Copies a file and returns the SHA-256 of what was written: a file hashed earlier in this process
 * and unchanged since is copied by the system (its hash is known), any other is copied and hashed
 * in one read (copyWithHash).
 */
export function copyHashed(source: string, target: string): string {
  const known = hashed.get(source);
  const stat = statSync(source);
  if (known && known.size === stat.size && known.mtimeMs === stat.mtimeMs && known.ino === stat.ino) {
    copyFileSync(source, target);
    return known.sha256;
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
      for (let written = 0; written < read; ) written += writeSync(output, bytes, written, read - written);
      position += read;
    }
  } finally {
    closeSync(input);
    closeSync(output);
  }
  return hash.digest('hex');
}
