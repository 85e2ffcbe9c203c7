#!/usr/bin/python3
"""Reference values for the comparison of a hand-made selection (run: npm run fixtures:compare).

Writes tests/fixtures/scipy/compare-selection.json: three groups of 4-stud runs by four operators,
with every run-level figure compareGroups shows, recomputed here with scipy and statsmodels.
Needs Debian's /usr/bin/python3 with python3-scipy and python3-statsmodels (the python3 earlier on
PATH may lack statsmodels). Sources: statsmodels anova_oneway(use_var='unequal') for Welch's ANOVA,
scipy f_oneway, scipy levene(center='median') (Brown-Forsythe), the Welch t interval from scipy's t
distribution, statsmodels MixedLM (ML fits for the likelihood-ratio test, REML for the estimates),
statsmodels multipletests('holm') and TTestIndPower.solve_power for the planner.
"""
import json
import math
import os

import numpy as np
import pandas as pd
import scipy
import statsmodels
import statsmodels.formula.api as smf
from scipy import stats
from statsmodels.stats.multitest import multipletests
from statsmodels.stats.oneway import anova_oneway
from statsmodels.stats.power import TTestIndPower

ROOT = os.path.dirname(os.path.dirname(os.path.abspath(__file__)))
OUT = os.path.join(ROOT, "tests", "fixtures", "scipy", "compare-selection.json")
TARGET = 100000.0
rng = np.random.Generator(np.random.PCG64(20261208))

# Invented: group spread (fraction), operator skill multiplier; attempts numbered per operator in order.
GROUPS = [("a", "Cross, three passes", 0.03), ("b", "Circular, one pass", 0.07), ("c", "Cross, one pass", 0.045)]
OPERATORS = [1, 2, 3, 4]
SKILL = {1: 0.5, 2: 1.0, 3: 1.6, 4: 2.4}
runs = []
attempts = {o: 0 for o in OPERATORS}
for r in range(7):
    for key, _label, spread in GROUPS:
        op = OPERATORS[(r + len(runs)) % 4]
        attempts[op] += 1
        loads = [round(TARGET * (1 + spread * SKILL[op] * rng.normal()) , 1) for _ in range(4)]
        runs.append({"group": key, "operator": op, "attempt": attempts[op], "finalLoadsN": loads})

df = pd.DataFrame([{
    "group": r["group"], "operator": r["operator"], "attempt": r["attempt"],
    "mean_pct": np.mean(r["finalLoadsN"]) / TARGET * 100,
    "sd_pct": np.std(r["finalLoadsN"], ddof=1) / TARGET * 100,
    "lncv": math.log(np.std(r["finalLoadsN"], ddof=1) / np.mean(r["finalLoadsN"])),
} for r in runs])
keys = [g[0] for g in GROUPS]
by = lambda col: [df[df.group == k][col].to_numpy() for k in keys]

tests = {}
w = anova_oneway(by("lncv"), use_var="unequal")
tests["welch-ln-cv"] = {"statistic": float(w.statistic), "pValue": float(w.pvalue)}
f = stats.f_oneway(*by("lncv"))
tests["anova-ln-cv"] = {"statistic": float(f.statistic), "pValue": float(f.pvalue)}
w = anova_oneway(by("sd_pct"), use_var="unequal")
tests["welch-within-sd"] = {"statistic": float(w.statistic), "pValue": float(w.pvalue)}
f = stats.f_oneway(*by("sd_pct"))
tests["anova-within-sd"] = {"statistic": float(f.statistic), "pValue": float(f.pvalue)}
bf = stats.levene(*by("mean_pct"), center="median")
tests["spread-of-run-means"] = {"statistic": float(bf.statistic), "pValue": float(bf.pvalue)}

df["g"] = pd.Categorical(df.group, categories=keys)
full = smf.mixedlm("lncv ~ C(g) + attempt", df, groups=df.operator).fit(reml=False)
reduced = smf.mixedlm("lncv ~ attempt", df, groups=df.operator).fit(reml=False)
lr = 2 * (full.llf - reduced.llf)
tests["trainee-blocks"] = {"statistic": float(lr), "pValue": float(stats.chi2.sf(lr, 2))}
reml = smf.mixedlm("lncv ~ C(g) + attempt", df, groups=df.operator).fit(reml=True)
estimates = {}
for k in keys[1:]:
    name = f"C(g)[T.{k}]"
    # Only the estimate: statsmodels 0.13's standard errors are unreliable when its optimiser warns
    # of a boundary (as here); the lme4 standard errors are checked in tests/stats.
    estimates[k] = {"ratio": math.exp(reml.fe_params[name])}

order = list(tests)
adjusted = multipletests([tests[t]["pValue"] for t in order], method="holm")[1]
for t, p in zip(order, adjusted):
    tests[t]["adjustedPValue"] = float(p)

# Effect of the ln-CV tests: Welch t interval of ln CV, largest vs smallest group mean, exponentiated.
means = {k: df[df.group == k].lncv.mean() for k in keys}
hi, lo = max(keys, key=means.get), min(keys, key=means.get)
a, b = df[df.group == hi].lncv.to_numpy(), df[df.group == lo].lncv.to_numpy()
va, vb = a.var(ddof=1) / len(a), b.var(ddof=1) / len(b)
dfw = (va + vb) ** 2 / (va ** 2 / (len(a) - 1) + vb ** 2 / (len(b) - 1))
d, se = a.mean() - b.mean(), math.sqrt(va + vb)
t = stats.t.ppf(0.975, dfw)
cv_ratio = {"high": hi, "low": lo, "ratio": math.exp(d), "lower": math.exp(d - t * se), "upper": math.exp(d + t * se)}

ss = sum(((df[df.group == k].lncv - means[k]) ** 2).sum() for k in keys)
dof = len(df) - len(keys)
sd_log_cv = math.sqrt(ss / dof)
n = TTestIndPower().solve_power(effect_size=math.log(1.5) / sd_log_cv, alpha=0.05, power=0.8, ratio=1, alternative="two-sided")

out = {
    "generator": "scripts/generate-compare-fixtures.py",
    "versions": {"scipy": scipy.__version__, "statsmodels": statsmodels.__version__, "numpy": np.__version__},
    "targetLoadN": TARGET,
    "groups": [{"key": k, "label": l} for k, l, _ in GROUPS],
    "runs": runs,
    "tests": tests,
    "traineeBlocks": {"estimates": estimates, "operators": int(df.operator.nunique())},
    "cvRatio": cv_ratio,
    "planner": {"sdLogCv": sd_log_cv, "df": dof, "exactRunsFor1_5": float(n)},
}
with open(OUT, "w") as fh:
    json.dump(out, fh, indent=1)
print("wrote", OUT)
