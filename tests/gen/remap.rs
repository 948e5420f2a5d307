//! `gen remap`: lookup-function rewrites of the ISCAS-85 circuits (the shared benchmark data)
//! proved equivalent to the originals by batsat on a miter written from the gate lines
//! (`tests/oracle/`), generated circuits compared on every input vector by the oracle's own
//! exhaustive simulator, and the share of internal nodes the rewrite keeps.

use super::oracle;
use equicone::aig::{Aig, Lit};
use equicone::design::{Design, Format};
use equicone::gen::{generate, remap::remap, GenFormat, GenSpec, Kind, Style};
use std::sync::Arc;

fn read(name: &str, text: &str) -> Design {
    equicone::front::load_texts(Format::Bench, &[(Arc::from(name), text.to_string())], None)
        .unwrap_or_else(|e| panic!("{name}: {e}"))
}

fn remapped(d: &Design, k: usize) -> String {
    let (c, stats) = remap(d, k, "remapped").unwrap_or_else(|e| panic!("{}: {e}", d.name));
    assert!(stats.luts > 0 || d.aig.num_ands() == 0);
    equicone::gen::remap::to_bench(&c)
}

/// AND nodes of `b`'s output cones that structural hashing finds among `a`'s, as a fraction of
/// `b`'s AND nodes (inputs matched by name).
fn shared_fraction(a: &Design, b: &Design) -> f64 {
    let mut g = Aig::new();
    let ins: Vec<Lit> = (0..a.aig.num_inputs()).map(|_| g.add_input()).collect();
    let ra: Vec<Lit> = a.outputs.iter().map(|o| o.lit).collect();
    g.import(&a.aig, &ins, &ra);
    let before = g.len();
    let map: Vec<Lit> = b
        .inputs
        .iter()
        .map(|bit| ins[a.input_index(&bit.name).expect("same inputs")])
        .collect();
    let rb: Vec<Lit> = b.outputs.iter().map(|o| o.lit).collect();
    g.import(&b.aig, &map, &rb);
    let added = g.len() - before;
    1.0 - added as f64 / b.aig.num_ands().max(1) as f64
}

#[test]
fn remapped_iscas85_circuits_are_equivalent_to_the_originals() {
    let Some(dir) = oracle::iscas_dir() else {
        return;
    };
    for (name, ks) in [
        ("c17", &[2usize, 4, 6][..]),
        ("c432", &[4, 6]),
        ("c499", &[6]),
        ("c880", &[3, 6]),
        ("c1355", &[6]),
        ("c1908", &[6]),
    ] {
        let text = std::fs::read_to_string(dir.join(format!("{name}.bench"))).unwrap();
        let d = read(name, &text);
        for &k in ks {
            let r = remapped(&d, k);
            let (a, b) = (oracle::parse(&text), oracle::parse(&r));
            assert_eq!(a.outputs.len(), b.outputs.len(), "{name} k={k}");
            assert!(
                oracle::batsat_differs(&a, &b).is_none(),
                "{name} remapped with k={k} differs from the original (batsat)"
            );
            let rd = read("remap", &r);
            let shared = shared_fraction(&d, &rd);
            eprintln!(
                "{name} k={k}: {} ANDs -> {} ANDs, {:.0}% of them shared with the original",
                d.aig.num_ands(),
                rd.aig.num_ands(),
                100.0 * shared
            );
            if k == 6 && d.aig.num_ands() > 100 {
                assert!(
                    shared < 0.5,
                    "{name}: {:.2} of the nodes are shared",
                    shared
                );
            }
        }
    }
}

#[test]
fn remapped_c499_is_equivalent_to_c1355() {
    // SOURCE.md of the shared data (published fact): c499 and c1355 compute the same function.
    let Some(dir) = oracle::iscas_dir() else {
        return;
    };
    let c499 = std::fs::read_to_string(dir.join("c499.bench")).unwrap();
    let c1355 = std::fs::read_to_string(dir.join("c1355.bench")).unwrap();
    let r = remapped(&read("c499", &c499), 5);
    assert!(oracle::batsat_differs(&oracle::parse(&r), &oracle::parse(&c1355)).is_none());
}

#[test]
fn remapped_generated_circuits_agree_on_every_vector() {
    for spec in [
        GenSpec::new(Kind::Multiplier, Style::Array, 6),
        GenSpec::new(Kind::Adder, Style::KoggeStone, 7),
        GenSpec::new(Kind::Majority, Style::Sorting, 13),
        GenSpec::new(Kind::Divider, Style::NonRestoring, 6),
        GenSpec::new(Kind::Arbiter, Style::KoggeStone, 6),
        GenSpec::new(Kind::Comparator, Style::Tree, 6),
    ] {
        let text = generate(&spec, GenFormat::Bench).unwrap().text;
        let d = read("gen", &text);
        for k in [3, 6] {
            let r = remapped(&d, k);
            let diffs = oracle::sim::exhaustive_diff(&oracle::parse(&text), &oracle::parse(&r));
            assert!(
                diffs.iter().all(|x| x.is_none()),
                "{} remapped with k={k}: {diffs:?}",
                spec.command_line(GenFormat::Bench)
            );
        }
    }
}

#[test]
fn remap_refuses_bad_requests() {
    let d = read("t", "INPUT(a)\nINPUT(b)\nOUTPUT(y)\ny = AND(a, b)\n");
    let e = remap(&d, 7, "m").unwrap_err();
    assert!(e.help.contains("between 2 and 6"), "{e}");
    let e = generate(
        &GenSpec::new(Kind::Remap, Style::Plain, 4),
        GenFormat::Bench,
    )
    .unwrap_err();
    assert!(e.help.contains("gen remap DESIGN"), "{e}");
    // Names that are not Verilog identifiers can only be written as bench.
    let d = read("t", "INPUT(1a)\nINPUT(b)\nOUTPUT(y)\ny = AND(1a, b)\n");
    let (c, _) = remap(&d, 6, "m").unwrap();
    assert!(equicone::gen::remap::verilog_names_ok(&c).is_err());
    assert!(c.to_bench().contains("INPUT(1a)"));
    // An output that is also an input stays one signal in bench.
    let d = read(
        "t",
        "INPUT(a)\nINPUT(b)\nOUTPUT(a)\nOUTPUT(y)\ny = AND(a, b)\n",
    );
    let (c, _) = remap(&d, 6, "m").unwrap();
    let text = equicone::gen::remap::to_bench(&c);
    assert!(!text.contains("a = BUFF(a)"), "{text}");
    let back = read("back", &text);
    assert_eq!(back.outputs.len(), 2);
}

/// The sweep alone on a 64-requester arbiter against `candidate` (bench text).
fn sweep(reference: &Design, candidate: &str) -> equicone::engine::ProveReport {
    use equicone::engine::{prove, EngineKind, ProveOptions};
    let c = read("cand", candidate);
    let opts = ProveOptions {
        engine: EngineKind::Sweep,
        ..ProveOptions::default()
    };
    prove(reference, &c, &opts).expect("prove runs")
}

#[test]
fn the_sweep_proves_a_remapped_arbiter_by_cut_matching() {
    use equicone::engine::Verdict;
    let text = generate(
        &GenSpec::new(Kind::Arbiter, Style::KoggeStone, 64),
        GenFormat::Bench,
    )
    .unwrap()
    .text;
    let d = read("arb", &text);
    let r = remapped(&d, 6);
    let rep = sweep(&d, &r);
    assert_eq!(rep.verdict, Verdict::Equivalent);
    let st = rep.stats.sweep.as_ref().expect("the sweep ran");
    // The lookup functions meet their source nodes over cuts of merged leaves.
    assert!(st.merged_by_cut > 100, "{st:?}");
    // Outside check: batsat on a miter written from the gate lines.
    assert!(oracle::batsat_differs(&oracle::parse(&text), &oracle::parse(&r)).is_none());
}

#[test]
fn a_bug_planted_in_a_remapped_arbiter_is_found_and_reproduces() {
    use equicone::engine::Verdict;
    use equicone::gen::Bug;
    use std::collections::HashMap;
    let spec = GenSpec::new(Kind::Arbiter, Style::KoggeStone, 64);
    let text = generate(&spec, GenFormat::Bench).unwrap().text;
    let d = read("arb", &text);
    let mut found = 0;
    for (bug, seed) in [(Bug::Invert, 3), (Bug::Stuck0, 5), (Bug::Swap, 7)] {
        let buggy = generate(&spec.clone().bug(bug).seed(seed), GenFormat::Bench)
            .unwrap()
            .text;
        let r = remapped(&read("buggy", &buggy), 6);
        let rep = sweep(&d, &r);
        // Outside check: batsat says whether the planted edit changes the function.
        let (a, b) = (oracle::parse(&text), oracle::parse(&r));
        let differs = oracle::batsat_differs(&a, &b).is_some();
        if !differs {
            assert_eq!(rep.verdict, Verdict::Equivalent, "{bug:?}: a masked edit");
            continue;
        }
        assert_eq!(rep.verdict, Verdict::Different, "{bug:?}");
        // The counterexample re-simulated by the oracle's own evaluator on both gate lists.
        let cex = &rep.counterexamples[0];
        let vals: HashMap<String, bool> = cex
            .inputs
            .iter()
            .map(|v| (v.name.clone(), v.value))
            .collect();
        assert_ne!(
            a.eval(&vals),
            b.eval(&vals),
            "{bug:?}: the vector reproduces"
        );
        found += 1;
    }
    assert!(found > 0, "no planted bug changed the function");
}
