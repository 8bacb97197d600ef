# Sourced by the firmware scripts (not run on its own): loads the env file
# that scripts/cross-setup.sh wrote and defines fw_cargo, which runs the
# chosen cargo on the firmware crate with its own target directory.
# Expects the current directory to be the repository root.

if [ ! -f target/cross-env.sh ]; then
  echo "target/cross-env.sh missing: run scripts/cross-setup.sh first" >&2
  exit 1
fi
# shellcheck source=/dev/null
. target/cross-env.sh
export VAPORA_QEMU

# Host-side settings must not leak into the thumb builds: RUSTFLAGS would
# replace the firmware's link flags (-Tlink.x), and a host CARGO_TARGET_DIR
# would mix the two builds.
# VAPORA_HOST_TARGET_DIR keeps the host one for host-side steps.
unset RUSTFLAGS CARGO_ENCODED_RUSTFLAGS CARGO_BUILD_TARGET
VAPORA_HOST_TARGET_DIR=${CARGO_TARGET_DIR:-$PWD/target}
export CARGO_TARGET_DIR=$VAPORA_FIRMWARE_TARGET_DIR

# fw_cargo SUBCOMMAND ARGS...: cargo in firmware-example/ (so its
# .cargo/config.toml, with the runners, applies), build-std flags when the
# Debian fallback is in use.
fw_cargo() {
  local sub=$1
  shift
  # shellcheck disable=SC2086 # VAPORA_CARGO_FLAGS is a list of flags
  (cd firmware-example && "$VAPORA_CARGO" "$sub" $VAPORA_CARGO_FLAGS --locked "$@")
}
