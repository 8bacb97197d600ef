#!/usr/bin/env bash
# Runs the steam-header monitor on one emulated core, installing what it
# needs first (scripts/cross-setup.sh).
#   scripts/run-firmware.sh [TARGET]   (default thumbv7em-none-eabihf, the Cortex-M4F)
# Other targets: thumbv6m-none-eabi (Cortex-M0), thumbv7m-none-eabi (Cortex-M3).
set -euo pipefail
cd "$(dirname "$0")/.."
target=${1:-thumbv7em-none-eabihf}
scripts/cross-setup.sh >&2
. scripts/firmware-common.sh
fw_cargo run --release --target "$target" --bin steam-header-monitor
