//! Wallace squarers with a Kogge-Stone final adder against `a * a`: proved by word polynomials
//! (the final rows of a Wallace squarer leave tree sums alone in their columns; the carry-chain
//! scan takes those positions as columns of one bit), checked against u128 squares, and planted
//! bugs found by the remainder and re-simulated.

use super::design;
use equicone::engine::{prove, EngineKind, Method, ProveOptions, Verdict};
use equicone::gen::{Bug, GenSpec, Kind, Style};
use equicone::Design;

fn wallace_kogge_stone(n: usize) -> GenSpec {
    GenSpec::new(Kind::Squarer, Style::Wallace, n).final_adder(Style::KoggeStone)
}

/// The output word `p` of `d` on operand value `a` (bit i of `a` drives `a[i]`).
fn square_of(d: &Design, n: usize, a: u128) -> u128 {
    let inputs: Vec<bool> = d
        .inputs
        .iter()
        .map(|i| {
            let k: usize = i
                .name
                .strip_prefix("a[")
                .and_then(|s| s.strip_suffix(']'))
                .and_then(|s| s.parse().ok())
                .expect("only a[i] inputs");
            a >> k & 1 == 1
        })
        .collect();
    let out = d.eval(&inputs);
    (0..2 * n).fold(0u128, |v, i| {
        v | (out[d.output_index(&format!("p[{i}]")).expect("p bit")] as u128) << i
    })
}

/// Corner operands (0, 1, all ones, alternating bits, the top bit alone) and a few from a
/// fixed linear congruential sequence.
fn operands(n: usize) -> Vec<u128> {
    let mask = (1u128 << n) - 1;
    let alt = (0..n).step_by(2).fold(0u128, |v, i| v | 1 << i);
    let mut v = vec![0, 1, mask, alt, mask ^ alt, 1 << (n - 1)];
    let mut x = 0x2545_f491_4f6c_dd1du128;
    for _ in 0..200 {
        x = x
            .wrapping_mul(6364136223846793005)
            .wrapping_add(1442695040888963407);
        v.push((x >> 64) & mask);
    }
    v
}

fn options(engine: EngineKind) -> ProveOptions {
    ProveOptions {
        engine,
        // Simulation off: the method itself decides, the counterexample comes from the remainder.
        sim_words: Some(0),
        ..ProveOptions::default()
    }
}

#[test]
fn wallace_squarers_with_a_prefix_final_adder_are_proved_by_algebra() {
    for n in [8, 16] {
        let r = design(&GenSpec::new(Kind::Squarer, Style::Spec, n));
        let c = design(&wallace_kogge_stone(n));
        // The candidate squares (u128 arithmetic, outside the engine).
        let mask = (1u128 << (2 * n)) - 1;
        for a in operands(n) {
            assert_eq!(square_of(&c, n, a), (a * a) & mask, "{n}x{n}: a = {a}");
        }
        let rep = prove(&r, &c, &options(EngineKind::Algebra)).expect("prove runs");
        assert_eq!(
            rep.verdict,
            Verdict::Equivalent,
            "{n}x{n}: {:?}",
            rep.stats.portfolio
        );
        assert!(
            rep.pairs.iter().all(|p| matches!(
                p.verdict.method(),
                Some(Method::Algebra | Method::Structure)
            )),
            "{n}x{n}: {:?}",
            rep.pairs
        );
    }
}

#[test]
fn planted_bugs_in_wallace_squarers_are_found_and_resimulated() {
    for (n, bug, seed) in [
        (8, Bug::PpBit, 1),
        (16, Bug::PpBit, 2),
        (16, Bug::SwapCarry, 3),
    ] {
        let r = design(&GenSpec::new(Kind::Squarer, Style::Spec, n));
        let c = design(&wallace_kogge_stone(n).seed(seed).bug(bug));
        let rep = prove(&r, &c, &options(EngineKind::Algebra)).expect("prove runs");
        assert_eq!(rep.verdict, Verdict::Different, "{n}x{n} {bug:?}");
        let cex = rep
            .counterexamples
            .iter()
            .find(|x| x.found_by == Method::Algebra)
            .expect("a counterexample from the remainder");
        // `prove` re-simulated it on both designs; here the operand is read back and both
        // designs are evaluated again: the reference gives the u128 square, the candidate not.
        let a = super::operand(cex, "a", n);
        let want = (a * a) & ((1u128 << (2 * n)) - 1);
        assert_eq!(
            square_of(&r, n, a),
            want,
            "{n}x{n} {bug:?}: the reference squares"
        );
        assert_ne!(
            square_of(&c, n, a),
            want,
            "{n}x{n} {bug:?}: the candidate differs"
        );
        for d in &cex.differing {
            assert_ne!(d.reference_value, d.candidate_value);
        }
    }
}
