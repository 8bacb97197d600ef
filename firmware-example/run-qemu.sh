#!/bin/sh
# Runs a firmware ELF on an emulated board, with semihosting for its output
# and its exit status (the firmware's exit code becomes this script's).
#   run-qemu.sh MACHINE CPU ELF
# Used as the cargo runner (.cargo/config.toml) and by scripts/measure-cost.sh.
# Environment:
#   VAPORA_QEMU_TIMEOUT  seconds before the run is killed (default 120): a
#                        hung firmware must fail CI, not stall it.
#   VAPORA_QEMU_EXTRA    extra qemu arguments (the instruction-count plugin).
#   VAPORA_QEMU          the qemu-system-arm to use (default: from PATH).
set -eu
if [ $# -lt 3 ]; then
  echo "usage: $0 MACHINE CPU ELF" >&2
  exit 2
fi
machine=$1
cpu=$2
elf=$3
# shellcheck disable=SC2086 # VAPORA_QEMU_EXTRA is a list of arguments
exec timeout --foreground "${VAPORA_QEMU_TIMEOUT:-120}" "${VAPORA_QEMU:-qemu-system-arm}" \
  -machine "$machine" -cpu "$cpu" \
  -nographic -monitor none -serial null \
  -semihosting-config enable=on,target=native \
  ${VAPORA_QEMU_EXTRA:-} \
  -kernel "$elf"
