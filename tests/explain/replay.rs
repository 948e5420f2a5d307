//! Counterexamples replayed outside equicone: every VCD written is read back by the
//! independent reader (`vcd_reader.rs`, from IEEE 1364-2005 clause 18) and must hold each
//! counterexample's input and output values; every testbench written is run by Icarus Verilog
//! (Debian package iverilog), which must report FAIL for every counterexample and pass for
//! random vectors on equivalent pairs.

use super::common::{design, prove, random_bench, run_iverilog};
use super::vcd_reader::{self, Dump};
use super::vcommon::iverilog_available;
use equicone::design::Design;
use equicone::engine::{ProveReport, Shared, Verdict};
use equicone::explain::testbench::{testbench, TbDesign};
use equicone::explain::waves::{counterexample_vcd, scope_names};
use rand::rngs::StdRng;
use rand::{Rng, SeedableRng};
use std::process::Command;

/// The value of bit `name` (`p` or `p[i]`) in `scope` at time `t`, from the dump.
fn bit(d: &Dump, scope: &str, name: &str, t: u64) -> Option<bool> {
    let (port, idx) = match name.rfind('[') {
        Some(o) if name.ends_with(']') => {
            (&name[..o], name[o + 1..name.len() - 1].parse::<i64>().ok())
        }
        _ => (name, None),
    };
    let state = d.at.get(&t)?;
    for v in d.vars.iter().filter(|v| v.scope == scope) {
        let val = state.get(&v.code)?;
        if v.name == name && v.size == 1 {
            return Some(val == "1");
        }
        if v.name != port {
            continue;
        }
        let Some(i) = idx else { continue };
        let r = v.range.trim_start_matches('[').trim_end_matches(']');
        let (m, l) = match r.split_once(':') {
            Some((m, l)) => (m.parse::<i64>().ok()?, l.parse::<i64>().ok()?),
            None => (r.parse::<i64>().ok()?, r.parse::<i64>().ok()?),
        };
        let pos = if m >= l { m - i } else { i - m };
        if (0..v.size as i64).contains(&pos) && i.clamp(m.min(l), m.max(l)) == i {
            return Some(val.as_bytes()[pos as usize] == b'1');
        }
    }
    None
}

/// Write the VCD of `rep`'s counterexamples, read it back and find every value in it.
fn check_vcd(r: &Design, c: &Design, shared: &Shared, rep: &ProveReport) {
    let text = counterexample_vcd(r, c, shared, &rep.counterexamples, true);
    let dump = vcd_reader::parse(&text);
    let (rs, cs) = scope_names(r, c);
    assert_eq!(
        dump.scopes(),
        vec![rs.clone(), cs.clone(), "compare".to_string()]
    );
    for (t, cx) in rep.counterexamples.iter().enumerate() {
        let t = t as u64;
        for iv in cx.inputs.iter().filter(|i| !i.unknown) {
            if iv.side.word() != "candidate" {
                assert_eq!(
                    bit(&dump, &rs, &iv.name, t),
                    Some(iv.value),
                    "{} at {t}",
                    iv.name
                );
            }
            if iv.side.word() == "both" && r.inputs.iter().any(|b| b.name == iv.name) {
                assert_eq!(
                    bit(&dump, &cs, &iv.name, t),
                    Some(iv.value),
                    "{} at {t}",
                    iv.name
                );
            }
        }
        for d in &cx.differing {
            assert_eq!(bit(&dump, &rs, &d.reference, t), Some(d.reference_value));
            assert_eq!(bit(&dump, &cs, &d.candidate, t), Some(d.candidate_value));
        }
        assert_eq!(dump.value("compare", "differs", t).as_deref(), Some("1"));
        let n = dump.value("compare", "vector", t).expect("vector number");
        assert_eq!(u64::from_str_radix(&n, 2).ok(), Some(t + 1));
    }
}

/// Write the testbench applying `vectors`, run it with Icarus Verilog and the designs' own
/// files, and check one FAIL (or pass) line per vector.
fn check_testbench(
    (r, rf): (&Design, &[(&str, &str)]),
    (c, cf): (&Design, &[(&str, &str)]),
    shared: &Shared,
    vectors: &[Vec<bool>],
    expect_fail: bool,
) {
    let dir = tempfile::tempdir().expect("temp dir");
    let files = |list: &[(&str, &str)], sub: &str| -> Vec<(String, String)> {
        std::fs::create_dir_all(dir.path().join(sub)).expect("mkdir");
        list.iter()
            .map(|(n, t)| {
                let p = dir.path().join(sub).join(n);
                std::fs::write(&p, t).expect("write");
                (p.display().to_string(), t.to_string())
            })
            .collect()
    };
    let rt = TbDesign {
        design: r,
        files: files(rf, "ref"),
    };
    let ct = TbDesign {
        design: c,
        files: files(cf, "cand"),
    };
    let tb = testbench(&rt, &ct, shared, vectors).expect("a testbench");
    let tbp = dir.path().join("tb.v");
    std::fs::write(&tbp, &tb.text).expect("write");
    let mut paths = vec![tbp.clone()];
    paths.extend(tb.compile_with.iter().map(std::path::PathBuf::from));
    let refs: Vec<&std::path::Path> = paths.iter().map(|p| p.as_path()).collect();
    let out = run_iverilog(&refs);
    let word = if expect_fail { "FAIL" } else { "pass" };
    for k in 1..=vectors.len() {
        assert!(
            out.lines()
                .any(|l| l.starts_with(&format!("vector {k}: {word}"))),
            "vector {k} not {word}:\n{out}\n{}",
            tb.text
        );
    }
    let fails = if expect_fail { vectors.len() } else { 0 };
    assert!(
        out.contains(&format!(
            "equicone testbench: {fails} of {} vectors FAIL",
            vectors.len()
        )),
        "{out}"
    );
}

fn vectors_of(rep: &ProveReport) -> Vec<Vec<bool>> {
    rep.counterexamples
        .iter()
        .map(|cx| cx.inputs.iter().map(|v| v.value).collect())
        .collect()
}

fn random_vectors(
    shared: &Shared,
    n: usize,
    seed: u64,
    keep: impl Fn(&[bool]) -> bool,
) -> Vec<Vec<bool>> {
    let mut rng = StdRng::seed_from_u64(seed);
    let mut out = Vec::new();
    while out.len() < n {
        let v: Vec<bool> = (0..shared.aig.num_inputs()).map(|_| rng.gen()).collect();
        if keep(&v) {
            out.push(v);
        }
    }
    out
}

#[test]
fn demo_bug_replays_in_a_vcd_and_under_icarus() {
    let f = equicone::demo::FILES;
    let spec = design(f[0].0, f[0].1);
    let r2 = design(f[1].0, f[1].1);
    let r3 = design(f[2].0, f[2].1);
    let (rep, shared) = prove(&spec, &r3, &["sel < 12"]);
    assert_eq!(rep.verdict, Verdict::Different);
    check_vcd(&spec, &r3, &shared, &rep);
    if !iverilog_available() {
        return;
    }
    // Both files define `t7_sensor_sel`: the candidate's modules are renamed into the testbench.
    let (sp, r3f, r2f) = ([(f[0].0, f[0].1)], [(f[2].0, f[2].1)], [(f[1].0, f[1].1)]);
    check_testbench((&spec, &sp), (&r3, &r3f), &shared, &vectors_of(&rep), true);
    // r2 is equivalent under sel < 12: random vectors with sel below 12 all pass.
    let (rep2, shared2) = prove(&spec, &r2, &["sel < 12"]);
    assert_eq!(rep2.verdict, Verdict::Equivalent);
    let sel: Vec<usize> = (0..4)
        .map(|i| spec.input_index(&format!("sel[{i}]")).expect("sel bit"))
        .map(|k| shared2.ref_input[k])
        .collect();
    let below12 = |v: &[bool]| {
        sel.iter()
            .enumerate()
            .map(|(i, &k)| (v[k] as usize) << i)
            .sum::<usize>()
            < 12
    };
    let vs = random_vectors(&shared2, 24, 7, below12);
    check_testbench((&spec, &sp), (&r2, &r2f), &shared2, &vs, false);
    // r2 against r3 (both define `mux2` and `t7_sensor_sel`).
    let (rep3, shared3) = prove(&r2, &r3, &["sel < 12"]);
    assert_eq!(rep3.verdict, Verdict::Different);
    check_testbench((&r2, &r2f), (&r3, &r3f), &shared3, &vectors_of(&rep3), true);
}

#[test]
fn random_bench_pairs_replay_as_written() {
    let iv = iverilog_available();
    let mut different = 0;
    for seed in 0..16u64 {
        let n = 3 + (seed as usize % 8);
        let (a, b) = random_bench(seed, n, 12 + seed as usize, 2, seed % 2 == 0, true);
        let r = design("ref.bench", &a);
        let c = design("cand.bench", &b);
        let (rep, shared) = prove(&r, &c, &[]);
        if rep.verdict == Verdict::Different {
            different += 1;
            check_vcd(&r, &c, &shared, &rep);
            if iv {
                check_testbench((&r, &[]), (&c, &[]), &shared, &vectors_of(&rep), true);
            }
        } else if iv {
            let vs = random_vectors(&shared, 8, seed, |_| true);
            check_testbench((&r, &[]), (&c, &[]), &shared, &vs, false);
        }
        // The unmutated copy is equivalent: random vectors pass.
        if iv && seed % 4 == 0 {
            let c0 = design("copy.bench", &a);
            let (rep0, shared0) = prove(&r, &c0, &[]);
            assert_eq!(rep0.verdict, Verdict::Equivalent);
            let vs = random_vectors(&shared0, 8, seed, |_| true);
            check_testbench((&r, &[]), (&c0, &[]), &shared0, &vs, false);
        }
    }
    eprintln!("{different} of 16 random mutants differ");
    assert!(different >= 8, "only {different} mutants differ");
}

#[test]
fn bench_design_against_verilog_design() {
    // A bench selector against its Verilog spec (one side generated, one side its own file).
    let bench = "INPUT(s)\nINPUT(d[0])\nINPUT(d[1])\nOUTPUT(y)\nns = NOT(s)\na = AND(d[0], ns)\nb = AND(d[1], ns)\ny = OR(a, b)\n";
    let v = "module sel2(input s, input [1:0] d, output y);\n  assign y = s ? d[1] : d[0];\nendmodule\n";
    let r = design("sel2.v", v);
    let c = design("sel2_bad.bench", bench);
    let (rep, shared) = prove(&r, &c, &[]);
    assert_eq!(rep.verdict, Verdict::Different);
    check_vcd(&r, &c, &shared, &rep);
    if iverilog_available() {
        check_testbench(
            (&r, &[("sel2.v", v)]),
            (&c, &[]),
            &shared,
            &vectors_of(&rep),
            true,
        );
    }
}

#[test]
fn command_line_writes_replayable_files() {
    let dir = tempfile::tempdir().expect("temp dir");
    let ex = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("bench-circuits/examples");
    let vcd = dir.path().join("cx.vcd");
    let tb = dir.path().join("tb.v");
    let out = Command::new(env!("CARGO_BIN_EXE_equicone"))
        .arg("prove")
        .arg(ex.join("mux4_spec.bench"))
        .arg(ex.join("mux4_swapped.bench"))
        .args(["--explain", "--json", "--vcd-nets", "--vcd"])
        .arg(&vcd)
        .arg("--testbench")
        .arg(&tb)
        .output()
        .expect("run equicone");
    assert_eq!(out.status.code(), Some(1));
    let json: serde_json::Value = serde_json::from_slice(&out.stdout).expect("json");
    let e = &json["explanation"]["pairs"][0];
    assert_eq!(e["end"], "complete");
    assert_eq!(e["terms"][0], "s[1]=1, d[2]!=d[3]");
    // mux4 (common practice): y differs exactly when s selects d[2] or d[3] and they differ:
    // s[1]=1 (2 values of s[0]) and d[2]!=d[3] (2 of 4), d[0] and d[1] free: 2*2*4 = 16 of 64.
    assert_eq!(e["differing_vectors"], 16);
    let dump = vcd_reader::parse(&std::fs::read_to_string(&vcd).expect("vcd written"));
    let ins = &json["counterexamples"][0]["inputs"];
    for i in ins.as_array().expect("inputs") {
        let name = i["name"].as_str().expect("name");
        assert_eq!(
            bit(&dump, "mux4_spec", name, 0),
            i["value"].as_bool(),
            "{name}"
        );
    }
    // Internal nets of the cone are there (the spec's t2 is the AND term of d[2]).
    assert!(dump
        .vars
        .iter()
        .any(|v| v.scope == "mux4_spec" && v.name == "t2"));
    if iverilog_available() {
        let o = run_iverilog(&[tb.as_path()]);
        assert!(o.contains("vector 1: FAIL"), "{o}");
    }
    // eval --vcd: the one vector, read back.
    let ev = dir.path().join("e.vcd");
    let out = Command::new(env!("CARGO_BIN_EXE_equicone"))
        .arg("eval")
        .arg(ex.join("mux4_spec.bench"))
        .args(["--set", "s=2", "--set", "d=0b0100", "--vcd"])
        .arg(&ev)
        .output()
        .expect("run equicone");
    assert_eq!(out.status.code(), Some(0));
    let dump = vcd_reader::parse(&std::fs::read_to_string(&ev).expect("vcd written"));
    assert_eq!(dump.value("mux4_spec", "s", 0).as_deref(), Some("10"));
    assert_eq!(dump.value("mux4_spec", "d", 0).as_deref(), Some("0100"));
    assert_eq!(dump.value("mux4_spec", "y", 0).as_deref(), Some("1"));
}
