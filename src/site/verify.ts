/**
 * Checks a published site against its manifests: every file listed must exist with the same
 * SHA-256, every issue manifest must match the hash the site manifest records for it, and no file
 * may stand in the site without being listed.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { listFiles, sha256File } from './files.ts';

export interface VerifyFinding {
  path: string;
  kind: 'changed' | 'missing' | 'unlisted' | 'manifest-unreadable';
}

interface Listed { path: string; sha256: string }

function readJson<T>(path: string): T | null {
  try {
    return JSON.parse(readFileSync(path, 'utf8')) as T;
  } catch {
    return null;
  }
}

export function verifySite(dir: string): { checked: number; findings: VerifyFinding[] } {
  const findings: VerifyFinding[] = [];
  const site = readJson<{ issues: Listed[]; outputs: Listed[] }>(join(dir, 'manifest.json'));
  if (!site) return { checked: 0, findings: [{ path: 'manifest.json', kind: 'manifest-unreadable' }] };
  const listed = new Set<string>(['manifest.json']);
  let checked = 0;
  const check = (path: string, expected: string) => {
    listed.add(path);
    checked++;
    const full = join(dir, path);
    if (!existsSync(full)) findings.push({ path, kind: 'missing' });
    else if (sha256File(full).sha256 !== expected) findings.push({ path, kind: 'changed' });
  };
  for (const output of site.outputs) check(output.path, output.sha256);
  for (const manifest of site.issues) {
    check(manifest.path, manifest.sha256);
    const issue = readJson<{ outputs: Listed[] }>(join(dir, manifest.path));
    if (!issue) {
      findings.push({ path: manifest.path, kind: 'manifest-unreadable' });
      continue;
    }
    const prefix = manifest.path.slice(0, -'manifest.json'.length);
    for (const output of issue.outputs) check(`${prefix}${output.path}`, output.sha256);
  }
  for (const path of listFiles(dir)) if (!listed.has(path)) findings.push({ path, kind: 'unlisted' });
  return { checked, findings: findings.sort((a, b) => a.path.localeCompare(b.path)) };
}
