/**
 * The issues of a bulletin folder: the folder itself is the current issue, and each folder under
 * `archive/` that holds a bulletin.json is an earlier issue, or an earlier revision of one, kept
 * with its own inputs so it can be rebuilt exactly as published. Each issue's inputs stay inside
 * its own folder; an entry of `archive/` that is a symbolic link is refused, never followed.
 */
import { say } from '../common/problemMessages.ts';
import { existsSync, lstatSync, readdirSync } from 'node:fs';
import { join, relative } from 'node:path';
import type { HashCache } from '../common/files.ts';
import { CONFIG_FILE, loadBulletin, type BulletinInputs, type Problem } from './index.ts';
import { monthLabel } from '../common/months.ts';

export const ARCHIVE_FOLDER = 'archive';

export function issueFolders(folder: string): { folders: string[]; links: string[] } {
  const archive = join(folder, ARCHIVE_FOLDER);
  const links: string[] = [];
  const archived: string[] = [];
  if (existsSync(archive) && lstatSync(archive).isSymbolicLink()) links.push(ARCHIVE_FOLDER);
  else if (existsSync(archive)) {
    for (const name of readdirSync(archive).sort()) {
      const path = join(archive, name);
      const stat = lstatSync(path);
      if (stat.isSymbolicLink()) links.push(`${ARCHIVE_FOLDER}/${name}`);
      else if (stat.isDirectory() && existsSync(join(path, CONFIG_FILE))) archived.push(path);
    }
  }
  return { folders: [...archived, folder], links };
}

export interface LoadedIssue {
  folder: string;
  inputs: BulletinInputs | null;
  warnings: Problem[];
}

/**
 * Reads and checks every issue of a bulletin folder, the archived ones first; `check` and `build`
 * both call this, so they report the same problems. Problems come sorted per issue, the current
 * issue last, followed by those that span issues (an issue archived twice, a linked archive entry).
 */
export async function loadIssues(
  folder: string,
  progress: { begin?: (count: number) => void; advance?: (k: number, detail?: string) => void; hashes?: HashCache } = {},
): Promise<{ issues: LoadedIssue[]; problems: Problem[]; errors: number; warnings: number }> {
  const { folders, links } = issueFolders(folder);
  progress.begin?.(folders.length);
  const issues: LoadedIssue[] = [];
  const problems: Problem[] = [];
  let errors = 0;
  let warnings = 0;
  for (const [k, issueFolder] of folders.entries()) {
    const prefix = relative(folder, issueFolder);
    const result = await loadBulletin(issueFolder, {
      labelPrefix: prefix ? `${prefix.split('\\').join('/')}/` : '',
      onStep: (detail) => progress.advance?.(k, detail),
      hashes: progress.hashes,
    });
    problems.push(...result.problems.sorted());
    errors += result.problems.total.errors;
    warnings += result.problems.total.warnings;
    issues.push({ folder: issueFolder, inputs: result.inputs, warnings: result.problems.warnings });
    progress.advance?.(k + 1);
  }
  const add = (problem: Problem) => {
    problems.push(problem);
    errors++;
  };
  for (const link of links)
    add({
      severity: 'error',
      code: 'archive-link',
      file: link,
      line: 0,
      column: '',
      value: '',
      expected: 'an archived issue as a folder inside the bulletin folder',
      message: say('archive-link'),
    });
  const seen = new Map<string, string>();
  for (const { folder: issueFolder, inputs } of issues) {
    if (!inputs) continue;
    const name = relative(folder, issueFolder) || '.';
    const key = `${inputs.bulletinMonth} ${inputs.config.issue.revision}`;
    const other = seen.get(key);
    if (other !== undefined)
      add({
        severity: 'error',
        code: 'issue-twice',
        file: name,
        line: 0,
        column: 'issue',
        value: `${monthLabel(inputs.bulletinMonth)} revision ${inputs.config.issue.revision}`,
        expected: 'each month and revision once',
        message: say('issue-twice', { other }),
      });
    seen.set(key, name);
  }
  return { issues, problems, errors, warnings };
}
