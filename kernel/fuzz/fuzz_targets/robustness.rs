//! Fuzz target: the input bytes choose a public kernel function and give it
//! f32 bit patterns; the result must be a typed error or finite values in
//! the physical ranges of `vapora_host_tests::robustness` (the property the
//! proptests assert). Layout (decoded by
//! `vapora_host_tests::robustness::decode_fuzz_input`, which the corpus
//! converter for the firmware cost bench shares): byte 0 picks the function
//! (among those that read an input), then up to 12 bytes: a, b and the
//! selector as little-endian u32 (missing bytes are zero).

#![no_main]

use libfuzzer_sys::fuzz_target;
use vapora_host_tests::robustness::{check, decode_fuzz_input, fuzzed_functions};

fuzz_target!(|data: &[u8]| {
    // The integrity functions read no input: the tests call them once.
    let functions = fuzzed_functions();
    let Some(input) = decode_fuzz_input(&functions, data) else {
        return;
    };
    let (name, a, b, selector) = (input.function, input.a, input.b, input.selector);
    if let Err(e) = check(name, a, b, selector) {
        panic!(
            "{name}(a = {a:e} [{:#010x}], b = {b:e} [{:#010x}], selector {selector}): {e}",
            a.to_bits(),
            b.to_bits()
        );
    }
});
