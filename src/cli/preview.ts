/**
 * `limnopress preview <folder>`: builds the bulletin into a temporary folder, serves it on
 * 127.0.0.1, and rebuilds when a file of the bulletin folder changes. A failed rebuild prints its
 * problems and keeps serving the last good site.
 */
import { mkdtempSync, watch } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { build } from '../build.ts';
import { formatProblem, InputError } from '../ingest/index.ts';
import { serveFolder } from '../site/serve.ts';
import { HELP, UsageError } from './usage.ts';

export async function runPreview(args: string[]): Promise<number> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: { port: { type: 'string', default: '8080' }, help: { type: 'boolean', short: 'h' } },
  });
  if (values.help) {
    process.stdout.write(HELP.preview);
    return 0;
  }
  if (positionals.length !== 1) throw new UsageError('preview needs exactly one bulletin folder');
  const port = Number(values.port);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new UsageError('--port needs a port number from 0 to 65535');
  const folder = positionals[0] as string;
  const site = join(mkdtempSync(join(tmpdir(), 'limnopress-preview-')), 'site');
  const log = (line: string) => process.stderr.write(`${line}\n`);

  const rebuild = async (): Promise<boolean> => {
    try {
      const result = await build({ bulletinFolder: folder, outDir: site });
      for (const warning of result.warnings) log(formatProblem(warning));
      return true;
    } catch (error) {
      if (error instanceof InputError) for (const problem of error.problems) log(formatProblem(problem));
      else log(`build failed: ${error instanceof Error ? error.message : String(error)}`);
      return false;
    }
  };
  if (!(await rebuild())) return 1;
  const server = await serveFolder(site, port);
  process.stdout.write(`Preview of ${folder} at ${server.origin}/ (rebuilt on every change; Ctrl-C to stop)\n`);

  let timer: NodeJS.Timeout | null = null;
  let running = Promise.resolve();
  const watcher = watch(folder, { recursive: true }, () => {
    if (timer) clearTimeout(timer);
    // Editors write files in several steps: wait until the folder has been quiet for a moment.
    timer = setTimeout(() => {
      running = running.then(async () => {
        log('change seen: rebuilding');
        if (await rebuild()) process.stdout.write(`Rebuilt: ${server.origin}/\n`);
      });
    }, 300);
  });
  await new Promise<void>((done) => {
    const stop = () => done();
    process.once('SIGINT', stop);
    process.once('SIGTERM', stop);
  });
  watcher.close();
  await running;
  await server.close();
  return 0;
}
