/** `limnopress verify`: checks a built site against its manifests. */
import { existsSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { verifySite } from '../site/verify.ts';
import { HELP, UsageError } from './usage.ts';

const WORDS = {
  changed: 'changed since it was built',
  missing: 'listed but missing',
  unlisted: 'not listed in any manifest',
  'manifest-unreadable': 'manifest cannot be read, or is not a limnopress manifest',
  outside: 'leads outside the site or is not a regular file; not read',
} as const;

export async function runVerify(args: string[]): Promise<number> {
  const { values, positionals } = parseArgs({ args, allowPositionals: true, options: { help: { type: 'boolean', short: 'h' } } });
  if (values.help) {
    process.stdout.write(HELP.verify);
    return 0;
  }
  if (positionals.length !== 1) throw new UsageError('verify needs exactly one site folder');
  const dir = positionals[0] as string;
  if (!existsSync(dir)) throw new UsageError(`there is no folder ${dir}`);
  const { checked, findings } = verifySite(dir);
  for (const finding of findings) process.stdout.write(`${finding.path}: ${WORDS[finding.kind]}\n`);
  process.stdout.write(
    findings.length === 0 ? `All ${checked} files match their manifests.\n` : `${findings.length} of ${checked} files do not match.\n`,
  );
  return findings.length === 0 ? 0 : 1;
}
