"""The Python side of `npm run bench:stats`: the same statistics on the same data by
(a) a per-series loop with scipy.stats.kendalltau + scipy.stats.theilslopes and
(b) a vectorized numpy implementation (Mann-Kendall S, tie-corrected Var(S), Z with continuity
correction and p; Sen's slope with its rank-method interval; seasonal Kendall S, Var(S), Z, p and
seasonal slope), timing both and checking their results against the TypeScript results.

Usage: python3 stats_python.py <data.json> <typescript-results.json>   (prints one JSON object)
"""
import json
import sys
import time

import numpy as np
from scipy import stats


def load(path):
    with open(path) as handle:
        return json.load(handle)


def to_array(rows):
    return np.array([[np.nan if v is None else v for v in row] for row in rows], dtype=float)


def tie_terms(x):
    """Σ t(t−1)(2t+5) per row over groups of equal finite values (NaN ignored)."""
    srt = np.sort(x, axis=1)  # NaN last
    finite = np.isfinite(srt)
    same = (srt[:, 1:] == srt[:, :-1]) & finite[:, 1:]
    out = np.zeros(x.shape[0])
    # run lengths: walk columns once (vectorized over rows)
    run = np.ones(x.shape[0])
    for k in range(same.shape[1]):
        ended = ~same[:, k]
        out += np.where(ended & (run > 1), run * (run - 1) * (2 * run + 5), 0)
        run = np.where(same[:, k], run + 1, 1)
    out += np.where(run > 1, run * (run - 1) * (2 * run + 5), 0)
    return out


def mk_vectorized(y):
    n_obs = np.isfinite(y).sum(axis=1).astype(float)
    i, j = np.triu_indices(y.shape[1], 1)
    s = np.nansum(np.sign(y[:, j] - y[:, i]), axis=1)
    var = (n_obs * (n_obs - 1) * (2 * n_obs + 5) - tie_terms(y)) / 18.0
    z = np.where(s == 0, 0.0, (s - np.sign(s)) / np.sqrt(var))
    return s, var, z, 2 * stats.norm.sf(np.abs(z))


def sen_vectorized(t, y, confidence=0.95):
    i, j = np.triu_indices(y.shape[1], 1)
    slopes = (y[:, j] - y[:, i]) / (t[j] - t[i])
    slopes.sort(axis=1)  # NaN last
    count = np.isfinite(slopes).sum(axis=1)
    rows = np.arange(y.shape[0])
    lo_mid = slopes[rows, (count - 1) // 2]
    hi_mid = slopes[rows, count // 2]
    median = (lo_mid + hi_mid) / 2
    n_obs = np.isfinite(y).sum(axis=1).astype(float)
    var = (n_obs * (n_obs - 1) * (2 * n_obs + 5) - tie_terms(y)) / 18.0  # times are never tied here
    spread = stats.norm.ppf(1 - (1 - confidence) / 2) * np.sqrt(var)
    lower_index = np.maximum(np.round((count - spread) / 2).astype(int) - 1, 0)
    upper_index = np.minimum(np.round((count + spread) / 2).astype(int), count - 1)
    return median, slopes[rows, lower_index], slopes[rows, upper_index]


def seasonal_vectorized(y):
    series, n = y.shape
    grid = y.reshape(series, n // 12, 12).transpose(0, 2, 1).reshape(series * 12, n // 12)  # (series·season) × years
    s, var, _, _ = mk_vectorized(grid)
    s_total = s.reshape(series, 12).sum(axis=1)
    var_total = var.reshape(series, 12).sum(axis=1)
    z = np.where(s_total == 0, 0.0, (s_total - np.sign(s_total)) / np.sqrt(var_total))
    years = n // 12
    i, j = np.triu_indices(years, 1)
    slopes = ((grid[:, j] - grid[:, i]) / (j - i)).reshape(series, 12 * len(i))
    return s_total, var_total, z, 2 * stats.norm.sf(np.abs(z)), np.nanmedian(slopes, axis=1)


def run_vectorized(t, y, batch=100):
    out = {k: [] for k in ['s', 'varianceS', 'z', 'p', 'slope', 'lower', 'upper', 'seasonalS', 'seasonalVarianceS', 'seasonalZ', 'seasonalP', 'seasonalSlope']}
    for start in range(0, y.shape[0], batch):
        part = y[start:start + batch]
        for key, value in zip(['s', 'varianceS', 'z', 'p'], mk_vectorized(part)):
            out[key].append(value)
        for key, value in zip(['slope', 'lower', 'upper'], sen_vectorized(t, part)):
            out[key].append(value)
        for key, value in zip(['seasonalS', 'seasonalVarianceS', 'seasonalZ', 'seasonalP', 'seasonalSlope'], seasonal_vectorized(part)):
            out[key].append(value)
    return {k: np.concatenate(v) for k, v in out.items()}


def run_scipy_loop(t, y):
    taus, ps, slopes, lowers, uppers = [], [], [], [], []
    for row in y:
        ok = np.isfinite(row)
        tau = stats.kendalltau(t[ok], row[ok], method='asymptotic')
        sen = stats.theilslopes(row[ok], t[ok], alpha=0.95)
        taus.append(tau.statistic)
        ps.append(tau.pvalue)
        slopes.append(sen.slope)
        lowers.append(sen.low_slope)
        uppers.append(sen.high_slope)
    return {'tau': np.array(taus), 'pUncorrected': np.array(ps), 'slope': np.array(slopes), 'lower': np.array(lowers), 'upper': np.array(uppers)}


def worst_relative(a, b):
    a, b = np.asarray(a, float), np.asarray(b, float)
    both_nan = np.isnan(a) & np.isnan(b)
    diff = np.abs(a - b) / np.maximum(np.maximum(np.abs(a), np.abs(b)), 1e-12)
    diff[both_nan] = 0
    return float(np.nanmax(np.where(np.isnan(diff), np.inf, diff)))


def main():
    data, ts = load(sys.argv[1]), load(sys.argv[2])
    report = []
    for case in data['cases']:
        t = np.array(case['times'], dtype=float)
        y = to_array(case['values'])
        mine = {k: to_array([v])[0] for k, v in ts[str(case['n'])].items()}
        loop_count = min(len(y), case['loopSeries'])
        # Best of the same number of passes as the TypeScript side.
        loop_seconds = vector_seconds = float('inf')
        for _ in range(data.get('repeats', 1)):
            start = time.perf_counter()
            loop = run_scipy_loop(t, y[:loop_count])
            loop_seconds = min(loop_seconds, time.perf_counter() - start)
            start = time.perf_counter()
            vectorized = run_vectorized(t, y)
            vector_seconds = min(vector_seconds, time.perf_counter() - start)
        agreement = {key: worst_relative(vectorized[key], mine[key]) for key in vectorized}
        agreement.update({f'scipy {key}': worst_relative(loop[key], mine[key][:loop_count]) for key in loop})
        report.append({
            'n': case['n'],
            'scipyLoopSeriesPerSecond': loop_count / loop_seconds,
            'numpySeriesPerSecond': len(y) / vector_seconds,
            'worstRelativeDifference': agreement,
        })
    print(json.dumps(report))


main()
