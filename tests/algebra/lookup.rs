//! Multipliers rewritten into six-input lookup functions (`gen remap --k 6`): no adder cell or
//! XOR survives, so only the lookup units (each function found again in the AIG and rewritten
//! whole) prove them against `a * b`, and a planted bug gives a counterexample from the
//! remainder, re-simulated on both designs and checked against native integer products.

use super::{design, word};
use equicone::algebra::{BitVerdict, Limits, Prepared};
use equicone::engine::{prove, EngineKind, Method, ProveOptions, Verdict};
use equicone::front::load_texts;
use equicone::gen::remap::remap;
use equicone::gen::{Bug, GenSpec, Kind, Style};
use equicone::rng::SplitMix64;
use equicone::{Design, Format};
use std::sync::Arc;

/// `spec` generated, then rewritten into lookup functions of at most six inputs.
fn remapped(spec: &GenSpec) -> Design {
    let d = design(spec);
    let (c, stats) = remap(&d, 6, "remapped").expect("remaps");
    assert!(stats.luts > 0);
    load_texts(
        Format::Verilog,
        &[(Arc::from("remapped.v"), c.to_verilog())],
        None,
    )
    .expect("reads the remap")
}

/// The value of `port` (`bits` wide) of `d` under operands `a` and `b` (n bits each).
fn product_of(d: &Design, n: usize, a: u128, b: u128, bits: usize) -> u128 {
    let inputs: Vec<bool> = d
        .inputs
        .iter()
        .map(|bit| {
            let (name, i) = bit.name.split_once('[').expect("bus bit");
            let i: usize = i.trim_end_matches(']').parse().expect("index");
            assert!(i < n);
            match name {
                "a" => a >> i & 1 == 1,
                "b" => b >> i & 1 == 1,
                other => panic!("unexpected input {other}"),
            }
        })
        .collect();
    let out = d.eval(&inputs);
    (0..bits).fold(0u128, |v, i| {
        v | (out[d.output_index(&format!("p[{i}]")).expect("p bit")] as u128) << i
    })
}

fn limits() -> Limits {
    Limits {
        max_terms: 2_000_000,
        deadline: None,
    }
}

#[test]
fn remapped_multipliers_are_proved_against_a_times_b() {
    for (n, style) in [
        (8, Style::Dadda),
        (8, Style::Wallace),
        // Wallace from 12x12 up passed its budget while the lookup units were rewritten in
        // node order (16x16: 219,573 terms); by distance to the outputs it stays near 1,300.
        (12, Style::Wallace),
        (16, Style::Wallace),
        (12, Style::Booth),
        (12, Style::Array),
        (16, Style::Dadda),
    ] {
        let r = design(&GenSpec::new(Kind::Multiplier, Style::Spec, n));
        let c = remapped(&GenSpec::new(Kind::Multiplier, style, n));
        // The remap still multiplies: native 128-bit products on corner and random operands
        // (Rust integer arithmetic, outside the project).
        let mask = (1u128 << (2 * n)) - 1;
        let max = (1u128 << n) - 1;
        let mut rng = SplitMix64::new(n as u64, 0);
        let mut pairs = vec![(0, 0), (1, max), (max, max), (0x5555 & max, 0xAAAA & max)];
        pairs.extend((0..64).map(|_| (rng.next_u64() as u128 & max, rng.next_u64() as u128 & max)));
        for (a, b) in pairs {
            assert_eq!(
                product_of(&c, n, a, b, 2 * n),
                (a * b) & mask,
                "{n} {a} {b}"
            );
        }
        let (s, rl, cl) = word(&r, &c, "p");
        let p = Prepared::new(&s.aig, &rl, &cl);
        let w = p.check_by_sides(&limits());
        assert!(
            w.bits.iter().all(|b| *b == BitVerdict::Equal),
            "{n}x{n} {}: {:?} {:?}",
            style.name(),
            w.stats,
            w.bits
        );
        assert!(w.stats.lookup_units > 0, "{:?}", w.stats);
    }
}

#[test]
fn planted_bugs_in_remapped_multipliers_give_resimulated_counterexamples() {
    // 6x6: every verdict is also checked on all 4,096 operand pairs against native u128
    // products (outside the project): a bit called equal is p[i] of a * b everywhere, a bit
    // called different differs under its vector.
    let n = 6;
    for (style, bug, seed) in [
        (Style::Dadda, Bug::PpBit, 1),
        (Style::Dadda, Bug::SwapCarry, 2),
        (Style::Wallace, Bug::PpBit, 3),
        (Style::Array, Bug::Invert, 4),
    ] {
        let r = design(&GenSpec::new(Kind::Multiplier, Style::Spec, n));
        let c = remapped(&GenSpec::new(Kind::Multiplier, style, n).seed(seed).bug(bug));
        let (s, rl, cl) = word(&r, &c, "p");
        let w = Prepared::new(&s.aig, &rl, &cl).check_by_sides(&limits());
        assert!(w.stats.lookup_units > 0, "{:?}", w.stats);
        assert!(w.stats.remainder_terms > 0, "{:?}", w.stats);
        let mut wrong = 0u128;
        for a in 0..64u128 {
            for b in 0..64u128 {
                wrong |= product_of(&c, n, a, b, 12) ^ (a * b);
            }
        }
        let mut differ = 0;
        for (i, bit) in w.bits.iter().enumerate() {
            match bit {
                BitVerdict::Equal => assert_eq!(wrong >> i & 1, 0, "{bug:?}: bit {i} called equal"),
                BitVerdict::Differ(v) => {
                    differ += 1;
                    let rin: Vec<bool> = s.ref_input.iter().map(|&k| v[k]).collect();
                    let cin: Vec<bool> = s.cand_input.iter().map(|&k| v[k]).collect();
                    let name = format!("p[{i}]");
                    let (ro, co) = (
                        r.output_index(&name).expect("bit"),
                        c.output_index(&name).expect("bit"),
                    );
                    assert_ne!(r.eval(&rin)[ro], c.eval(&cin)[co], "{bug:?} {name}");
                }
                BitVerdict::Undecided(_) => {}
            }
        }
        assert!(differ > 0, "{bug:?}: no counterexample: {:?}", w.bits);
    }
}

#[test]
fn prove_with_the_algebra_engine_decides_remapped_multipliers() {
    let opts = ProveOptions {
        engine: EngineKind::Algebra,
        sim_words: Some(0),
        ..ProveOptions::default()
    };
    let r = design(&GenSpec::new(Kind::Multiplier, Style::Spec, 10));
    let good = remapped(&GenSpec::new(Kind::Multiplier, Style::Dadda, 10));
    let rep = prove(&r, &good, &opts).expect("prove runs");
    assert_eq!(rep.verdict, Verdict::Equivalent);
    assert!(rep
        .pairs
        .iter()
        .any(|p| p.verdict.method() == Some(Method::Algebra)));
    let groups = rep.stats.portfolio.as_ref().expect("figures");
    let alg = groups
        .iter()
        .find(|g| g.method.word() == "algebra")
        .expect("an algebra group");
    assert!(alg.note.contains("lookup units"), "{}", alg.note);
    // Simulation off: the counterexample comes from the remainder; `prove` re-simulates it on
    // both designs, and the reference's product is checked against u128 here.
    let bad = remapped(
        &GenSpec::new(Kind::Multiplier, Style::Dadda, 10)
            .seed(5)
            .bug(Bug::PpBit),
    );
    let rep = prove(&r, &bad, &opts).expect("prove runs");
    assert_eq!(rep.verdict, Verdict::Different);
    let cex = rep
        .counterexamples
        .iter()
        .find(|x| x.found_by == Method::Algebra)
        .expect("a counterexample from the algebra");
    let (a, b) = (super::operand(cex, "a", 10), super::operand(cex, "b", 10));
    assert_eq!(product_of(&r, 10, a, b, 20), a * b);
    assert_ne!(product_of(&bad, 10, a, b, 20), a * b);
}
