#!/usr/bin/env bash
# Benchmark: seconds of the near-duplicate scan on random rows. Usage: bench/duplicates.sh [SUBJECTS [FEATURES [ROUNDS]]]
# (default 2000 x 35778, 1 round). Prints CSV (subjects, features, seconds, pairs_found); depends on machine and load.
exec "$(dirname "${BASH_SOURCE[0]}")/test-main.sh" 4g org.viewgain.engine.DuplicatesBenchmark "$@"
