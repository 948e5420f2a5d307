//! Integration tests of `prove` on bench netlists: published facts about the ISCAS-85 circuits,
//! single-gate mutants checked against an independent SAT solver, random small circuits against
//! exhaustive truth tables, and the command line's exit codes, reports and errors.

mod oracle;

use equicone::engine::{prove, EngineKind, PairBy, ProveOptions, ProveReport, Verdict};
use equicone::front::bench::read_bench;
use equicone::Design;
use std::collections::HashMap;
use std::sync::Arc;

fn design(name: &str, text: &str) -> Design {
    read_bench(&Arc::from(name), text).unwrap_or_else(|e| panic!("{e}"))
}

fn engines() -> Vec<EngineKind> {
    EngineKind::ALL.to_vec()
}

/// Engines that decide only what fits their limits (one method of the portfolio alone): an
/// undecided verdict is allowed from them, a wrong one never.
fn partial(e: EngineKind) -> bool {
    matches!(
        e,
        EngineKind::Exhaustive | EngineKind::Bdd | EngineKind::BddSweep | EngineKind::Algebra
    )
}

fn run(r: &Design, c: &Design, by: PairBy, engine: EngineKind) -> ProveReport {
    let opts = ProveOptions {
        pair_by: by,
        engine,
        ..ProveOptions::default()
    };
    prove(r, c, &opts).unwrap_or_else(|_| panic!("prove failed"))
}

/// Check a report's counterexamples with the independent evaluator: each claimed difference
/// shows on the oracle's own evaluation of both texts (pairs by name or position).
fn check_counterexamples(rep: &ProveReport, a: &oracle::Net, b: &oracle::Net) {
    for cex in &rep.counterexamples {
        let ia: HashMap<String, bool> = cex
            .inputs
            .iter()
            .map(|i| (i.name.clone(), i.value))
            .collect();
        // Candidate inputs by position when the names differ.
        let ib: HashMap<String, bool> = a
            .inputs
            .iter()
            .zip(&b.inputs)
            .map(|(x, y)| (y.clone(), ia[x]))
            .collect();
        let oa = a.eval(&ia);
        let ob = b.eval(&ib);
        assert!(!cex.differing.is_empty());
        for d in &cex.differing {
            let ka = a.outputs.iter().position(|o| *o == d.reference).unwrap();
            let kb = b.outputs.iter().position(|o| *o == d.candidate).unwrap();
            assert_eq!(
                oa[ka], d.reference_value,
                "reference value of {}",
                d.reference
            );
            assert_eq!(
                ob[kb], d.candidate_value,
                "candidate value of {}",
                d.candidate
            );
            assert_ne!(oa[ka], ob[kb]);
        }
    }
}

mod iscas {
    use super::*;

    const ALL: [&str; 11] = [
        "c17", "c432", "c499", "c880", "c1355", "c1908", "c2670", "c3540", "c5315", "c6288",
        "c7552",
    ];

    fn read(dir: &std::path::Path, name: &str) -> String {
        std::fs::read_to_string(dir.join(format!("{name}.bench"))).unwrap()
    }

    /// Published: c1355 is c499 with each XOR expanded into NAND gates (Hansen, Yalcin and Hayes,
    /// IEEE Design & Test 1999); the data's SOURCE.md gives the port correspondence by position.
    #[test]
    fn c499_equals_c1355_by_position() {
        let Some(dir) = oracle::iscas_dir() else {
            return;
        };
        let r = design("c499.bench", &read(&dir, "c499"));
        let c = design("c1355.bench", &read(&dir, "c1355"));
        for e in engines() {
            let rep = run(&r, &c, PairBy::Position, e);
            if partial(e) && rep.verdict == Verdict::Undecided {
                continue;
            }
            assert_eq!(rep.verdict, Verdict::Equivalent, "engine {e:?}");
            assert_eq!(rep.pairs.len(), 32);
            assert!(rep.counterexamples.is_empty());
        }
    }

    /// Every circuit equals itself and a copy with its gate lines in reverse and shuffled order
    /// (the reader must not depend on line order).
    #[test]
    fn every_circuit_equals_its_shuffled_copy() {
        let Some(dir) = oracle::iscas_dir() else {
            return;
        };
        for name in ALL {
            let text = read(&dir, name);
            let (decls, mut gates): (Vec<&str>, Vec<&str>) = text
                .lines()
                .filter(|l| !l.trim().is_empty())
                .partition(|l| !l.contains('='));
            // A fixed pseudo-random shuffle of the gate lines.
            let mut rng = equicone::rng::SplitMix64::new(0x2545_F491_4F6C_DD1D, 0);
            for i in (1..gates.len()).rev() {
                gates.swap(i, rng.below(i + 1));
            }
            let mut shuffled: Vec<&str> = gates.clone();
            shuffled.extend(decls);
            let r = design(name, &text);
            let c = design("shuffled", &shuffled.join("\n"));
            for e in engines().into_iter().filter(|&e| !partial(e)) {
                assert_eq!(
                    run(&r, &r, PairBy::Name, e).verdict,
                    Verdict::Equivalent,
                    "{name} vs itself"
                );
                assert_eq!(
                    run(&r, &c, PairBy::Name, e).verdict,
                    Verdict::Equivalent,
                    "{name} vs shuffled"
                );
            }
        }
    }

    /// Published: c6288 is a 16x16 multiplier (Hansen et al. 1999); SOURCE.md measured the port
    /// order: A = first 16 inputs, B = next 16, LSB first; outputs p0..p29, then p31, then p30.
    #[test]
    fn c6288_multiplies() {
        let Some(dir) = oracle::iscas_dir() else {
            return;
        };
        let d = design("c6288.bench", &read(&dir, "c6288"));
        assert_eq!((d.inputs.len(), d.outputs.len()), (32, 32));
        let mut rng = equicone::rng::SplitMix64::new(12345, 0);
        for _ in 0..300 {
            let x = rng.next_u64();
            let (a, b) = ((x >> 20) & 0xFFFF, (x >> 40) & 0xFFFF);
            let ins: Vec<bool> = (0..32)
                .map(|i| {
                    if i < 16 {
                        a >> i & 1 == 1
                    } else {
                        b >> (i - 16) & 1 == 1
                    }
                })
                .collect();
            let out = d.eval(&ins);
            let bit = |k: usize| out[k] as u64;
            let mut p = 0u64;
            for k in 0..30 {
                p |= bit(k) << k;
            }
            p |= bit(30) << 31 | bit(31) << 30;
            assert_eq!(p, a * b, "{a} * {b}");
        }
    }

    /// Counts from the data provider's SOURCE.md table (an independent count).
    #[test]
    fn port_counts_match_the_published_table() {
        let Some(dir) = oracle::iscas_dir() else {
            return;
        };
        let table = [
            ("c17", 5, 2),
            ("c432", 36, 7),
            ("c499", 41, 32),
            ("c880", 60, 26),
            ("c1355", 41, 32),
            ("c1908", 33, 25),
            ("c2670", 233, 140),
            ("c3540", 50, 22),
            ("c5315", 178, 123),
            ("c6288", 32, 32),
            ("c7552", 207, 108),
        ];
        for (name, i, o) in table {
            let d = design(name, &read(&dir, name));
            assert_eq!((d.inputs.len(), d.outputs.len()), (i, o), "{name}");
            assert_eq!(
                d.netlist.as_ref().unwrap().cells.len(),
                oracle::parse(&read(&dir, name)).gates.len()
            );
        }
    }

    /// Single-gate mutants of four circuits: the verdict agrees with batsat on an independent
    /// encoding, and every counterexample reproduces on the independent evaluator.
    #[test]
    fn mutants_agree_with_a_second_solver() {
        let Some(dir) = oracle::iscas_dir() else {
            return;
        };
        let mut checked = 0;
        let mut different = 0;
        for name in ["c432", "c880", "c1908", "c3540"] {
            let text = read(&dir, name);
            let net = oracle::parse(&text);
            let r = design(name, &text);
            for k in 0..6 {
                let mut m = net.clone();
                let g = (k * 7919 + 13) % m.gates.len();
                if k % 2 == 0 {
                    // Change the gate type (keep the arity legal).
                    let kind = m.gates[g].1.clone();
                    m.gates[g].1 = match kind.as_str() {
                        "AND" => "NAND",
                        "NAND" => "NOR",
                        "OR" => "AND",
                        "NOR" => "OR",
                        "XOR" => "XNOR",
                        "XNOR" => "XOR",
                        "NOT" => "BUFF",
                        _ => "NOT",
                    }
                    .to_string();
                } else {
                    // Swap one fan-in with another gate's fan-in (no cycle: take a fan-in of
                    // a gate that comes earlier in topological order).
                    let order = m.order();
                    let pos = order.iter().position(|&x| x == g).unwrap();
                    let Some(&h) = order[..pos]
                        .iter()
                        .rev()
                        .find(|&&h| m.gates[h].2[0] != m.gates[g].2[0])
                    else {
                        continue;
                    };
                    let tmp = m.gates[g].2[0].clone();
                    m.gates[g].2[0] = m.gates[h].2[0].clone();
                    m.gates[h].2[0] = tmp;
                    if std::panic::catch_unwind(|| m.order()).is_err() {
                        continue;
                    }
                }
                let text_m = to_bench(&m);
                let c = design("mutant", &text_m);
                let expect_diff = oracle::batsat_differs(&net, &m).is_some();
                for e in engines() {
                    let rep = run(&r, &c, PairBy::Name, e);
                    check_counterexamples(&rep, &net, &m);
                    if partial(e) && rep.verdict == Verdict::Undecided {
                        continue;
                    }
                    assert_eq!(
                        rep.verdict == Verdict::Different,
                        expect_diff,
                        "{name} mutant {k}, engine {e:?}"
                    );
                    assert_ne!(rep.verdict, Verdict::Undecided);
                    check_counterexamples(&rep, &net, &m);
                }
                checked += 1;
                different += expect_diff as usize;
            }
        }
        assert!(checked >= 20, "only {checked} mutants");
        eprintln!("{checked} mutants checked, {different} different");
    }

    pub fn to_bench(n: &oracle::Net) -> String {
        let mut s = String::new();
        for i in &n.inputs {
            s += &format!("INPUT({i})\n");
        }
        for o in &n.outputs {
            s += &format!("OUTPUT({o})\n");
        }
        for (name, kind, args) in &n.gates {
            s += &format!("{name} = {kind}({})\n", args.join(", "));
        }
        s
    }
}

mod random_pairs {
    use super::*;
    use proptest::prelude::*;

    /// A random circuit: `n` inputs, gates over earlier signals, the last `outs` gates as outputs.
    fn circuit(n: usize, gates: &[(u8, u16, u16, u16)], outs: usize) -> oracle::Net {
        let kinds = ["AND", "NAND", "OR", "NOR", "XOR", "XNOR", "NOT", "BUFF"];
        let mut net = oracle::Net {
            inputs: (0..n).map(|i| format!("i{i}")).collect(),
            outputs: vec![],
            gates: vec![],
        };
        for (g, &(k, a, b, c)) in gates.iter().enumerate() {
            let avail = n + g;
            let sig = |x: u16| {
                if (x as usize % avail) < n {
                    format!("i{}", x as usize % avail)
                } else {
                    format!("g{}", x as usize % avail - n)
                }
            };
            let kind = kinds[k as usize % kinds.len()];
            let args = match kind {
                "NOT" | "BUFF" => vec![sig(a)],
                _ if c % 3 == 0 => vec![sig(a), sig(b), sig(c)],
                _ => vec![sig(a), sig(b)],
            };
            net.gates.push((format!("g{g}"), kind.to_string(), args));
        }
        let total = gates.len();
        for o in 0..outs.min(total) {
            net.outputs.push(format!("g{}", total - 1 - o));
        }
        net
    }

    /// An equivalent rewrite: each gate through De Morgan (AND = NOT(NOR of NOTs), ...),
    /// with fresh names for the helper gates.
    fn rewrite(n: &oracle::Net) -> oracle::Net {
        let mut m = oracle::Net {
            inputs: n.inputs.clone(),
            outputs: n.outputs.clone(),
            gates: vec![],
        };
        for (name, kind, args) in &n.gates {
            let inv: Vec<String> = args
                .iter()
                .enumerate()
                .map(|(j, a)| {
                    let t = format!("{name}_n{j}");
                    m.gates.push((t.clone(), "NOT".into(), vec![a.clone()]));
                    t
                })
                .collect();
            let (k, a) = match kind.as_str() {
                "AND" => ("NOR", inv),
                "NAND" => ("OR", inv),
                "OR" => ("NAND", inv),
                "NOR" => ("AND", inv),
                "XOR" if args.len() == 2 => ("XOR", inv),
                "XNOR" if args.len() == 2 => ("XNOR", inv),
                k => (k, args.clone()),
            };
            m.gates.push((name.clone(), k.to_string(), a));
        }
        m
    }

    fn truth_differs(a: &oracle::Net, b: &oracle::Net) -> bool {
        let n = a.inputs.len();
        (0..1u32 << n).any(|v| {
            let ins: HashMap<String, bool> = a
                .inputs
                .iter()
                .enumerate()
                .map(|(i, x)| (x.clone(), v >> i & 1 == 1))
                .collect();
            a.eval(&ins) != b.eval(&ins)
        })
    }

    proptest! {
        #![proptest_config(ProptestConfig { cases: 600, .. ProptestConfig::default() })]

        /// Random pairs of small circuits (up to 12 inputs): equivalent rewrites and single-gate
        /// mutants; the verdict agrees with exhaustive truth-table comparison for every engine.
        #[test]
        fn verdicts_match_truth_tables(
            n in 1usize..=12,
            gates in proptest::collection::vec((any::<u8>(), any::<u16>(), any::<u16>(), any::<u16>()), 1..40),
            outs in 1usize..5,
            mutate in any::<bool>(),
            which in any::<u16>(),
            new_kind in 0u8..6,
        ) {
            let a = circuit(n, &gates, outs);
            let mut b = rewrite(&a);
            if mutate {
                let g = which as usize % a.gates.len();
                let name = a.gates[g].0.clone();
                let pos = b.gates.iter().position(|x| x.0 == name).unwrap();
                let kinds = ["AND", "NAND", "OR", "NOR", "XOR", "XNOR"];
                if b.gates[pos].2.len() >= 2 {
                    b.gates[pos].1 = kinds[new_kind as usize].to_string();
                } else {
                    b.gates[pos].1 = if b.gates[pos].1 == "NOT" { "BUFF".into() } else { "NOT".into() };
                }
            }
            let expect = truth_differs(&a, &b);
            let ra = design("a", &iscas::to_bench(&a));
            let rb = design("b", &iscas::to_bench(&b));
            for e in engines() {
                let rep = run(&ra, &rb, PairBy::Name, e);
                prop_assert_eq!(rep.verdict == Verdict::Different, expect);
                prop_assert!(rep.verdict != Verdict::Undecided);
                check_counterexamples(&rep, &a, &b);
            }
        }
    }
}
