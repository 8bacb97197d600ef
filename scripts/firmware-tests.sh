#!/usr/bin/env bash
# Firmware checks on emulated Cortex-M boards (called by scripts/test-all.sh):
#   1. installs what is missing (scripts/cross-setup.sh),
#   2. checks the firmware's formatting and lints (when rustfmt and clippy
#      exist), builds the firmware for thumbv6m (M0), thumbv7m (M3), thumbv7em-eabihf (M4F),
#   3. runs the steam-header monitor on each core in QEMU (with a timeout);
#      it must exit with success and end with `end result=pass`,
#   4. checks that the three cores printed the same results, digit for digit,
#   5. checks that a deliberately failing build does fail (the harness can fail),
#   6. checks the printed steam figures against the f64 formulation
#      (host-tests/tests/firmware_output.rs),
#   7. runs the bit-identity test on each core: every vector of
#      firmware-example/vectors/kernel-bits.bin (the kernel's exact f32 bits
#      on the host) recomputed on the device; checks that the M4F images
#      contain no fused multiply-add, and that a flipped bit is caught,
#   8. builds the defmt-log binary (the kernel's types logged with defmt) on
#      each core, runs it and decodes its frames with defmt-print (installed
#      with cargo install if missing, about 2 minutes once); the three cores
#      must log the same text,
#   9. runs the cost measurement (target/cost/*.csv),
#  10. runs every fuzz-corpus input on the M4F and fails if one exceeds a
#      stated target, the documented limit of the saturated state at T,
#      the stack target or its sweep's worst case + margin
#      (scripts/measure-fuzz-cost.sh), and checks that this check can fail.
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
  fw_cargo clippy --release --target thumbv7em-none-eabihf --bins --lib --features defmt-log -- -D warnings
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

step "printed results against the f64 formulation (host test)"
(
  # Host build: the host target dir and compiler, not the firmware's.
  export CARGO_TARGET_DIR=$VAPORA_HOST_TARGET_DIR
  unset RUSTC RUSTC_BOOTSTRAP
  VAPORA_FIRMWARE_OUTPUT=$PWD/$out cargo test --workspace --all-features --test firmware_output -- --ignored --nocapture
)

for t in "${targets[@]}"; do
  step "bit identity with the host on $t"
  status=0
  VAPORA_QEMU_TIMEOUT=120 fw_cargo run --quiet --release --target "$t" --bin bit-identity \
    >"$out/$t-bit-identity.txt" || status=$?
  grep -v '^function ' "$out/$t-bit-identity.txt"
  if [ "$status" != 0 ] || ! grep -qx "end result=pass" "$out/$t-bit-identity.txt"; then
    echo "firmware: $t does not reproduce the host's bits (exit status $status); see $out/$t-bit-identity.txt" >&2
    exit 1
  fi
done

step "no fused multiply-add in the M4F images"
# vmla/vmls on the M4F round the product before adding (as separate
# instructions would); the fused vfma/vfms/vfnma/vfnms round once, which
# the host build does not do. Rust does not contract a*b+c by default;
# this checks that it stays so.
objdump=$(dirname "$VAPORA_NM")/llvm-objdump
if [ -x "$objdump" ]; then
  for bin in bit-identity steam-header-monitor; do
    fused=$("$objdump" -d "$VAPORA_FIRMWARE_TARGET_DIR/thumbv7em-none-eabihf/release/$bin" |
      grep -ciE $'\t(vfma|vfms|vfnma|vfnms)\.' || true)
    echo "$bin: $fused fused multiply-add instructions"
    [ "$fused" = 0 ] || exit 1
  done
else
  echo "skipped: no llvm-objdump beside $VAPORA_NM"
fi

step "a flipped bit fails the bit-identity test (harness check)"
status=0
VAPORA_QEMU_TIMEOUT=120 fw_cargo run --quiet --release --target "$check" --bin bit-identity \
  --features inject-check-failure >"$out/$check-bit-identity-must-fail.txt" || status=$?
if [ "$status" = 0 ] || ! grep -qx "end result=fail" "$out/$check-bit-identity-must-fail.txt"; then
  echo "firmware: the bit-identity test did not catch a flipped bit (status $status)" >&2
  exit 1
fi
grep '^diff ' "$out/$check-bit-identity-must-fail.txt"
echo "exit status $status, as it must be"

step "defmt log on every core, decoded on the host"
for t in "${targets[@]}"; do
  fw_cargo build --quiet --release --target "$t" --bin defmt-log --features defmt-log
done
# The host decoder, installed here rather than in cross-setup.sh so that
# the quick start (scripts/run-firmware.sh) does not wait for it. The 1.x
# decoder reads the frames of defmt 1.x.
defmt_print=$(command -v defmt-print || true)
[ -n "$defmt_print" ] || [ ! -x "$HOME/.cargo/bin/defmt-print" ] || defmt_print=$HOME/.cargo/bin/defmt-print
if [ -z "$defmt_print" ]; then
  echo "cargo install defmt-print --version '^1' --locked (about 2 minutes, once)"
  (
    # A host build: none of the firmware's cargo settings.
    unset CARGO_TARGET_DIR RUSTC RUSTC_BOOTSTRAP
    cd /tmp && timeout 900 cargo install defmt-print --version '^1' --locked --quiet
  )
  defmt_print=$(command -v defmt-print || echo "$HOME/.cargo/bin/defmt-print")
fi
VAPORA_DEFMT_PRINT=$defmt_print
"$VAPORA_DEFMT_PRINT" --version
for t in "${targets[@]}"; do
  status=0
  VAPORA_QEMU_TIMEOUT=60 fw_cargo run --quiet --release --target "$t" --bin defmt-log \
    --features defmt-log >"$out/$t-defmt.bin" || status=$?
  # Decoded lines only (no timestamps or locations), so cores compare.
  "$VAPORA_DEFMT_PRINT" --log-format '{L} {s}' -e "$VAPORA_FIRMWARE_TARGET_DIR/$t/release/defmt-log" \
    <"$out/$t-defmt.bin" >"$out/$t-defmt.txt" 2>"$out/$t-defmt.err" || true
  if [ "$status" != 0 ] || ! grep -q "end result=pass" "$out/$t-defmt.txt"; then
    cat "$out/$t-defmt.txt" "$out/$t-defmt.err"
    echo "firmware: defmt-log failed on $t (exit status $status)" >&2
    exit 1
  fi
done
cat "$out/${targets[0]}-defmt.txt"
for t in "${targets[@]:1}"; do
  grep -v 'begin firmware' "$out/${targets[0]}-defmt.txt" >"$out/defmt-reference.txt"
  if ! grep -v 'begin firmware' "$out/$t-defmt.txt" | diff -u "$out/defmt-reference.txt" -; then
    echo "firmware: $t logged different results from ${targets[0]}" >&2
    exit 1
  fi
done
echo "decoded and identical on ${targets[*]}"

step "cost measurement"
scripts/measure-cost.sh "${targets[@]}"

# The limits and the rule are in scripts/cost-table.py (the comment above DOCUMENTED_LIMITS): the
# stated M4F targets; saturated_state_at_temperature, which misses its 250
# target in the sweep (298), is held to 298 as its documented limit, not
# passed as meeting 250; stack <= 256 B; and no input above its sweep's
# worst case by more than max(16, 10 %).
step "fuzz corpus worst case on the Cortex-M4F"
scripts/measure-fuzz-cost.sh thumbv7em-none-eabihf

step "a corpus input over its limit fails (harness check)"
# The same run against a sweep whose saturated state at p took at most 100
# instructions: the corpus's 172 must fail the no-slow-path rule.
doctored=target/cost/doctored-sweep.csv
awk -F, -v OFS=, '$1 == "saturated_state_at_pressure" {$5 = 100} {print}' \
  target/cost/thumbv7em-none-eabihf.csv >"$doctored"
status=0
python3 scripts/cost-table.py corpus target/cost/thumbv7em-none-eabihf.corpus-stdout \
  target/cost/thumbv7em-none-eabihf.corpus-marks.log "$doctored" "$out/doctored-inputs.csv" \
  "$out/doctored-corpus.csv" >/dev/null 2>"$out/doctored.err" || status=$?
if [ "$status" = 0 ] || ! grep -q "saturated_state_at_pressure" "$out/doctored.err"; then
  echo "firmware: the corpus check passed against a doctored sweep (status $status)" >&2
  exit 1
fi
cat "$out/doctored.err"
echo "exit status $status, as it must be"

step "done"
