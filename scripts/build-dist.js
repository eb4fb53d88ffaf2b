#!/usr/bin/env node
// Compiles src/ into dist/ (plain JavaScript, what bin/limnopress.js runs), then stamps dist/.built
// with the time the compile started, so a source edited during the compile still counts as newer.
// dist/ is the tool's own output: it is removed and written whole each time.
import { spawnSync } from 'node:child_process';
import { closeSync, openSync, rmSync, utimesSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const dist = join(root, 'dist');
const started = new Date();
rmSync(dist, { recursive: true, force: true });
const tsc = createRequire(import.meta.url).resolve('typescript/bin/tsc');
const result = spawnSync(process.execPath, [tsc, '-p', join(root, 'tsconfig.build.json')], { stdio: 'inherit' });
if (result.status !== 0) {
  process.stderr.write('build-dist: the TypeScript compile failed; dist/ is removed, so the command runs the sources until it compiles\n');
  rmSync(dist, { recursive: true, force: true });
  process.exit(1);
}
const stamp = join(dist, '.built');
closeSync(openSync(stamp, 'w'));
utimesSync(stamp, started, started);
