#!/usr/bin/env bash
# The whole test suite: formatting, lints, host tests, docs, and (when the
# firmware step is present) the Cortex-M builds and emulator runs.
# Installs what it needs; safe to run on a fresh machine with only Rust.
set -euo pipefail
cd "$(dirname "$0")/.."

step() { printf '\n=== %s\n' "$*"; }

step "toolchain components"
rustup component add rustfmt clippy >/dev/null 2>&1 || true

step "cargo fmt --check"
cargo fmt --all -- --check

step "cargo clippy (warnings denied)"
cargo clippy --workspace --all-targets --all-features -- -D warnings

step "cargo test (host)"
cargo test --workspace --all-features

step "rustdoc (warnings denied)"
RUSTDOCFLAGS="-D warnings" cargo doc --workspace --no-deps --all-features

step "no panic path in the kernel (link-time proof, Cortex-M0 and M4F)"
scripts/no-panic-check.sh

if [ -x scripts/firmware-tests.sh ]; then
  step "firmware on emulated Cortex-M boards"
  scripts/firmware-tests.sh
fi

echo
echo "all checks passed"
