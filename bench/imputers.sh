#!/usr/bin/env bash
# Benchmark: fit + impute seconds of each built-in imputer on random data of 400 subjects (320 training, 80 new)
# x 4,950 source and 4,950 target features (100-region networks). Usage: bench/imputers.sh [ROUNDS]
# Prints CSV (method, fit_seconds, impute_seconds, total_seconds, rounds); figures depend on the machine and its load.
exec "$(dirname "${BASH_SOURCE[0]}")/test-main.sh" 3g org.viewgain.imputation.ImputerBenchmark "$@"
