/**
 * Stage 5, site: a build writes into a fresh staging folder beside the destination and swaps it in
 * only once everything succeeded. A failed or killed build leaves the published folder as it was;
 * its staging folder carries a marker name that no later build publishes and that is cleaned up.
 */
import { existsSync, mkdirSync, readdirSync, renameSync, rmSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';

const STAGING_MARK = '.limnopress-staging-';
const RETIRED_MARK = '.limnopress-retired-';

/**
 * Cleans up after builds that died part way: a retired site whose successor never took its name is
 * put back, and staging folders are removed.
 */
function recoverLeftovers(parent: string, name: string): void {
  if (!existsSync(parent)) return;
  const entries = readdirSync(parent).sort();
  const retired = entries.filter((entry) => entry.startsWith(`${name}${RETIRED_MARK}`));
  if (!existsSync(join(parent, name)) && retired[0] !== undefined) renameSync(join(parent, retired[0]), join(parent, name));
  for (const entry of entries) {
    if (entry.startsWith(`${name}${STAGING_MARK}`) || entry.startsWith(`${name}${RETIRED_MARK}`)) {
      rmSync(join(parent, entry), { recursive: true, force: true });
    }
  }
}

export async function publishAtomically(outDir: string, writeInto: (stagingDir: string) => Promise<void>): Promise<void> {
  const target = resolve(outDir);
  const parent = dirname(target);
  const name = basename(target);
  mkdirSync(parent, { recursive: true });
  recoverLeftovers(parent, name);
  const staging = join(parent, `${name}${STAGING_MARK}${process.pid}`);
  mkdirSync(staging);
  try {
    await writeInto(staging);
  } catch (error) {
    rmSync(staging, { recursive: true, force: true });
    throw error;
  }
  // Two renames: the old site is moved aside, then the new one takes its name. A crash between
  // them leaves the old site under the retired name, never a half-written one under the real name.
  const retired = join(parent, `${name}${RETIRED_MARK}${process.pid}`);
  if (existsSync(target)) renameSync(target, retired);
  renameSync(staging, target);
  rmSync(retired, { recursive: true, force: true });
}
