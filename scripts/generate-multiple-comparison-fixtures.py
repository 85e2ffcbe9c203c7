#!/usr/bin/python3
"""Reference values for the run-level statistics (run: npm run fixtures:run-level).

Writes tests/fixtures/scipy/run-level.json for gamesHowell, holmAdjust, runsPerGroupForCvRatio,
varianceComponents and cvRatioFromLogCv. Needs Debian's python3 with python3-scipy and
python3-statsmodels (call /usr/bin/python3: a python3 earlier on PATH may lack statsmodels).

Where a library implements the method, its result is the reference (statsmodels multipletests
for Holm, statsmodels TTestIndPower.solve_power for the planner, scipy ttest_ind's confidence
t and p for the CV ratio). Games-Howell and the variance-component intervals are not in scipy 1.10
or statsmodels 0.13, so their textbook formulas are evaluated here with scipy's distribution
functions (studentized_range, chi2, f); the "source" fields name the formula. Data are drawn from
numpy's PCG64 generator with a fixed seed, rounded, and written into the JSON.
"""
import json
import math
import os
import sys

import numpy as np
import scipy
import statsmodels
from scipy import stats
from statsmodels.stats.multitest import multipletests
from statsmodels.stats.power import TTestIndPower

ROOT = os.path.dirname(os.path.dirname(os.path.abspath(__file__)))
OUT = os.path.join(ROOT, "tests", "fixtures", "scipy", "run-level.json")
SEED = 20261207


def games_howell(groups, confidence=0.95):
    """Games & Howell (1976): Welch SE and df per pair, studentized range for k means."""
    k = len(groups)
    pairs = []
    for a in range(k):
        for b in range(a + 1, k):
            ga, gb = np.asarray(groups[a]), np.asarray(groups[b])
            va, vb = ga.var(ddof=1) / len(ga), gb.var(ddof=1) / len(gb)
            se = math.sqrt(va + vb)
            df = (va + vb) ** 2 / (va ** 2 / (len(ga) - 1) + vb ** 2 / (len(gb) - 1))
            diff = ga.mean() - gb.mean()
            q = abs(diff) / (se / math.sqrt(2))
            crit = stats.studentized_range.ppf(confidence, k, df)
            pairs.append({"groupA": a, "groupB": b, "meanDifference": float(diff), "df": float(df),
                          "statistic": float(q), "pValue": float(stats.studentized_range.sf(q, k, df)),
                          "lower": float(diff - crit * se / math.sqrt(2)), "upper": float(diff + crit * se / math.sqrt(2))})
    return {"confidence": confidence, "pairs": pairs,
            "source": "Games & Howell (1976) formula: q = |diff|/sqrt((va+vb)/2), Welch df, "
                      "scipy.stats.studentized_range.sf / .ppf(k, df)"}


def variance_components(runs, confidence=0.95):
    """One-way random effects; exact chi-square (within), MLS of Ting et al. 1990 (between);
    unbalanced: Thomas-Hultquist unweighted means with the harmonic-mean run size."""
    a = len(runs)
    sizes = [len(r) for r in runs]
    n = sum(sizes)
    n_h = a / sum(1 / s for s in sizes)
    means = np.array([np.mean(r) for r in runs])
    ssw = sum(((np.asarray(r) - np.mean(r)) ** 2).sum() for r in runs)
    n1, n2 = a - 1, n - a
    s2 = ssw / n2
    s1 = n_h * means.var(ddof=1)
    al = 1 - confidence
    g = lambda nu: 1 - nu / stats.chi2.ppf(1 - al / 2, nu)
    h = lambda nu: nu / stats.chi2.ppf(al / 2, nu) - 1
    g1, h1, g2, h2 = g(n1), h(n1), g(n2), h(n2)
    f_hi, f_lo = stats.f.ppf(1 - al / 2, n1, n2), stats.f.ppf(al / 2, n1, n2)
    g12 = ((f_hi - 1) ** 2 - g1 ** 2 * f_hi ** 2 - h2 ** 2) / f_hi
    h12 = ((1 - f_lo) ** 2 - h1 ** 2 * f_lo ** 2 - g2 ** 2) / f_lo
    vl = g1 ** 2 * s1 ** 2 + h2 ** 2 * s2 ** 2 + g12 * s1 * s2
    vu = h1 ** 2 * s1 ** 2 + g2 ** 2 * s2 ** 2 + h12 * s1 * s2
    return {
        "runs": runs, "confidence": confidence, "runSize": n_h, "msBetween": float(s1), "msWithin": float(s2),
        "withinLower": float(ssw / stats.chi2.ppf(1 - al / 2, n2)), "withinUpper": float(ssw / stats.chi2.ppf(al / 2, n2)),
        "betweenEstimate": float((s1 - s2) / n_h),
        "betweenLowerUntruncated": float((s1 - s2 - math.sqrt(max(0.0, vl))) / n_h),
        "betweenUpperUntruncated": float((s1 - s2 + math.sqrt(max(0.0, vu))) / n_h),
        "source": "Burdick & Graybill (1992) one-fold nested MLS (Ting et al. 1990) with scipy.stats.chi2.ppf and f.ppf; "
                  "within: exact chi-square; unbalanced: harmonic-mean n and unweighted run means (Thomas & Hultquist 1978)",
    }


def main():
    rng = np.random.default_rng(SEED)

    # Games-Howell: ln run CV of four methods, unequal sizes and spreads.
    sizes, centres, sds = [7, 12, 9, 15], [-3.0, -3.4, -2.9, -3.1], [0.15, 0.45, 0.3, 0.2]
    gh_groups = [list(map(float, np.round(rng.normal(c, s, n), 6))) for n, c, s in zip(sizes, centres, sds)]
    gh = dict(games_howell(gh_groups), groups=gh_groups)
    gh90 = games_howell(gh_groups[:3], 0.90)
    gh90["groups"] = gh_groups[:3]

    # Holm: a family with ties, a p above 1/m and a zero.
    holm_cases = [[0.01, 0.04, 0.03, 0.005, 0.2], [0.03, 0.03, 0.5, 0.0, 0.0125, 0.9, 0.011], [0.2], [0.8, 0.6]]
    holm = [{"pValues": ps, "adjusted": [float(v) for v in multipletests(ps, method="holm")[1]]} for ps in holm_cases]

    # Planner grid.
    grid = []
    for ratio in [1.1, 1.25, 1.5, 2.0, 0.7]:
        for sd in [0.2, 0.35, 0.6]:
            for alpha, power in [(0.05, 0.8), (0.05, 0.9), (0.01, 0.8)]:
                d = abs(math.log(ratio)) / sd
                n = TTestIndPower().solve_power(effect_size=d, alpha=alpha, power=power, ratio=1.0, alternative="two-sided")
                n = float(np.asarray(n).item())
                if n < 2:
                    continue
                grid.append({"ratio": ratio, "sdLogCv": sd, "alpha": alpha, "power": power, "effectSize": d, "exact": n})

    # Variance components: balanced (8 runs x 12 studs) and unbalanced (8- and 12-stud runs), kN.
    run_effects = rng.normal(0, 2.0, 8)
    balanced = [list(map(float, np.round(100 + e + rng.normal(0, 3.0, 12), 4))) for e in run_effects]
    unbalanced = [list(map(float, np.round(100 + e + rng.normal(0, 3.0, n), 4)))
                  for e, n in zip(rng.normal(0, 2.0, 7), [8, 12, 8, 8, 12, 16, 12])]
    small_between = [list(map(float, np.round(100 + rng.normal(0, 3.0, 8), 4))) for _ in range(5)]
    vc = [dict(variance_components(balanced), name="balanced"),
          dict(variance_components(unbalanced), name="unbalanced"),
          dict(variance_components(small_between, 0.90), name="noRunEffect90")]

    # CV ratio from ln CV.
    cv_a = list(map(float, np.round(np.exp(rng.normal(math.log(0.04), 0.3, 11)), 8)))
    cv_b = list(map(float, np.round(np.exp(rng.normal(math.log(0.025), 0.5, 14)), 8)))
    la, lb = np.log(cv_a), np.log(cv_b)
    t = stats.ttest_ind(la, lb, equal_var=False)
    # scipy 1.10's ttest_ind gives t and p but no interval: Welch's SE and df, the quantile from scipy.
    va, vb = la.var(ddof=1) / len(la), lb.var(ddof=1) / len(lb)
    df = (va + vb) ** 2 / (va ** 2 / (len(la) - 1) + vb ** 2 / (len(lb) - 1))
    d = float(la.mean() - lb.mean())
    half = stats.t.ppf(0.975, df) * math.sqrt(va + vb)
    cv_ratio = {"groupA": cv_a, "groupB": cv_b, "ratio": math.exp(d), "lower": math.exp(d - half), "upper": math.exp(d + half),
                "df": float(df), "statistic": float(t.statistic), "pValue": float(t.pvalue),
                "source": "statistic, pValue: scipy.stats.ttest_ind(log a, log b, equal_var=False); interval: exp(diff -/+ "
                          "scipy.stats.t.ppf(0.975, Welch df) * Welch SE) (scipy 1.10 has no ttest_ind confidence_interval)"}

    payload = {
        "meta": {"generator": "scripts/generate-multiple-comparison-fixtures.py", "scipy": scipy.__version__,
                 "numpy": np.__version__, "statsmodels": statsmodels.__version__, "python": sys.version.split()[0],
                 "seed": SEED},
        "gamesHowell": [gh, gh90],
        "holm": {"cases": holm, "source": "statsmodels.stats.multitest.multipletests(p, method='holm')[1]"},
        "runsPerGroup": {"grid": grid, "source": "statsmodels TTestIndPower().solve_power(effect_size=|ln ratio|/sdLogCv, "
                                                 "alpha, power, ratio=1, alternative='two-sided')"},
        "varianceComponents": vc,
        "cvRatio": cv_ratio,
    }
    os.makedirs(os.path.dirname(OUT), exist_ok=True)
    with open(OUT, "w", encoding="utf-8") as fh:
        json.dump(payload, fh, indent=2)
        fh.write("\n")
    print("wrote", os.path.relpath(OUT, ROOT))


if __name__ == "__main__":
    main()
