//! Writes the fuzz-corpus vector file (`firmware-example/vectors/fuzz-corpus.bin`)
//! from the committed corpus `kernel/fuzz/corpus/robustness/`, for the
//! firmware's corpus cost bench. Run from anywhere in the repository:
//! `cargo run -p vapora-host-tests --bin write-fuzz-vectors`.
use vapora_host_tests::fuzz_vectors::{
    corpus_inputs, generate, repository, CORPUS_DIR, VECTOR_FILE,
};

fn main() -> std::io::Result<()> {
    let root = repository();
    let corpus = root.join(CORPUS_DIR);
    let bytes = generate(&corpus)?;
    let path = root.join(VECTOR_FILE);
    std::fs::write(&path, &bytes)?;
    println!(
        "wrote {} ({} corpus inputs, {} bytes)",
        path.display(),
        corpus_inputs(&corpus)?.len(),
        bytes.len()
    );
    Ok(())
}
