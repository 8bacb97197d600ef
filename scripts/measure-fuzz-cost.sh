#!/usr/bin/env bash
# Worst-case instruction count over the fuzz corpus on the Cortex-M4F:
# every committed input of kernel/fuzz/corpus/robustness (converted to
# firmware-example/vectors/fuzz-corpus.bin by write-fuzz-vectors, with the
# fuzz target's decoding) runs through the kernel function it names in the
# fuzz-cost bench on the emulated core, instructions counted per call by
# the QEMU plugin (tools/qemu-insn-count), stack by painting.
#
#   scripts/measure-fuzz-cost.sh [TARGET]   (default: thumbv7em-none-eabihf)
#
# Writes target/cost/<target>-corpus-inputs.csv (one row per input) and
# target/cost/<target>-corpus.csv (worst case per function, the input that
# hit it, the sweep's worst case from target/cost/<target>.csv, the target).
# Fails (scripts/cost-table.py corpus) if a corpus input exceeds a stated
# target or documented limit, the 256-byte stack target, or the sweep's
# worst case by more than the margin stated there. Needs the sweep figures:
# runs scripts/measure-cost.sh for the target first if they are missing.
set -euo pipefail
cd "$(dirname "$0")/.."
[ -f target/cross-env.sh ] || scripts/cross-setup.sh
t=${1:-thumbv7em-none-eabihf}
[ -f "target/cost/$t.csv" ] || scripts/measure-cost.sh "$t"
. scripts/firmware-common.sh
mkdir -p target/cost

elf=$VAPORA_FIRMWARE_TARGET_DIR/$t/release/fuzz-cost
fw_cargo build --release --target "$t" --bin fuzz-cost
mark=$("$VAPORA_NM" "$elf" | awk '/ bench_mark$/ {print $1}')
if [ -z "$mark" ]; then
  echo "measure-fuzz-cost: no bench_mark symbol in $elf" >&2
  exit 1
fi
log=target/cost/$t.corpus-marks.log
out=target/cost/$t.corpus-stdout
rm -f "$log"
VAPORA_QEMU_EXTRA="-plugin $VAPORA_PLUGIN,mark=0x$mark -d plugin -D $PWD/$log" \
  VAPORA_QEMU_TIMEOUT=300 fw_cargo run --quiet --release --target "$t" --bin fuzz-cost >"$out"
grep -qx "end result=pass" "$out" || {
  echo "measure-fuzz-cost: the corpus bench on $t did not end with result=pass" >&2
  cat "$out" >&2
  exit 1
}
echo "== $t: fuzz corpus, worst case per function (instructions per call, not cycles)"
python3 scripts/cost-table.py corpus "$out" "$log" "target/cost/$t.csv" \
  "target/cost/$t-corpus-inputs.csv" "target/cost/$t-corpus.csv"
