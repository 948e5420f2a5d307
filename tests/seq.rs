//! Clocked designs: the ISCAS-89 circuits s27 and s298 (shared data, `../shared/bench-data/iscas89`,
//! provenance in its SOURCE.md) proved equal to copies with renamed and inverted registers, their
//! mutants found different with traces that an independent cycle simulator (`seq/oracle.rs`) and
//! Icarus Verilog replay to the same first difference, and a counter mod 10 whose rewrite differs
//! only in unreachable states, which must never be `different`.

#[path = "seq/clocks.rs"]
mod clocks;
#[path = "seq/clocks_mapped.rs"]
mod clocks_mapped;
#[path = "verilog/common.rs"]
#[allow(dead_code)]
mod common;
#[path = "seq/exact.rs"]
mod exact;
#[path = "seq/flags.rs"]
mod flags;
#[path = "seq/gated.rs"]
mod gated;
#[path = "seq/initial.rs"]
mod initial;
#[path = "oracle/mod.rs"]
mod oracle;
#[path = "seq/portmap.rs"]
mod portmap;
#[path = "seq/renamed.rs"]
mod renamed;
#[path = "seq/oracle.rs"]
mod seq_oracle;
#[path = "seq/verilog.rs"]
mod verilog;

use equicone::aig::{Aig, Lit};
use equicone::design::{Design, InputKind};
use equicone::front::bench::read_bench;
use equicone::seq::{self, InitUnset, SeqOptions, Side, Trace};
use std::collections::BTreeMap;
use std::path::PathBuf;
use std::sync::Arc;

/// The ISCAS-89 folder of the shared data (`oracle::shared_data`).
/// A command-line argument: a word or a path.
type Arg<'a> = &'a dyn AsRef<std::ffi::OsStr>;

/// Run equicone with `args` (in `dir` when given), check its exit code (showing both streams when
/// it differs) and give its stdout and stderr.
fn cli(dir: Option<&std::path::Path>, args: &[Arg], code: i32) -> (String, String) {
    let mut cmd = std::process::Command::new(env!("CARGO_BIN_EXE_equicone"));
    if let Some(d) = dir {
        cmd.current_dir(d);
    }
    let o = cmd.args(args.iter().map(|a| a.as_ref())).output().unwrap();
    let (out, err) = (
        String::from_utf8_lossy(&o.stdout).into_owned(),
        String::from_utf8_lossy(&o.stderr).into_owned(),
    );
    assert_eq!(o.status.code(), Some(code), "{out}{err}");
    (out, err)
}

/// `cli` for a command that prints JSON: the parsed stdout.
fn cli_json(dir: Option<&std::path::Path>, args: &[Arg], code: i32) -> serde_json::Value {
    let (out, err) = cli(dir, args, code);
    serde_json::from_str(&out).unwrap_or_else(|e| panic!("{e}: {out}{err}"))
}

/// The output of an equicone testbench run by Icarus Verilog: its first failing cycle must be
/// `first` (the trace's first difference).
fn assert_first_fail(out: &str, first: u64) {
    let fails: Vec<&str> = out.lines().filter(|l| l.contains("FAIL,")).collect();
    assert!(
        fails
            .first()
            .is_some_and(|l| l.starts_with(&format!("cycle {first}: FAIL"))),
        "{out}"
    );
}

/// Run the testbench equicone wrote at `tb` with the reference design `r` in Icarus Verilog and
/// check its first failing cycle is `first`.
fn testbench_fails_first_at(tb: &std::path::Path, r: &std::path::Path, first: u64) {
    let src = std::fs::read_to_string(tb).unwrap() + &std::fs::read_to_string(r).unwrap();
    assert_first_fail(
        &common::run_iverilog_as(&src, "equicone_tb", "-g2005"),
        first,
    );
}

fn iscas89() -> Option<PathBuf> {
    oracle::shared_data("iscas89", "s27.bench")
}

fn read(name: &str, text: &str) -> Design {
    read_bench(&Arc::from(name), text).expect("reads")
}

/// A copy of `d` whose registers are renamed (`st_reg_K_`... shapes that do not match by name)
/// and, where `invert(k)`, store the complement, all starting from the state `d` starts in with
/// every register at 0 (inverted ones at 1, by their reset value).
fn rewrite(d: &Design, invert: impl Fn(usize) -> bool) -> Design {
    let mut g = Aig::new();
    let mut map = Vec::new();
    let mut flip = vec![false; d.inputs.len()];
    for (k, r) in d.registers.iter().enumerate() {
        flip[r.input] = invert(k);
    }
    for &f in &flip {
        let l = g.add_input();
        map.push(l.xor_complement(f));
    }
    let mut roots: Vec<Lit> = d.outputs.iter().map(|o| o.lit).collect();
    roots.extend(d.registers.iter().map(|r| r.next));
    let lits = g.import(&d.aig, &map, &roots);
    let mut c = d.clone();
    c.aig = g;
    c.name = format!("{} (rewritten)", d.name);
    for (k, o) in c.outputs.iter_mut().enumerate() {
        o.lit = lits[k];
    }
    let n = d.outputs.len();
    for (k, r) in c.registers.iter_mut().enumerate() {
        let inv = invert(k);
        r.next = lits[n + k].xor_complement(inv);
        r.init = Some(inv);
        r.name = format!("state_{}_", 100 + k);
        r.port = r.name.clone();
        r.index = None;
        c.inputs[r.input].name = r.name.clone();
    }
    c
}

fn options() -> SeqOptions {
    SeqOptions {
        init_unset: InitUnset::Value(false),
        ..SeqOptions::default()
    }
}

#[test]
fn iscas89_proved_equal_to_copies_with_renamed_and_inverted_registers() {
    let Some(dir) = iscas89() else { return };
    // Counts from SOURCE.md: s27 has 3 flip-flops, s298 has 14.
    for (name, dffs) in [("s27", 3), ("s298", 14)] {
        let text = std::fs::read_to_string(dir.join(format!("{name}.bench"))).unwrap();
        let d = read(name, &text);
        assert_eq!(
            d.registers.len(),
            dffs,
            "{name}: flip-flops as SOURCE.md counts them"
        );
        let c = rewrite(&d, |k| k % 2 == 1);
        // The pairing inductive by structure alone (tried first on large products) proves the
        // rewritten copies too.
        let structural = SeqOptions {
            structural_first: 0,
            ..options()
        };
        let rep = seq::check(&d, &c, &structural)
            .map_err(|e| format!("{e:?}"))
            .unwrap();
        assert_eq!(rep.verdict, "equivalent", "{name} (structural):\n{rep}");
        assert!(
            rep.pairing_evidence.contains("inductive by structure"),
            "{name}: {}",
            rep.pairing_evidence
        );
        let rep = seq::check(&d, &c, &options())
            .map_err(|e| format!("{e:?}"))
            .unwrap();
        assert_eq!(rep.verdict, "equivalent", "{name}:\n{rep}");
        // Every register that is not constant from reset is paired, inverted where rewritten so.
        for p in &rep.pairs {
            let k: usize = p.candidate["state_".len()..p.candidate.len() - 1]
                .parse()
                .unwrap();
            assert_eq!(p.inverted, (k - 100) % 2 == 1, "{name}: {p:?}");
            assert_eq!(p.found_by, "behaviour");
        }
        for u in &rep.unpaired {
            assert!(
                u.note.starts_with("constant") || u.note.starts_with("duplicate"),
                "{name}: {u:?}"
            );
        }
    }
}

/// Mutants: each gate's type swapped for its dual (AND<->OR, NAND<->NOR, NOT->BUF).
fn mutants(text: &str) -> Vec<String> {
    let lines: Vec<&str> = text.lines().collect();
    let mut out = Vec::new();
    for (i, l) in lines.iter().enumerate() {
        let swaps = [
            ("= AND(", "= OR("),
            ("= OR(", "= AND("),
            ("= NAND(", "= NOR("),
            ("= NOR(", "= NAND("),
            ("= NOT(", "= BUFF("),
        ];
        if let Some((a, b)) = swaps.iter().find(|(a, _)| l.contains(a)) {
            let mut m = lines.clone();
            let new = l.replace(a, b);
            m[i] = &new;
            out.push(m.join("\n"));
        }
    }
    out
}

/// The per-cycle inputs of a trace, by name.
fn cycles_of(t: &Trace) -> Vec<BTreeMap<String, bool>> {
    t.cycles
        .iter()
        .map(|c| c.inputs.iter().map(|i| (i.name.clone(), i.value)).collect())
        .collect()
}

#[test]
fn iscas89_mutants_differ_with_traces_the_oracle_replays() {
    let Some(dir) = iscas89() else { return };
    for name in ["s27", "s298"] {
        let text = std::fs::read_to_string(dir.join(format!("{name}.bench"))).unwrap();
        let d = read(name, &text);
        let reference = seq_oracle::parse(&text);
        let (mut different, mut total) = (0, 0);
        // Every mutant twice: with the SAT refinement of the pairing, and with the pairing
        // inductive by structure alone first (as on large products); both must agree with the
        // oracle.
        let structural = SeqOptions {
            structural_first: 0,
            ..options()
        };
        for (m, o) in mutants(&text)
            .into_iter()
            .flat_map(|m| [(m.clone(), options()), (m, structural.clone())])
        {
            total += 1;
            let c = read("mutant", &m);
            let rep = seq::check(&d, &c, &o).unwrap();
            let mutant = seq_oracle::parse(&m);
            match rep.verdict {
                "different" => {
                    different += 1;
                    let t = rep.trace.as_ref().unwrap();
                    let fd = t.first_difference.as_ref().unwrap();
                    let ins = cycles_of(t);
                    let (a, b) = (reference.run(&ins), mutant.run(&ins));
                    let first = (0..ins.len()).find(|&k| a[k] != b[k]);
                    assert_eq!(
                        first,
                        Some(fd.cycle),
                        "{name}: the oracle's first difference"
                    );
                    for o in &fd.outputs {
                        let j = reference
                            .outputs
                            .iter()
                            .position(|x| *x == o.reference)
                            .unwrap();
                        assert_eq!(
                            (a[fd.cycle][j], b[fd.cycle][j]),
                            (o.reference_value, o.candidate_value)
                        );
                    }
                }
                "equivalent" | "undecided" => {
                    // Then no run of the oracle may tell them apart: 64 random runs of 200 cycles
                    // (equivalent), or of the cycles the unrolling checked (undecided).
                    let len = if rep.verdict == "equivalent" {
                        200
                    } else {
                        rep.cycles_checked
                    };
                    if rep.verdict == "undecided" {
                        assert_eq!(rep.cycles_checked, rep.cycles_asked, "{name}: {rep}");
                    }
                    let mut rng = equicone::rng::SplitMix64::new(0x1234_5678, 0);
                    for _ in 0..64 {
                        let ins: Vec<BTreeMap<String, bool>> = (0..len)
                            .map(|_| {
                                reference
                                    .inputs
                                    .iter()
                                    .map(|i| (i.clone(), rng.next_u64() & 1 == 1))
                                    .collect()
                            })
                            .collect();
                        assert_eq!(
                            reference.run(&ins),
                            mutant.run(&ins),
                            "{name}: an equivalent mutant differs"
                        );
                    }
                }
                v => panic!("{name}: verdict {v}:\n{rep}"),
            }
        }
        eprintln!("{name}: {different} of {total} mutants different");
        assert!(
            different * 2 > total,
            "{name}: only {different} of {total} mutants differ"
        );
    }
}

#[test]
fn icarus_replays_every_trace_to_the_same_first_difference() {
    let Some(dir) = iscas89() else { return };
    if !common::iverilog_available() {
        return;
    }
    let mut checked = 0;
    for name in ["s27", "s298"] {
        let text = std::fs::read_to_string(dir.join(format!("{name}.bench"))).unwrap();
        let d = read(name, &text);
        let reference = seq_oracle::parse(&text);
        // Every other mutant with the pairing inductive by structure alone tried first (as on
        // large products), so that Icarus replays the traces of both paths.
        let structural = SeqOptions {
            structural_first: 0,
            ..options()
        };
        for (k, m) in mutants(&text).into_iter().enumerate() {
            let c = read("mutant", &m);
            let o = if k % 2 == 1 {
                structural.clone()
            } else {
                options()
            };
            let rep = seq::check(&d, &c, &o).unwrap();
            let Some(t) = rep.trace.as_ref() else {
                continue;
            };
            let fd = t.first_difference.as_ref().unwrap();
            let mutant = seq_oracle::parse(&m);
            // A testbench: both designs from reset (registers at 0), the trace's inputs applied each
            // cycle, outputs compared before the clock edge; it prints the first differing cycle and
            // the differing outputs.
            let mut tb = reference.verilog("ref_m") + &mutant.verilog("cand_m");
            tb += "module tb;\n  reg clk = 0;\n";
            let esc = |s: &str| format!("\\{s} ");
            for i in &reference.inputs {
                tb += &format!("  reg {};\n", esc(i));
            }
            for o in &reference.outputs {
                tb += &format!(
                    "  wire {}, {};\n",
                    esc(&format!("r_{o}")),
                    esc(&format!("c_{o}"))
                );
            }
            let conn = |p: &str| {
                let mut s: Vec<String> = vec![".clk(clk)".into()];
                s.extend(
                    reference
                        .inputs
                        .iter()
                        .map(|i| format!(".{}({})", esc(i), esc(i))),
                );
                s.extend(
                    reference
                        .outputs
                        .iter()
                        .map(|o| format!(".{}({})", esc(o), esc(&format!("{p}_{o}")))),
                );
                s.join(", ")
            };
            tb += &format!("  ref_m r({});\n  cand_m c({});\n", conn("r"), conn("c"));
            tb += "  integer found = 0;\n  initial begin\n";
            for cyc in &t.cycles {
                for i in &cyc.inputs {
                    tb += &format!("    {} = {};\n", esc(&i.name), i.value as u8);
                }
                tb += "    #1;\n";
                for o in &reference.outputs {
                    tb += &format!(
                    "    if (found == 0 && {} !== {}) $display(\"cycle {} output {} %b %b\", {}, {});\n",
                    esc(&format!("r_{o}")), esc(&format!("c_{o}")), cyc.cycle, o, esc(&format!("r_{o}")), esc(&format!("c_{o}"))
                );
                }
                tb += &format!(
                    "    if (found == 0 && ({})) found = 1;\n",
                    reference
                        .outputs
                        .iter()
                        .map(|o| format!(
                            "{} !== {}",
                            esc(&format!("r_{o}")),
                            esc(&format!("c_{o}"))
                        ))
                        .collect::<Vec<_>>()
                        .join(" || ")
                );
                tb += "    clk = 1; #1; clk = 0; #1;\n";
            }
            tb += "  end\nendmodule\n";
            let out = common::run_iverilog(&tb, "tb");
            let want: Vec<String> = fd
                .outputs
                .iter()
                .map(|o| {
                    format!(
                        "cycle {} output {} {} {}",
                        fd.cycle, o.reference, o.reference_value as u8, o.candidate_value as u8
                    )
                })
                .collect();
            let got: Vec<String> = out
                .lines()
                .map(|l| l.trim().to_string())
                .filter(|l| !l.is_empty())
                .collect();
            assert_eq!(got, want, "Icarus Verilog disagrees with the trace:\n{tb}");
            checked += 1;
        }
    }
    eprintln!("Icarus Verilog replayed {checked} traces");
    assert!(checked > 0, "no mutant gave a trace");
}

/// A 4-bit counter mod 10 in bench text: `wrap` is the test `q == 9` (reference) or `q >= 9`
/// (the rewrite; the same on states 0..9, different on 10..15, which reset never reaches).
/// `wrap_at` 8 instead gives a real bug.
fn counter(rewrite: bool, wrap_at: u32) -> String {
    let mut s = String::from("INPUT(en)\nOUTPUT(q0)\nOUTPUT(q1)\nOUTPUT(q2)\nOUTPUT(q3)\n");
    for k in 0..4 {
        s += &format!("q{k} = DFF(n{k})\n");
        s += &format!("nq{k} = NOT(q{k})\n");
    }
    // Increment when enabled: carry chain.
    s += "c0 = BUFF(en)\n";
    for k in 0..4 {
        s += &format!("i{k} = XOR(q{k}, c{k})\n");
        s += &format!("c{} = AND(q{k}, c{k})\n", k + 1);
    }
    let lit = |k: u32| {
        if wrap_at >> k & 1 == 1 {
            format!("q{k}")
        } else {
            format!("nq{k}")
        }
    };
    if rewrite {
        // q >= 9: q3 & (q2 | q1 | q0)
        s += "any = OR(q2, q1, q0)\nw = AND(q3, any)\n";
    } else {
        s += &format!("w = AND({}, {}, {}, {})\n", lit(0), lit(1), lit(2), lit(3));
    }
    s += "wrap = AND(w, en)\nnwrap = NOT(wrap)\n";
    for k in 0..4 {
        s += &format!("n{k} = AND(i{k}, nwrap)\n");
    }
    s
}

#[test]
fn counter_mod_10_differing_only_in_unreachable_states_is_never_different() {
    let r = read("ref", &counter(false, 9));
    let c = read("cand", &counter(true, 9));
    // The counter starts at 0 (the convention for registers without a reset). With free initial
    // values instead, states 10..15 are possible starting states and `different` is right.
    let o = SeqOptions {
        init_unset: InitUnset::Value(false),
        cycles: 30,
        ..SeqOptions::default()
    };
    let rep = seq::check(&r, &c, &o).unwrap();
    assert_ne!(rep.verdict, "different", "{rep}");
    if rep.verdict == "undecided" {
        assert_eq!(rep.cycles_checked, 30, "{rep}");
        assert!(
            rep.to_string()
                .contains("no difference in the first 30 cycles"),
            "{rep}"
        );
    }
    // A real bug (wrapping at 8) is found, first on the ninth enabled cycle.
    let bug = read("bug", &counter(false, 8));
    let rep = seq::check(&r, &bug, &options()).unwrap();
    assert_eq!(rep.verdict, "different", "{rep}");
    let t = rep.trace.unwrap();
    assert_eq!(t.first_difference.as_ref().unwrap().cycle, 9);
    let by_oracle = seq_oracle::parse(&counter(false, 9)).run(&cycles_of(&t));
    let by_oracle_bug = seq_oracle::parse(&counter(false, 8)).run(&cycles_of(&t));
    assert_eq!((0..10).find(|&k| by_oracle[k] != by_oracle_bug[k]), Some(9));
}

#[test]
fn a_design_against_itself_with_free_initial_values_is_equivalent() {
    let r = read("ref", &counter(false, 9));
    let rep = seq::check(&r, &r.clone(), &SeqOptions::default()).unwrap();
    assert_eq!(rep.verdict, "equivalent", "{rep}");
    assert!(rep
        .pairs
        .iter()
        .all(|p| p.found_by == "name" && !p.inverted));
    assert!(
        r.inputs
            .iter()
            .filter(|b| matches!(b.kind, InputKind::Register))
            .count()
            == 4
    );
    let _ = Side::Both;
}

#[test]
fn cli_prove_gives_a_trace_that_eval_replays() {
    let dir = tempfile::tempdir().unwrap();
    let r = dir.path().join("ref.bench");
    let c = dir.path().join("bug.bench");
    std::fs::write(&r, counter(false, 9)).unwrap();
    std::fs::write(&c, counter(false, 8)).unwrap();
    let rep = dir.path().join("rep.json");
    let v = cli_json(
        None,
        &[
            &"prove",
            &"--init-unset",
            &"0",
            &"--json",
            &"--report",
            &rep,
            &r,
            &c,
        ],
        1,
    );
    assert_eq!(v["verdict"], "different");
    let cycles = v["trace"]["cycles"].as_array().unwrap();
    assert_eq!(cycles.len(), 10);
    assert!(cycles.iter().all(|c| c["inputs"][0]["name"] == "en"));
    assert_eq!(v["trace"]["first_difference"]["cycle"], 9);
    // Text: one row per cycle, the first difference marked.
    let (text, _) = cli(None, &[&"prove", &"--init-unset", &"0", &r, &c], 1);
    assert!(text.contains("<- first difference"), "{text}");
    assert!(text.contains("verdict: different"), "{text}");
    // Every report says what its verdict covers (project rule: a proof covers the netlist as
    // modeled, one clock cycle per step, not timing).
    assert!(
        text.lines().nth(1).is_some_and(
            |l| l.starts_with("scope: ") && l.contains("one step per clock cycle from reset")
        ),
        "{text}"
    );
    assert!(
        v["scope"].as_str().is_some_and(|s| s.contains("timing")),
        "{v}"
    );
    // eval steps each design through the trace: they part in cycle 9.
    let run = |design: &PathBuf, side: &str| trace_outputs(&rep, design, side);
    let (a, b) = (run(&r, "reference"), run(&c, "candidate"));
    assert_eq!((0..10).find(|&k| a[k] != b[k]), Some(9));
}

/// `stats` of a clocked design under the state cut, against counts made by hand on s27 as
/// published (shared data, `iscas89/s27.bench`; its SOURCE.md gives 10 gates: 2 NOT, 1 AND,
/// 1 NAND, 2 OR, 4 NOR). The register inputs are G10 (of G5), G11 (of G6), G13 (of G7).
#[test]
fn stats_of_s27_under_the_state_cut_match_a_hand_count() {
    let Some(dir) = iscas89() else { return };
    let text = std::fs::read_to_string(dir.join("s27.bench")).unwrap();
    let d = read("s27", &text);
    let rep = equicone::cost::stats(
        &d,
        &equicone::cost::CostModel::unit(),
        &equicone::sat::Limits::none(),
    );
    assert_eq!((rep.outputs, rep.registers), (1, 3));
    assert_eq!(rep.written.as_ref().unwrap().gates, 10);
    let row = |name: &str| {
        let o = rep.per_output.iter().find(|o| o.name == name).unwrap();
        (
            o.register.clone(),
            o.support,
            o.gates.unwrap(),
            o.gate_bound,
            o.depth.unwrap(),
            o.depth_bound,
        )
    };
    // G13 = NOR(G2, G12), G12 = NOR(G1, G7): 2 gates, depth 2, support {G1, G2, G7}; 3 inputs
    // need 2 two-input gates and depth ceil(log2 3) = 2.
    assert_eq!(row("next(G7)"), (Some("G7".into()), 3, 2, 2, 2, 2));
    // G11 = NOR(G5, G9), G9 = NAND(G16, G15), G16 = OR(G3, G8), G15 = OR(G12, G8),
    // G8 = AND(G14, G6), G14 = NOT(G0), G12 = NOR(G1, G7): 7 gates, longest path
    // G14 G8 G15 G9 G11 = depth 5; support {G0, G1, G3, G5, G6, G7}: bounds 5 gates, depth 3.
    assert_eq!(row("next(G6)"), (Some("G6".into()), 6, 7, 5, 5, 3));
    // G10 = NOR(G14, G11) = G0 AND (G5 OR G9): its cone is G11's plus G10 (8 gates, depth 6);
    // G10 = 1 needs G0 = 1, which makes G8 = 0, so G6 is not in its support: 5 inputs,
    // bounds 4 gates and depth 3.
    assert_eq!(row("next(G5)"), (Some("G5".into()), 5, 8, 4, 6, 3));
    // The port output as before: G17 = NOT(G11).
    assert_eq!(row("G17"), (None, 6, 8, 5, 6, 3));
    let text = rep.to_string();
    assert!(
        text.contains(
            "inputs 7 (3 of them register outputs), outputs 1, register inputs 3 (state cut)"
        ),
        "{text}"
    );
    assert!(text.contains("note: state cut:"), "{text}");
}

/// `eval --json --side SIDE --trace REPORT DESIGN`: the outputs of each cycle of the trace in
/// the saved report, stepped on `design` (the command must succeed).
fn trace_outputs(
    report: &std::path::Path,
    design: &std::path::Path,
    side: &str,
) -> Vec<serde_json::Value> {
    let v = cli_json(
        None,
        &[
            &"eval", &"--json", &"--side", &side, &"--trace", &report, &design,
        ],
        0,
    );
    v["cycles"]
        .as_array()
        .unwrap()
        .iter()
        .map(|c| c["outputs"].clone())
        .collect()
}
