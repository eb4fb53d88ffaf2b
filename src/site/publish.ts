/**
 * Stage 5, site: where a build may publish, and how it swaps the new site in.
 *
 * Layout. `--out site` becomes a symbolic link `site → .site.limnopress/site-<id>`; the store
 * `.site.limnopress/` beside it holds the published version, the build lock and, during a build,
 * one staging folder. The tool writes only inside the store and at the link.
 *
 * The swap. A build writes into a staging folder in the store, renames it to a version folder, makes
 * a new link beside the old one and renames the new link over the old (rename(2) replaces a link
 * atomically); only then is the old version removed. A process killed at any instant (kill -9
 * included) leaves the link naming a complete site, the old or the new. Leftovers (staging folders,
 * unlinked versions, a stale lock) are cleaned by the next build, under the lock.
 *
 * The first build into a folder published by an earlier layout (a plain folder with a limnopress
 * manifest) moves that folder aside, then links: the one moment with no site at the path, and a
 * crash there is repaired by the next build, which puts the old folder back first.
 *
 * Refused before any work: an empty --out; a file; a folder that is, holds or lies inside the
 * bulletin folder; a folder that is or holds the current folder, the home folder or /; a mount point;
 * a link or a non-empty folder that this tool did not publish (unless `force`, which keeps that folder
 * under a new name and never deletes it).
 */
import { hostname, homedir } from 'node:os';
import {
  existsSync,
  lstatSync,
  mkdirSync,
  readdirSync,
  readFileSync,
  readlinkSync,
  realpathSync,
  renameSync,
  rmSync,
  rmdirSync,
  statSync,
  symlinkSync,
  unlinkSync,
  writeFileSync,
  linkSync,
} from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { isInside, isLink } from '../common/paths.ts';

const OLD_STAGING_MARK = '.limnopress-staging-';
const OLD_RETIRED_MARK = '.limnopress-retired-';

/** A refusal or failure of the site stage, worded for a person (one line). */
export class PublishError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PublishError';
  }
}

/** Points where a test can pause a build (LIMNOPRESS_TEST_PAUSE=<point>, or the pause option). */
export type PausePoint = 'locked' | 'inputs' | 'model' | 'charts' | 'pages' | 'renamed' | 'retired' | 'linked' | 'swapped';

/**
 * Test hook: with LIMNOPRESS_TEST_PAUSE naming this point, the process says so on stderr and then
 * waits until it is killed, so a test can kill it at an exact step.
 */
export async function pauseAt(point: PausePoint, hook?: (point: PausePoint) => Promise<void>): Promise<void> {
  if (hook) await hook(point);
  if (process.env.LIMNOPRESS_TEST_PAUSE === point) {
    process.stderr.write(`limnopress-paused ${point}\n`);
    await new Promise<void>(() => setInterval(() => {}, 1 << 30));
  }
}

/** Real path of a path that may not exist yet: the real path of its nearest existing ancestor, with the rest appended. */
function realish(path: string): string {
  const absolute = resolve(path);
  const rest: string[] = [];
  let at = absolute;
  while (!existsSync(at)) {
    rest.unshift(basename(at));
    const up = dirname(at);
    if (up === at) break;
    at = up;
  }
  return join(realpathSync(at), ...rest);
}

/** True when `dir` holds a site this tool published (its manifest says so). */
function isOurSite(dir: string): boolean {
  try {
    const manifest = JSON.parse(readFileSync(join(dir, 'manifest.json'), 'utf8')) as { tool?: { name?: unknown } };
    return manifest.tool?.name === 'limnopress';
  } catch {
    return false;
  }
}

export interface Target {
  /** The path given, resolved. */
  path: string;
  /** Writes a new site into staging and swaps it in; the old site stays until the new one is complete. */
  publish(writeInto: (stagingDir: string) => Promise<void>, pause?: (point: PausePoint) => Promise<void>): Promise<void>;
  /** Removes this build's staging folder and lock (synchronous: safe in a signal handler). */
  release(): void;
}

interface LockInfo {
  pid: number;
  host: string;
  started: string;
}

function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

function readLock(path: string): { raw: string; info: LockInfo | null } | null {
  try {
    const raw = readFileSync(path, 'utf8');
    try {
      return { raw, info: JSON.parse(raw) as LockInfo };
    } catch {
      return { raw, info: null };
    }
  } catch {
    return null;
  }
}

/**
 * Takes the store's lock: a file made with O_EXCL that names this process. A lock left by a process
 * of this machine that is gone (a build killed with -9) is taken over; one held by a live process, or
 * by another machine, stops the build with a message naming the holder.
 */
function takeLock(lockPath: string, out: string): void {
  const mine = `${JSON.stringify({ pid: process.pid, host: hostname(), started: new Date().toISOString() })}\n`;
  for (let attempt = 0; attempt < 5; attempt++) {
    try {
      writeFileSync(lockPath, mine, { flag: 'wx' });
      return;
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
    }
    const held = readLock(lockPath);
    if (!held) continue;
    const { info } = held;
    const stale = info !== null && info.host === hostname() && !processAlive(info.pid);
    if (!stale) {
      const who = info ? `process ${info.pid} on ${info.host}, since ${info.started}` : 'an unreadable lock';
      throw new PublishError(
        `another build is publishing to ${out} (${who}); wait for it to finish, or remove ${lockPath} if that build is gone`,
      );
    }
    // Stale: move it aside under a name of our own, and put it back if it changed meanwhile (another build took it).
    const aside = `${lockPath}.stale-${process.pid}`;
    try {
      renameSync(lockPath, aside);
    } catch {
      continue;
    }
    if (readLock(aside)?.raw !== held.raw) {
      try {
        linkSync(aside, lockPath);
      } catch {
        // A newer lock is in place already; ours was a stale one after all.
      }
    }
    unlinkSync(aside);
  }
  throw new PublishError(`cannot take the lock ${lockPath}`);
}

/**
 * Checks `outDir` and takes its lock, before the build does any work. `bulletinFolder` is the
 * folder being built, which the site may not overlap.
 */
export function openTarget(outDir: string, options: { bulletinFolder?: string; force?: boolean } = {}): Target {
  if (outDir.trim() === '') throw new PublishError('--out is empty; give the folder the site is published to');
  const target = resolve(outDir);
  const real = realish(target);
  const parent = dirname(target);
  const name = basename(target);
  const forbidden: Array<[string, string]> = [
    ['/', 'the root folder'],
    [realish(process.cwd()), 'the current folder'],
    [realish(homedir()), 'the home folder'],
  ];
  for (const [path, what] of forbidden)
    if (isInside(real, path)) throw new PublishError(`--out ${outDir} is or holds ${what}; give a folder of its own for the site`);
  if (options.bulletinFolder !== undefined && existsSync(options.bulletinFolder)) {
    const bulletin = realpathSync(options.bulletinFolder);
    if (isInside(real, bulletin) || isInside(bulletin, real))
      throw new PublishError(`--out ${outDir} overlaps the bulletin folder ${options.bulletinFolder}; publish the site outside it`);
  }
  const store = join(parent, `.${name}.limnopress`);
  let existing: ReturnType<typeof lstatSync> | null = null;
  try {
    existing = lstatSync(target);
  } catch {
    existing = null;
  }
  let kind: 'none' | 'link' | 'empty' | 'old-site' | 'foreign' = 'none';
  if (existing?.isSymbolicLink()) {
    const link = readlinkSync(target);
    if (!link.startsWith(`.${name}.limnopress/site-`) || link.includes('..'))
      throw new PublishError(`--out ${outDir} is a symbolic link that limnopress did not make; give another folder`);
    kind = 'link';
  } else if (existing?.isDirectory()) {
    if (statSync(parent).dev !== existing.dev)
      throw new PublishError(`--out ${outDir} is a mount point, which cannot be swapped; give a folder inside it`);
    if (readdirSync(target).length === 0) kind = 'empty';
    else if (isOurSite(target)) kind = 'old-site';
    else if (options.force) kind = 'foreign';
    else
      throw new PublishError(
        `--out ${outDir} is a folder that holds files but no limnopress site; give an empty or new folder, or --force to keep it under a new name and publish there`,
      );
  } else if (existing) {
    throw new PublishError(`--out ${outDir} is a file, not a folder; give a folder for the site`);
  }
  try {
    // Not one recursive mkdir: on some file systems (/proc) it never returns.
    if (!existsSync(parent)) mkdirSync(parent, { recursive: true });
    if (!existsSync(store)) mkdirSync(store);
  } catch (error) {
    throw new PublishError(`cannot write beside ${outDir}: ${systemReason(error)}`);
  }
  const lockPath = join(store, 'lock');
  takeLock(lockPath, outDir);
  let staging: string | null = null;
  let released = false;
  const release = () => {
    if (released) return;
    released = true;
    if (staging) rmSync(staging, { recursive: true, force: true });
    rmSync(lockPath, { force: true });
  };
  try {
    recover(parent, name, store);
  } catch (error) {
    release();
    throw error;
  }

  return {
    path: target,
    release,
    async publish(writeInto, pause) {
      staging = join(store, `staging-${process.pid}`);
      mkdirSync(staging);
      await writeInto(staging);
      const id = `site-${Date.now().toString(36)}-${process.pid}`;
      const version = join(store, id);
      renameSync(staging, version);
      staging = null;
      await pauseAt('renamed', pause);
      const linkText = `.${name}.limnopress/${id}`;
      if (kind === 'old-site' || kind === 'foreign' || kind === 'empty') {
        // One time only: the plain folder goes aside (kept, for a folder not ours), then the link takes its name.
        if (kind === 'empty') rmdirSync(target);
        else
          renameSync(
            target,
            kind === 'foreign'
              ? join(parent, `${name}.replaced-${Date.now().toString(36)}`)
              : join(parent, `${name}${OLD_RETIRED_MARK}${process.pid}`),
          );
        await pauseAt('retired', pause);
        symlinkSync(linkText, target);
      } else {
        const next = join(store, `link-${process.pid}`);
        rmSync(next, { force: true });
        symlinkSync(linkText, next);
        await pauseAt('linked', pause);
        renameSync(next, target);
      }
      kind = 'link';
      await pauseAt('swapped', pause);
      recover(parent, name, store);
    },
  };
}

/**
 * Under the lock: puts back an old-layout site that a crash left aside, and removes what no link
 * names (staging folders, superseded versions, loose links), only inside the store.
 */
function recover(parent: string, name: string, store: string): void {
  const target = join(parent, name);
  const beside = readdirSync(parent).sort();
  const retired = beside.filter((entry) => entry.startsWith(`${name}${OLD_RETIRED_MARK}`));
  if (!existsSync(target) && !isLink(target) && retired[0] !== undefined) renameSync(join(parent, retired[0]), target);
  for (const entry of beside) {
    if (
      entry.startsWith(`${name}${OLD_STAGING_MARK}`) ||
      (entry.startsWith(`${name}${OLD_RETIRED_MARK}`) && isOurSite(join(parent, entry)))
    )
      rmSync(join(parent, entry), { recursive: true, force: true });
  }
  const current = isLink(target) ? basename(readlinkSync(target)) : null;
  for (const entry of readdirSync(store)) {
    if (entry === 'lock' || entry === current) continue;
    if (entry.startsWith('staging-') || entry.startsWith('site-') || entry.startsWith('link-'))
      rmSync(join(store, entry), { recursive: true, force: true });
  }
}

/** A system error in words: "permission denied (EACCES)". */
export function systemReason(error: unknown): string {
  const code = (error as NodeJS.ErrnoException)?.code;
  const words: Record<string, string> = {
    EACCES: 'permission denied',
    EPERM: 'operation not permitted',
    EROFS: 'the file system is read-only',
    ENOSPC: 'no space left on the device',
    EDQUOT: 'disk quota exceeded',
    ENOENT: 'no such file or folder',
    ENOTDIR: 'a part of the path is not a folder',
    EISDIR: 'is a folder',
    EXDEV: 'crosses file systems',
    EBUSY: 'busy (a mount point?)',
    ELOOP: 'a loop of symbolic links',
  };
  if (code && words[code]) return `${words[code]} (${code})`;
  return error instanceof Error ? error.message : String(error);
}

/** For tests and older callers: check the folder, take the lock, publish, release. */
export async function publishAtomically(
  outDir: string,
  writeInto: (stagingDir: string) => Promise<void>,
  options: { bulletinFolder?: string; force?: boolean } = {},
): Promise<void> {
  const target = openTarget(outDir, options);
  try {
    await target.publish(writeInto);
  } finally {
    target.release();
  }
}
