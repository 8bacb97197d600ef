//! The committed bit-identity vector file must be what the current kernel
//! gives on the host: regenerate it in memory and compare byte for byte. If
//! this fails after a kernel change, rerun
//! `cargo run -p vapora-host-tests --bin write-kernel-vectors` and commit.
use std::path::Path;

use vapora_host_tests::bit_vectors::{generate, vector_inputs, VECTOR_FILE};

#[test]
fn vector_file_is_current() {
    let path = Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("..")
        .join(VECTOR_FILE);
    let committed = std::fs::read(&path).unwrap_or_else(|e| panic!("{}: {e}", path.display()));
    let fresh = generate();
    assert!(
        committed == fresh,
        "{} is stale ({} bytes committed, {} regenerated): run write-kernel-vectors",
        path.display(),
        committed.len(),
        fresh.len()
    );
}

#[test]
fn vectors_cover_every_call_with_errors_and_results() {
    use vapora_host_tests::bit_vectors::kernel_calls::CALLS;
    let inputs = vector_inputs();
    for (i, call) in CALLS.iter().enumerate() {
        let statuses: Vec<u32> = inputs
            .iter()
            .filter(|(f, _)| *f == i)
            .map(|(_, x)| (call.eval)(*x).words[0])
            .collect();
        assert!(
            statuses.len() >= 20,
            "{}: only {} vectors",
            call.name,
            statuses.len()
        );
        assert!(statuses.contains(&0), "{}: no vector succeeds", call.name);
        // Every call but the accuracy lookup and the table lookups (which
        // take any f32) has error inputs.
        if !call.name.starts_with("accuracy_") && !call.name.contains("CubicTable::locate") {
            assert!(
                statuses.iter().any(|&s| s != 0),
                "{}: no error vector",
                call.name
            );
        }
    }
    assert!(inputs.len() >= 2000, "only {} vectors", inputs.len());
}
