import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const cli = join(import.meta.dirname, '..', '..', 'scripts', 'limnopress-src.js');

/** Resolves with the first stdout line matching `pattern`; rejects once the process has ended without one (never on time alone). */
function waitFor(output: { text: string; ended: boolean }, pattern: RegExp): Promise<RegExpExecArray> {
  return new Promise((resolve, reject) => {
    const poll = () => {
      const match = pattern.exec(output.text);
      if (match) resolve(match);
      else if (output.ended) reject(new Error(`no ${pattern} in: ${output.text}`));
      else setTimeout(poll, 100);
    };
    poll();
  });
}

describe('limnopress preview', () => {
  it('serves the built site on 127.0.0.1 and rebuilds when the foreword changes', async () => {
    const folder = join(mkdtempSync(join(tmpdir(), 'limnopress-preview-test-')), 'bulletin');
    spawnSync(process.execPath, [cli, 'init', folder, '--month', '2026-03']);
    const child = spawn(process.execPath, [cli, 'preview', folder, '--port', '0'], { stdio: ['ignore', 'pipe', 'pipe'] });
    const output = { text: '', ended: false };
    child.stdout.on('data', (chunk: Buffer) => (output.text += chunk.toString()));
    child.on('exit', () => (output.ended = true));
    try {
      const [, origin] = await waitFor(output, /at (http:\/\/127\.0\.0\.1:\d+)\//);
      const first = await (await fetch(`${origin}/issues/2026-03/`)).text();
      expect(first).toContain('Write the foreword of this issue here');
      expect((await fetch(`${origin}/no-such-page/`)).status).toBe(404);
      writeFileSync(join(folder, 'content', 'foreword.md'), 'A preview of the **March** issue.\n');
      await waitFor(output, /Rebuilt:/);
      const second = await (await fetch(`${origin}/issues/2026-03/`)).text();
      expect(second).toContain('A preview of the <strong>March</strong> issue.');
    } finally {
      child.kill('SIGTERM');
    }
    const code = await new Promise<number | null>((resolve) => child.on('exit', resolve));
    expect(code).toBe(0);
  });
});
