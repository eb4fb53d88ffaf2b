/**
 * The issues of a bulletin folder: the folder itself is the current issue, and each folder under
 * `archive/` that holds a bulletin.json is an earlier issue, or an earlier revision of one, kept
 * with its own inputs so it can be rebuilt exactly as published.
 */
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { CONFIG_FILE } from './index.ts';

export const ARCHIVE_FOLDER = 'archive';

export function issueFolders(folder: string): string[] {
  const archive = join(folder, ARCHIVE_FOLDER);
  const archived = existsSync(archive)
    ? readdirSync(archive)
        .sort()
        .map((name) => join(archive, name))
        .filter((path) => statSync(path).isDirectory() && existsSync(join(path, CONFIG_FILE)))
    : [];
  return [...archived, folder];
}
