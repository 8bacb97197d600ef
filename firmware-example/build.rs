//! Picks the board's memory map from the target being built, so one crate
//! serves every emulated core: cortex-m-rt's `link.x` includes `memory.x`
//! from the linker search path, which is this build's `OUT_DIR`.
use std::{env, fs, path::PathBuf};

fn main() {
    let target = env::var("TARGET").unwrap_or_default();
    // The board each target runs on in QEMU 7.2 (see README.md, "Boards").
    let board = match target.as_str() {
        "thumbv6m-none-eabi" => "microbit",
        "thumbv7m-none-eabi" => "mps2-an385",
        "thumbv7em-none-eabihf" | "thumbv7em-none-eabi" => "mps2-an386",
        other => panic!("no board for target {other:?}: add one under boards/ and here"),
    };
    let manifest =
        PathBuf::from(env::var("CARGO_MANIFEST_DIR").expect("cargo sets CARGO_MANIFEST_DIR"));
    let source = manifest.join("boards").join(board).join("memory.x");
    let out = PathBuf::from(env::var("OUT_DIR").expect("cargo sets OUT_DIR"));
    fs::copy(&source, out.join("memory.x")).expect("copy memory.x into OUT_DIR");
    println!("cargo:rustc-link-search={}", out.display());
    println!("cargo:rustc-env=VAPORA_BOARD={board}");
    // The micro:bit's 256 KiB hold the cost bench with under 1 KiB to
    // spare: benches leave out their optional rows there (see
    // `measured::LOOKUPS`).
    println!("cargo::rustc-check-cfg=cfg(vapora_small_flash)");
    if board == "microbit" {
        println!("cargo:rustc-cfg=vapora_small_flash");
    }
    // defmt's linker script, for the one binary that logs with defmt (other
    // binaries have no defmt symbols, and the script would fail their link).
    if env::var_os("CARGO_FEATURE_DEFMT_LOG").is_some() {
        println!("cargo:rustc-link-arg-bin=defmt-log=-Tdefmt.x");
    }
    println!("cargo:rerun-if-changed={}", source.display());
    println!("cargo:rerun-if-changed=build.rs");
}
