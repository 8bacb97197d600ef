#!/usr/bin/env bash
# Installs what the Cortex-M builds and emulator runs need, and writes
# target/cross-env.sh for the other firmware scripts to source. Idempotent:
# on a machine that has everything it only checks and rewrites the env file.
#
#   1. Thumb targets: `rustup target add` (with a timeout); if rustup is
#      missing or cannot download, Debian's own Rust (rustc-web, cargo-web,
#      rust-web-src) with `-Zbuild-std=core` and lld-16 as the linker.
#      VAPORA_CROSS_PATH=debian forces the fallback (to test it).
#   2. qemu-system-arm (Debian package).
#   3. The instruction-count plugin, built with gcc from
#      tools/qemu-insn-count/markcount.c.
#   4. llvm-nm and llvm-size: rustup's llvm-tools, else Debian's llvm, else
#      binutils-arm-none-eabi.
set -euo pipefail
cd "$(dirname "$0")/.."
root=$PWD
targets=(thumbv6m-none-eabi thumbv7m-none-eabi thumbv7em-none-eabihf)
env_file=target/cross-env.sh
mkdir -p target

say() { printf 'cross-setup: %s\n' "$*"; }

apt_updated=0
apt_install() {
  if [ "$(id -u)" != 0 ]; then
    say "need root to apt-get install $*"
    return 1
  fi
  if [ "$apt_updated" = 0 ]; then
    apt-get update -qq
    apt_updated=1
  fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$@" >/dev/null
}

# --- 1. targets --------------------------------------------------------------
path=""
if [ "${VAPORA_CROSS_PATH:-}" != debian ] && command -v rustup >/dev/null 2>&1; then
  # Ask from the firmware folder, so a toolchain override there is honoured.
  installed=$(cd firmware-example && rustup target list --installed 2>/dev/null || true)
  missing=()
  for t in "${targets[@]}"; do
    grep -qx "$t" <<<"$installed" || missing+=("$t")
  done
  if [ ${#missing[@]} -eq 0 ]; then
    path=rustup
  else
    say "rustup target add ${missing[*]} (timeout 300 s)"
    if (cd firmware-example && timeout 300 rustup target add "${missing[@]}"); then
      path=rustup
    else
      say "rustup could not add the targets: falling back to Debian's Rust"
    fi
  fi
fi
if [ -z "$path" ]; then
  if [ ! -x /usr/bin/cargo ] || [ ! -x /usr/bin/rustc ] || ! command -v ld.lld-16 >/dev/null 2>&1 ||
    [ ! -d "$(/usr/bin/rustc --print sysroot 2>/dev/null)/lib/rustlib/src/rust/library/core" ]; then
    say "apt-get install rustc-web cargo-web rust-web-src rust-web-llvm lld-16"
    apt_install rustc-web cargo-web rust-web-src rust-web-llvm lld-16
  fi
  src="$(/usr/bin/rustc --print sysroot)/lib/rustlib/src/rust/library/core"
  if [ ! -d "$src" ]; then
    say "Debian's Rust has no library sources at $src: cannot build core"
    exit 1
  fi
  path=debian
fi

# --- 2. emulator -------------------------------------------------------------
if ! command -v qemu-system-arm >/dev/null 2>&1; then
  say "apt-get install qemu-system-arm"
  apt_install qemu-system-arm
fi
qemu=$(command -v qemu-system-arm)

# --- 3. instruction-count plugin ----------------------------------------------
plugin=$root/target/qemu-insn-count/libmarkcount.so
plugin_src=$root/tools/qemu-insn-count/markcount.c
if [ ! -f "$plugin" ] || [ "$plugin_src" -nt "$plugin" ]; then
  mkdir -p "$(dirname "$plugin")"
  gcc -O2 -shared -fPIC -fvisibility=hidden -o "$plugin" "$plugin_src"
fi

# --- 4. symbol and section tools ----------------------------------------------
nm="" size=""
if [ "$path" = rustup ]; then
  sysroot_bin() { echo "$(cd firmware-example && rustc --print sysroot)/lib/rustlib/$(rustc -vV | sed -n 's/^host: //p')/bin"; }
  if [ ! -x "$(sysroot_bin)/llvm-nm" ]; then
    (cd firmware-example && timeout 300 rustup component add llvm-tools >/dev/null 2>&1) ||
      say "rustup could not add llvm-tools: looking for Debian's"
  fi
  if [ -x "$(sysroot_bin)/llvm-nm" ] && [ -x "$(sysroot_bin)/llvm-size" ]; then
    nm="$(sysroot_bin)/llvm-nm"
    size="$(sysroot_bin)/llvm-size"
  fi
fi
if [ -z "$nm" ]; then
  if ! command -v llvm-nm >/dev/null 2>&1 || ! command -v llvm-size >/dev/null 2>&1; then
    say "apt-get install llvm"
    apt_install llvm || apt_install binutils-arm-none-eabi || true
  fi
  if command -v llvm-nm >/dev/null 2>&1 && command -v llvm-size >/dev/null 2>&1; then
    nm=$(command -v llvm-nm)
    size=$(command -v llvm-size)
  elif command -v arm-none-eabi-nm >/dev/null 2>&1; then
    nm=$(command -v arm-none-eabi-nm)
    size=$(command -v arm-none-eabi-size)
  else
    say "found no llvm-nm/llvm-size nor arm-none-eabi-nm/size"
    exit 1
  fi
fi

# --- env file --------------------------------------------------------------------
{
  echo "# Written by scripts/cross-setup.sh; sourced by the firmware scripts."
  echo "VAPORA_CROSS_PATH=$path"
  echo "VAPORA_QEMU=$qemu"
  echo "VAPORA_PLUGIN=$plugin"
  echo "VAPORA_NM=$nm"
  echo "VAPORA_SIZE=$size"
  echo "VAPORA_FIRMWARE_TARGET_DIR=$root/firmware-example/target"
  echo "VAPORA_TARGETS=\"${targets[*]}\""
  if [ "$path" = rustup ]; then
    echo "VAPORA_CARGO=cargo"
    echo "VAPORA_CARGO_FLAGS="
  else
    # Debian's cargo and rustc (rustup's come first on PATH), nightly
    # features on a stable compiler for build-std, and lld-16 because
    # Debian's /usr/bin/rust-lld is a dangling link.
    echo "VAPORA_CARGO=/usr/bin/cargo"
    echo "VAPORA_CARGO_FLAGS=-Zbuild-std=core"
    echo "export RUSTC=/usr/bin/rustc"
    echo "export RUSTC_BOOTSTRAP=1"
    for t in "${targets[@]}"; do
      echo "export CARGO_TARGET_$(tr 'a-z-' 'A-Z_' <<<"$t")_LINKER=ld.lld-16"
    done
  fi
} >"$env_file"

say "targets via $path; qemu $("$qemu" --version | head -n1 | sed 's/QEMU emulator version //')"
say "plugin $plugin; nm $nm"
say "wrote $env_file"
