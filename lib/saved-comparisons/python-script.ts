/**
 * The Python script shipped in a saved comparison's data package. It reads data/runs.csv and
 * data/final_loads.csv, recomputes the headline numbers (each run's CV from its final loads, the
 * mean ln run CV per group, Welch's ANOVA and the one-way ANOVA on ln run CV, and the CV ratio of
 * the two groups furthest apart with its Welch 95 % interval) with numpy, scipy and statsmodels,
 * recomputes the data hash from the files, and prints both beside the frozen figures as JSON. From
 * package layout 2 it also recomputes each group's mean gasket stress after the final step (MPa) and
 * the share of runs reaching seating, from the runs table's stored gasket figures (the rule of
 * lib/analysis/group-gasket.ts: mean over runs with a stress; share over runs with a seating stress,
 * reaching it when stress ≥ seating).
 * Pure and browser-safe: it only writes text.
 *
 * Methods as in the app: Welch's ANOVA is statsmodels' `anova_oneway(use_var="unequal")` (Welch,
 * Biometrika 38 (1951) 330–336); the one-way ANOVA is `scipy.stats.f_oneway`; the CV ratio is
 * exp of the Welch t interval of the difference of mean ln CV (statsmodels `CompareMeans
 * .tconfint_diff(usevar="unequal")`).
 */
import type { Headline } from './headline';
import { dataTablesOf, type PackageLayout } from './data-tables';

export const PYTHON_SCRIPT_PATH = 'reproduce.py';

export function pythonScript(input: { title: string; groupKeys: readonly string[]; headline: Headline; dataSha256: string; layout: PackageLayout }): string {
  const tables = dataTablesOf(input.layout);
  const frozen = JSON.stringify({ headline: input.headline, dataSha256: input.dataSha256 });
  return `#!/usr/bin/env python3
"""Recomputes the headline numbers of the saved comparison "${input.title.replace(/["\\\n\r]/g, ' ')}"
from the CSV tables beside this script, and prints them with the frozen figures as JSON.

Needs numpy, scipy and statsmodels (Debian: python3-numpy python3-scipy python3-statsmodels).
Run from the folder that holds datapackage.json:  python3 ${PYTHON_SCRIPT_PATH}
"""
import csv
import hashlib
import json
import math
import os
import sys

import numpy as np
from scipy import stats
from statsmodels.stats.oneway import anova_oneway
from statsmodels.stats.weightstats import CompareMeans, DescrStatsW

HERE = os.path.dirname(os.path.abspath(__file__))
GROUP_KEYS = json.loads(${JSON.stringify(JSON.stringify(input.groupKeys))})
FROZEN = json.loads(${JSON.stringify(frozen)})
DATA_FILES = ${JSON.stringify(tables.map((t) => t.path))}
HAS_GASKET = ${input.layout === 1 ? 'False' : 'True'}


def read_rows(path):
    with open(os.path.join(HERE, path), newline="", encoding="utf-8") as handle:
        return list(csv.DictReader(handle))


def data_sha256():
    """sha256 of the lines "<sha256>  <path>" of the data files, in the package's order."""
    lines = ""
    for path in DATA_FILES:
        with open(os.path.join(HERE, path), "rb") as handle:
            lines += hashlib.sha256(handle.read()).hexdigest() + "  " + path + "\\n"
    return hashlib.sha256(lines.encode("utf-8")).hexdigest()


def ln_run_cvs():
    """ln of each run's CV (sample SD / mean of its final loads), per group key, in run order."""
    loads = {}
    for row in read_rows("${tables[1]!.path}"):
        loads.setdefault(int(row["run_id"]), []).append((int(row["stud"]), float(row["final_load_n"])))
    by_group = {key: [] for key in GROUP_KEYS}
    labels = {}
    for row in read_rows("${tables[0]!.path}"):
        values = np.array([load for _, load in sorted(loads.get(int(row["run_id"]), []))])
        labels[row["group_key"]] = row["group_label"]
        if len(values) < 2 or values.mean() <= 0:
            continue
        cv = values.std(ddof=1) / values.mean()
        if cv > 0 and row["group_key"] in by_group:
            by_group[row["group_key"]].append(math.log(cv))
    return by_group, labels


def gasket_figures():
    """Per group key: (mean average gasket stress in MPa or None, share of runs reaching seating or None)."""
    stresses = {key: [] for key in GROUP_KEYS}
    seated = {key: [] for key in GROUP_KEYS}
    for row in read_rows("${tables[0]!.path}"):
        key = row["group_key"]
        if not HAS_GASKET or key not in stresses or row["final_gasket_stress_mpa"] == "":
            continue
        stress = float(row["final_gasket_stress_mpa"])
        stresses[key].append(stress)
        if row["gasket_min_seating_mpa"] != "":
            seated[key].append(stress >= float(row["gasket_min_seating_mpa"]))
    return {
        key: (
            math.fsum(stresses[key]) / len(stresses[key]) if stresses[key] else None,
            sum(seated[key]) / len(seated[key]) if seated[key] else None,
        )
        for key in GROUP_KEYS
    }


def main():
    by_group, labels = ln_run_cvs()
    gasket = gasket_figures()
    groups = [
        {"key": k, "label": labels.get(k, k), "meanLnCv": float(np.mean(by_group[k])), "meanGasketStressMpa": gasket[k][0], "seatedShare": gasket[k][1]}
        for k in GROUP_KEYS
        if by_group[k]
    ]
    usable = [k for k in GROUP_KEYS if len(by_group[k]) >= 2]
    headline = {"groups": groups, "welchLnCv": None, "anovaLnCv": None, "cvRatio": None}
    if len(usable) >= 2:
        data = [np.array(by_group[k]) for k in usable]
        welch = anova_oneway(data, use_var="unequal", welch_correction=True)
        headline["welchLnCv"] = {"statistic": float(welch.statistic), "pValue": float(welch.pvalue)}
        anova = stats.f_oneway(*data)
        headline["anovaLnCv"] = {"statistic": float(anova.statistic), "pValue": float(anova.pvalue)}
        means = [float(np.mean(d)) for d in data]
        high, low = int(np.argmax(means)), int(np.argmin(means))
        compare = CompareMeans(DescrStatsW(data[high]), DescrStatsW(data[low]))
        lower, upper = compare.tconfint_diff(alpha=0.05, usevar="unequal")
        headline["cvRatio"] = {
            "label": "Run CV, %s \\u00f7 %s" % (labels[usable[high]], labels[usable[low]]),
            "ratio": math.exp(means[high] - means[low]),
            "lower": math.exp(lower),
            "upper": math.exp(upper),
        }
    json.dump({"recomputed": headline, "frozen": FROZEN["headline"], "dataSha256": data_sha256(), "frozenDataSha256": FROZEN["dataSha256"]}, sys.stdout, indent=2)
    sys.stdout.write("\\n")


if __name__ == "__main__":
    main()
`;
}
