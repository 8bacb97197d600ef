//! The committed fuzz-corpus vector file must be a fresh conversion of the
//! committed corpus: convert it in memory and compare byte for byte. If
//! this fails after the corpus changed (a fuzzing run kept new inputs),
//! rerun `cargo run -p vapora-host-tests --bin write-fuzz-vectors` and
//! commit.
use vapora_host_tests::fuzz_vectors::{
    corpus_inputs, generate, repository, CORPUS_DIR, VECTOR_FILE,
};
use vapora_host_tests::robustness::fuzzed_functions;

#[test]
fn fuzz_vector_file_is_current() {
    let path = repository().join(VECTOR_FILE);
    let committed = std::fs::read(&path).unwrap_or_else(|e| panic!("{}: {e}", path.display()));
    let fresh = generate(&repository().join(CORPUS_DIR)).expect("reading the corpus");
    assert!(
        committed == fresh,
        "{} is stale ({} bytes committed, {} converted): run write-fuzz-vectors",
        path.display(),
        committed.len(),
        fresh.len()
    );
}

#[test]
fn every_nonempty_corpus_file_has_a_record() {
    let corpus = repository().join(CORPUS_DIR);
    let nonempty = std::fs::read_dir(&corpus)
        .unwrap()
        .filter(|e| e.as_ref().unwrap().metadata().unwrap().len() > 0)
        .count();
    let inputs = corpus_inputs(&corpus).unwrap();
    assert_eq!(inputs.len(), nonempty);
    // The corpus reaches the functions with a target on the M4F.
    for f in [
        "saturation_temperature",
        "saturated_state_at_pressure",
        "saturated_state_at_temperature",
        "phase_from_pressure_enthalpy",
    ] {
        assert!(
            inputs.iter().any(|(_, i)| i.function == f),
            "no corpus input calls {f}"
        );
    }
    assert!(inputs
        .iter()
        .all(|(_, i)| fuzzed_functions().get(i.index) == Some(&i.function)));
}
