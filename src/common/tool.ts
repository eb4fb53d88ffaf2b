/**
 * The tool itself: its version and the error every stage raises for a failure outside the inputs.
 * A leaf, so the command line can answer `--version` and `--help` without loading a stage.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** The version in the tool's package.json (the same file in a clone, a packed tarball and an install). */
export function toolVersion(): string {
  const pkg = JSON.parse(readFileSync(fileURLToPath(new URL('../../package.json', import.meta.url)), 'utf8')) as { version: string };
  return pkg.version;
}

/** A failure outside the inputs, with the stage it happened in (one line for a person; the cause keeps the stack). */
export class StageError extends Error {
  constructor(
    readonly stage: string,
    readonly reason: string,
    options?: { cause?: unknown },
  ) {
    super(`${stage}: ${reason}`, options);
    this.name = 'StageError';
  }
}
