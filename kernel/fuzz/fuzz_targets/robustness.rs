//! Fuzz target: the input bytes choose a public kernel function and give it
//! f32 bit patterns; the result must be a typed error or finite values in
//! the physical ranges of `vapora_host_tests::robustness` (the property the
//! proptests assert). Layout: byte 0 picks the function (among those that
//! read an input), then up to 12 bytes: a, b and the selector as
//! little-endian u32 (missing bytes are zero).

#![no_main]

use libfuzzer_sys::fuzz_target;
use vapora_host_tests::robustness::{check, input_shape, CHECKED_FUNCTIONS};

fn word(data: &[u8], i: usize) -> u32 {
    let mut bytes = [0u8; 4];
    for (k, b) in bytes.iter_mut().enumerate() {
        *b = data.get(1 + 4 * i + k).copied().unwrap_or(0);
    }
    u32::from_le_bytes(bytes)
}

fuzz_target!(|data: &[u8]| {
    // The integrity functions read no input: the tests call them once.
    let functions: Vec<&str> = CHECKED_FUNCTIONS
        .iter()
        .copied()
        .filter(|f| input_shape(f).a)
        .collect();
    let Some(&choice) = data.first() else {
        return;
    };
    let name = functions[usize::from(choice) % functions.len()];
    let (a, b, selector) = (
        f32::from_bits(word(data, 0)),
        f32::from_bits(word(data, 1)),
        word(data, 2),
    );
    if let Err(e) = check(name, a, b, selector) {
        panic!(
            "{name}(a = {a:e} [{:#010x}], b = {b:e} [{:#010x}], selector {selector}): {e}",
            a.to_bits(),
            b.to_bits()
        );
    }
});
