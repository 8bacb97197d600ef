#!/usr/bin/env bash
# Firmware checks on emulated Cortex-M boards (called by scripts/test-all.sh):
#   1. installs what is missing (scripts/cross-setup.sh),
#   2. checks the firmware's formatting and lints (when rustfmt and clippy
#      exist), builds the firmware for thumbv6m (M0), thumbv7m (M3), thumbv7em-eabihf (M4F),
#   3. runs the steam-header monitor on each core in QEMU (with a timeout);
#      it must exit with success and end with `end result=pass`,
#   4. checks that the three cores printed the same results, digit for digit,
#   5. checks that a deliberately failing build does fail (the harness can fail),
#   6. runs the cost measurement (target/cost/*.csv).
# Any failure stops the script with a non-zero status.
set -euo pipefail
cd "$(dirname "$0")/.."
start=$SECONDS
step() { printf '\n--- firmware: %s (%ss)\n' "$*" "$((SECONDS - start))"; }

step "setup"
scripts/cross-setup.sh
. scripts/firmware-common.sh
# shellcheck disable=SC2206 # VAPORA_TARGETS is a space-separated list
targets=($VAPORA_TARGETS)
out=target/firmware
mkdir -p "$out"

if [ "$VAPORA_CROSS_PATH" = rustup ] && cargo fmt --version >/dev/null 2>&1 &&
  cargo clippy --version >/dev/null 2>&1; then
  step "fmt and clippy (warnings denied)"
  (cd firmware-example && cargo fmt -- --check)
  fw_cargo clippy --release --target thumbv7em-none-eabihf --bins --lib -- -D warnings
else
  step "fmt and clippy skipped (not available with the $VAPORA_CROSS_PATH toolchain)"
fi

for t in "${targets[@]}"; do
  step "build $t"
  fw_cargo build --release --target "$t" --bins
done

for t in "${targets[@]}"; do
  step "run steam-header-monitor on $t"
  status=0
  VAPORA_QEMU_TIMEOUT=60 fw_cargo run --quiet --release --target "$t" --bin steam-header-monitor \
    >"$out/$t-monitor.txt" || status=$?
  cat "$out/$t-monitor.txt"
  if [ "$status" != 0 ] || ! grep -qx "end result=pass" "$out/$t-monitor.txt"; then
    echo "firmware: steam-header-monitor failed on $t (exit status $status)" >&2
    exit 1
  fi
done

step "same results on every core"
reference=${targets[0]}
grep -v '^begin ' "$out/$reference-monitor.txt" >"$out/$reference-results.txt"
for t in "${targets[@]:1}"; do
  grep -v '^begin ' "$out/$t-monitor.txt" >"$out/$t-results.txt"
  if ! diff -u "$out/$reference-results.txt" "$out/$t-results.txt"; then
    echo "firmware: $t printed different results from $reference" >&2
    exit 1
  fi
done
echo "identical on ${targets[*]}"

step "a failing firmware fails (harness check)"
check=${targets[${#targets[@]} - 1]}
status=0
VAPORA_QEMU_TIMEOUT=60 fw_cargo run --quiet --release --target "$check" --bin steam-header-monitor \
  --features inject-check-failure >"$out/$check-must-fail.txt" || status=$?
if [ "$status" = 0 ] || ! grep -qx "end result=fail" "$out/$check-must-fail.txt"; then
  echo "firmware: the build with an injected check failure did not fail (status $status)" >&2
  exit 1
fi
echo "exit status $status, as it must be"

step "cost measurement"
scripts/measure-cost.sh "${targets[@]}"

step "done"
