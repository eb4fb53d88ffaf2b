/**
 * Warnings about extra input columns: named once in the build log however many issues carry the
 * same export, and on the data page only when tables.columnWarningsOnDataPage asks for it.
 */
import { say } from '../../src/common/problemMessages.ts';
import { cpSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadIssues } from '../../src/ingest/issues.ts';
import { foldAcrossIssues, formatFolded } from '../../src/ingest/problems.ts';
import { loadBulletin } from '../../src/ingest/index.ts';
import { buildModel } from '../../src/wording/index.ts';
import { MINI_CONFIG, miniFiles, writeMini } from '../support/miniBulletin.ts';

const withExtra = miniFiles()
  ['area.csv'].replace('scenes\n', 'scenes,operator\n')
  .replace(/,(\d)\n/g, ',$1,ops\n');

/** The mini bulletin with an extra column in its surface-area table, and two archived issues that carry the same export. */
function folderWithArchive(): string {
  const folder = writeMini({ 'area.csv': withExtra });
  const copy = writeMini({ 'area.csv': withExtra });
  for (const month of ['2020-04', '2020-05']) {
    const archived = join(folder, 'archive', month);
    cpSync(copy, archived, { recursive: true });
    writeFileSync(join(archived, 'bulletin.json'), JSON.stringify({ ...MINI_CONFIG, issue: { month, published: `${month}-28` } }, null, 2));
  }
  return folder;
}

describe('column warnings', () => {
  it('the same extra column in three issues is one line of the build log, naming the issues', async () => {
    const { problems, warnings } = await loadIssues(folderWithArchive());
    // The archived copies also hold rows after their own month (month-after-bulletin): left aside here.
    const columns = problems.filter((problem) => problem.code === 'column-unknown');
    // check and build count every issue's warning (the totals stay the same); the log folds them.
    expect(columns.map((problem) => problem.file)).toEqual(['archive/2020-04/area.csv', 'archive/2020-05/area.csv', 'area.csv']);
    expect(warnings).toBe(problems.filter((problem) => problem.severity === 'warning').length);
    const folded = foldAcrossIssues(columns);
    expect(folded).toHaveLength(1);
    expect(folded[0]?.problem.file).toBe('area.csv');
    expect(formatFolded(folded[0]!)).toBe(
      'warning area.csv:1 [operator]: an unknown column is ignored (found "operator"; expected body_id, month, water_area_ha, observed_share, scenes) (the same in 3 issues: archive/2020-04, archive/2020-05, the current issue)',
    );
  });

  it('different places stay apart: another column or another file is its own line', () => {
    const problem = {
      severity: 'warning' as const,
      code: 'column-unknown' as const,
      line: 1,
      value: 'x',
      expected: '',
      message: say('column-unknown'),
    };
    const folded = foldAcrossIssues([
      { ...problem, file: 'archive/2020-05/area.csv', column: 'x' },
      { ...problem, file: 'area.csv', column: 'y' },
      { ...problem, file: 'quality.csv', column: 'x' },
      { ...problem, file: 'area.csv', column: 'x' },
    ]);
    expect(folded.map((entry) => [entry.problem.file, entry.problem.column, entry.issues])).toEqual([
      ['area.csv', 'x', ['archive/2020-05', '']],
      ['area.csv', 'y', ['']],
      ['quality.csv', 'x', ['']],
    ]);
  });

  it('column warnings reach the data page only with tables.columnWarningsOnDataPage', async () => {
    const quiet = await loadBulletin(writeMini({ 'area.csv': withExtra }));
    expect(quiet.problems.warnings.map((problem) => problem.code)).toEqual(['column-unknown']);
    expect(buildModel(quiet.inputs!, quiet.problems.warnings, 'test').warnings).toEqual([]);
    const shown = await loadBulletin(
      writeMini({
        'area.csv': withExtra,
        'bulletin.json': JSON.stringify({ ...MINI_CONFIG, tables: { columnWarningsOnDataPage: true } }, null, 2),
      }),
    );
    expect(buildModel(shown.inputs!, shown.problems.warnings, 'test').warnings.map((warning) => warning.code)).toEqual(['column-unknown']);
  });
});
