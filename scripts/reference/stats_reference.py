"""Reference values for limnopress's statistics, from scipy and numpy.

Writes test/fixtures/stats-reference.json (or the path given as the first argument). The cases are
fixed by a seeded numpy generator, so the file is the same on every run with the same library
versions; .ci/fixtures regenerates it and fails if it differs from the committed one.

Where scipy has a function it is used (kendalltau, theilslopes, false_discovery_control,
percentileofscore, linregress, norm). Where it has none (Kendall's S and Var(S) with the
continuity correction, the seasonal Kendall test and its covariance variant, the Hamed & Rao
correction, Pettitt's test) the statistic is written out below in numpy lines, independently of
the TypeScript code, and marked "numpy lines".
"""
import json
import sys

import numpy as np
import scipy
from scipy import stats

rng = np.random.default_rng(20240611)


def clean(value):
    if isinstance(value, (list, tuple, np.ndarray)):
        return [clean(v) for v in value]
    if isinstance(value, dict):
        return {k: clean(v) for k, v in value.items()}
    if isinstance(value, (bool, np.bool_)):
        return bool(value)
    if isinstance(value, (int, np.integer)):
        return int(value)
    if value is None or isinstance(value, str):
        return value
    value = float(value)
    return None if not np.isfinite(value) else value


def tie_term(x):
    _, counts = np.unique(x, return_counts=True)
    return float(np.sum(counts * (counts - 1) * (2 * counts + 5)))


def mk_numpy(x):
    """numpy lines: Kendall's S, Var(S) with ties, Z with continuity correction."""
    n = len(x)
    s = float(np.sum(np.sign(x[None, :] - x[:, None])[np.triu_indices(n, 1)]))
    var = (n * (n - 1) * (2 * n + 5) - tie_term(x)) / 18.0
    z = 0.0 if s == 0 else (s - np.sign(s)) / np.sqrt(var)
    return s, var, z


def mann_kendall(y):
    x = y[np.isfinite(y)]
    n = len(x)
    s, var, z = mk_numpy(x)
    out = {'n': n, 's': s, 'varianceS': var}
    if n >= 3 and var > 0:
        tau = stats.kendalltau(np.arange(n), x, method='asymptotic')
        out.update({'z': z, 'p': 2 * stats.norm.sf(abs(z)), 'tau': tau.statistic, 'pUncorrected': tau.pvalue,
                    'zUncorrected': s / np.sqrt(var)})
    return out


def sens(t, y):
    keep = np.isfinite(y)
    r = stats.theilslopes(y[keep], t[keep], alpha=0.95)
    return {'slope': r.slope, 'intercept': r.intercept, 'lower': r.low_slope, 'upper': r.high_slope}


def seasonal(months, y, min_years=10):
    """numpy lines: Hirsch, Slack & Smith (1982) and Hirsch & Slack (1984)."""
    years = months // 12
    first, last = years[np.isfinite(y)].min(), years[np.isfinite(y)].max()
    n_years = last - first + 1
    grid = np.full((n_years, 12), np.nan)
    for m, v in zip(months, y):
        if np.isfinite(v):
            grid[m // 12 - first, m % 12] = v
    s_total, var_total, counts, slopes = 0.0, 0.0, [], []
    for g in range(12):
        col = grid[:, g]
        ok = np.isfinite(col)
        x = col[ok]
        counts.append(len(x))
        if len(x) >= 2:
            s, var, _ = mk_numpy(x)
            s_total += s
            var_total += var
            idx = np.nonzero(ok)[0]
            i, j = np.triu_indices(len(x), 1)
            slopes.extend((x[j] - x[i]) / (idx[j] - idx[i]))
    z = 0.0 if s_total == 0 else (s_total - np.sign(s_total)) / np.sqrt(var_total)
    out = {'s': s_total, 'varianceS': var_total, 'z': z, 'p': 2 * stats.norm.sf(abs(z)), 'slope': float(np.median(slopes))}
    if min(counts) >= min_years:
        sg = np.nan_to_num(np.sign(grid[None, :, :] - grid[:, None, :]), nan=0.0)  # sg[i, j, g] = sgn(x_jg - x_ig)
        ranks = (n_years + 1 + sg.sum(axis=0)) / 2.0  # R_jg
        cov = 0.0
        iu = np.triu_indices(n_years, 1)
        for g in range(12):
            for h in range(12):
                if g == h:
                    continue
                k = np.sum((sg[:, :, g] * sg[:, :, h])[iu])
                cov += (k + 4 * np.sum(ranks[:, g] * ranks[:, h]) - n_years * (n_years + 1) ** 2) / 3.0
        var_c = var_total + cov
        zc = 0.0 if s_total == 0 else (s_total - np.sign(s_total)) / np.sqrt(var_c)
        out['covariance'] = {'varianceS': var_c, 'z': zc, 'p': 2 * stats.norm.sf(abs(zc))}
    return out


def hamed_rao(t, y, alpha=0.05):
    """numpy lines: Hamed & Rao (1998) variance correction with the signed sum over significant lags."""
    keep = np.isfinite(y)
    t, x = t[keep], y[keep]
    n = len(x)
    s, var, _ = mk_numpy(x)
    beta = stats.theilslopes(x, t).slope
    ranks = stats.rankdata(x - beta * t)
    d = ranks - ranks.mean()
    acf = np.array([np.sum(d[:n - k] * d[k:]) for k in range(n)]) / np.sum(d * d)
    bound = stats.norm.ppf(1 - alpha / 2) / np.sqrt(n)
    lags = [k for k in range(1, n) if abs(acf[k]) > bound]
    total = sum((n - k) * (n - k - 1) * (n - k - 2) * acf[k] for k in lags)
    factor = 1 + 2.0 / (n * (n - 1) * (n - 2)) * total
    var_c = var * factor
    if factor <= 0:
        return {'correctionFactor': factor, 'significantLags': lags, 'varianceS': None, 'z': None, 'p': None}
    z = 0.0 if s == 0 else (s - np.sign(s)) / np.sqrt(var_c)
    return {'correctionFactor': factor, 'significantLags': lags, 'varianceS': var_c, 'z': z, 'p': 2 * stats.norm.sf(abs(z))}


def ar1_mann_kendall(t, y, months=None):
    """numpy lines: Mann-Kendall on calendar-month anomalies with the AR(1) variance inflation and a t reference."""
    y = np.array(y, dtype=float)
    if months is not None:
        cal = np.asarray(months) % 12
        medians = {c: np.median(y[np.isfinite(y) & (cal == c)]) for c in range(12) if np.any(np.isfinite(y) & (cal == c))}
        y = np.array([v - medians[c] if np.isfinite(v) else np.nan for v, c in zip(y, cal)])
    keep = np.isfinite(y)
    t, x = np.asarray(t, dtype=float)[keep], y[keep]
    n = len(x)
    s, var, _ = mk_numpy(x)
    if n < 3 or var <= 0:
        return None
    beta = stats.theilslopes(x, t).slope
    d = x - beta * t
    d = d - d.mean()
    r1 = np.sum(d[:-1] * d[1:]) / np.sum(d * d)
    phi = min(0.99, max(0.0, r1 + (3 + 5 * r1) / n))
    k = np.arange(1, n)
    rho = 6 / np.pi * np.arcsin(phi ** k / 2)
    factor = 1 + 2.0 / (n * (n - 1) * (n - 2)) * np.sum((n - k) * (n - k - 1) * (n - k - 2) * rho)
    df = max(1.0, n / factor - 2)
    z = 0.0 if s == 0 else (s - np.sign(s)) / np.sqrt(var * factor)
    return {'lag1': r1, 'phi': phi, 'correctionFactor': factor, 'degreesOfFreedom': df, 'z': z, 'p': 2 * stats.t.sf(abs(z), df)}


def pettitt(y):
    """numpy lines: Pettitt (1979)."""
    x = y[np.isfinite(y)]
    n = len(x)
    sg = np.sign(x[:, None] - x[None, :])  # sg[i, j] = sgn(x_i - x_j)
    u = np.array([sg[:t + 1, t + 1:].sum() for t in range(n - 1)])
    k = np.abs(u).max()
    return {'k': k, 'location': int(np.argmax(np.abs(u)) + 1), 'p': min(1.0, 2 * np.exp(-6 * k ** 2 / (n ** 3 + n ** 2)))}


def ar1_pettitt(y):
    """numpy lines: Pettitt's K with the AR(1) factor of the residuals about the two segment medians."""
    x = y[np.isfinite(y)]
    n = len(x)
    base = pettitt(y)
    loc = base['location']
    if loc <= 0 or loc >= n:
        return None
    res = x - np.where(np.arange(n) < loc, np.median(x[:loc]), np.median(x[loc:]))
    d = res - res.mean()
    r1 = np.sum(d[:-1] * d[1:]) / np.sum(d * d) if np.sum(d * d) > 0 else 0.0
    phi = min(0.99, max(0.0, r1 + (3 + 5 * r1) / n))
    k = np.arange(1, n)
    factor = 1 + 2.0 / (n * (n - 1) * (n - 2)) * np.sum((n - k) * (n - k - 1) * (n - k - 2) * (6 / np.pi * np.arcsin(phi ** k / 2)))
    return {'lag1': r1, 'phi': phi, 'correctionFactor': factor, 'p': min(1.0, 2 * np.exp(-6 * base['k'] ** 2 / ((n ** 3 + n ** 2) * factor)))}


def monthly(n_years, trend, amplitude, noise, gaps=0.0, round_to=None, start_year=2015):
    months = np.arange(start_year * 12, (start_year + n_years) * 12)
    t = months / 12.0
    y = 50 + trend * (t - start_year) + amplitude * np.cos(2 * np.pi * (months % 12) / 12) + rng.normal(0, noise, len(months))
    if round_to is not None:
        y = np.round(y / round_to) * round_to
    if gaps:
        y[rng.random(len(y)) < gaps] = np.nan
    return months, y


def weighted_median_cases():
    """numpy lines: the smallest value whose cumulative weight reaches half (mean of two on an exact half)."""
    out = []
    for size in (1, 2, 5, 40):
        values = np.round(rng.normal(10, 4, size), 1)
        weights = np.round(rng.lognormal(2, 1, size), 2)
        order = np.argsort(values, kind='stable')
        v, w = values[order], weights[order]
        cumulative = np.cumsum(w)
        half = w.sum() / 2
        k = int(np.argmax(cumulative >= half - 1e-12 * w.sum()))
        median = (v[k] + v[min(k + 1, size - 1)]) / 2 if abs(cumulative[k] - half) <= 1e-12 * w.sum() else v[k]
        out.append({'values': values, 'weights': weights, 'median': median})
    return out


cases = []


def add(name, t, y, months=None):
    cases.append({'name': name, 't': t, 'y': y, 'months': months})


little = np.array([12.9, 14.8, 13.2, 15.7, 13.8, 15.6, 12.9, 11.0, 17.3, 15.9, 19.0, 18.3, 20.1, 21.7])
add('holy-cross-14', np.arange(1.0, 15.0), little)
add('n3-rising', np.array([2000.0, 2001.0, 2002.0]), np.array([1.0, 2.0, 4.0]))
add('n3-tied', np.array([2000.0, 2001.0, 2002.0]), np.array([1.0, 1.0, 4.0]))
add('n4-falling', np.arange(4.0), np.array([9.0, 7.5, 7.5, 1.0]))
add('monotone-20', np.arange(20.0) / 4, np.arange(20.0) ** 1.5)
add('monotone-falling-30', np.arange(30.0), -np.exp(np.arange(30.0) / 10))
add('all-equal-10', np.arange(10.0), np.full(10, 3.5))
add('heavy-ties-40', np.arange(40.0), np.round(rng.normal(0, 1, 40)))
add('ties-and-gaps-48', np.arange(48.0) / 12, np.where(rng.random(48) < 0.1, np.nan, np.round(rng.normal(5, 2, 48), 0)))
for n in (5, 7, 12, 25, 60, 100, 200, 360):
    add(f'noise-{n}', np.arange(n) / 12.0, rng.normal(0, 1, n))
for n in (36, 120, 240):
    add(f'trend-{n}', np.arange(n) / 12.0, 0.02 * np.arange(n) + rng.normal(0, 1, n))
ar = np.zeros(150)
for k in range(1, 150):
    ar[k] = 0.7 * ar[k - 1] + rng.normal()
add('autocorrelated-150', np.arange(150) / 12.0, ar + 0.01 * np.arange(150))
add('missing-15pct-120', np.arange(120) / 12.0, np.where(rng.random(120) < 0.15, np.nan, rng.normal(0, 1, 120) - 0.01 * np.arange(120)))
for name, args in {
    'seasonal-8y-gaps': (8, -0.4, 5, 1, 0.1, None),
    'seasonal-12y': (12, 0.3, 8, 2, 0.0, None),
    'seasonal-12y-gaps-ties': (12, -0.2, 4, 1, 0.08, 1.0),
    'seasonal-15y-flat': (15, 0.0, 6, 1.5, 0.05, None),
    'seasonal-20y-rising': (20, 0.5, 10, 3, 0.03, None),
    'seasonal-30y-gaps': (30, -0.1, 3, 1, 0.2, 0.5),
}.items():
    months, y = monthly(*args)
    add(name, months / 12.0, y, months)

out_cases = []
for case in cases:
    t, y, months = case['t'], case['y'], case['months']
    entry = {'name': case['name'], 't': t, 'y': y, 'mannKendall': mann_kendall(y)}
    if np.isfinite(y).sum() >= 2:
        entry['sensSlope'] = sens(t, y)
    if np.isfinite(y).sum() >= 4 and len(np.unique(y[np.isfinite(y)])) > 1:
        entry['hamedRao'] = hamed_rao(t, y)
        entry['pettitt'] = pettitt(y)
        ar1p = ar1_pettitt(y)
        if ar1p is not None:
            entry['ar1Pettitt'] = ar1p
    ar1 = ar1_mann_kendall(t, y, months)
    if ar1 is not None:
        entry['ar1MannKendall'] = ar1
    if months is not None:
        entry['months'] = months
        entry['seasonalKendall'] = seasonal(months, y)
        ok = np.isfinite(y)
        groups = [y[ok & (months % 12 == g)] for g in range(12)]
        kw = stats.kruskal(*[g for g in groups if len(g) > 0])
        entry['kruskalWallis'] = {'h': kw.statistic, 'p': kw.pvalue}
    out_cases.append(entry)

p_values = np.array([c['mannKendall']['p'] for c in out_cases if 'p' in c['mannKendall']])
bh = [0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.3240, 0.4262, 0.5719, 0.6528, 0.7590, 1.000]
sample = rng.normal(10, 3, 37)
field = rng.lognormal(1.5, 0.6, 45)
estimate = field * rng.lognormal(0.05, 0.2, 45)

reference = {
    'generator': f'scripts/reference/stats_reference.py with numpy {np.__version__} and scipy {scipy.__version__}',
    'cases': out_cases,
    'benjaminiHochberg': [
        {'p': p_values, 'adjusted': stats.false_discovery_control(p_values, method='bh')},
        {'p': bh, 'adjusted': stats.false_discovery_control(bh, method='bh')},
    ],
    'quantile': {'sample': sample, 'probabilities': [0, 0.1, 0.25, 0.5, 0.75, 0.9, 1],
                 'values': np.quantile(sample, [0, 0.1, 0.25, 0.5, 0.75, 0.9, 1])},
    'percentileRank': {'sample': np.round(sample), 'scores': [3, 7, 10, 13, 20],
                       'values': [stats.percentileofscore(np.round(sample), s, kind='mean') for s in [3, 7, 10, 13, 20]]},
    'standardDeviation': {'sample': sample, 'value': np.std(sample, ddof=1)},
    'agreement': {'reference': field, 'estimate': estimate,
                  'bias': np.mean(estimate - field), 'meanAbsoluteError': np.mean(np.abs(estimate - field)),
                  'rootMeanSquareError': np.sqrt(np.mean((estimate - field) ** 2)),
                  **(lambda r: {'slope': r.slope, 'intercept': r.intercept, 'rSquared': r.rvalue ** 2})(stats.linregress(field, estimate))},
    # numpy lines: Morley et al. (2018) on the log accuracy ratio, and log10 bias and R².
    'logAgreement': (lambda q, lr, le: {
        'medianSymmetricAccuracy': 100 * (np.exp(np.median(np.abs(q))) - 1),
        'symmetricSignedBias': 100 * np.sign(np.median(q)) * (np.exp(np.abs(np.median(q))) - 1),
        'log10Bias': np.mean(le - lr),
        'rSquaredLog10': stats.pearsonr(lr, le).statistic ** 2,
    })(np.log(estimate / field), np.log10(field), np.log10(estimate)),
    'chiSquare': {'x': [0.5, 3, 11, 19.7, 40, 120, 0.01], 'df': [1, 2, 11, 11, 5, 30, 3],
                  'survival': stats.chi2.sf([0.5, 3, 11, 19.7, 40, 120, 0.01], [1, 2, 11, 11, 5, 30, 3])},
    'weightedMedian': weighted_median_cases(),
    'studentT': {'t': [0, 0.5, 1.96, 2.5, 4, 10, 2.1, 0.3, 30],
                 'df': [1, 1.5, 3, 4.2, 10, 100, 7.7, 250, 12],
                 'twoSided': 2 * stats.t.sf([0, 0.5, 1.96, 2.5, 4, 10, 2.1, 0.3, 30], [1, 1.5, 3, 4.2, 10, 100, 7.7, 250, 12])},
    'normal': {'z': [0, 0.3, 1, 1.96, 2.4, 2.6, 3.5, 6, 9, 15, 30],
               'survival': stats.norm.sf([0, 0.3, 1, 1.96, 2.4, 2.6, 3.5, 6, 9, 15, 30]),
               'p': [1e-12, 0.001, 0.025, 0.3, 0.5, 0.9, 0.975, 0.999999],
               'quantile': stats.norm.ppf([1e-12, 0.001, 0.025, 0.3, 0.5, 0.9, 0.975, 0.999999])},
}

path = sys.argv[1] if len(sys.argv) > 1 else 'test/fixtures/stats-reference.json'
with open(path, 'w') as handle:
    json.dump(clean(reference), handle, indent=1, allow_nan=False)
    handle.write('\n')
print(f'wrote {len(out_cases)} cases to {path}')
