//! Random circuits: the rewritten copy computes the same outputs (exhaustively for few inputs,
//! else on random vectors), differs in structure, and every gate feeds some output.

use super::oracle::parse;
use super::support::{bench_text, eval, ports, random_vectors};
use equicone::gen::{GenSpec, Kind, Style};
use std::collections::HashSet;

fn spec(style: Style, gates: usize, inputs: usize, seed: u64) -> GenSpec {
    let mut s = GenSpec::new(Kind::Random, style, gates).seed(seed);
    s.inputs = inputs;
    s
}

#[test]
fn rewritten_copy_is_equivalent_but_different() {
    for (gates, inputs, seed) in [(200, 10, 1), (300, 16, 2), (3000, 32, 3), (20000, 64, 4)] {
        let plain = spec(Style::Plain, gates, inputs, seed);
        let rewritten = spec(Style::Rewritten, gates, inputs, seed);
        let p = ports(&plain);
        let vectors = if inputs <= 10 {
            (0..1u64 << inputs)
                .map(|x| vec![(0..inputs).map(|b| (x >> b) & 1 == 1).collect()])
                .collect()
        } else {
            random_vectors(&p, 64 * 32, seed)
        };
        let (ta, tb) = (bench_text(&plain), bench_text(&rewritten));
        let (a, b) = (parse(&ta).evaluator(), parse(&tb).evaluator());
        assert_eq!(a.outputs, b.outputs, "same output names");
        assert!(
            b.gates() > a.gates(),
            "rewriting adds gates: {} vs {}",
            b.gates(),
            a.gates()
        );
        assert_eq!(
            eval(&a, &p, &vectors),
            eval(&b, &p, &vectors),
            "{gates} gates seed {seed}"
        );
        eprintln!(
            "random {gates} gates: plain {} / rewritten {} bench gates, {} outputs, agree on {} vectors",
            a.gates(),
            b.gates(),
            a.outputs.len(),
            vectors.len()
        );
        for text in [&ta, &tb] {
            every_gate_is_read(text);
        }
    }
}

/// Every gate output is an output or read by another gate.
fn every_gate_is_read(text: &str) {
    let mut read = HashSet::new();
    let mut defined = Vec::new();
    for line in text.lines().filter(|l| !l.starts_with('#')) {
        if let Some(x) = line.strip_prefix("OUTPUT(") {
            read.insert(x.trim_end_matches(')').to_string());
        } else if let Some((lhs, rhs)) = line.split_once(" = ") {
            defined.push(lhs.to_string());
            let args = &rhs[rhs.find('(').unwrap() + 1..rhs.len() - 1];
            read.extend(args.split(", ").map(str::to_string));
        }
    }
    for d in defined {
        assert!(read.contains(&d), "gate {d} feeds nothing");
    }
}

#[test]
fn same_seed_same_circuit_other_seed_other_circuit() {
    let a = bench_text(&spec(Style::Plain, 1000, 20, 7));
    assert_eq!(a, bench_text(&spec(Style::Plain, 1000, 20, 7)));
    assert_ne!(a, bench_text(&spec(Style::Plain, 1000, 20, 8)));
}
