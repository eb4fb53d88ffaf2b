#!/usr/bin/env node
// The installed command: runs the compiled JavaScript in dist/, built by `npm run build:dist`
// (which `npm ci`, `npm install` and `npm pack` run through `prepare`). In a clone whose dist/ is
// missing or older than src/, it runs the sources instead (with a note), so it is never out of date.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const compiled = join(root, 'dist', 'cli', 'main.js');

/** Newest modification time of the files below a folder (0 when it does not exist). */
function newest(folder) {
  if (!existsSync(folder)) return 0;
  let latest = 0;
  for (const entry of readdirSync(folder, { withFileTypes: true, recursive: true })) {
    if (entry.isFile()) latest = Math.max(latest, statSync(join(entry.parentPath ?? entry.path, entry.name)).mtimeMs);
  }
  return latest;
}

const sources = join(root, 'src');
const stamp = join(root, 'dist', '.built');
const current = existsSync(compiled) && (!existsSync(sources) || (existsSync(stamp) && statSync(stamp).mtimeMs >= newest(sources)));
if (current) {
  const { main } = await import(pathToFileURL(compiled).href);
  process.exitCode = await main(process.argv.slice(2));
} else if (existsSync(sources)) {
  process.stderr.write('limnopress: dist/ is missing or older than src/, so the sources run (slower start); `npm run build:dist` compiles them\n');
  await import(new URL('../scripts/limnopress-src.js', import.meta.url).href);
} else {
  process.stderr.write('limnopress: the compiled tool (dist/) is missing from this installation; reinstall it\n');
  process.exitCode = 1;
}
