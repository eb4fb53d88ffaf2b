/** Builds the example bulletin once for the whole run; test files read it through inject('exampleSite'). */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';
import { build } from '../../src/build.ts';

export default async function setup(project: TestProject): Promise<void> {
  const dir = join(mkdtempSync(join(tmpdir(), 'limnopress-example-')), 'site');
  await build({ bulletinFolder: join(import.meta.dirname, '..', '..', 'example-bulletin'), outDir: dir });
  project.provide('exampleSite', dir);
}

declare module 'vitest' {
  export interface ProvidedContext {
    exampleSite: string;
  }
}
