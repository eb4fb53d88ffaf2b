/** Where a path lies, for every stage that must stay inside a folder (ingest, publish, verify, preview). */
import { lstatSync } from 'node:fs';
import { isAbsolute, relative, sep } from 'node:path';

/** True when `inner` is `root` or lies below it (both absolute; a name such as `..notes` inside counts as inside). */
export function isInside(root: string, inner: string): boolean {
  const rel = relative(root, inner);
  return rel === '' || (rel !== '..' && !rel.startsWith(`..${sep}`) && !isAbsolute(rel));
}

/** The absolute address of a site path (`/issues/2026-11/`) under the configured base URL. */
export const siteUrl = (baseUrl: string, path: string) => new URL(path.replace(/^\//, ''), baseUrl).href;

/** True when `path` is a symbolic link (not followed). */
export function isLink(path: string): boolean {
  try {
    return lstatSync(path).isSymbolicLink();
  } catch {
    return false;
  }
}
