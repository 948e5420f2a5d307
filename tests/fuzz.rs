//! A short fuzz run of every reader (bench, Verilog, `--expect`, cost model, `--assume`) in
//! the normal test suite: grammar-aware inputs and byte mutations from `tests/fuzzgen/`, each
//! checked for panics (on any thread), errors without a position, and runs far over a second.
//! The long campaigns (a million inputs per reader) are `scripts/fuzz`; figures in
//! docs/robustness.md.

mod fuzzgen;

use fuzzgen::{Outcome, Reader};
use std::time::Duration;

/// Inputs per reader here; `EQUICONE_FUZZ_EXECS` raises it.
fn execs() -> u64 {
    std::env::var("EQUICONE_FUZZ_EXECS")
        .ok()
        .and_then(|s| s.parse().ok())
        .unwrap_or(2000)
}

fn campaign(reader: Reader, seed: u64) {
    let ctx = fuzzgen::context_design();
    // Debug builds run the readers unoptimized: allow a generous time per input here (the
    // campaigns of scripts/fuzz hold each input to 1 s in an optimized build).
    let slow = Duration::from_secs(20);
    let (mut accepted, mut rejected) = (0, 0);
    let mut failures = Vec::new();
    for i in 0..execs() {
        let input = fuzzgen::input(reader, seed, i, &[]);
        match fuzzgen::run(reader, &input, &ctx, slow) {
            Ok(Outcome::Accepted) => accepted += 1,
            Ok(Outcome::Rejected) => rejected += 1,
            Err(f) => failures.push(format!("input {i}: {}", f.what)),
        }
    }
    assert!(
        failures.is_empty(),
        "{} seed {seed}: {} failures (replay with examples/fuzz_readers --reader {} --seed {seed} --only N):\n{}",
        reader.name(),
        failures.len(),
        reader.name(),
        failures.join("\n")
    );
    // The generators must reach past the first error: some inputs read, some rejected.
    assert!(
        accepted > 0 && rejected > 0,
        "{accepted} accepted, {rejected} rejected"
    );
}

#[test]
fn bench_reader_survives_fuzzing() {
    campaign(Reader::Bench, 11);
}

#[test]
fn verilog_reader_survives_fuzzing() {
    campaign(Reader::Verilog, 12);
}

#[test]
fn expect_reader_survives_fuzzing() {
    campaign(Reader::Expect, 13);
}

#[test]
fn cost_model_reader_survives_fuzzing() {
    campaign(Reader::Cost, 14);
}

#[test]
fn assumption_reader_survives_fuzzing() {
    campaign(Reader::Assume, 15);
}

/// The generator is a pure function of (seed, index): a failure is replayed from two numbers.
#[test]
fn inputs_are_reproducible() {
    for r in Reader::ALL {
        assert_eq!(fuzzgen::input(r, 5, 77, &[]), fuzzgen::input(r, 5, 77, &[]));
        assert_ne!(fuzzgen::input(r, 5, 77, &[]), fuzzgen::input(r, 5, 78, &[]));
    }
}
