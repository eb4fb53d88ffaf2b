/**
 * Progress of a long build, for a person at a terminal: each stage begins, advances and ends. The
 * build reports to this interface and never prints itself; the command line picks how it shows
 * (a bar on a terminal, plain lines in a log, nothing with --quiet). Nothing of it reaches the site.
 */
import type { WriteStream } from 'node:tty';

export interface Progress {
  /** A stage begins: its number and name, and how much work it has when that is known. */
  begin(step: string, name: string, total?: number): void;
  /** Work done so far in the current stage, with a few words on what is being done. */
  advance(done: number, detail?: string): void;
  /** The stage ended; `summary` says what it did. */
  end(summary?: string): void;
  /** A line that is not a stage (the closing summary). */
  note(line: string): void;
}

export const silentProgress: Progress = { begin() {}, advance() {}, end() {}, note() {} };

/** Plain lines, one when a stage begins and one when it ends, for logs and pipes. */
export function lineProgress(write: (line: string) => void): Progress {
  let started = 0;
  let name = '';
  let lastLine = 0;
  let total: number | undefined;
  return {
    begin(step, stageName, stageTotal) {
      started = performance.now();
      lastLine = started;
      name = stageName;
      total = stageTotal;
      write(`${step} ${stageName}`);
    },
    advance(done, detail) {
      // In a log, a line every ten seconds at most is enough to show the build is alive.
      const now = performance.now();
      if (now - lastLine < 10_000) return;
      lastLine = now;
      write(`    ${total ? `${Math.floor((100 * done) / total)} % ` : ''}${detail ?? ''}`.trimEnd());
    },
    end(summary) {
      write(`    ${name}: ${seconds(performance.now() - started)}${summary ? `, ${summary}` : ''}`);
    },
    note: write,
  };
}

/** A bar redrawn in place on a terminal (at most ten times a second), and a line per finished stage. */
export function barProgress(stream: WriteStream): Progress {
  let started = 0;
  let name = '';
  let total: number | undefined;
  let drawn = 0;
  const clear = () => stream.write('\r\x1b[2K');
  return {
    begin(step, stageName, stageTotal) {
      started = performance.now();
      name = `${step} ${stageName}`;
      total = stageTotal;
      drawn = 0;
      stream.write(`${name}…`);
    },
    advance(done, detail) {
      const now = performance.now();
      if (now - drawn < 100) return;
      drawn = now;
      const width = Math.max(10, Math.min(30, (stream.columns ?? 80) - name.length - 30));
      const share = total ? Math.min(1, done / total) : 0;
      const bar = total
        ? `[${'#'.repeat(Math.round(share * width)).padEnd(width, '-')}] ${String(Math.floor(share * 100)).padStart(3)} %`
        : '';
      const line = `${name} ${bar} ${detail ?? ''}`;
      clear();
      stream.write(line.slice(0, (stream.columns ?? 80) - 1));
    },
    end(summary) {
      clear();
      stream.write(`${name}: ${seconds(performance.now() - started)}${summary ? `, ${summary}` : ''}\n`);
    },
    note(line) {
      stream.write(`${line}\n`);
    },
  };
}

export const seconds = (ms: number) => `${(ms / 1000).toFixed(1)} s`;
