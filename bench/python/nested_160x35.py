#!/usr/bin/env python3
"""Side-by-side benchmark: the experiment of bench/specs/nested-160x35.yaml scripted with scikit-learn.

Mirrors viewgain's nested cross-validation (5 x 2 stratified outer folds, 3 inner folds, balanced accuracy for
tuning), its ridge imputer (alpha in [10, 1000] tuned by 3-fold MAE, cross-fitted imputations for training
subjects, final fit for test subjects), three feature sets x two classifiers, and 3 label permutations within
site (4 full runs). Only the timing is meant to be compared; see README.md for the differences.
"""
import argparse
import csv
import os
import resource
import sys
import time
import warnings

import numpy as np
from joblib import Parallel, delayed
from joblib.externals.loky import get_reusable_executor
from sklearn.ensemble import RandomForestClassifier
from sklearn.linear_model import Ridge
from sklearn.metrics import balanced_accuracy_score
from sklearn.model_selection import GridSearchCV, RepeatedStratifiedKFold, StratifiedKFold
from sklearn.pipeline import Pipeline
from sklearn.preprocessing import StandardScaler
from sklearn.svm import SVC

HERE = os.path.dirname(os.path.abspath(__file__))
DEFAULT_COHORT = os.path.normpath(os.path.join(HERE, "..", "work", "c160x35"))
SEED = 7
OUTER_FOLDS, OUTER_REPEATS, INNER_FOLDS = 5, 2, 3
ALPHAS = [10.0, 1000.0]
PERMUTATIONS = 3
GROUPS = ["control", "patient"]  # patient = positive = 1
FEATURE_SETS = ["source", "target", "source+imputed"]


def read_matrix(path):
    """Region x region CSV with a header row of region names and no row names."""
    m = np.loadtxt(path, delimiter=",", skiprows=1)
    if m.ndim != 2 or m.shape[0] != m.shape[1]:
        raise ValueError(f"{path}: not a square matrix {m.shape}")
    return m


def load(cohort):
    with open(os.path.join(cohort, "subjects.csv"), newline="") as f:
        rows = list(csv.DictReader(f))
    ids = [r["subject"] for r in rows]
    y = np.array([GROUPS.index(r["group"]) for r in rows])
    sites = np.array([r["site"] for r in rows])
    src, tgt, has_t = [], [], []
    iu = None
    for s in ids:
        m = read_matrix(os.path.join(cohort, "views", "thickness", f"{s}.csv"))
        if iu is None:
            iu = np.triu_indices(m.shape[0], k=1)
        src.append(m[iu])
        p = os.path.join(cohort, "views", "area", f"{s}.csv")
        if os.path.exists(p):
            tgt.append(read_matrix(p)[iu])
            has_t.append(True)
        else:
            tgt.append(np.full(len(iu[0]), np.nan))
            has_t.append(False)
    return ids, y, sites, np.array(src), np.array(tgt), np.array(has_t)


def strata(*cols):
    keys = ["|".join(str(c[i]) for c in cols) for i in range(len(cols[0]))]
    _, codes = np.unique(keys, return_inverse=True)
    return codes


def permute_within_site(y, sites, population, rng):
    """Shuffle labels among the population's subjects within each site; others keep their real label."""
    out = y.copy()
    for s in np.unique(sites):
        idx = np.where(population & (sites == s))[0]
        out[idx] = y[rng.permutation(idx)]
    return out


def impute(src, tgt, has_t, sites, train, test, seed):
    """Ridge source -> target on training subjects with a target: alpha by 3-fold MAE, cross-fitted training
    imputations at the chosen alpha, test imputations from the fit on all training subjects with a target."""
    folds = np.empty(len(train), dtype=int)
    skf = StratifiedKFold(INNER_FOLDS, shuffle=True, random_state=seed)
    for j, (_, held) in enumerate(skf.split(np.zeros(len(train)), strata(sites[train], has_t[train]))):
        folds[held] = j
    best = None
    for alpha in ALPHAS:
        pred = np.empty((len(train), src.shape[1]))
        err, cnt = 0.0, 0
        for j in range(INNER_FOLDS):
            fit_rows = train[(folds != j) & has_t[train]]
            held = folds == j
            model = Ridge(alpha=alpha).fit(src[fit_rows], tgt[fit_rows])
            pred[held] = model.predict(src[train[held]])
            obs = held & has_t[train]
            err += np.abs(pred[obs] - tgt[train[obs]]).sum()
            cnt += obs.sum() * src.shape[1]
        mae = err / cnt
        if best is None or mae < best[0]:
            best = (mae, alpha, pred)
    _, alpha, cross_fitted = best
    fit_rows = train[has_t[train]]
    final = Ridge(alpha=alpha).fit(src[fit_rows], tgt[fit_rows])
    imputed = np.full_like(src, np.nan)
    imputed[train] = cross_fitted
    imputed[test] = final.predict(src[test])
    return imputed, alpha


def classifiers(seed):
    forest = (Pipeline([("scale", StandardScaler()),
                        ("clf", RandomForestClassifier(n_estimators=200, random_state=seed, n_jobs=1))]),
              {"clf__max_features": ["sqrt", 0.1]})
    svm = (Pipeline([("scale", StandardScaler()), ("clf", SVC(kernel="rbf"))]),
           {"clf__C": [0.1, 1, 10], "clf__gamma": ["scale", 0.001]})
    return {"forest": forest, "svm": svm}


def unit(perm, repeat, fold, train_all, test_all, y_all, train_obs, test_obs, y_obs, data):
    """One (permutation, repeat, outer fold): imputer once, then the 6 pipelines."""
    src, tgt, has_t, sites = data
    seed = SEED * 1_000_003 + perm * 1000 + repeat * 10 + fold
    imputed, alpha = impute(src, tgt, has_t, sites, train_all, test_all, seed)
    out = []
    for fs in FEATURE_SETS:
        if fs == "source":
            X, y, tr, te = src, y_all, train_all, test_all
        elif fs == "target":
            X, y, tr, te = tgt, y_obs, train_obs[has_t[train_obs]], test_obs[has_t[test_obs]]
        else:
            X, y, tr, te = np.hstack([src, imputed]), y_all, train_all, test_all
        for name, (pipe, grid) in classifiers(seed).items():
            inner = StratifiedKFold(INNER_FOLDS, shuffle=True, random_state=seed)
            gs = GridSearchCV(pipe, grid, cv=inner, scoring="balanced_accuracy", n_jobs=1, refit=True)
            gs.fit(X[tr], y[tr])
            out.append((perm, repeat, fs, name, te, gs.predict(X[te]), alpha))
    return out


def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--cohort", default=DEFAULT_COHORT)
    ap.add_argument("--n-jobs", type=int, default=2)
    ap.add_argument("--permutations", type=int, default=PERMUTATIONS)
    args = ap.parse_args()

    t0, c0 = time.perf_counter(), time.process_time()
    ids, y, sites, src, tgt, has_t = load(args.cohort)
    print(f"cohort: {len(ids)} subjects, {src.shape[1]} edges/view, {has_t.sum()} with target", file=sys.stderr)
    rng = np.random.default_rng(SEED)
    everyone = np.ones(len(y), dtype=bool)

    tasks = []
    for perm in range(args.permutations + 1):
        if perm == 0:
            y_all, y_obs = y, y
        else:  # one permutation per population, as viewgain: everyone / subjects with an observed target
            y_all = permute_within_site(y, sites, everyone, rng)
            y_obs = permute_within_site(y, sites, has_t, rng)
        # outer folds stratified by group x target availability x site, re-drawn from each permutation's labels
        plan_all = list(RepeatedStratifiedKFold(n_splits=OUTER_FOLDS, n_repeats=OUTER_REPEATS, random_state=SEED + perm)
                        .split(src, strata(y_all, has_t, sites)))
        plan_obs = list(RepeatedStratifiedKFold(n_splits=OUTER_FOLDS, n_repeats=OUTER_REPEATS, random_state=SEED + perm)
                        .split(src, strata(y_obs, has_t, sites)))
        for k in range(OUTER_FOLDS * OUTER_REPEATS):
            r, f = divmod(k, OUTER_FOLDS)
            tasks.append((perm, r, f, *plan_all[k], y_all, *plan_obs[k], y_obs))

    data = (src, tgt, has_t, sites)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        results = Parallel(n_jobs=args.n_jobs)(delayed(unit)(*t, data) for t in tasks)
    get_reusable_executor().shutdown(wait=True)

    # pooled out-of-fold balanced accuracy per (permutation, feature set, classifier), averaged over repeats
    preds = {}
    for block in results:
        for perm, r, fs, name, te, p, _ in block:
            preds.setdefault((perm, fs, name, r), []).append((te, p))
    table = {}
    for (perm, fs, name, r), parts in preds.items():
        te = np.concatenate([a for a, _ in parts])
        p = np.concatenate([b for _, b in parts])
        table.setdefault((perm, fs, name), []).append((te, p))
    # true labels per permutation are the ones each unit was given; rebuild from tasks
    labels = {}
    for t in tasks:
        labels[(t[0], "all")], labels[(t[0], "obs")] = t[5], t[8]
    print("| feature set | classifier | balanced accuracy (observed) | permuted |")
    print("|---|---|---|---|")
    for fs in FEATURE_SETS:
        for name in ["forest", "svm"]:
            vals = []
            for perm in range(args.permutations + 1):
                yy = labels[(perm, "obs" if fs == "target" else "all")]
                vals.append(np.mean([balanced_accuracy_score(yy[te], p) for te, p in table[(perm, fs, name)]]))
            print(f"| {fs} | {name} | {vals[0]:.3f} | {', '.join(f'{v:.3f}' for v in vals[1:])} |")

    wall = time.perf_counter() - t0
    own = time.process_time() - c0
    ch = resource.getrusage(resource.RUSAGE_CHILDREN)
    print(f"wall {wall:.1f} s; cpu {own + ch.ru_utime + ch.ru_stime:.1f} s "
          f"(this process {own:.1f} s + reaped children {ch.ru_utime + ch.ru_stime:.1f} s); n_jobs={args.n_jobs}")


if __name__ == "__main__":
    main()
