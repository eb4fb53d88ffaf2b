/** Walking a built site: its files as sorted relative paths with forward slashes, and their hashes. */
import { createHash } from 'node:crypto';
import { readdirSync, statSync } from 'node:fs';
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
