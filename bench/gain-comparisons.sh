#!/usr/bin/env bash
# Power of the paired comparisons on invented cohorts with a planted truth (issue 14): logistic regression on
# source+target (a group shift in three target features) against source (at chance). Rejections at 0.05 beside the
# exact 99% interval, and the mean gain. Settings in org.viewgain.engine.GainComparisonBench.
# Usage: bench/gain-comparisons.sh [COHORTS [EFFECT [FOLDS [REPEATS [FIRST_SEED]]]]]   defaults 200 0.8 5 2 1
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
exec "$here/test-main.sh" 3g org.viewgain.engine.GainComparisonBench "${1:-200}" "${2:-0.8}" "${3:-5}" "${4:-2}" \
    "${5:-1}"
