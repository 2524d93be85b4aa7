#!/usr/bin/env bash
# Calibration of the permutation test on invented null cohorts (issue 11): the observed statistic against the mean of
# the permuted ones, the mean p-value and the rejection rate at alpha = 0.05 beside its 99% binomial band, for the
# source, source+imputed and target pipelines. Settings in org.viewgain.engine.NullCalibrationBench.
# Usage: bench/null-calibration.sh [COHORTS [FIRST_SEED [PERMUTATIONS [SITES [EXTRA_MISSING_IN_PATIENTS [tuned
#        [svm-forest]]]]]]]
#        defaults 600 1 19 0 0 fixed   (SITES 0 alternates one and two sites; about 7 minutes on 2 cores; 'tuned'
#        tunes the logistic regression over lambda, exercising inner folds and nested imputations; 'svm-forest' as the
#        seventh argument replaces it by svm-linear tuned over C and random-forest)
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
exec "$here/test-main.sh" 4g org.viewgain.engine.NullCalibrationBench "${1:-600}" "${2:-1}" "${3:-19}" "${4:-0}" \
    "${5:-0}" "${6:-fixed}" "${7:-logistic}"
