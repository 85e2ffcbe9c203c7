#!/usr/bin/env python3
"""Generate reference values for tests/stats from scipy (run: npm run fixtures:scipy).

Writes JSON files into tests/fixtures/scipy/. Every file records the scipy and numpy versions and
this script's path, so a change of reference is visible in review. Inputs are either the NIST
e-Handbook GEAR.DAT file (tests/fixtures/reference/nist-ehandbook/GEAR.DAT in this repository) or data
drawn from numpy's PCG64 generator with a fixed seed; the data themselves are written into the JSON
so the TypeScript tests never need to reproduce the generator.

Nothing here is hand-typed: every expected value is the output of the scipy/numpy call named
beside it in the JSON ("source" fields).
"""
import json
import math
import os
import sys

import numpy as np
import scipy
from scipy import stats

ROOT = os.path.dirname(os.path.dirname(os.path.abspath(__file__)))
OUT = os.path.join(ROOT, "tests", "fixtures", "scipy")
REFERENCE = os.path.join(ROOT, "tests", "fixtures", "reference")
SEED = 20261201


def meta(description):
    return {
        "generator": "scripts/generate-scipy-fixtures.py",
        "scipy": scipy.__version__,
        "numpy": np.__version__,
        "python": sys.version.split()[0],
        "description": description,
    }


def write(name, payload):
    os.makedirs(OUT, exist_ok=True)
    with open(os.path.join(OUT, name), "w", encoding="utf-8") as fh:
        json.dump(payload, fh, indent=2, sort_keys=False)
        fh.write("\n")
    print("wrote", os.path.join("tests", "fixtures", "scipy", name))


def read_gear():
    path = os.path.join(REFERENCE, "nist-ehandbook", "GEAR.DAT")
    with open(path, "r", encoding="ascii") as fh:
        lines = fh.read().splitlines()
    groups = {}
    for line in lines[25:]:  # data lines 26-125 (1-based), per tests/fixtures/reference/README.md
        parts = line.split()
        if len(parts) != 2:
            continue
        value, batch = float(parts[0]), int(round(float(parts[1])))
        groups.setdefault(batch, []).append(value)
    return [groups[k] for k in sorted(groups)]


def variance_ratio(a, b):
    f = np.var(a, ddof=1) / np.var(b, ddof=1)
    da, db = len(a) - 1, len(b) - 1
    p = min(1.0, 2 * min(stats.f.sf(f, da, db), stats.f.cdf(f, da, db)))
    return {"statistic": float(f), "dfNumerator": da, "dfDenominator": db, "pValue": float(p),
            "source": "F = var(a, ddof=1)/var(b, ddof=1); p = 2*min(scipy.stats.f.sf, scipy.stats.f.cdf)"}


def vangel(values, confidence):
    x = np.asarray(values, dtype=float)
    nu = len(x) - 1
    k = np.std(x, ddof=1) / np.mean(x)
    alpha = 1 - confidence
    u1 = stats.chi2.ppf(1 - alpha / 2, nu)
    u2 = stats.chi2.ppf(alpha / 2, nu)

    def limit(u):
        rad = ((u + 2) / (nu + 1) - 1) * k * k + u / nu
        return float(k / math.sqrt(rad)) if rad > 0 else None

    return {"confidence": confidence, "cv": float(k), "lower": limit(u1), "upper": limit(u2),
            "source": "Vangel (1996) eq. 16 with scipy.stats.chi2.ppf quantiles"}


def comparisons(groups):
    out = {}
    out["fOneway"] = {"statistic": float(stats.f_oneway(*groups).statistic),
                      "pValue": float(stats.f_oneway(*groups).pvalue), "source": "scipy.stats.f_oneway"}
    w = stats.f_oneway(*groups, equal_var=False)
    out["welchAnova"] = {"statistic": float(w.statistic), "pValue": float(w.pvalue),
                         "source": "scipy.stats.f_oneway(equal_var=False) (Welch 1951)"}
    lm = stats.levene(*groups, center="mean")
    out["leveneMean"] = {"statistic": float(lm.statistic), "pValue": float(lm.pvalue),
                         "source": "scipy.stats.levene(center='mean')"}
    lmed = stats.levene(*groups, center="median")
    out["leveneMedian"] = {"statistic": float(lmed.statistic), "pValue": float(lmed.pvalue),
                           "source": "scipy.stats.levene(center='median')"}
    b = stats.bartlett(*groups)
    out["bartlett"] = {"statistic": float(b.statistic), "pValue": float(b.pvalue), "source": "scipy.stats.bartlett"}
    t = stats.tukey_hsd(*groups)
    ci = t.confidence_interval(0.95)
    pairs = []
    for i in range(len(groups)):
        for j in range(i + 1, len(groups)):
            pairs.append({"groupA": i, "groupB": j, "meanDifference": float(t.statistic[i, j]),
                          "pValue": float(t.pvalue[i, j]), "lower": float(ci.low[i, j]), "upper": float(ci.high[i, j])})
    out["tukeyHsd"] = {"confidence": 0.95, "pairs": pairs, "source": "scipy.stats.tukey_hsd, confidence_interval(0.95)"}
    return out


def main():
    rng = np.random.default_rng(SEED)

    gear = read_gear()
    write("gear.json", {"meta": meta("NIST/SEMATECH e-Handbook GEAR.DAT (10 batches x 10 diameters) through scipy"),
                        "groups": gear, **comparisons(gear)})

    # Stud-load-like groups: unequal sizes and unequal scatter (newtons).
    sizes = [8, 12, 10, 16]
    sds = [1500.0, 3500.0, 2500.0, 900.0]
    centres = [100000.0, 101500.0, 98000.0, 100400.0]
    groups = [list(map(float, np.round(rng.normal(c, s, n), 3))) for c, s, n in zip(centres, sds, sizes)]
    payload = {"meta": meta(f"Four seeded normal groups (numpy PCG64 seed {SEED}), rounded to 1e-3 N"),
               "groups": groups, **comparisons(groups)}
    a, bgrp = groups[0], groups[1]
    tt = stats.ttest_ind(a, bgrp, equal_var=False)
    tci = tt.confidence_interval(0.95)
    payload["welchTTest"] = {"statistic": float(tt.statistic), "df": float(tt.df), "pValue": float(tt.pvalue),
                             "lower": float(tci.low), "upper": float(tci.high),
                             "source": "scipy.stats.ttest_ind(groups[0], groups[1], equal_var=False), confidence_interval(0.95)"}
    payload["varianceRatio"] = variance_ratio(a, bgrp)
    payload["vangel"] = [dict(vangel(g, 0.95), group=i) for i, g in enumerate(groups)] + [dict(vangel(groups[1], 0.90), group=1)]
    write("comparisons.json", payload)

    # Quantiles (R-7 = numpy 'linear') on seeded data with ties.
    q_data = list(map(float, np.round(rng.normal(50, 10, 37), 1)))
    probs = [0.0, 0.01, 0.1, 0.25, 0.5, 0.75, 0.9, 0.975, 1.0]
    write("quantiles.json", {"meta": meta("numpy.quantile(method='linear') = Hyndman & Fan type 7"),
                             "values": q_data, "probabilities": probs,
                             "quantiles": [float(np.quantile(q_data, p, method="linear")) for p in probs]})

    # Distribution functions.
    f_cases = [(x, d1, d2) for x, d1, d2 in [(0.5, 3, 20), (1.0, 1, 1), (3.5, 2, 10), (4.12, 3, 36), (25.0, 9, 90),
                                             (1e-3, 5, 5), (100.0, 4, 200), (2.0, 0.5, 7.5), (1.7059, 9, 90)]]
    t_cases = [(0.1, 3), (1.0, 1), (2.228138851986274, 10), (-1.5, 7.3), (8.0, 4), (40.0, 30), (0.0, 5), (3.0, 15.7)]
    c_cases = [(0.5, 1), (2.0, 2), (20.785873428064864, 9), (100.0, 10), (3.0, 0.5), (1e-4, 3)]
    sr_cases = [(1.0, 3, 10), (3.0, 3, 10), (5.0, 3, 10), (3.5, 4, 42), (6.0, 10, 90), (2.0, 2, 5), (4.5, 5, 20)]
    write("distributions.json", {
        "meta": meta("Upper tails (sf) and quantiles (ppf) of F, t, chi-square and studentized range"),
        "fSf": [{"x": x, "df1": a1, "df2": a2, "value": float(stats.f.sf(x, a1, a2))} for x, a1, a2 in f_cases],
        "tSf": [{"x": x, "df": d, "value": float(stats.t.sf(x, d))} for x, d in t_cases],
        "chi2Sf": [{"x": x, "df": d, "value": float(stats.chi2.sf(x, d))} for x, d in c_cases],
        "studentizedRangeSf": [{"x": x, "k": k, "df": d, "value": float(stats.studentized_range.sf(x, k, d))}
                               for x, k, d in sr_cases],
        "tPpf": [{"p": p, "df": d, "value": float(stats.t.ppf(p, d))}
                 for p in [0.6, 0.9, 0.975, 0.995, 0.025] for d in [1, 2, 4.5, 9, 30, 120]],
        "chi2Ppf": [{"p": p, "df": d, "value": float(stats.chi2.ppf(p, d))}
                    for p in [0.005, 0.025, 0.5, 0.975, 0.995] for d in [1, 2, 7, 30, 200]],
        "studentizedRangePpf": [{"p": p, "k": k, "df": d, "value": float(stats.studentized_range.ppf(p, k, d))}
                                for p in [0.95, 0.99] for k, d in [(3, 10), (4, 42), (10, 90)]],
        "source": "scipy.stats.{f,t,chi2,studentized_range}.{sf,ppf}",
    })


if __name__ == "__main__":
    main()
