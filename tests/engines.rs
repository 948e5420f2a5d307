//! The proof engines against exhaustive truth tables (an oracle outside the engines: plain
//! evaluation of every input vector), on random small circuit pairs: equivalent local rewrites
//! and single-gate mutants. Also: `--jobs` does not change any result.

use equicone::engine::{prove, EngineKind, PairBy, ProveOptions, ProveReport, Verdict};
use equicone::front::bench::read_bench;
use equicone::Design;
use rand::rngs::StdRng;
use rand::{Rng, SeedableRng};
use std::sync::Arc;

/// Replaces gate `g` (kind, fan-in names) by bench lines, or keeps it (`None`).
type Rewrite<'a> = dyn FnMut(usize, &str, &[String]) -> Option<Vec<String>> + 'a;

const KINDS: [&str; 8] = ["AND", "OR", "NAND", "NOR", "XOR", "XNOR", "NOT", "BUFF"];

/// A random gate-level circuit: (kind, fan-ins) per gate over signals `x0..` then `g0..`.
struct Circuit {
    inputs: usize,
    gates: Vec<(&'static str, Vec<usize>)>,
    outputs: Vec<usize>,
}

impl Circuit {
    fn random(rng: &mut StdRng, inputs: usize, gates: usize, outputs: usize) -> Circuit {
        let mut gs = Vec::new();
        for g in 0..gates {
            let kind = KINDS[rng.gen_range(0..KINDS.len())];
            let arity = if matches!(kind, "NOT" | "BUFF") {
                1
            } else {
                rng.gen_range(2..=3)
            };
            let fanin = (0..arity).map(|_| rng.gen_range(0..inputs + g)).collect();
            gs.push((kind, fanin));
        }
        let total = inputs + gates;
        let outs = (0..outputs)
            .map(|k| {
                if k == 0 {
                    total - 1
                } else {
                    rng.gen_range(0..total)
                }
            })
            .collect();
        Circuit {
            inputs,
            gates: gs,
            outputs: outs,
        }
    }

    /// Bench text; gate `g` may be replaced by the lines `rewrite` gives for it.
    fn bench(&self, rewrite: &mut Rewrite<'_>) -> String {
        let name = |s: usize| {
            if s < self.inputs {
                format!("x{s}")
            } else {
                format!("g{}", s - self.inputs)
            }
        };
        let mut t = String::new();
        for i in 0..self.inputs {
            t += &format!("INPUT(x{i})\n");
        }
        for k in 0..self.outputs.len() {
            t += &format!("OUTPUT(y{k})\n");
        }
        for (g, (kind, fanin)) in self.gates.iter().enumerate() {
            let args: Vec<String> = fanin.iter().map(|&s| name(s)).collect();
            match rewrite(g, kind, &args) {
                Some(lines) => {
                    for l in lines {
                        t += &l;
                        t.push('\n');
                    }
                }
                None => t += &format!("g{g} = {kind}({})\n", args.join(", ")),
            }
        }
        for (k, &s) in self.outputs.iter().enumerate() {
            t += &format!("y{k} = BUFF({})\n", name(s));
        }
        t
    }
}

/// An equivalent local rewrite of a two-input gate that structural hashing does not undo
/// (Boolean identities, common practice: absorption, De Morgan, XOR expansions).
fn rewrite_gate(g: usize, kind: &str, a: &[String]) -> Option<Vec<String>> {
    if a.len() != 2 {
        return None;
    }
    let (x, y) = (&a[0], &a[1]);
    let o = format!("g{g}");
    let t = |k: usize| format!("r{g}_{k}");
    Some(match kind {
        // x & y = x & ((x & y) | (y & !x))
        "AND" => vec![
            format!("{} = NOT({x})", t(0)),
            format!("{} = AND({y}, {})", t(1), t(0)),
            format!("{} = AND({x}, {y})", t(2)),
            format!("{} = OR({}, {})", t(3), t(2), t(1)),
            format!("{o} = AND({x}, {})", t(3)),
        ],
        // x | y = x ^ (!x & y)
        "OR" => vec![
            format!("{} = NOT({x})", t(0)),
            format!("{} = AND({}, {y})", t(1), t(0)),
            format!("{o} = XOR({x}, {})", t(1)),
        ],
        // x ^ y = (x | y) & !(x & y)
        "XOR" => vec![
            format!("{} = OR({x}, {y})", t(0)),
            format!("{} = NAND({x}, {y})", t(1)),
            format!("{o} = AND({}, {})", t(0), t(1)),
        ],
        // !(x & y) = !x | (x & !y)
        "NAND" => vec![
            format!("{} = NOT({x})", t(0)),
            format!("{} = NOT({y})", t(1)),
            format!("{} = AND({x}, {})", t(2), t(1)),
            format!("{o} = OR({}, {})", t(0), t(2)),
        ],
        _ => return None,
    })
}

fn read(name: &str, text: &str) -> Design {
    read_bench(&Arc::from(name), text).unwrap_or_else(|e| panic!("{name}: {e}\n{text}"))
}

/// Per output pair: equal on all 2^n vectors?
fn truth(r: &Design, c: &Design, n: usize) -> Vec<bool> {
    let mut eq = vec![true; r.outputs.len()];
    for v in 0..1u32 << n {
        let ins: Vec<bool> = (0..n).map(|i| (v >> i) & 1 == 1).collect();
        let (a, b) = (r.eval(&ins), c.eval(&ins));
        for k in 0..eq.len() {
            eq[k] &= a[k] == b[k];
        }
    }
    eq
}

fn opts(engine: EngineKind, jobs: usize) -> ProveOptions {
    ProveOptions {
        pair_by: PairBy::Name,
        engine,
        jobs,
        ..ProveOptions::default()
    }
}

fn check(rep: &ProveReport, expect: &[bool], what: &str) {
    assert_eq!(rep.pairs.len(), expect.len(), "{what}");
    for (p, &e) in rep.pairs.iter().zip(expect) {
        let want = if e {
            Verdict::Equivalent
        } else {
            Verdict::Different
        };
        assert_eq!(p.status, want, "{what}: output {}", p.reference);
        if !e {
            let k = p
                .counterexample
                .expect("a different pair has a counterexample");
            assert!(rep.counterexamples[k]
                .differing
                .iter()
                .any(|d| d.reference == p.reference));
        }
    }
    let overall = if expect.iter().all(|&e| e) {
        Verdict::Equivalent
    } else {
        Verdict::Different
    };
    assert_eq!(rep.verdict, overall, "{what}");
}

#[test]
fn engines_agree_with_truth_tables_on_random_pairs() {
    let mut checked = 0;
    let mut different = 0;
    for seed in 0..520u64 {
        let mut rng = StdRng::seed_from_u64(seed);
        let n = rng.gen_range(2..=12);
        let gates = rng.gen_range(4..=40);
        let outs = rng.gen_range(1..=4);
        let c = Circuit::random(&mut rng, n, gates, outs);
        let reference = c.bench(&mut |_, _, _| None);
        let mutant = seed % 2 == 1;
        let candidate = if mutant {
            // One gate changes its kind (same arity).
            let g = rng.gen_range(0..gates);
            let arity = c.gates[g].1.len();
            let choices: Vec<&str> = KINDS
                .iter()
                .copied()
                .filter(|k| (matches!(*k, "NOT" | "BUFF") == (arity == 1)) && *k != c.gates[g].0)
                .collect();
            let new = choices[rng.gen_range(0..choices.len())];
            c.bench(&mut |i, kind, a| {
                let k = if i == g { new } else { kind };
                (i == g).then(|| vec![format!("g{i} = {k}({})", a.join(", "))])
            })
        } else {
            let mut rw = StdRng::seed_from_u64(seed ^ 0xABCD);
            c.bench(&mut |i, kind, a| {
                if rw.gen_bool(0.5) {
                    rewrite_gate(i, kind, a)
                } else {
                    None
                }
            })
        };
        let r = read("ref.bench", &reference);
        let d = read("cand.bench", &candidate);
        let expect = truth(&r, &d, n);
        if expect.iter().any(|&e| !e) {
            different += 1;
        }
        for engine in [EngineKind::Sweep, EngineKind::Plain, EngineKind::Pairs] {
            let rep = prove(&r, &d, &opts(engine, 1)).expect("prove runs");
            check(
                &rep,
                &expect,
                &format!("seed {seed}, engine {}", engine.name()),
            );
        }
        checked += 1;
    }
    assert!(checked >= 500);
    // Both kinds of answers must be exercised.
    assert!(
        different >= 50 && checked - different >= 250,
        "{different} of {checked} pairs differ"
    );
}

/// Eight independent blocks (disjoint inputs) of random logic, large enough for the sweep
/// engine to split the outputs into groups; one block of the candidate has a mutant gate.
fn blocks(mutant: bool) -> (Design, Design) {
    let mut rng = StdRng::seed_from_u64(77);
    let (mut rt, mut ct) = (String::new(), String::new());
    for b in 0..8 {
        let c = Circuit::random(&mut rng, 24, 3000, 12);
        // Signal names are lower case, gate keywords upper case: prefix the names only.
        let prefix = |t: String| {
            t.replace('x', &format!("b{b}x"))
                .replace('g', &format!("b{b}g"))
                .replace("y", &format!("b{b}y"))
                .replace('r', &format!("b{b}r"))
        };
        rt += &prefix(c.bench(&mut |_, _, _| None));
        let mut rw = StdRng::seed_from_u64(b);
        ct += &prefix(c.bench(&mut |i, kind, a| {
            if mutant && b == 5 && i == 2999 {
                let k = if kind == "XOR" { "XNOR" } else { "XOR" };
                return Some(vec![format!("g{i} = {k}({})", a.join(", "))]);
            }
            if rw.gen_bool(0.3) {
                rewrite_gate(i, kind, a)
            } else {
                None
            }
        }));
    }
    (read("ref.bench", &rt), read("cand.bench", &ct))
}

#[test]
fn jobs_do_not_change_results() {
    for mutant in [false, true] {
        let (r, c) = blocks(mutant);
        let mut reports = Vec::new();
        for jobs in [1, 2, 3] {
            let mut rep = prove(&r, &c, &opts(EngineKind::Sweep, jobs)).expect("prove runs");
            rep.stats.seconds = 0.0;
            reports.push(rep);
        }
        let groups = reports[0].stats.sweep.as_ref().map_or(0, |s| s.groups);
        assert!(
            groups > 1,
            "the blocks should be swept in several groups ({} nodes)",
            reports[0].stats.shared_nodes
        );
        assert_eq!(reports[0], reports[1]);
        assert_eq!(reports[0], reports[2]);
        let plain = prove(&r, &c, &opts(EngineKind::Plain, 1)).expect("prove runs");
        assert_eq!(reports[0].verdict, plain.verdict);
        assert_eq!(
            reports[0].verdict,
            if mutant {
                Verdict::Different
            } else {
                Verdict::Equivalent
            }
        );
    }
}
