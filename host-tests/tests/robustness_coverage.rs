//! Fails when a public kernel function has no robustness check: the public
//! functions are read from kernel/src (a small parse: `pub fn` and
//! `pub const fn` at the top level of a module, or inside an inherent
//! `impl Type` block, as `Type::name`), and each must be
//! - listed in `robustness::CHECKED_FUNCTIONS`, which the property tests
//!   and the fuzz target sweep (an unlisted name makes `check` fail);
//! - called, by name, in the shared checker (host-tests/src/robustness.rs)
//!   and in the no-panic image (tools/no-panic-check/src/main.rs);
//! - reached by the fuzz target, which picks from `CHECKED_FUNCTIONS` every
//!   function that reads an input (checked below that it still does).
//!
//! A listed name that is no longer public in the kernel fails too.

use std::collections::BTreeSet;
use std::fs;
use std::path::{Path, PathBuf};

use vapora_host_tests::robustness::{check, input_shape, CHECKED_FUNCTIONS};

fn repository() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("..")
}

fn rust_files(dir: &Path, out: &mut Vec<PathBuf>) {
    for entry in fs::read_dir(dir).unwrap() {
        let path = entry.unwrap().path();
        if path.is_dir() {
            rust_files(&path, out);
        } else if path.extension().is_some_and(|e| e == "rs") {
            out.push(path);
        }
    }
}

/// The name after `pub fn ` or `pub const fn ` on this line, if any.
fn public_fn_name(line: &str) -> Option<String> {
    let rest = line
        .trim_start()
        .strip_prefix("pub fn ")
        .or_else(|| line.trim_start().strip_prefix("pub const fn "))?;
    let name: String = rest
        .chars()
        .take_while(|c| c.is_alphanumeric() || *c == '_')
        .collect();
    (!name.is_empty()).then_some(name)
}

/// The type of an inherent `impl` block opened on this line (None for a
/// trait impl, whose methods are not `pub fn`).
fn inherent_impl_type(line: &str) -> Option<String> {
    let rest = line.strip_prefix("impl")?;
    if line.contains(" for ") {
        return None;
    }
    // Skip generic parameters: `impl<const P: usize> Name<P> {`.
    let rest = if rest.starts_with('<') {
        let mut depth = 0;
        let mut end = 0;
        for (i, c) in rest.char_indices() {
            match c {
                '<' => depth += 1,
                '>' => {
                    depth -= 1;
                    if depth == 0 {
                        end = i + 1;
                        break;
                    }
                }
                _ => {}
            }
        }
        &rest[end..]
    } else {
        rest
    };
    let name: String = rest
        .trim_start()
        .chars()
        .take_while(|c| c.is_alphanumeric() || *c == '_')
        .collect();
    (!name.is_empty()).then_some(name)
}

fn kernel_public_functions() -> BTreeSet<String> {
    let mut files = Vec::new();
    rust_files(&repository().join("kernel/src"), &mut files);
    let mut names = BTreeSet::new();
    for file in files {
        let text = fs::read_to_string(&file).unwrap();
        let mut current_impl: Option<String> = None;
        for line in text.lines() {
            if let Some(t) = inherent_impl_type(line) {
                current_impl = Some(t);
                continue;
            }
            if line.starts_with("impl") {
                current_impl = None;
                continue;
            }
            if line.starts_with('}') {
                current_impl = None;
                continue;
            }
            let top_level = !line.starts_with(' ');
            let in_impl = line.starts_with("    ") && !line.starts_with("     ");
            if let Some(name) = public_fn_name(line) {
                match (&current_impl, top_level, in_impl) {
                    (None, true, _) => {
                        names.insert(name);
                    }
                    (Some(t), _, true) => {
                        names.insert(format!("{t}::{name}"));
                    }
                    _ => {}
                }
            }
        }
    }
    names
}

#[test]
fn the_parse_finds_the_functions_it_must() {
    // Guards the parser itself: a few public functions that certainly exist.
    let found = kernel_public_functions();
    for name in [
        "saturation_temperature",
        "AbsolutePressure::from_pa",
        "UniformCubicTable::locate",
        "Phase::dryness_fraction",
        "self_test",
    ] {
        assert!(found.contains(name), "parse missed {name}; found {found:?}");
    }
    assert!(
        !found.iter().any(|n| n.contains("interval_at_pressure")),
        "pub(crate) counted"
    );
}

#[test]
fn every_public_kernel_function_has_a_robustness_check() {
    let public = kernel_public_functions();
    let checked: BTreeSet<String> = CHECKED_FUNCTIONS.iter().map(|s| s.to_string()).collect();
    let missing: Vec<_> = public.difference(&checked).collect();
    let stale: Vec<_> = checked.difference(&public).collect();
    assert!(
        missing.is_empty(),
        "public kernel functions without a robustness check (add them to \
         robustness::CHECKED_FUNCTIONS, robustness::check and the no-panic image): {missing:?}"
    );
    assert!(
        stale.is_empty(),
        "checked but no longer public in the kernel: {stale:?}"
    );
    println!("{} public kernel functions, all checked", public.len());
}

#[test]
fn every_checked_function_is_called_by_the_checker_and_the_no_panic_image() {
    let checker = fs::read_to_string(repository().join("host-tests/src/robustness.rs")).unwrap();
    let image = fs::read_to_string(repository().join("tools/no-panic-check/src/main.rs")).unwrap();
    for name in CHECKED_FUNCTIONS {
        let method = name.rsplit("::").next().unwrap();
        let call = format!("{method}(");
        let by_reference = format!("{method},"); // passed as a function value
        for (what, text) in [
            ("host-tests/src/robustness.rs", &checker),
            ("the no-panic image", &image),
        ] {
            assert!(
                text.contains(&call)
                    || text.contains(&format!("::{by_reference}"))
                    || text.contains(&format!("::{method})")),
                "{what} never calls {name}"
            );
        }
        // And the checker knows the name (an unknown name is an error).
        let shape = input_shape(name);
        let known = (0..shape.selectors).all(|s| {
            check(name, 1.0, 1.0, s)
                .map_or_else(|e| !e.starts_with("unknown kernel function"), |()| true)
        });
        assert!(known, "robustness::check does not know {name}");
    }
}

#[test]
fn the_fuzz_target_sweeps_the_checked_functions() {
    let target =
        fs::read_to_string(repository().join("kernel/fuzz/fuzz_targets/robustness.rs")).unwrap();
    assert!(
        target.contains("decode_fuzz_input(&functions, data)")
            && target.contains("fuzzed_functions()")
            && target.contains("check(name, a, b, selector)"),
        "the fuzz target no longer picks from robustness::fuzzed_functions (CHECKED_FUNCTIONS \
         that read an input) through decode_fuzz_input and check()"
    );
}
