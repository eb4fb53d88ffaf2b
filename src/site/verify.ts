/**
 * Checks a published site against its manifests: every file listed must exist with the same
 * SHA-256, every issue manifest must match the hash the site manifest records for it, and no file
 * may stand in the site without being listed.
 */
import { lstatSync, readFileSync, realpathSync } from 'node:fs';
import { join } from 'node:path';
import { isInside } from '../common/paths.ts';
import { z } from 'zod';
import { listFiles, sha256File } from '../common/files.ts';

export interface VerifyFinding {
  path: string;
  kind: 'changed' | 'missing' | 'unlisted' | 'manifest-unreadable' | 'outside';
}

/** A path as a manifest lists it: relative, forward slashes, no `..` segment, no NUL. */
const sitePath = z
  .string()
  .min(1)
  .max(4096)
  .refine(
    (path) =>
      !path.startsWith('/') &&
      !path.includes('\0') &&
      !path.includes('\\') &&
      !path.split('/').some((part) => part === '..' || part === '.' || part === ''),
    'a relative path inside the site',
  );
const listed = z.array(z.object({ path: sitePath, sha256: z.string().regex(/^[0-9a-f]{64}$/) }));
const siteManifest = z.object({ issues: listed, outputs: listed });
const issueManifest = z.object({ outputs: listed });

function readJson<T>(path: string, schema: z.ZodType<T>): T | null {
  try {
    const parsed = schema.safeParse(JSON.parse(readFileSync(path, 'utf8')));
    return parsed.success ? parsed.data : null;
  } catch {
    return null;
  }
}

export function verifySite(dir: string): { checked: number; findings: VerifyFinding[] } {
  const findings: VerifyFinding[] = [];
  const root = realpathSync(dir);
  const site = readJson(join(root, 'manifest.json'), siteManifest);
  if (!site) return { checked: 0, findings: [{ path: 'manifest.json', kind: 'manifest-unreadable' }] };
  const seen = new Set<string>(['manifest.json']);
  let checked = 0;
  const check = (path: string, expected: string) => {
    seen.add(path);
    checked++;
    const full = join(root, path);
    let real: string;
    try {
      real = realpathSync(full);
    } catch {
      findings.push({ path, kind: 'missing' });
      return;
    }
    // Only files of the site itself are read: a link (or a path) out of it is a finding, never followed.
    if (!isInside(root, real) || lstatSync(full).isSymbolicLink() || !lstatSync(real).isFile()) findings.push({ path, kind: 'outside' });
    else if (sha256File(real).sha256 !== expected) findings.push({ path, kind: 'changed' });
  };
  for (const output of site.outputs) check(output.path, output.sha256);
  for (const manifest of site.issues) {
    check(manifest.path, manifest.sha256);
    const issue = findings.some((finding) => finding.path === manifest.path) ? null : readJson(join(root, manifest.path), issueManifest);
    if (!issue) {
      findings.push({ path: manifest.path, kind: 'manifest-unreadable' });
      continue;
    }
    const prefix = manifest.path.slice(0, -'manifest.json'.length);
    for (const output of issue.outputs) check(`${prefix}${output.path}`, output.sha256);
  }
  for (const path of listFiles(root)) if (!seen.has(path)) findings.push({ path, kind: 'unlisted' });
  return { checked, findings: findings.sort((a, b) => a.path.localeCompare(b.path)) };
}
