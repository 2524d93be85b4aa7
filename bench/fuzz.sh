#!/usr/bin/env bash
# Fuzzing at scale, outside CI (issue 16): mutated inputs for every loader (spec, subjects table, text matrices, edge
# tables, .npy/.mat per subject, stacked arrays with their order and labels lists) and for 'viewgain check', with the
# mutations and clean-outcome rules of the jqwik fuzz tests. Prints inputs, loaded and broken per target, the time,
# and any input that escaped with another exception or an unclean message (saved under OUT_DIR/failures/).
# Usage: bench/fuzz.sh [INPUTS [SEED [OUT_DIR]]]   defaults 100000 2026 target/fuzz-bench; exit 1 if any broke.
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
exec "$here/test-main.sh" 1g org.viewgain.fuzz.FuzzBench "${1:-100000}" "${2:-2026}" "${3:-target/fuzz-bench}"
