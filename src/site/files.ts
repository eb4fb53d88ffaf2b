/** Walking a built site: its files as sorted relative paths with forward slashes, and their hashes. */
import { createHash } from 'node:crypto';
import { closeSync, openSync, readdirSync, readSync, statSync, writeSync } from 'node:fs';
import { join, relative, sep } from 'node:path';

export function listFiles(dir: string): string[] {
  const found: string[] = [];
  const walk = (folder: string) => {
    for (const entry of readdirSync(folder).sort()) {
      const path = join(folder, entry);
      if (statSync(path).isDirectory()) walk(path);
      else found.push(relative(dir, path).split(sep).join('/'));
    }
  };
  walk(dir);
  return found;
}

export const sha256 = (bytes: Buffer | string) => createHash('sha256').update(bytes).digest('hex');

/** SHA-256 and size of a file read in 8 MB pieces, so a file of gigabytes is never held whole. */
export function sha256File(path: string): { sha256: string; bytes: number } {
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
  return { sha256: hash.digest('hex'), bytes };
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
