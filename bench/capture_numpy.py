"""The numpy side of `npm run bench:capture`: the same capture file, the equivalent work.

Reads the CSV (numpy.loadtxt, numpy's own C reader; also np.fromstring on the whole text, and
the faster of the two is kept as the baseline), then: state levels by the histogram method
(IEEE Std 181-2011, 5.2.1: the mode of each half of the histogram, refined to the mean of the
bins within its full width at half maximum), the 10 %/50 %/90 % reference levels, every
transition with hysteresis between the 10 % and 90 % levels and its interpolated crossing
instants, rise and fall time, and the period from the 50 % crossings. Prints one JSON line.
"""
import json
import sys
import time

import numpy as np


def read_loadtxt(path):
    data = np.loadtxt(path, delimiter=',', skiprows=1, dtype=np.float64)
    return data[:, 0], data[:, 1]


def read_fromstring(path):
    with open(path, 'rb') as f:
        f.readline()
        text = f.read()
    values = np.fromstring(text.replace(b'\n', b','), sep=',')
    return values[0::2], values[1::2]


def half_level(counts, sums, lo, hi):
    part = counts[lo:hi]
    mode = lo + int(np.argmax(part))
    peak = counts[mode]
    first, last = mode, mode
    while first > lo and 2 * counts[first - 1] >= peak:
        first -= 1
    while last < hi - 1 and 2 * counts[last + 1] >= peak:
        last += 1
    return sums[first:last + 1].sum() / counts[first:last + 1].sum()


def analyse(t, v):
    n = v.size
    bins = int(min(4096, max(32, round(np.sqrt(n)) * 2)))
    lo_v, hi_v = v.min(), v.max()
    counts, edges = np.histogram(v, bins=bins, range=(lo_v, hi_v))
    sums, _ = np.histogram(v, bins=bins, range=(lo_v, hi_v), weights=v)
    base = half_level(counts, sums, 0, bins // 2)
    top = half_level(counts, sums, bins // 2, bins)
    amp = top - base
    low, mid, high = base + 0.1 * amp, base + 0.5 * amp, base + 0.9 * amp
    state = np.where(v <= low, -1, np.where(v >= high, 1, 0)).astype(np.int8)
    idx = np.flatnonzero(state)
    s = state[idx]
    change = np.flatnonzero(s[1:] != s[:-1])
    a = idx[change]
    b = idx[change + 1]
    rising = s[change + 1] == 1

    def cross(k, level):
        return t[k] + (level - v[k]) * (t[k + 1] - t[k]) / (v[k + 1] - v[k])

    # 10 % and 90 % instants: from the last sample in the old state and the first in the new one
    t_low = np.where(rising, cross(a, low), cross(b - 1, low))
    t_high = np.where(rising, cross(b - 1, high), cross(a, high))
    durations = np.abs(t_high - t_low)
    mids = np.empty(a.size)
    for j in range(a.size):
        seg = v[a[j]:b[j] + 1]
        k = a[j] + int(np.argmax(seg[1:] >= mid) if rising[j] else np.argmax(seg[1:] <= mid))
        mids[j] = cross(k, mid)
    periods = []
    for kind in (True, False):
        m = mids[rising == kind]
        if m.size >= 2:
            periods.append(((m[-1] - m[0]) / (m.size - 1), m.size - 1))
    period = sum(p * c for p, c in periods) / sum(c for _, c in periods) if periods else None
    return {
        'points': int(n),
        'baseV': float(base),
        'topV': float(top),
        'riseTimeS': float(durations[rising].mean()) if rising.any() else None,
        'fallTimeS': float(durations[~rising].mean()) if (~rising).any() else None,
        'periodS': None if period is None else float(period),
        'edges': int(a.size),
    }


def main():
    path, reader = sys.argv[1], sys.argv[2]
    t0 = time.perf_counter()
    t, v = read_loadtxt(path) if reader == 'loadtxt' else read_fromstring(path)
    t1 = time.perf_counter()
    result = analyse(t, v)
    t2 = time.perf_counter()
    try:
        import resource
        peak_mb = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024
    except ImportError:
        peak_mb = None
    print(json.dumps({'reader': reader, 'parseS': t1 - t0, 'analyzeS': t2 - t1, 'totalS': t2 - t0, 'peakRssMB': peak_mb, 'numpy': np.__version__, 'analysis': result}))


if __name__ == '__main__':
    main()
