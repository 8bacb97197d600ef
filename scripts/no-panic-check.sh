#!/usr/bin/env bash
# Link-time proof that no public kernel function can panic, on Cortex-M0
# (thumbv6m-none-eabi) and Cortex-M4F (thumbv7em-none-eabihf), at every
# optimisation level a firmware is built with (1, 2, 3, "s", "z").
#
# tools/no-panic-check is a bare-metal image that calls every public kernel
# function on inputs read through volatile reads; its panic handler calls a
# function that exists nowhere, so it links only if no panic path survives.
# First a self-check: the same image with one deliberately fallible
# indexing (feature deliberate-panic) must FAIL to link, or the proof could
# not fail and would prove nothing.
#
# Installs the targets if missing: through scripts/cross-setup.sh when the
# repository has it, else `rustup target add` with a timeout.
set -euo pipefail
cd "$(dirname "$0")/.."
root=$PWD
targets=(thumbv7em-none-eabihf thumbv6m-none-eabi)
opt_levels=(${VAPORA_NO_PANIC_OPT_LEVELS:-3 s 2 1 z})

say() { printf 'no-panic-check: %s\n' "$*"; }

cargo_cmd=(cargo)
if [ -x scripts/cross-setup.sh ]; then
  scripts/cross-setup.sh
  # shellcheck source=/dev/null
  . target/cross-env.sh
  # shellcheck disable=SC2206 # VAPORA_CARGO_FLAGS is a list of flags
  cargo_cmd=("${VAPORA_CARGO:-cargo}" build ${VAPORA_CARGO_FLAGS:-})
else
  installed=$(rustup target list --installed 2>/dev/null || true)
  for t in "${targets[@]}"; do
    if ! grep -qx "$t" <<<"$installed"; then
      say "rustup target add $t (timeout 300 s)"
      timeout 300 rustup target add "$t"
    fi
  done
  cargo_cmd=(cargo build)
fi

# Host settings must not leak into the thumb builds.
unset RUSTFLAGS CARGO_ENCODED_RUSTFLAGS CARGO_BUILD_TARGET
export CARGO_TARGET_DIR=${VAPORA_NO_PANIC_TARGET_DIR:-$root/target/no-panic-check}
log=$CARGO_TARGET_DIR/last-link.log
mkdir -p "$CARGO_TARGET_DIR"

build() { # build TARGET OPT_LEVEL [cargo args...]
  local target=$1 opt=$2
  shift 2
  (cd tools/no-panic-check &&
    CARGO_PROFILE_RELEASE_OPT_LEVEL=$opt "${cargo_cmd[@]}" --locked --release --target "$target" "$@") \
    >"$log" 2>&1
}

for t in "${targets[@]}"; do
  if build "$t" 3 --features deliberate-panic; then
    say "SELF-CHECK FAILED on $t: a deliberately panicking call linked, so the proof cannot fail"
    exit 1
  fi
  if ! grep -q 'undefined symbol: vapora_kernel_panic_path_survived' "$log"; then
    say "self-check on $t failed for another reason than the panic path:"
    cat "$log"
    exit 1
  fi
  say "self-check $t: a deliberate out-of-bounds indexing fails to link, as it must"
done

passed=0
for t in "${targets[@]}"; do
  for opt in "${opt_levels[@]}"; do
    if build "$t" "$opt"; then
      say "$t opt-level $opt: links, no panic path reachable from any public kernel function"
      passed=$((passed + 1))
    else
      cat "$log"
      say "FAILED: $t opt-level $opt: a panic path survives (see the linker's message above)"
      exit 1
    fi
  done
done
say "$passed images linked without a panic path (${#targets[@]} targets × ${#opt_levels[@]} opt-levels)"
