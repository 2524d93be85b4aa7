#!/usr/bin/env bash
# Type-I error of the paired comparisons (corrected and Bayesian correlated t-tests, McNemar exact and mid-p,
# DeLong) on invented null cohorts (issue 14): the same forest under two seeds, and two logistic pipelines both at
# chance. Rejections at 0.05 beside the exact 99% interval. Settings in org.viewgain.engine.NullComparisonBench.
# Usage: bench/null-comparisons.sh [COHORTS [FIRST_SEED [FOLDS [REPEATS [SITES]]]]]
#        defaults 400 1 5 2 0   (SITES 0 alternates one and two sites)
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
exec "$here/test-main.sh" 3g org.viewgain.engine.NullComparisonBench "${1:-400}" "${2:-1}" "${3:-5}" "${4:-2}" \
    "${5:-0}"
