//! Traces of clocked designs replayed outside equicone: random bench netlists with flip-flops
//! and their mutants. Every trace's VCD is read back by the independent reader
//! (`vcd_reader.rs`, IEEE 1364-2005 clause 18) and must hold, at each cycle, the values that the
//! independent cycle simulator (`seq/oracle.rs`, no equicone code) computes; every trace's
//! testbench is run by Icarus Verilog (Debian package iverilog), which must pass every cycle
//! before the first difference and FAIL in it; equivalent pairs pass random cycles under
//! Icarus; every per-cycle difference cube is checked by the oracle (every input sequence in
//! the cube differs in that cycle) and, for small unrollings, complete covers are checked to
//! count exactly the differing sequences.

use super::common::run_iverilog;
use super::oracle::random::Gates;
use super::seq_oracle::{self, SeqNet};
use super::vcd_reader::{self, Dump};
use super::vcommon::iverilog_available;
use equicone::design::Design;
use equicone::explain::cubes::{CoverEnd, CubeLimits};
use equicone::explain::testbench::TbDesign;
use equicone::explain::trace_bench::trace_testbench;
use equicone::explain::trace_cubes::trace_cubes;
use equicone::explain::trace_run::random_trace;
use equicone::explain::trace_vcd::{design_trace_vcd, trace_vcd};
use equicone::explain::waves::{scope_name, scope_names};
use equicone::front::bench::read_bench;
use equicone::sat::Limits;
use equicone::seq::{self, InitUnset, SeqOptions, Side, Trace};
use rand::rngs::StdRng;
use rand::{Rng, SeedableRng};
use std::collections::BTreeMap;
use std::sync::Arc;

/// A random bench netlist with flip-flops (the gates from the tests' one generator,
/// `tests/oracle/random.rs`): inputs `i0..`, registers `q0..` (each loading a gate), gates of
/// fan-in 1 to 3 over earlier signals, outputs `y0..`; the candidate has one gate kind
/// changed when `mutate`, and its registers renamed `st_K` when `rename`.
pub fn random_seq_bench(
    seed: u64,
    (n, ffs, gates, outs): (usize, usize, usize, usize),
    mutate: bool,
    rename: bool,
) -> (String, String) {
    let mut rng = StdRng::seed_from_u64(seed);
    let c = Gates::random(&mut rng, n + ffs, gates);
    let loads: Vec<usize> = (0..ffs).map(|_| rng.gen_range(gates / 3..gates)).collect();
    let pick: Vec<usize> = (0..outs).map(|k| gates - 1 - k * 3).collect();
    let mutated = rng.gen_range(gates / 2..gates);
    let text = |mutated: Option<usize>, rename: bool| {
        let name = |s: usize| {
            if s < n {
                format!("i{s}")
            } else if s < n + ffs {
                if rename {
                    format!("st_{}", s - n)
                } else {
                    format!("q{}", s - n)
                }
            } else {
                format!("g{}", s - n - ffs)
            }
        };
        let mut s = String::new();
        for i in 0..n {
            s += &format!("INPUT(i{i})\n");
        }
        for k in 0..outs {
            s += &format!("OUTPUT(y{k})\n");
        }
        for (k, &g) in loads.iter().enumerate() {
            s += &format!("{} = DFF(g{g})\n", name(n + k));
        }
        s += &c.lines(mutated, &name);
        for (k, &p) in pick.iter().enumerate() {
            s += &format!("y{k} = BUFF(g{p})\n");
        }
        s
    };
    (text(None, false), text(mutate.then_some(mutated), rename))
}

fn read(name: &str, text: &str) -> Design {
    read_bench(&Arc::from(name), text).expect("reads")
}

fn options() -> SeqOptions {
    SeqOptions {
        init_unset: InitUnset::Value(false),
        cycles: 12,
        ..SeqOptions::default()
    }
}

/// The trace's inputs per cycle, by name (every trace input here belongs to both designs).
fn cycles_of(t: &Trace) -> Vec<BTreeMap<String, bool>> {
    t.cycles
        .iter()
        .map(|c| c.inputs.iter().map(|i| (i.name.clone(), i.value)).collect())
        .collect()
}

/// Per cycle, (outputs, state) of the oracle from the all-zero state.
fn oracle_run(
    n: &SeqNet,
    cycles: &[BTreeMap<String, bool>],
) -> Vec<(Vec<bool>, BTreeMap<String, bool>)> {
    let mut state: BTreeMap<String, bool> =
        n.dffs.iter().map(|(q, _)| (q.clone(), false)).collect();
    let mut out = Vec::new();
    for ins in cycles {
        let (o, next) = n.step(ins, &state);
        out.push((o, state.clone()));
        state = next;
    }
    out
}

fn one(d: &Dump, scope: &str, name: &str, t: u64) -> Option<bool> {
    d.value(scope, name, t).map(|v| v == "1")
}

/// The VCD of `t` read back: inputs, outputs and registers of both designs at each cycle's
/// time as the oracle computes them, `differs` only in the last cycle.
fn check_vcd(r: &Design, c: &Design, (rn, cn): (&SeqNet, &SeqNet), t: &Trace) {
    let text = trace_vcd(r, c, t).expect("a dump");
    let dump = vcd_reader::parse(&text);
    let (rs, cs) = scope_names(r, c);
    let cycles = cycles_of(t);
    let (ro, co) = (oracle_run(rn, &cycles), oracle_run(cn, &cycles));
    let last = t.cycles.len() - 1;
    for (k, ins) in cycles.iter().enumerate() {
        let at = 10 * (k as u64 + 1);
        for (scope, net, run) in [(&rs, rn, &ro), (&cs, cn, &co)] {
            for (name, &v) in ins {
                assert_eq!(
                    one(&dump, scope, name, at),
                    Some(v),
                    "{scope}.{name} at cycle {k}"
                );
            }
            for (o, &v) in net.outputs.iter().zip(&run[k].0) {
                assert_eq!(
                    one(&dump, scope, o, at),
                    Some(v),
                    "{scope}.{o} at cycle {k}\n{text}"
                );
            }
            for (q, &v) in &run[k].1 {
                assert_eq!(
                    one(&dump, &format!("{scope}.registers"), q, at),
                    Some(v),
                    "{scope}.registers.{q} at cycle {k}"
                );
            }
        }
        assert_eq!(one(&dump, "trace", "differs", at), Some(k == last));
        assert_eq!(one(&dump, "trace", "clock", at), Some(false));
        assert_eq!(one(&dump, "trace", "clock", at + 5), Some(true));
        let n = dump.value("trace", "cycle", at).expect("cycle number");
        assert_eq!(u64::from_str_radix(&n, 2).ok(), Some(k as u64));
    }
    assert_eq!(one(&dump, "trace", "reset", 0), Some(true));
    // eval --trace --vcd: one design's scope holds the same values.
    let one_side = design_trace_vcd(c, Side::Candidate, t).expect("a dump");
    let d1 = vcd_reader::parse(&one_side);
    for (k, (outs, _)) in co.iter().enumerate() {
        for (o, &v) in cn.outputs.iter().zip(outs) {
            assert_eq!(one(&d1, &scope_name(c), o, 10 * (k as u64 + 1)), Some(v));
        }
    }
}

/// Run the testbench of `t` under Icarus; returns its output lines.
fn icarus(r: &Design, c: &Design, t: &Trace) -> Vec<String> {
    let tb = trace_testbench(
        &TbDesign {
            design: r,
            files: vec![],
        },
        &TbDesign {
            design: c,
            files: vec![],
        },
        t,
    )
    .expect("a testbench");
    let dir = tempfile::tempdir().expect("temp dir");
    let p = dir.path().join("tb.v");
    std::fs::write(&p, &tb.text).expect("write");
    run_iverilog(&[p.as_path()])
        .lines()
        .map(|l| l.trim().to_string())
        .filter(|l| !l.is_empty())
        .collect()
}

/// Every sequence in each cube differs in the trace's last cycle on the explained pair
/// (oracle); complete covers of at most 14 unrolled inputs count exactly the differing ones.
fn check_cubes(
    r: &Design,
    c: &Design,
    (rn, cn): (&SeqNet, &SeqNet),
    t: &Trace,
    seed: u64,
) -> usize {
    let e = trace_cubes(r, c, t, &CubeLimits::default(), &Limits::none()).expect("cubes");
    let k = e.cycle;
    assert_eq!(k, t.cycles.len() - 1);
    let oi = rn
        .outputs
        .iter()
        .position(|o| *o == e.reference)
        .expect("output");
    let names: Vec<String> = t.cycles[0].inputs.iter().map(|i| i.name.clone()).collect();
    let differs = |seq: &[BTreeMap<String, bool>]| {
        let (a, b) = (oracle_run(rn, seq), oracle_run(cn, seq));
        a[k].0[oi] != b[k].0[oi]
    };
    let mut rng = StdRng::seed_from_u64(seed);
    for cube in &e.cubes {
        for _ in 0..64 {
            let seq: Vec<BTreeMap<String, bool>> = (0..=k)
                .map(|cy| {
                    names
                        .iter()
                        .map(|nm| {
                            let fixed = cube
                                .iter()
                                .find(|ci| ci.cycle == cy)
                                .and_then(|ci| ci.inputs.get(nm))
                                .map(|v| v.as_u64() == Some(1));
                            (nm.clone(), fixed.unwrap_or_else(|| rng.gen()))
                        })
                        .collect()
                })
                .collect();
            assert!(
                differs(&seq),
                "a sequence in cube {cube:?} does not differ in cycle {k}"
            );
        }
    }
    // Cubes are disjoint: two cubes fix some input of some cycle to opposite values.
    for (a, ca) in e.cubes.iter().enumerate() {
        for cb in &e.cubes[a + 1..] {
            let opposite = ca.iter().any(|x| {
                cb.iter().any(|y| {
                    y.cycle == x.cycle
                        && x.inputs
                            .iter()
                            .any(|(n, v)| y.inputs.get(n).is_some_and(|w| w != v))
                })
            });
            assert!(opposite, "cubes overlap: {ca:?} {cb:?}");
        }
    }
    let total = names.len() * (k + 1);
    if e.end == CoverEnd::Complete && total <= 14 {
        let mut count = 0u64;
        for m in 0u64..1 << total {
            let seq: Vec<BTreeMap<String, bool>> = (0..=k)
                .map(|cy| {
                    names
                        .iter()
                        .enumerate()
                        .map(|(j, nm)| (nm.clone(), (m >> (cy * names.len() + j)) & 1 == 1))
                        .collect()
                })
                .collect();
            count += differs(&seq) as u64;
        }
        let n = e
            .differing_sequences
            .as_ref()
            .and_then(|v| v.as_u64())
            .expect("a count");
        assert_eq!(count, n << (total - e.inputs), "differing sequences");
    }
    e.cubes.len()
}

#[test]
fn clocked_traces_replay_in_vcds_testbenches_and_cubes() {
    let ivl = iverilog_available();
    let (mut traces, mut cubes, mut equal) = (0, 0, 0);
    for seed in 0..40u64 {
        let size = if seed % 2 == 0 {
            (3, 3, 14, 2)
        } else {
            (4, 5, 30, 3)
        };
        let (rt, ct) = random_seq_bench(seed, size, true, seed % 3 == 0);
        let (r, c) = (read("ref.bench", &rt), read("cand.bench", &ct));
        let (rn, cn) = (seq_oracle::parse(&rt), seq_oracle::parse(&ct));
        let rep = seq::check(&r, &c, &options()).expect("checks");
        match &rep.trace {
            Some(t) => {
                traces += 1;
                check_vcd(&r, &c, (&rn, &cn), t);
                cubes += check_cubes(&r, &c, (&rn, &cn), t, seed);
                if ivl {
                    let out = icarus(&r, &c, t);
                    let last = t.cycles.len() - 1;
                    let mut want: Vec<String> =
                        (0..last).map(|k| format!("cycle {k}: pass")).collect();
                    let fd = t.first_difference.as_ref().expect("a difference");
                    want.push(format!(
                        "cycle {last}: FAIL, {} of {} output pairs differ",
                        fd.outputs.len(),
                        r.outputs.len()
                    ));
                    want.push(format!("equicone testbench: 1 of {} cycles FAIL", last + 1));
                    assert_eq!(out, want, "seed {seed}");
                }
            }
            None if rep.verdict == "equivalent" && ivl => {
                equal += 1;
                let t = random_trace(&r, &c, &rep.held, InitUnset::Value(false), 40, seed);
                let out = icarus(&r, &c, &t);
                assert_eq!(
                    out.last().map(String::as_str),
                    Some("equicone testbench: 0 of 40 cycles FAIL")
                );
            }
            None => {}
        }
    }
    eprintln!("{traces} traces, {cubes} cubes, {equal} equivalent mutants under Icarus");
    assert!(traces >= 10, "only {traces} mutants gave traces");
}

#[test]
fn renamed_copies_are_equivalent_and_pass_random_cycles_under_icarus() {
    if !iverilog_available() {
        return;
    }
    for seed in 100..106u64 {
        let (rt, ct) = random_seq_bench(seed, (4, 4, 24, 2), false, true);
        let (r, c) = (read("ref.bench", &rt), read("cand.bench", &ct));
        let rep = seq::check(&r, &c, &options()).expect("checks");
        assert_eq!(rep.verdict, "equivalent", "seed {seed}:\n{rep}");
        let t = random_trace(&r, &c, &rep.held, InitUnset::Value(false), 64, seed);
        let out = icarus(&r, &c, &t);
        assert_eq!(out.len(), 65);
        assert!(out[..64].iter().all(|l| l.ends_with(": pass")), "{out:?}");
        assert_eq!(out[64], "equicone testbench: 0 of 64 cycles FAIL");
    }
}

/// A 2-bit counter with enable `en` (reference) and a rewrite whose carry into the high bit is
/// `q0 | en` instead of `q0 & en`; `y = q1 & d`.
const COUNTER: &str = "INPUT(en)\nINPUT(d)\nOUTPUT(y)\nq0 = DFF(n0)\nq1 = DFF(n1)\nn0 = XOR(q0, en)\nc0 = AND(q0, en)\nn1 = XOR(q1, c0)\ny = AND(q1, d)\n";

#[test]
fn command_line_writes_trace_files_and_cubes() {
    let dir = tempfile::tempdir().expect("temp dir");
    let (rp, cp) = (
        dir.path().join("count.bench"),
        dir.path().join("count_or.bench"),
    );
    std::fs::write(&rp, COUNTER).expect("write");
    std::fs::write(&cp, COUNTER.replace("c0 = AND", "c0 = OR")).expect("write");
    let (vcd, tb, json_path) = (
        dir.path().join("t.vcd"),
        dir.path().join("tb.v"),
        dir.path().join("r.json"),
    );
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_equicone"))
        .arg("prove")
        .args([&rp, &cp])
        .args(["--init-unset", "0", "--explain", "--json", "--vcd"])
        .arg(&vcd)
        .arg("--testbench")
        .arg(&tb)
        .arg("--report")
        .arg(&json_path)
        .output()
        .expect("run equicone");
    assert_eq!(
        out.status.code(),
        Some(1),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let json: serde_json::Value = serde_json::from_slice(&out.stdout).expect("json");
    // By hand: from q = 00 the reference's q1 stays 0 in cycle 1; the rewrite's q1 becomes en
    // of cycle 0; y = q1 & d differs in cycle 1 exactly when en=1 in cycle 0 and d=1 in cycle
    // 1 (en of cycle 1 and d of cycle 0 do not reach y in cycle 1).
    let e = &json["explanation"];
    assert_eq!(e["cycle"], 1);
    assert_eq!(e["end"], "complete");
    assert_eq!(e["terms"][0], "cycle 0: en=1; cycle 1: d=1");
    assert_eq!(e["differing_sequences"], 1);
    assert_eq!(e["inputs"], 2);
    let dump = vcd_reader::parse(&std::fs::read_to_string(&vcd).expect("vcd written"));
    for (k, cyc) in json["trace"]["cycles"]
        .as_array()
        .expect("cycles")
        .iter()
        .enumerate()
    {
        for i in cyc["inputs"].as_array().expect("inputs") {
            let v = one(
                &dump,
                "count",
                i["name"].as_str().expect("name"),
                10 * (k as u64 + 1),
            );
            assert_eq!(v, i["value"].as_bool());
        }
    }
    assert_eq!(one(&dump, "count_or.registers", "q1", 20), Some(true));
    assert_eq!(one(&dump, "count.registers", "q1", 20), Some(false));
    if iverilog_available() {
        let o = run_iverilog(&[tb.as_path()]);
        assert_eq!(
            o.lines().collect::<Vec<_>>(),
            vec![
                "cycle 0: pass",
                "cycle 1: FAIL, 1 of 1 output pairs differ",
                "equicone testbench: 1 of 2 cycles FAIL"
            ]
        );
    }
    // eval --trace --vcd on the candidate.
    let ev = dir.path().join("e.vcd");
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_equicone"))
        .arg("eval")
        .arg(&cp)
        .arg("--trace")
        .arg(&json_path)
        .args(["--side", "candidate", "--vcd"])
        .arg(&ev)
        .output()
        .expect("run equicone");
    assert_eq!(
        out.status.code(),
        Some(0),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let d1 = vcd_reader::parse(&std::fs::read_to_string(&ev).expect("vcd written"));
    assert_eq!(one(&d1, "count_or", "y", 20), Some(true));
    assert_eq!(one(&d1, "count_or.registers", "q1", 20), Some(true));
    // Without a difference: random cycles, all pass.
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_equicone"))
        .arg("prove")
        .args([&rp, &rp])
        .args(["--init-unset", "0", "--testbench"])
        .arg(&tb)
        .output()
        .expect("run equicone");
    assert_eq!(out.status.code(), Some(0));
    if iverilog_available() {
        let o = run_iverilog(&[tb.as_path()]);
        assert!(
            o.ends_with("equicone testbench: 0 of 32 cycles FAIL\n"),
            "{o}"
        );
    }
}

/// Demo step 5 (clocked Verilog, both files define `t7_sensor_reg`): r4 proved with its inverted
/// register bit; r5's trace first differs in cycle 2; `demo --write` writes its VCD (read back:
/// r4-style inverted storage shows as dout_r[5] = 1 from reset) and a testbench that Icarus runs
/// with the designs' own files; r4 passes random cycles under Icarus.
#[test]
fn demo_step_five_replays_in_a_vcd_and_under_icarus() {
    let out = equicone::demo::run().expect("demo runs");
    let five = &out[out.find("== 5.").expect("step 5")..];
    assert!(
        five.contains("y[5]    = !dout_r[5]   by behaviour, inverted"),
        "{five}"
    );
    assert!(
        five.contains("the designs first differ in cycle 2 after reset"),
        "{five}"
    );
    // The cube names one bit of channel 9 against the same bit of channel 10 (which output bit
    // the unrolling reports first is the solver's choice).
    let line = five
        .lines()
        .find_map(|l| l.strip_prefix("    cycle 1: sel=9, ch["))
        .unwrap_or_else(|| panic!("{five}"));
    let (a, b) = line
        .strip_suffix(']')
        .and_then(|l| l.split_once("]!=ch["))
        .and_then(|(a, b)| Some((a.parse::<usize>().ok()?, b.parse::<usize>().ok()?)))
        .unwrap_or_else(|| panic!("{five}"));
    assert!((72..80).contains(&a) && b == a + 8, "{five}");
    let dir = tempfile::tempdir().expect("temp dir");
    let o = std::process::Command::new(env!("CARGO_BIN_EXE_equicone"))
        .arg("demo")
        .arg("--write")
        .arg(dir.path())
        .output()
        .expect("run equicone");
    assert_eq!(o.status.code(), Some(0));
    let f = equicone::demo::FILES;
    let (spec, r4, r5) = (
        equicone::demo::load(3),
        equicone::demo::load(4),
        equicone::demo::load(5),
    );
    let rep = equicone::demo::clocked(&spec, &r5).expect("checks");
    let t = rep.trace.expect("a trace");
    let dump = vcd_reader::parse(
        &std::fs::read_to_string(dir.path().join("t7_sensor_reg_r5.vcd")).expect("vcd"),
    );
    let (rs, cs) = scope_names(&spec, &r5);
    for (k, cyc) in t.cycles.iter().enumerate() {
        let at = 10 * (k as u64 + 1);
        let sel: u64 = (0..4)
            .map(|i| {
                (cyc.inputs
                    .iter()
                    .find(|x| x.name == format!("sel[{i}]"))
                    .expect("sel")
                    .value as u64)
                    << i
            })
            .sum();
        let v = dump.value(&rs, "sel", at).expect("sel");
        assert_eq!(u64::from_str_radix(&v, 2).ok(), Some(sel), "cycle {k}");
        assert_eq!(one(&dump, "trace", "differs", at), Some(k == 2));
    }
    let bit5 = |scope: &str, name: &str, t: u64| {
        dump.value(&format!("{scope}.registers"), name, t)
            .map(|v| v.as_bytes()[v.len() - 1 - 5] == b'1')
    };
    assert_eq!(
        bit5(&cs, "dout_r", 10),
        Some(true),
        "stored inverted from reset"
    );
    assert_eq!(bit5(&rs, "y", 10), Some(false));
    if !iverilog_available() {
        return;
    }
    let tb = dir.path().join("t7_sensor_reg_r5_tb.v");
    let spec_file = dir.path().join("t7_sensor_reg_spec.v");
    let out = run_iverilog(&[tb.as_path(), spec_file.as_path()]);
    let lines: Vec<&str> = out.lines().collect();
    // Icarus counts as many differing output pairs in cycle 2 as the trace reports.
    let rep5 = equicone::demo::clocked(&spec, &r5).expect("checks");
    let differing = rep5
        .trace
        .as_ref()
        .and_then(|t| t.first_difference.as_ref())
        .map_or(0, |d| d.outputs.len());
    assert!(differing > 0, "{out}");
    let fail = format!("cycle 2: FAIL, {differing} of 10 output pairs differ");
    assert_eq!(
        lines,
        vec![
            "cycle 0: pass",
            "cycle 1: pass",
            fail.as_str(),
            "equicone testbench: 1 of 3 cycles FAIL"
        ],
        "{out}"
    );
    // r4: random cycles from reset, all pass (both files define t7_sensor_reg).
    let rep4 = equicone::demo::clocked(&spec, &r4).expect("checks");
    assert_eq!(rep4.verdict, "equivalent");
    let rt = random_trace(&spec, &r4, &rep4.held, InitUnset::Free, 200, 9);
    let files = |k: usize| {
        let p = dir.path().join(f[k].0);
        vec![(p.display().to_string(), f[k].1.to_string())]
    };
    let tb4 = trace_testbench(
        &TbDesign {
            design: &spec,
            files: files(3),
        },
        &TbDesign {
            design: &r4,
            files: files(4),
        },
        &rt,
    )
    .expect("a testbench");
    let p = dir.path().join("tb4.v");
    std::fs::write(&p, &tb4.text).expect("write");
    let mut paths = vec![p.clone()];
    paths.extend(tb4.compile_with.iter().map(std::path::PathBuf::from));
    let refs: Vec<&std::path::Path> = paths.iter().map(|p| p.as_path()).collect();
    let out = run_iverilog(&refs);
    assert!(
        out.ends_with("equicone testbench: 0 of 200 cycles FAIL\n"),
        "{out}"
    );
    assert_eq!(out.lines().filter(|l| l.ends_with(": pass")).count(), 200);
}
