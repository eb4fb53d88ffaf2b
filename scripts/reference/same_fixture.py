"""Whether a fresh reference fixture is the committed one: the same structure, strings and integers, and
floats equal to 1e-12 relative (1e-300 absolute near zero). numpy and scipy may differ in the last bit
or two from one CPU or BLAS build to another (rSquaredLog10 has come out as ...808 and ...81); that
is not drift of the script, and the tests compare at 1e-9. Prints the largest difference found.

Usage: python3 same_fixture.py FRESH COMMITTED; exit 0 when they agree, 1 otherwise."""
import json
import sys

RELATIVE = 1e-12
worst = [0.0, '']
problems = []


def walk(fresh, committed, path):
    if isinstance(fresh, bool) or isinstance(committed, bool) or isinstance(fresh, str) or fresh is None or committed is None:
        if fresh != committed:
            problems.append(f'{path}: {fresh!r} against {committed!r}')
        return
    if isinstance(fresh, dict) and isinstance(committed, dict):
        if set(fresh) != set(committed):
            problems.append(f'{path}: keys {sorted(set(fresh) ^ set(committed))} in one only')
        for key in set(fresh) & set(committed):
            walk(fresh[key], committed[key], f'{path}/{key}')
        return
    if isinstance(fresh, list) and isinstance(committed, list):
        if len(fresh) != len(committed):
            problems.append(f'{path}: {len(fresh)} items against {len(committed)}')
        for k, (a, b) in enumerate(zip(fresh, committed)):
            walk(a, b, f'{path}[{k}]')
        return
    if isinstance(fresh, (int, float)) and isinstance(committed, (int, float)):
        if isinstance(fresh, int) and isinstance(committed, int):
            if fresh != committed:
                problems.append(f'{path}: {fresh} against {committed}')
            return
        difference = abs(fresh - committed)
        relative = difference / max(abs(committed), 1e-300)
        if relative > worst[0]:
            worst[0], worst[1] = relative, path
        if difference > max(RELATIVE * abs(committed), 1e-300):
            problems.append(f'{path}: {fresh!r} against {committed!r}')
        return
    problems.append(f'{path}: {type(fresh).__name__} against {type(committed).__name__}')


with open(sys.argv[1]) as handle:
    fresh = json.load(handle)
with open(sys.argv[2]) as handle:
    committed = json.load(handle)
walk(fresh, committed, '')
print(f'largest relative difference {worst[0]:.1e}' + (f' at {worst[1]}' if worst[1] else ''))
for problem in problems[:20]:
    print(problem, file=sys.stderr)
sys.exit(1 if problems else 0)
