#!/usr/bin/env bash
# Coverage-guided fuzzing of every public kernel function (kernel/fuzz),
# each target for a bounded time, starting from the committed corpus in
# kernel/fuzz/corpus/<target>/. Prints the executions run and the corpus
# size per target; fails if a target finds an input that breaks the
# robustness property (the crash input is left in kernel/fuzz/artifacts/).
#
#   VAPORA_FUZZ_SECONDS   seconds per target (default 60)
#   VAPORA_FUZZ_TARGETS   targets to run (default: every target)
#
# cargo fuzz needs nightly compiler flags (sanitizers); RUSTC_BOOTSTRAP=1
# lets the stable toolchain accept them. Installs cargo-fuzz if missing.
# Called from .ci/run, not from scripts/test-all.sh (it takes minutes).
set -euo pipefail
cd "$(dirname "$0")/.."
seconds=${VAPORA_FUZZ_SECONDS:-60}

say() { printf 'fuzz: %s\n' "$*"; }

if ! cargo fuzz --version >/dev/null 2>&1; then
  say "cargo install cargo-fuzz --locked"
  cargo install cargo-fuzz --locked
fi

# Host settings that would fight the sanitizer flags stay out.
unset RUSTFLAGS CARGO_ENCODED_RUSTFLAGS CARGO_BUILD_TARGET
export RUSTC_BOOTSTRAP=1
export CARGO_TARGET_DIR=${VAPORA_FUZZ_TARGET_DIR:-$PWD/target/fuzz}

cd kernel/fuzz
# shellcheck disable=SC2207 # one target name per line
targets=(${VAPORA_FUZZ_TARGETS:-$(cargo fuzz list)})
jobs=$(nproc 2>/dev/null || echo 1)
mkdir -p "$CARGO_TARGET_DIR"
for t in "${targets[@]}"; do
  mkdir -p "corpus/$t"
  say "building $t"
  cargo fuzz build "$t" >"$CARGO_TARGET_DIR/$t-build.log" 2>&1 || {
    cat "$CARGO_TARGET_DIR/$t-build.log"
    exit 1
  }
  log=$CARGO_TARGET_DIR/$t-run.log
  say "running $t for $seconds s"
  start=$(date +%s)
  if ! cargo fuzz run "$t" "corpus/$t" -- -max_total_time="$seconds" -print_final_stats=1 >"$log" 2>&1; then
    tail -n 60 "$log"
    say "FAILED: $t found an input that breaks the property (see artifacts/$t/)"
    exit 1
  fi
  elapsed=$(($(date +%s) - start))
  runs=$(sed -n 's/^stat::number_of_executed_units: *//p' "$log" | tail -n1)
  rate=$(sed -n 's/^stat::average_exec_per_sec: *//p' "$log" | tail -n1)
  files=$(find "corpus/$t" -type f | wc -l)
  bytes=$(du -sb "corpus/$t" | cut -f1)
  say "$t: ${runs:-?} executions in $elapsed s (${rate:-?} per second, 1 of $jobs cores), 0 failures; corpus $files inputs, $bytes bytes"
done
