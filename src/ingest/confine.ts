/**
 * Confinement: every file the tool reads from a bulletin folder must lie inside that folder once
 * symbolic links are resolved, be a regular file (never a FIFO, a device or a socket, which could
 * hang a read or never end), and stay under the size limit of its kind. Paths are relative, without
 * a NUL byte, and at most MAX_PATH_LENGTH characters.
 */
import { say, type ProblemText } from '../common/problemMessages.ts';
import { lstatSync, readdirSync, realpathSync, statSync } from 'node:fs';
import { isAbsolute, join, relative, sep } from 'node:path';
import { isInside } from '../common/paths.ts';

/** Longest relative path accepted in a configuration, in characters. */
export const MAX_PATH_LENGTH = 1024;

/** Size limits per kind of file, in bytes (documented in docs/input-format.md). */
export const SIZE_LIMITS = {
  /** bulletin.json */
  config: 1 << 20,
  /** content/*.md */
  content: 1 << 20,
  /** GeoJSON boundaries (read whole, so held in memory once). */
  boundaries: 256 << 20,
  /** The agency's logo (site.logo), PNG or SVG. */
  logo: 1 << 20,
  /** A CSV or Parquet table, or one Parquet partition (read in a stream). */
  table: 64 * 2 ** 30,
} as const;

export type FileKind = keyof typeof SIZE_LIMITS;

export class ConfinementError extends Error {
  declare readonly message: ProblemText;
  constructor(
    readonly code: 'path-invalid' | 'path-outside' | 'file-missing' | 'not-regular-file' | 'file-too-large',
    message: ProblemText,
    readonly expected: string,
  ) {
    super(message);
    this.name = 'ConfinementError';
  }
}

/**
 * Resolves `path` (relative, as written in a configuration) inside the real folder `root` and
 * checks what it names: inside `root` after links are resolved, and a regular file within the
 * kind's size limit, or, when `allowFolder`, a folder. Returns the real path.
 */
export function resolveInside(root: string, path: string, kind: FileKind, allowFolder = false): string {
  if (path === '' || path.includes('\0') || path.length > MAX_PATH_LENGTH) {
    throw new ConfinementError('path-invalid', say('path-invalid'), `a relative path of at most ${MAX_PATH_LENGTH} characters`);
  }
  if (isAbsolute(path) || /^[a-zA-Z]:[\\/]/.test(path)) {
    throw new ConfinementError('path-outside', say('path-absolute'), 'a path relative to the bulletin folder');
  }
  const joined = join(root, path);
  if (!isInside(root, joined)) throw new ConfinementError('path-outside', say('path-outside'), 'a path inside the bulletin folder');
  let real: string;
  try {
    real = realpathSync(joined);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ELOOP') throw new ConfinementError('path-invalid', say('path-link-loop'), 'a file inside the bulletin folder');
    throw new ConfinementError('file-missing', say('file-missing'), 'an existing file');
  }
  if (!isInside(root, real)) throw new ConfinementError('path-outside', say('path-link-outside'), 'a file inside the bulletin folder');
  const stat = statSync(real);
  if (stat.isDirectory() && allowFolder) return real;
  if (!stat.isFile())
    throw new ConfinementError('not-regular-file', stat.isDirectory() ? say('path-folder') : say('path-not-regular'), 'a regular file');
  if (stat.size > SIZE_LIMITS[kind])
    throw new ConfinementError(
      'file-too-large',
      say('file-too-large', { size: stat.size, limit: SIZE_LIMITS[kind] }),
      `at most ${SIZE_LIMITS[kind]} bytes`,
    );
  return real;
}

/**
 * The regular files below a folder as sorted relative paths with forward slashes. Symbolic links
 * are not followed (so a loop or a link out of the folder is never walked) and are reported.
 */
export function listRegularFiles(dir: string): { files: string[]; links: string[] } {
  const files: string[] = [];
  const links: string[] = [];
  const walk = (folder: string) => {
    for (const entry of readdirSync(folder).sort()) {
      const path = join(folder, entry);
      const stat = lstatSync(path);
      const rel = relative(dir, path).split(sep).join('/');
      if (stat.isSymbolicLink()) links.push(rel);
      else if (stat.isDirectory()) walk(path);
      else if (stat.isFile()) files.push(rel);
    }
  };
  walk(dir);
  return { files, links };
}
