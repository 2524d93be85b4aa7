# Writes the reference values of viewgain's calibration tests (CalibrationTest) with scikit-learn and statsmodels.
# Run from this folder: python3 generate.py
# Versions used: Python 3.11.7, numpy 2.4.6, scikit-learn 1.9.1, statsmodels 0.15.0, pandas 3.0.6.
# Inputs are the open data sets in ../reference/ (sources in ../reference/README.md). Outputs:
#   wdbc-probabilities.csv   held-out probabilities of a deliberately weak, over-regularised logistic model on WDBC
#   reference-values.csv     case,quantity,value: Brier score, calibration intercept and slope, reliability bins
#                            (cases: asah, wdbc, and clipped: a 10-row table with p of exactly 0 and 1 in both groups)
import numpy as np
import pandas as pd
import sklearn
import statsmodels
import statsmodels.api as sm
from sklearn.calibration import calibration_curve
from sklearn.linear_model import LogisticRegression
from sklearn.metrics import brier_score_loss
from sklearn.preprocessing import StandardScaler

EPS = 1e-6  # viewgain's Calibration.EPSILON: p is clipped to [EPS, 1 - EPS] before the logit
BINS = 10


def asah_case():
    """aSAH (Turck et al. 2010, via pROC 1.18.0): Poor outcome; a probability from the WFNS grade, p = (wfns - 0.5) / 5."""
    d = pd.read_csv("../reference/asah.csv")
    y = (d["outcome"] == "Poor").to_numpy().astype(int)
    p = (d["wfns"].to_numpy() - 0.5) / 5
    return y, p


def wdbc_case():
    """WDBC (Wolberg et al. 1995): malignant; logistic regression (C = 0.02, 3 standardised mean_* features) fitted on
    the file's first 100 rows, probabilities of the other 469 rows, which the test reads from wdbc-probabilities.csv."""
    d = pd.read_csv("../reference/breast-cancer-wisconsin.csv")
    y = (d["diagnosis"] == "malignant").to_numpy().astype(int)
    x = d[["mean_radius", "mean_texture", "mean_smoothness"]].to_numpy()
    train = np.arange(len(d)) < 100
    scaler = StandardScaler().fit(x[train])
    model = LogisticRegression(C=0.02, solver="lbfgs", tol=1e-12, max_iter=10000)
    model.fit(scaler.transform(x[train]), y[train])
    p = model.predict_proba(scaler.transform(x[~train]))[:, 1]
    pd.DataFrame({"id": d["id"][~train], "malignant": np.where(y[~train] == 1, "true", "false"),
                  "probability": [repr(float(v)) for v in p]}).to_csv("wdbc-probabilities.csv", index=False)
    return y[~train], p


def clipped_case():
    """A small table with probabilities of exactly 0 and 1 on both groups, so that clipping at EPS matters."""
    y = np.array([1, 0, 1, 0, 1, 0, 1, 0, 1, 0])
    p = np.array([1.0, 1.0, 0.9, 0.6, 0.7, 0.3, 0.2, 0.4, 0.0, 0.0])
    return y, p


def reference(case, y, p, rows):
    rows.append((case, "n", len(y)))
    rows.append((case, "brier", float(brier_score_loss(y, p))))
    logit = np.log(np.clip(p, EPS, 1 - EPS) / (1 - np.clip(p, EPS, 1 - EPS)))
    # calibration slope: logistic regression of y on logit(p), no penalty (C = inf, scikit-learn 1.9's spelling of
    # penalty=None), checked against statsmodels' IRLS (Cox 1958)
    sk = LogisticRegression(C=np.inf, solver="newton-cg", tol=1e-14, max_iter=10000)
    sk.fit(logit.reshape(-1, 1), y)
    glm = sm.GLM(y, sm.add_constant(logit), family=sm.families.Binomial()).fit(tol=1e-14, maxiter=1000)
    assert abs(sk.coef_[0][0] - glm.params[1]) < 1e-7, (sk.coef_, glm.params)
    rows.append((case, "slope", float(glm.params[1])))
    rows.append((case, "slope_sklearn", float(sk.coef_[0][0])))
    # calibration intercept: intercept-only logistic regression with logit(p) as offset (Van Calster et al. 2016)
    off = sm.GLM(y, np.ones((len(y), 1)), family=sm.families.Binomial(), offset=logit).fit(tol=1e-14, maxiter=1000)
    rows.append((case, "intercept", float(off.params[0])))
    # reliability: equal-width bins; calibration_curve returns the non-empty bins only
    true_rate, mean_pred = calibration_curve(y, p, n_bins=BINS, strategy="uniform")
    for k, (t, m) in enumerate(zip(true_rate, mean_pred)):
        rows.append((case, f"reliability_{k}_observed", float(t)))
        rows.append((case, f"reliability_{k}_predicted", float(m)))


def main():
    rows = []
    reference("asah", *asah_case(), rows)
    reference("wdbc", *wdbc_case(), rows)
    reference("clipped", *clipped_case(), rows)
    with open("reference-values.csv", "w") as f:
        f.write(f"# scikit-learn {sklearn.__version__}, statsmodels {statsmodels.__version__}, "
                f"numpy {np.__version__}; written by generate.py\n")
        f.write("case,quantity,value\n")
        for case, q, v in rows:
            f.write(f"{case},{q},{v!r}\n" if not isinstance(v, int) else f"{case},{q},{v}\n")


if __name__ == "__main__":
    main()
