//! The proof engines against two oracles outside equicone (`tests/oracle/`: exhaustive
//! bit-parallel simulation and the batsat solver on a miter encoded from the gate lines), on
//! 10,000 random small circuit pairs: equivalent local rewrites and single-edit mutants
//! (gate kind, rewired or inverted fan-in, output moved). Also: `--jobs` does not change any
//! result.

use equicone::engine::{prove, EngineKind, PairBy, ProveOptions, Verdict};
use equicone::front::bench::read_bench;
use equicone::Design;
use rand::rngs::StdRng;
use rand::{Rng, SeedableRng};
use std::collections::{BTreeMap, HashMap};
use std::io::Write;
use std::sync::atomic::{AtomicU64, Ordering};
use std::sync::Arc;
use std::time::Instant;

mod oracle;

use oracle::random::{is_unary, Gates, KINDS};

/// Replaces gate `g` (kind, fan-in names) by bench lines, or keeps it (`None`).
type Rewrite<'a> = dyn FnMut(usize, &str, &[String]) -> Option<Vec<String>> + 'a;

/// A random gate-level circuit (the tests' one generator, `tests/oracle/random.rs`) over
/// signals `x0..` then `g0..`, with outputs.
struct Circuit {
    inputs: usize,
    gates: Gates,
    outputs: Vec<usize>,
}

impl Circuit {
    fn random(rng: &mut StdRng, inputs: usize, gates: usize, outputs: usize) -> Circuit {
        let gs = Gates::random(rng, inputs, gates);
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
        for (g, (kind, fanin)) in self.gates.gates.iter().enumerate() {
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
    let o = format!("g{g}");
    let t = |k: usize| format!("r{g}_{k}");
    if a.len() == 3 {
        // Three inputs: regrouped as two two-input gates (associativity, common practice),
        // the inner pair chosen by the gate index.
        let (p, q, r) = match g % 3 {
            0 => (&a[0], &a[1], &a[2]),
            1 => (&a[1], &a[2], &a[0]),
            _ => (&a[0], &a[2], &a[1]),
        };
        let (inner, outer) = match kind {
            "AND" => ("AND", "AND"),
            "OR" => ("OR", "OR"),
            "XOR" => ("XOR", "XOR"),
            "NAND" => ("AND", "NAND"),
            "NOR" => ("OR", "NOR"),
            "XNOR" => ("XOR", "XNOR"),
            _ => return None,
        };
        return Some(vec![
            format!("{} = {inner}({p}, {q})", t(0)),
            format!("{o} = {outer}({}, {r})", t(0)),
        ]);
    }
    if a.len() != 2 {
        return None;
    }
    let (x, y) = (&a[0], &a[1]);
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
        // !(x ^ y) = (x & y) | (!x & !y)
        "XNOR" => vec![
            format!("{} = AND({x}, {y})", t(0)),
            format!("{} = NOR({x}, {y})", t(1)),
            format!("{o} = OR({}, {})", t(0), t(1)),
        ],
        _ => return None,
    })
}

fn read(name: &str, text: &str) -> Design {
    read_bench(&Arc::from(name), text).unwrap_or_else(|e| panic!("{name}: {e}\n{text}"))
}

fn opts(engine: EngineKind, jobs: usize) -> ProveOptions {
    ProveOptions {
        pair_by: PairBy::Name,
        engine,
        jobs,
        ..ProveOptions::default()
    }
}

/// One edit that may change the function (a mutant); the oracles decide whether it does.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Hash, PartialOrd, Ord)]
enum Edit {
    /// A gate changes its kind (same arity).
    Kind,
    /// One fan-in of a gate reads another earlier signal.
    Rewire,
    /// One fan-in of a gate is inverted.
    Invert,
    /// One output reads another signal.
    Output,
}

/// A random pair for `seed`: the reference, the candidate and the edit (`None`: an
/// equivalent rewrite). Mutants are also rewritten elsewhere, so they are not structurally
/// close to the reference.
fn random_pair(seed: u64) -> (usize, String, String, Option<Edit>) {
    let mut rng = StdRng::seed_from_u64(seed);
    let n = rng.gen_range(2..=16);
    let gates = rng.gen_range(4..=48);
    let outs = rng.gen_range(1..=4);
    let mut c = Circuit::random(&mut rng, n, gates, outs);
    let reference = c.bench(&mut |_, _, _| None);
    let mut rw = StdRng::seed_from_u64(seed ^ 0xABCD);
    let rewrite = seed.is_multiple_of(2);
    let share = if rewrite { 0.5 } else { 0.2 };
    if rewrite {
        let cand = c.bench(&mut |i, kind, a| {
            if rw.gen_bool(share) {
                rewrite_gate(i, kind, a)
            } else {
                None
            }
        });
        return (n, reference, cand, None);
    }
    // The edited gate is one that some output reads (through any path).
    let live = c.gates.live(&c.outputs);
    let cone: Vec<usize> = (0..gates).filter(|&g| live[n + g]).collect();
    let g = if cone.is_empty() {
        rng.gen_range(0..gates)
    } else {
        cone[rng.gen_range(0..cone.len())]
    };
    let edit = [Edit::Kind, Edit::Rewire, Edit::Invert, Edit::Output][rng.gen_range(0..4)];
    let arity = c.gates.gates[g].1.len();
    let mut new_kind = c.gates.gates[g].0;
    let (mut pin, mut new_src) = (0, 0);
    match edit {
        Edit::Kind => {
            let choices: Vec<&str> = KINDS
                .iter()
                .copied()
                .filter(|k| is_unary(k) == (arity == 1) && *k != new_kind)
                .collect();
            new_kind = choices[rng.gen_range(0..choices.len())];
        }
        Edit::Rewire | Edit::Invert => {
            pin = rng.gen_range(0..arity);
            let old = c.gates.gates[g].1[pin];
            // Another signal defined before gate g (or the same one when there is no other).
            new_src = rng.gen_range(0..n + g);
            if new_src == old && n + g > 1 {
                new_src = (old + 1) % (n + g);
            }
        }
        Edit::Output => {
            let k = rng.gen_range(0..outs);
            let old = c.outputs[k];
            let total = n + gates;
            c.outputs[k] = (old + 1 + rng.gen_range(0..total - 1)) % total;
        }
    }
    let name = |s: usize| {
        if s < n {
            format!("x{s}")
        } else {
            format!("g{}", s - n)
        }
    };
    let cand = c.bench(&mut |i, kind, a| {
        if i == g && edit != Edit::Output {
            let mut a = a.to_vec();
            let mut lines = Vec::new();
            match edit {
                Edit::Rewire => a[pin] = name(new_src),
                Edit::Invert => {
                    lines.push(format!("m{i} = NOT({})", a[pin]));
                    a[pin] = format!("m{i}");
                }
                _ => {}
            }
            let k = if edit == Edit::Kind { new_kind } else { kind };
            lines.push(format!("g{i} = {k}({})", a.join(", ")));
            return Some(lines);
        }
        if rw.gen_bool(share) {
            rewrite_gate(i, kind, a)
        } else {
            None
        }
    });
    (n, reference, cand, Some(edit))
}

/// What one pair contributed to the campaign.
#[derive(Default)]
struct Tally {
    pairs: usize,
    rewrites: usize,
    mutants: BTreeMap<Edit, (usize, usize)>,
    output_pairs: usize,
    equal_pairs: usize,
    engine_runs: usize,
    batsat_queries: usize,
}

/// Check one pair: the two oracles (exhaustive simulation and batsat on a miter encoded
/// from the gate lines) must agree on every output pair; then every engine's verdict must
/// match them, every `equivalent` must have an UNSAT batsat answer and no distinguishing
/// vector, and every counterexample must separate its output pair when evaluated by the
/// oracle's own evaluator.
fn check_pair(seed: u64, engines: &[EngineKind], t: &mut Tally) {
    let (_, ref_text, cand_text, edit) = random_pair(seed);
    let (na, nb) = (oracle::parse(&ref_text), oracle::parse(&cand_text));
    let sim = oracle::sim::exhaustive_diff(&na, &nb);
    let sat = oracle::batsat_per_output(&na, &nb);
    t.batsat_queries += sat.len();
    for (k, (s, b)) in sim.iter().zip(&sat).enumerate() {
        assert_eq!(
            s.is_some(),
            b.is_some(),
            "seed {seed}: output {k}: exhaustive simulation and batsat disagree"
        );
        for v in [s.map(|v| oracle::sim::vector(&na, v)), b.clone()]
            .into_iter()
            .flatten()
        {
            assert_ne!(
                na.eval(&v)[k],
                nb.eval(&v)[k],
                "seed {seed}: an oracle's vector does not separate output {k}"
            );
        }
    }
    let equal: Vec<bool> = sim.iter().map(|s| s.is_none()).collect();
    t.pairs += 1;
    t.output_pairs += equal.len();
    t.equal_pairs += equal.iter().filter(|&&e| e).count();
    match edit {
        None => {
            assert!(
                equal.iter().all(|&e| e),
                "seed {seed}: a rewrite changed the function"
            );
            t.rewrites += 1;
        }
        Some(e) => {
            let m = t.mutants.entry(e).or_default();
            m.0 += 1;
            if equal.iter().any(|&e| !e) {
                m.1 += 1;
            }
        }
    }
    let (r, c) = (read("ref.bench", &ref_text), read("cand.bench", &cand_text));
    for &engine in engines {
        let what = format!("seed {seed}, engine {}", engine.name());
        let rep = prove(&r, &c, &opts(engine, 1)).expect("prove runs");
        t.engine_runs += 1;
        assert_eq!(rep.pairs.len(), equal.len(), "{what}");
        for (k, (p, &e)) in rep.pairs.iter().zip(&equal).enumerate() {
            assert_eq!(p.reference, na.outputs[k], "{what}");
            if e {
                assert_eq!(p.status(), Verdict::Equivalent, "{what}: output {k}");
                continue;
            }
            assert_eq!(p.status(), Verdict::Different, "{what}: output {k}");
            let cx = &rep.counterexamples[p.verdict.counterexample().expect("a counterexample")];
            let v: HashMap<String, bool> = cx
                .inputs
                .iter()
                .map(|i| (i.name.clone(), i.value))
                .collect();
            assert_eq!(v.len(), na.inputs.len(), "{what}: every input has a value");
            assert_ne!(
                na.eval(&v)[k],
                nb.eval(&v)[k],
                "{what}: the counterexample does not separate output {k}"
            );
            assert!(cx.differing.iter().any(|d| d.reference == p.reference));
        }
        let overall = if equal.iter().all(|&e| e) {
            Verdict::Equivalent
        } else {
            Verdict::Different
        };
        assert_eq!(rep.verdict, overall, "{what}");
    }
}

/// The differential campaign: `EQUICONE_CAMPAIGN_PAIRS` random pairs (default 10,000) of up to
/// 16 inputs, half equivalent rewrites and half single-edit mutants, every pair proved by the
/// `sweep`, `plain` and `portfolio` engines, every second by `exhaustive` and the others by
/// `bdd` or `bdd-sweep` (and every fourth also by `pairs`), checked against exhaustive
/// simulation and batsat (`tests/oracle/`). Spread over the cores; the counts go to standard
/// error (written directly, so the test harness does not hide them).
#[test]
fn engines_agree_with_exhaustive_simulation_and_batsat() {
    let total: u64 = std::env::var("EQUICONE_CAMPAIGN_PAIRS")
        .ok()
        .and_then(|s| s.parse().ok())
        .unwrap_or(10_000);
    let start = Instant::now();
    let next = AtomicU64::new(0);
    let workers = std::thread::available_parallelism().map_or(2, |n| n.get());
    let tallies: Vec<Tally> = std::thread::scope(|s| {
        let hs: Vec<_> = (0..workers)
            .map(|_| {
                s.spawn(|| {
                    let mut t = Tally::default();
                    loop {
                        let seed = next.fetch_add(1, Ordering::Relaxed);
                        if seed >= total {
                            return t;
                        }
                        let mut engines =
                            vec![EngineKind::Sweep, EngineKind::Plain, EngineKind::Portfolio];
                        engines.push(match seed % 4 {
                            0 | 2 => EngineKind::Exhaustive,
                            1 => EngineKind::Bdd,
                            _ => EngineKind::BddSweep,
                        });
                        if seed % 4 == 3 {
                            engines.push(EngineKind::Pairs);
                        }
                        check_pair(seed, &engines, &mut t);
                    }
                })
            })
            .collect();
        hs.into_iter()
            .map(|h| h.join().expect("a worker failed"))
            .collect()
    });
    let mut t = Tally::default();
    for x in tallies {
        t.pairs += x.pairs;
        t.rewrites += x.rewrites;
        t.output_pairs += x.output_pairs;
        t.equal_pairs += x.equal_pairs;
        t.engine_runs += x.engine_runs;
        t.batsat_queries += x.batsat_queries;
        for (e, (a, b)) in x.mutants {
            let m = t.mutants.entry(e).or_default();
            m.0 += a;
            m.1 += b;
        }
    }
    let mutants: usize = t.mutants.values().map(|m| m.0).sum();
    let changed: usize = t.mutants.values().map(|m| m.1).sum();
    let by_edit: Vec<String> = t
        .mutants
        .iter()
        .map(|(e, (a, b))| format!("{e:?} {b}/{a}"))
        .collect();
    let line = format!(
        "differential campaign: {} pairs ({} rewrites, {} mutants of which {} change an output: {}), \
         {} output pairs ({} equal), {} engine runs, {} batsat queries, {:.1} s on {} threads\n",
        t.pairs,
        t.rewrites,
        mutants,
        changed,
        by_edit.join(", "),
        t.output_pairs,
        t.equal_pairs,
        t.engine_runs,
        t.batsat_queries,
        start.elapsed().as_secs_f64(),
        workers
    );
    let _ = std::io::stderr().write_all(line.as_bytes());
    assert_eq!(t.pairs as u64, total);
    // Both kinds of answers and every kind of edit must be exercised.
    if total >= 1000 {
        assert!(
            changed * 2 >= mutants && t.rewrites * 3 >= t.pairs,
            "{line}"
        );
        assert!(
            t.mutants.values().all(|m| m.1 >= total as usize / 40),
            "{line}"
        );
    }
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
            rep.stats.engine_memory_bytes = None;
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
