#!/usr/bin/env bash
# Measures the cost of every function in firmware-example/src/measured.rs on
# each emulated core: instructions per call (exact counts from the QEMU
# plugin in tools/qemu-insn-count), stack depth per call (stack painting on
# the target), and the flash and static RAM of the linked image.
#
#   scripts/measure-cost.sh [TARGET...]     (default: all three cores)
#
# Writes target/cost/<target>.csv
#   function,calls,min_insns,median_insns,max_insns,stack_bytes
# target/cost/<target>-size.csv
#   component,code_bytes,table_bytes,static_ram_bytes
# whose `kernel` row is the difference between the bench built without the
# separately measured table look-ups (feature without-lookups: a user's
# image has them only inside the kernel's calls) and the same bench built
# without the kernel's functions (feature without-kernel), and
# `baseline` row the same for the f64 formulation (feature without-baseline);
# and target/cost/<target>-ratio.csv, the f64 formulation's cost over the
# kernel's per function (median and worst case over the same inputs).
# Instruction counts are not cycles: see firmware-example/README.md.
set -euo pipefail
cd "$(dirname "$0")/.."
[ -f target/cross-env.sh ] || scripts/cross-setup.sh
. scripts/firmware-common.sh

# shellcheck disable=SC2206 # VAPORA_TARGETS is a space-separated list
targets=("$@")
[ ${#targets[@]} -gt 0 ] || targets=($VAPORA_TARGETS)
mkdir -p target/cost

for t in "${targets[@]}"; do
  elf=$VAPORA_FIRMWARE_TARGET_DIR/$t/release/cost
  # The same bench without the kernel's functions, and without the f64
  # baseline, for the size differences (built first: all builds write the
  # same ELF path).
  fw_cargo build --release --target "$t" --bin cost --features without-kernel
  "$VAPORA_SIZE" -A "$elf" >"target/cost/$t.size-without-kernel.txt"
  fw_cargo build --release --target "$t" --bin cost --features without-lookups
  "$VAPORA_SIZE" -A "$elf" >"target/cost/$t.size-without-lookups.txt"
  fw_cargo build --release --target "$t" --bin cost --features without-baseline
  "$VAPORA_SIZE" -A "$elf" >"target/cost/$t.size-without-baseline.txt"
  fw_cargo build --release --target "$t" --bin cost
  mark=$("$VAPORA_NM" "$elf" | awk '/ bench_mark$/ {print $1}')
  if [ -z "$mark" ]; then
    echo "measure-cost: no bench_mark symbol in $elf" >&2
    exit 1
  fi
  log=target/cost/$t.marks.log
  out=target/cost/$t.stdout
  rm -f "$log"
  VAPORA_QEMU_EXTRA="-plugin $VAPORA_PLUGIN,mark=0x$mark -d plugin -D $PWD/$log" \
    VAPORA_QEMU_TIMEOUT=300 fw_cargo run --quiet --release --target "$t" --bin cost >"$out"
  grep -qx "end result=pass" "$out" || {
    echo "measure-cost: the bench on $t did not end with result=pass" >&2
    cat "$out" >&2
    exit 1
  }
  python3 scripts/cost-table.py insns "$out" "$log" "target/cost/$t.csv"
  "$VAPORA_NM" -S -C --defined-only "$elf" >"target/cost/$t.nm.txt"
  "$VAPORA_SIZE" -A "$elf" >"target/cost/$t.size.txt"
  python3 scripts/cost-table.py size "target/cost/$t.nm.txt" "target/cost/$t.size.txt" \
    "target/cost/$t.size-without-kernel.txt" "target/cost/$t.size-without-lookups.txt" \
    "target/cost/$t.size-without-baseline.txt" \
    "target/cost/$t-size.csv"
  python3 scripts/cost-table.py ratio "target/cost/$t.csv" "target/cost/$t-ratio.csv"
  echo "== $t (instructions per call, not cycles)"
  column -t -s, "target/cost/$t.csv" 2>/dev/null || cat "target/cost/$t.csv"
  echo "-- $t flash and static RAM (bytes)"
  grep -v '^wrapper:' "target/cost/$t-size.csv" | { column -t -s, 2>/dev/null || cat; }
  echo "-- $t f64 formulation over kernel (instructions; detail rows in $t-size.csv)"
  column -t -s, "target/cost/$t-ratio.csv" 2>/dev/null || cat "target/cost/$t-ratio.csv"
done
