"""Reference values for limnopress's PCHIP interpolation, from scipy.interpolate.PchipInterpolator.

Writes test/fixtures/pchip-reference.json (or the path given as the first argument). The knots and
evaluation points come from a seeded numpy generator, so the file is the same on every run with the
same library versions; .ci/fixtures regenerates it and fails if it differs from the committed one.
"""
import json
import sys

import numpy as np
import scipy
from scipy.interpolate import PchipInterpolator

rng = np.random.default_rng(20261202)
cases = []


def add(name, x, y, at):
    interpolant = PchipInterpolator(x, y)
    cases.append({
        'name': name,
        'x': [float(v) for v in x],
        'y': [float(v) for v in y],
        'at': [float(v) for v in at],
        'values': [float(v) for v in interpolant(at)],
        'slopes': [float(v) for v in interpolant.derivative()(x)],
    })


# Monotone curves like a reservoir's elevation–volume table: uneven steps, some flat.
for k in range(8):
    n = int(rng.integers(3, 14))
    x = np.cumsum(rng.uniform(0.2, 3.0, n)) + 100.0
    steps = rng.gamma(1.5, 2.0, n)
    steps[rng.random(n) < 0.15] = 0.0
    y = np.cumsum(steps)
    at = np.sort(rng.uniform(x[0], x[-1], 25))
    add(f'monotone-{k}', x, y, np.concatenate([x, at]))

# Two and three knots, and data that go up and down (the shape-preserving rules at work).
add('two-knots', np.array([0.0, 2.0]), np.array([1.0, 5.0]), np.linspace(0.0, 2.0, 9))
add('three-knots', np.array([0.0, 1.0, 3.0]), np.array([0.0, 4.0, 5.0]), np.linspace(0.0, 3.0, 13))
for k in range(3):
    n = int(rng.integers(4, 10))
    x = np.cumsum(rng.uniform(0.5, 2.0, n))
    y = rng.normal(0.0, 3.0, n)
    add(f'up-and-down-{k}', x, y, np.sort(rng.uniform(x[0], x[-1], 25)))

json.dump({'scipy': scipy.__version__, 'numpy': np.__version__, 'cases': cases},
          open(sys.argv[1] if len(sys.argv) > 1 else 'test/fixtures/pchip-reference.json', 'w'), indent=1)
