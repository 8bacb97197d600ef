//! Writes the bit-identity vector file (`firmware-example/vectors/kernel-bits.bin`)
//! from the kernel as built on this machine. Run from anywhere in the repository:
//! `cargo run -p vapora-host-tests --bin write-kernel-vectors`.
use std::path::Path;

use vapora_host_tests::bit_vectors::{generate, vector_inputs, VECTOR_FILE};

fn main() -> std::io::Result<()> {
    let root = Path::new(env!("CARGO_MANIFEST_DIR")).join("..");
    let path = root.join(VECTOR_FILE);
    let bytes = generate();
    std::fs::write(&path, &bytes)?;
    println!(
        "wrote {} ({} vectors, {} bytes)",
        path.display(),
        vector_inputs().len(),
        bytes.len()
    );
    Ok(())
}
