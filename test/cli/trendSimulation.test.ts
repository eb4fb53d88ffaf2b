/**
 * The bulletin's trend decision, checked by simulation through the command a user runs,
 * `limnopress trend --seasonal`: on trend-free AR(1) monthly series (lag-1 correlation φ from 0 to
 * 0.9, 96 to 240 months, with a seasonal cycle), the share of series the decision calls a trend at
 * the 5 % level must stay at most 0.08 (the limit set in the project's issue on trend statements;
 * nominal is 0.05). The plain seasonal Kendall test on the same series is reported beside it, to
 * show the data are persistent enough to fool a test that ignores the dependence. Power on series
 * with a known linear trend is printed. The data are generated here from a fixed seed: they are
 * the check's input, not a check value.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { mulberry32 } from '../../scripts/random.ts';

const cli = join(import.meta.dirname, '..', '..', 'scripts', 'limnopress-src.js');
/** Series per cell: enough that a cell's Monte Carlo standard error is under 0.01 at a rate of 0.08 (power cells get fewer). */
const REPLICATES = 1000;
const POWER_REPLICATES = 300;
const PHIS = [0, 0.5, 0.8, 0.9];
const LENGTHS = [96, 168, 240];
/** Trends for the power table, in units of the innovation's standard deviation per year. */
const SLOPES = [0.1, 0.3];

const random = mulberry32(20261202);
const normal = () => {
  let u = 0;
  while (u === 0) u = random();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * random());
};

/** An AR(1) series with unit innovations, started in its stationary law, plus a seasonal cycle and a linear trend. */
function series(months: number, phi: number, slopePerYear: number): number[] {
  let state = normal() / Math.sqrt(1 - phi * phi);
  return Array.from({ length: months }, (_, k) => {
    state = phi * state + normal();
    return state + 2 * Math.cos((2 * Math.PI * k) / 12) + (slopePerYear * k) / 12;
  });
}

/** Wilson score interval of a proportion (Wilson 1927), at z standard errors. */
function wilson(hits: number, trials: number, z: number): [number, number] {
  const p = hits / trials;
  const centre = (p + (z * z) / (2 * trials)) / (1 + (z * z) / trials);
  const half = (z * Math.sqrt((p * (1 - p)) / trials + (z * z) / (4 * trials * trials))) / (1 + (z * z) / trials);
  return [centre - half, centre + half];
}

describe('limnopress trend --seasonal on simulated series', () => {
  it('calls at most 8 % of trend-free AR(1) series a trend at the 5 % level, for φ up to 0.9 and 96 to 240 months; power is reported', () => {
    const rows = ['series,month,value'];
    const cells: Array<{ key: string; phi: number; months: number; slope: number; replicates: number }> = [];
    for (const phi of PHIS)
      for (const months of LENGTHS)
        for (const slope of [0, ...(months === 168 ? SLOPES : [])])
          cells.push({
            key: `phi${phi}-n${months}-b${slope}`,
            phi,
            months,
            slope,
            replicates: slope === 0 ? REPLICATES : POWER_REPLICATES,
          });
    for (const cell of cells) {
      for (let r = 0; r < cell.replicates; r++) {
        series(cell.months, cell.phi, cell.slope).forEach((value, k) => {
          const month = 2000 * 12 + k;
          rows.push(`${cell.key}-${r},${Math.floor(month / 12)}-${String((month % 12) + 1).padStart(2, '0')},${value.toFixed(6)}`);
        });
      }
    }
    const path = join(mkdtempSync(join(tmpdir(), 'limnopress-trend-simulation-')), 'series.csv');
    writeFileSync(path, `${rows.join('\n')}\n`);
    const result = spawnSync(
      process.execPath,
      [cli, 'trend', path, '--time', 'month', '--value', 'value', '--by', 'series', '--seasonal'],
      {
        encoding: 'utf8',
        maxBuffer: 1 << 30,
      },
    );
    expect(result.stderr).toBe('');
    expect(result.status).toBe(0);
    const [header, ...lines] = result.stdout.trim().split('\n');
    const columns = (header as string).split(',');
    const at = (name: string) => columns.indexOf(name);
    const [cSeries, cMethod, cP, cSeasonal] = [at('series'), at('method'), at('p'), at('seasonal_p')];
    const found = new Map<string, { trials: number; decision: number; seasonalKendall: number }>();
    for (const line of lines) {
      const fields = line.split(',');
      expect(fields[cMethod]).toBe('mann-kendall-ar1');
      const key = (fields[cSeries] as string).replace(/-\d+$/, '');
      const entry = found.get(key) ?? { trials: 0, decision: 0, seasonalKendall: 0 };
      entry.trials++;
      if (Number(fields[cP]) < 0.05) entry.decision++;
      if (Number(fields[cSeasonal]) < 0.05) entry.seasonalKendall++;
      found.set(key, entry);
    }
    const report: string[] = ['φ     months  slope/yr  decision rejects (95% interval)   seasonal Kendall rejects'];
    let nullTrials = 0;
    let nullRejects = 0;
    for (const cell of cells) {
      const entry = found.get(cell.key) as { trials: number; decision: number; seasonalKendall: number };
      expect(entry.trials).toBe(cell.replicates);
      const [low, high] = wilson(entry.decision, entry.trials, 1.96);
      report.push(
        `${cell.phi.toFixed(1)}   ${String(cell.months).padStart(6)}  ${cell.slope.toFixed(1).padStart(8)}  ${(entry.decision / entry.trials).toFixed(3)} (${low.toFixed(3)}–${high.toFixed(3)})            ${(entry.seasonalKendall / entry.trials).toFixed(3)}`,
      );
      if (cell.slope === 0) {
        nullTrials += entry.trials;
        nullRejects += entry.decision;
      }
    }
    console.log(report.join('\n'));
    for (const cell of cells.filter((entry) => entry.slope === 0)) {
      const entry = found.get(cell.key) as { trials: number; decision: number; seasonalKendall: number };
      // Each trend-free cell: the rejection rate at most 0.08.
      expect(entry.decision / entry.trials, cell.key).toBeLessThanOrEqual(0.08);
      // The simulated persistence is real: the test that ignores it is fooled at φ = 0.9.
      if (cell.phi === 0.9) expect(entry.seasonalKendall / entry.trials, cell.key).toBeGreaterThan(0.3);
    }
    // Over all trend-free cells, the Monte Carlo error is small enough to bound the rate itself: its upper 99 % limit.
    const [, upper] = wilson(nullRejects, nullTrials, 2.576);
    console.log(
      `all trend-free series: ${(nullRejects / nullTrials).toFixed(4)} rejected, upper 99% limit ${upper.toFixed(4)} (${nullTrials} series)`,
    );
    expect(upper).toBeLessThanOrEqual(0.08);
    // Power is reported above; as a floor, a steep trend in moderately persistent data is found most of the time.
    const steep = found.get('phi0.5-n168-b0.3') as { trials: number; decision: number };
    expect(steep.decision / steep.trials).toBeGreaterThan(0.8);
  });
});
