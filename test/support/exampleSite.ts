/** Builds the example bulletin once per test file into a fresh temporary folder. */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { build, type BuildResult } from '../../src/build.ts';

export const EXAMPLE = join(import.meta.dirname, '..', '..', 'example-bulletin');

export async function buildExample(label = 'site'): Promise<BuildResult & { dir: string }> {
  const dir = join(mkdtempSync(join(tmpdir(), 'limnopress-test-')), label);
  const result = await build({ bulletinFolder: EXAMPLE, outDir: dir });
  return { ...result, dir };
}
