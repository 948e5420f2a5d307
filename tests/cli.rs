//! Tests of the real executable: exit codes, reports, replaying a counterexample with `eval`,
//! the DIMACS export, and one fixture per class of bad bench input with its exact message.

mod oracle;

use std::path::{Path, PathBuf};
use std::process::Output;

mod runner;
use runner::{code, equicone};

fn stdout(o: &Output) -> String {
    String::from_utf8_lossy(&o.stdout).into_owned()
}

fn tmp(name: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("equicone-cli-{}", std::process::id()));
    std::fs::create_dir_all(&d).unwrap();
    d.join(name)
}

mod exit_codes {
    use super::*;

    /// Issue 13 B1: an absurd `--jobs` is capped at the useful number of threads, so the run
    /// ends with its verdict (it used to start every thread asked for, past the deadline).
    #[test]
    fn a_huge_jobs_value_still_gives_the_verdict() {
        for engine in ["sweep", "portfolio"] {
            let o = equicone(&[
                "prove",
                "bench-circuits/examples/mux4_spec.bench",
                "bench-circuits/examples/mux4_tree.bench",
                "--engine",
                engine,
                "--jobs",
                "100000",
                "--timeout",
                "30",
            ]);
            assert_eq!(code(&o), 0, "{}", String::from_utf8_lossy(&o.stderr));
        }
    }

    /// Every engine the library has is a `--engine` value (the algebra engine was missing from
    /// the command line once); the algebra proves a 10x10 array multiplier against Dadda's.
    #[test]
    fn every_engine_is_on_the_command_line() {
        for engine in equicone::engine::EngineKind::ALL {
            let o = equicone(&[
                "prove",
                "bench-circuits/examples/mux4_spec.bench",
                "bench-circuits/examples/mux4_tree.bench",
                "--engine",
                engine.name(),
            ]);
            // The algebra alone leaves a one-bit output undecided; the others prove it.
            let c = code(&o);
            assert!(
                c == 0 || (c == 3 && engine == equicone::engine::EngineKind::Algebra),
                "{}: exit {c}: {}",
                engine.name(),
                String::from_utf8_lossy(&o.stderr)
            );
        }
        let o = equicone(&[
            "prove",
            "bench-circuits/multiplier/mul10_array.bench",
            "bench-circuits/multiplier/mul10_dadda.bench",
            "--engine",
            "algebra",
        ]);
        assert_eq!(code(&o), 0, "{}", stdout(&o));
        assert!(stdout(&o).contains("by algebra"), "{}", stdout(&o));
    }

    #[test]
    fn equivalent_is_0_and_different_is_1() {
        let o = equicone(&[
            "prove",
            "bench-circuits/examples/mux4_spec.bench",
            "bench-circuits/examples/mux4_tree.bench",
        ]);
        assert_eq!(code(&o), 0, "{}", stdout(&o));
        assert!(stdout(&o).contains("verdict     EQUIVALENT"));
        assert!(stdout(&o).contains("timing, power and layout are not covered"));
        let o = equicone(&[
            "prove",
            "bench-circuits/examples/mux4_spec.bench",
            "bench-circuits/examples/mux4_swapped.bench",
        ]);
        assert_eq!(code(&o), 1, "{}", stdout(&o));
        assert!(stdout(&o).contains("verdict     DIFFERENT"));
        assert!(stdout(&o).contains("re-simulated on both designs"));
        // The route tables point at the two swapped data lines.
        assert!(
            stdout(&o).contains("s 2: reference d[2], candidate d[3]  !"),
            "{}",
            stdout(&o)
        );
        assert!(
            stdout(&o).contains("s 3: reference d[3], candidate d[2]  !"),
            "{}",
            stdout(&o)
        );
    }

    #[test]
    fn a_conflict_limit_gives_undecided_3() {
        let Some(dir) = oracle::iscas_dir() else {
            return;
        };
        let (a, b) = (dir.join("c499.bench"), dir.join("c1355.bench"));
        let o = equicone(&[
            "prove",
            a.to_str().unwrap(),
            b.to_str().unwrap(),
            "--pair-by",
            "position",
            // The single-call miter: the sweep's truth-table windows now prove this pair
            // without a conflict, so a conflict limit would not bind it.
            "--engine",
            "plain",
            "--conflict-limit",
            "1",
        ]);
        assert_eq!(code(&o), 3, "{}", stdout(&o));
        assert!(stdout(&o).contains("UNDECIDED"));
        assert!(stdout(&o).contains("conflict limit reached"));
    }

    #[test]
    fn usage_errors_are_2() {
        assert_eq!(code(&equicone(&["prove", "only-one.bench"])), 2);
        assert_eq!(code(&equicone(&["frobnicate"])), 2);
        let o = equicone(&[
            "prove",
            "nope.bench",
            "bench-circuits/examples/mux4_tree.bench",
        ]);
        assert_eq!(code(&o), 2);
        assert!(
            String::from_utf8_lossy(&o.stderr).contains("cannot read `nope.bench`: no such file")
        );
        let o = equicone(&[
            "prove",
            "bench-circuits/examples/mux4_spec.bench",
            "Cargo.toml",
        ]);
        assert_eq!(code(&o), 2);
        assert!(
            String::from_utf8_lossy(&o.stderr).contains("cannot tell the format of `Cargo.toml`")
        );
    }

    #[test]
    fn unmatched_ports_are_listed_with_advice() {
        let Some(dir) = oracle::iscas_dir() else {
            return;
        };
        let (a, b) = (dir.join("c499.bench"), dir.join("c1355.bench"));
        let o = equicone(&["prove", a.to_str().unwrap(), b.to_str().unwrap()]);
        assert_eq!(code(&o), 2);
        let err = String::from_utf8_lossy(&o.stderr);
        assert!(err.contains("do not match by name"), "{err}");
        assert!(err.contains("try `--pair-by position`"), "{err}");
    }
}

mod reports {
    use super::*;

    #[test]
    fn json_report_has_the_documented_fields_and_replays_with_eval() {
        let spec = "bench-circuits/examples/mux4_spec.bench";
        let bad = "bench-circuits/examples/mux4_swapped.bench";
        let report = tmp("report.json");
        let o = equicone(&[
            "prove",
            spec,
            bad,
            "--json",
            "--report",
            report.to_str().unwrap(),
        ]);
        assert_eq!(code(&o), 1);
        let v: serde_json::Value = serde_json::from_str(&stdout(&o)).unwrap();
        assert_eq!(v["schema"], 1);
        assert_eq!(v["verdict"], "different");
        for key in [
            "reference",
            "candidate",
            "pair_by",
            "engine",
            "pairs",
            "counterexamples",
            "stats",
            "scope",
        ] {
            assert!(v.get(key).is_some(), "missing {key}");
        }
        for key in [
            "reference_ands",
            "candidate_ands",
            "shared_nodes",
            "sim_patterns",
            "sat",
            "seconds",
        ] {
            assert!(v["stats"].get(key).is_some(), "missing stats.{key}");
        }
        let pair = &v["pairs"][0];
        assert!(pair["status"].is_string() && pair["method"].is_string());
        let cex = &v["counterexamples"][0];
        let diff = &cex["differing"][0];
        // The file written with --report is the same document.
        let file: serde_json::Value =
            serde_json::from_str(&std::fs::read_to_string(&report).unwrap()).unwrap();
        assert_eq!(file["counterexamples"], v["counterexamples"]);
        // Replay: eval on each design gives the reported values.
        for (design, key) in [(spec, "reference_value"), (bad, "candidate_value")] {
            let o = equicone(&[
                "eval",
                design,
                "--vector",
                report.to_str().unwrap(),
                "--json",
            ]);
            assert_eq!(code(&o), 0, "{}", String::from_utf8_lossy(&o.stderr));
            let e: serde_json::Value = serde_json::from_str(&stdout(&o)).unwrap();
            let name = diff["reference"].as_str().unwrap();
            assert_eq!(
                e["outputs"][name].as_u64().unwrap() == 1,
                diff[key].as_bool().unwrap()
            );
        }
    }

    #[test]
    fn eval_sets_ports_and_bits() {
        // mux4: y = d[s]; with s = 2 and d[2] = 1 the output is 1.
        let o = equicone(&[
            "eval",
            "bench-circuits/examples/mux4_spec.bench",
            "--set",
            "s[0]=0",
            "--set",
            "s[1]=1",
            "--set",
            "d[2]=1",
            "--rest",
            "0",
        ]);
        assert_eq!(code(&o), 0, "{}", String::from_utf8_lossy(&o.stderr));
        assert!(stdout(&o).contains("y=1"), "{}", stdout(&o));
        let o = equicone(&[
            "eval",
            "bench-circuits/examples/mux4_spec.bench",
            "--set",
            "s=2",
            "--set",
            "d=0b1011",
        ]);
        assert_eq!(code(&o), 0, "{}", String::from_utf8_lossy(&o.stderr));
        assert!(stdout(&o).contains("y=0"), "{}", stdout(&o));
        let o = equicone(&[
            "eval",
            "bench-circuits/examples/mux4_spec.bench",
            "--set",
            "s=2",
        ]);
        assert_eq!(code(&o), 2);
        assert!(String::from_utf8_lossy(&o.stderr)
            .contains("4 input bits are not set: d[0], d[1], d[2], d[3]"));
        let o = equicone(&[
            "eval",
            "bench-circuits/examples/mux4_spec.bench",
            "--set",
            "s=9",
            "--rest",
            "0",
        ]);
        assert_eq!(code(&o), 2);
        assert!(String::from_utf8_lossy(&o.stderr).contains("does not fit in 2 bits"));
    }

    /// The DIMACS export of a different pair is satisfiable and of an equivalent pair is not,
    /// decided by batsat (a second SAT solver from crates.io) reading the file.
    #[test]
    fn cnf_export_is_checkable_by_another_solver() {
        use batsat::{lbool, BasicSolver, Lit, SolverInterface};
        for (cand, sat) in [("mux4_tree", false), ("mux4_swapped", true)] {
            let out = tmp(&format!("{cand}.cnf"));
            let o = equicone(&[
                "cnf",
                "bench-circuits/examples/mux4_spec.bench",
                &format!("bench-circuits/examples/{cand}.bench"),
                "-o",
                out.to_str().unwrap(),
            ]);
            assert_eq!(code(&o), 0);
            let text = std::fs::read_to_string(&out).unwrap();
            assert!(text.contains("c input "), "variables are named in comments");
            let mut s = BasicSolver::default();
            let mut vars = Vec::new();
            for line in text
                .lines()
                .filter(|l| !l.starts_with('c') && !l.starts_with('p'))
            {
                let mut clause: Vec<Lit> = Vec::new();
                for t in line
                    .split_whitespace()
                    .map(|t| t.parse::<i64>().unwrap())
                    .take_while(|&t| t != 0)
                {
                    while vars.len() < t.unsigned_abs() as usize {
                        vars.push(s.new_var_default());
                    }
                    clause.push(Lit::new(vars[t.unsigned_abs() as usize - 1], t > 0));
                }
                s.add_clause_reuse(&mut clause);
            }
            assert_eq!(s.solve_limited(&[]) == lbool::TRUE, sat, "{cand}");
        }
    }

    #[test]
    fn reports_are_byte_identical_between_runs() {
        let a = equicone(&[
            "prove",
            "bench-circuits/examples/mux4_spec.bench",
            "bench-circuits/examples/mux4_swapped.bench",
        ]);
        let b = equicone(&[
            "prove",
            "bench-circuits/examples/mux4_spec.bench",
            "bench-circuits/examples/mux4_swapped.bench",
        ]);
        let strip = |s: String| {
            s.lines()
                .filter(|l| !l.starts_with("figures") && !l.starts_with("slowest"))
                .collect::<Vec<_>>()
                .join("\n")
        };
        assert_eq!(strip(stdout(&a)), strip(stdout(&b)));
    }
}

mod diagnosis {
    use super::*;

    /// A miswired data line shows up as a support difference: the reference reads d[2], the
    /// candidate does not.
    #[test]
    fn a_miswired_input_shows_in_the_supports() {
        let text = std::fs::read_to_string(
            Path::new(env!("CARGO_MANIFEST_DIR")).join("bench-circuits/examples/mux4_tree.bench"),
        )
        .unwrap()
        .replace("a1 = NAND(d[2], n0)", "a1 = NAND(d[1], n0)");
        let cand = tmp("miswired.bench");
        std::fs::write(&cand, text).unwrap();
        let o = equicone(&[
            "prove",
            "bench-circuits/examples/mux4_spec.bench",
            cand.to_str().unwrap(),
        ]);
        assert_eq!(code(&o), 1);
        let out = stdout(&o);
        assert!(out.contains("supports that differ"), "{out}");
        assert!(out.contains("read by the reference only: d[2]"), "{out}");
        assert!(
            out.contains("s 2: reference d[2], candidate d[1]  !"),
            "{out}"
        );
    }
}

mod bad_input {
    use super::*;

    /// Each `tests/data/bench/err/NAME.bench` gives exactly the message in `NAME.expected`
    /// on standard error, and exit code 2.
    #[test]
    fn every_error_fixture_gives_its_message() {
        let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/data/bench/err");
        let mut n = 0;
        for entry in std::fs::read_dir(&dir).unwrap() {
            let p = entry.unwrap().path();
            if p.extension().and_then(|e| e.to_str()) != Some("bench") {
                continue;
            }
            let rel = format!(
                "tests/data/bench/err/{}",
                p.file_name().unwrap().to_str().unwrap()
            );
            let expected = std::fs::read_to_string(p.with_extension("expected")).unwrap();
            let o = equicone(&["eval", &rel, "--rest", "0"]);
            assert_eq!(code(&o), 2, "{rel}");
            assert_eq!(String::from_utf8_lossy(&o.stderr), expected, "{rel}");
            assert!(o.stdout.is_empty(), "{rel}");
            n += 1;
        }
        assert!(n >= 10, "only {n} fixtures");
    }
}

mod demo {
    use super::*;

    /// The demo proves r2, catches r3 with its crossed channels, and flags the masked pin.
    #[test]
    fn demo_shows_a_proof_a_caught_bug_and_a_redundant_input() {
        let o = equicone(&["demo"]);
        assert_eq!(code(&o), 0, "{}", String::from_utf8_lossy(&o.stderr));
        let out = stdout(&o);
        assert!(
            out.contains("verdict     EQUIVALENT: all 8 output pairs agree"),
            "{out}"
        );
        assert!(
            out.contains("verdict     DIFFERENT: 8 of 8 output pairs differ"),
            "{out}"
        );
        assert!(
            out.contains("sel 9: reference ch[72], candidate ch[80]  !"),
            "{out}"
        );
        assert!(
            out.contains("sel 10: reference ch[80], candidate ch[72]  !"),
            "{out}"
        );
        assert!(
            out.contains("redundant input: y[0..7] (8 bits) do not depend on test_mode"),
            "{out}"
        );
    }

    /// Issue 13 D: `demo --write DIR` creates DIR (and its parents) when missing.
    #[test]
    fn demo_write_creates_its_folder() {
        let dir = tmp("demo-new").join("sub");
        let _ = std::fs::remove_dir_all(&dir);
        let o = equicone(&["demo", "--write", dir.to_str().unwrap()]);
        assert_eq!(code(&o), 0, "{}", String::from_utf8_lossy(&o.stderr));
        assert!(dir.join("t7_sensor_sel_spec.v").is_file());
    }
}

mod shards {
    use super::*;
    use serde_json::Value;

    fn json(path: &Path) -> Value {
        serde_json::from_str(&std::fs::read_to_string(path).unwrap()).unwrap()
    }

    /// Run `prove ARGS --shard k/n` for every k, merge the parts, and compare with one run.
    fn merged_equals_one_run(args: &[&str], n: usize, tag: &str) {
        let mut parts = Vec::new();
        for k in 1..=n {
            let part = tmp(&format!("{tag}-{k}.json"));
            let shard = format!("{k}/{n}");
            let mut a = args.to_vec();
            a.extend(["--shard", &shard, "--report", part.to_str().unwrap()]);
            let o = equicone(&a);
            assert!([0, 1].contains(&code(&o)), "{tag} {shard}: {}", stdout(&o));
            parts.push(part);
        }
        let whole = tmp(&format!("{tag}-whole.json"));
        let mut m = vec!["merge", "--report", whole.to_str().unwrap()];
        // Any order of the parts.
        m.extend(parts.iter().rev().map(|p| p.to_str().unwrap()));
        let merged = equicone(&m);
        let mut a = args.to_vec();
        a.push("--json");
        let one = equicone(&a);
        assert_eq!(code(&merged), code(&one), "{tag}: {}", stdout(&merged));
        let (w, o) = (
            json(&whole),
            serde_json::from_slice::<Value>(&one.stdout).unwrap(),
        );
        assert_eq!(w["verdict"], o["verdict"], "{tag}");
        let (wp, op) = (
            w["pairs"].as_array().unwrap(),
            o["pairs"].as_array().unwrap(),
        );
        assert_eq!(wp.len(), op.len(), "{tag}");
        let cexs = w["counterexamples"].as_array().unwrap();
        for (x, y) in wp.iter().zip(op) {
            for f in ["reference", "candidate", "status"] {
                assert_eq!(x[f], y[f], "{tag}: {x} against {y}");
            }
            if let Some(k) = x["counterexample"].as_u64() {
                let c = &cexs[k as usize];
                let names: Vec<&Value> = c["differing"]
                    .as_array()
                    .unwrap()
                    .iter()
                    .map(|d| &d["reference"])
                    .collect();
                assert!(names.contains(&&x["reference"]), "{tag}: {x} -> {c}");
            }
        }
        assert!(w.get("shard").is_none());
        assert_eq!(w["merged_shards"], n);
    }

    #[test]
    fn merged_partial_runs_equal_one_run() {
        let (r, c) = (tmp("shard-ref.bench"), tmp("shard-bug.bench"));
        for (file, style, bug) in [(&r, "ripple", None), (&c, "kogge-stone", Some("invert"))] {
            let mut a = vec![
                "gen", "adder", "--n", "12", "--style", style, "--format", "bench",
            ];
            a.extend(["-o", file.to_str().unwrap()]);
            if let Some(b) = bug {
                a.extend(["--bug", b, "--seed", "3"]);
            }
            assert_eq!(code(&equicone(&a)), 0);
        }
        let (rs, cs) = (r.to_str().unwrap(), c.to_str().unwrap());
        merged_equals_one_run(&["prove", rs, cs], 4, "adder-bug");
        // One pair, two shards: the second shard decides nothing.
        merged_equals_one_run(
            &[
                "prove",
                "bench-circuits/examples/mux4_spec.bench",
                "bench-circuits/examples/mux4_tree.bench",
            ],
            2,
            "mux4",
        );
        // The published fact (SOURCE.md of the shared data): c499 and c1355 are equivalent.
        if let Some(dir) = oracle::iscas_dir() {
            let (a, b) = (dir.join("c499.bench"), dir.join("c1355.bench"));
            let args = [
                "prove",
                a.to_str().unwrap(),
                b.to_str().unwrap(),
                "--pair-by",
                "position",
            ];
            merged_equals_one_run(&args, 3, "c499");
        }
    }

    #[test]
    fn merge_refuses_parts_that_do_not_make_one_run() {
        let spec = "bench-circuits/examples/mux4_spec.bench";
        let tree = "bench-circuits/examples/mux4_tree.bench";
        let part = |k: &str, seed: &str, name: &str| {
            let p = tmp(name);
            let o = equicone(&[
                "prove",
                spec,
                tree,
                "--shard",
                k,
                "--seed",
                seed,
                "--report",
                p.to_str().unwrap(),
            ]);
            assert_eq!(code(&o), 0, "{}", stdout(&o));
            p.to_str().unwrap().to_string()
        };
        let a = part("1/2", "1", "refuse-1.json");
        let b = part("2/2", "1", "refuse-2.json");
        let b_seed = part("2/2", "9", "refuse-2-seed.json");
        let err = |args: &[&str]| {
            let o = equicone(args);
            assert_eq!(code(&o), 2, "{}", stdout(&o));
            String::from_utf8_lossy(&o.stderr).into_owned()
        };
        assert!(err(&["merge", &a]).contains("shards missing: 2/2"));
        assert!(err(&["merge", &a, &a, &b]).contains("again"));
        assert!(err(&["merge", &a, &b_seed]).contains("other options"));
        assert!(err(&["prove", spec, tree, "--shard", "3/2"]).contains("K/N"));
        assert_eq!(code(&equicone(&["merge", &a, &b])), 0);
        // The inputs' fingerprint is of their contents: the second shard run on the same path
        // after the file was edited (a comment added, same function) is refused.
        let edited = tmp("refuse-tree.bench");
        let text = std::fs::read_to_string(tree).unwrap();
        std::fs::write(&edited, &text).unwrap();
        let run = |k: &str, name: &str| {
            let p = tmp(name);
            let e = edited.to_str().unwrap();
            let o = equicone(&[
                "prove",
                spec,
                e,
                "--shard",
                k,
                "--report",
                p.to_str().unwrap(),
            ]);
            assert_eq!(code(&o), 0, "{}", stdout(&o));
            p.to_str().unwrap().to_string()
        };
        let e1 = run("1/2", "refuse-edit-1.json");
        std::fs::write(&edited, format!("# edited\n{text}")).unwrap();
        let e2 = run("2/2", "refuse-edit-2.json");
        assert!(err(&["merge", &e1, &e2]).contains("other input files"));
        // Parts of two different splits, and a part of a cone audit, are refused too.
        let c2 = part("2/3", "1", "refuse-2-of-3.json");
        assert!(err(&["merge", &a, &c2]).contains("split"));
        let cone = tmp("refuse-cone.json");
        let o = equicone(&[
            "cone",
            spec,
            "--shard",
            "2/2",
            "--report",
            cone.to_str().unwrap(),
        ]);
        assert!([0, 1].contains(&code(&o)), "{}", stdout(&o));
        err(&["merge", &a, cone.to_str().unwrap()]);
    }

    /// Run `cone ARGS --shard k/n` for every k, merge the parts, and compare with one run:
    /// every output's cone, support, redundant and undecided inputs, every flag in order, the
    /// input counts and the claim count. (Evidence vectors may differ: each run simulates
    /// its own share.)
    fn cone_merged_equals_one_run(args: &[&str], n: usize, tag: &str) {
        let mut parts = Vec::new();
        for k in 1..=n {
            let part = tmp(&format!("{tag}-{k}.json"));
            let shard = format!("{k}/{n}");
            let mut a = args.to_vec();
            a.extend(["--shard", &shard, "--report", part.to_str().unwrap()]);
            let o = equicone(&a);
            assert!([0, 1].contains(&code(&o)), "{tag} {shard}: {}", stdout(&o));
            parts.push(part);
        }
        let whole = tmp(&format!("{tag}-whole.json"));
        let mut m = vec!["merge", "--report", whole.to_str().unwrap()];
        m.extend(parts.iter().rev().map(|p| p.to_str().unwrap()));
        let merged = equicone(&m);
        let mut a = args.to_vec();
        a.push("--json");
        let one = equicone(&a);
        assert_eq!(code(&merged), code(&one), "{tag}: {}", stdout(&merged));
        let (w, o) = (
            json(&whole),
            serde_json::from_slice::<Value>(&one.stdout).unwrap(),
        );
        let (wo, oo) = (
            w["outputs"].as_array().unwrap(),
            o["outputs"].as_array().unwrap(),
        );
        assert_eq!(wo.len(), oo.len(), "{tag}");
        for (x, y) in wo.iter().zip(oo) {
            for f in [
                "name",
                "cone",
                "support",
                "redundant",
                "undecided",
                "constant",
                "expected",
            ] {
                assert_eq!(x.get(f), y.get(f), "{tag}: {f} of {}", y["name"]);
            }
        }
        for f in ["flags", "inputs", "all_outputs", "design", "schema"] {
            assert_eq!(w[f], o[f], "{tag}: {f}");
        }
        for f in ["claims", "undecided"] {
            assert_eq!(w["stats"][f], o["stats"][f], "{tag}: stats.{f}");
        }
        assert!(w.get("shard").is_none());
        assert_eq!(w["merged_shards"], n);
    }

    #[test]
    fn merged_partial_audits_equal_one_audit() {
        // Redundant, missing, unexpected and unused inputs and nested supports, so that every
        // kind of flag the merge rebuilds shows up.
        let d = tmp("cone-shard.bench");
        std::fs::write(
            &d,
            "INPUT(a)\nINPUT(b)\nINPUT(c)\nINPUT(d)\nINPUT(e)\nOUTPUT(y1)\nOUTPUT(y2)\nOUTPUT(y3)\n\
             OUTPUT(y4)\ny1 = AND(a, b)\ny2 = AND(a, b, c)\nt = AND(a, e)\ny3 = OR(a, t)\n\
             y4 = XOR(c, b)\n",
        )
        .unwrap();
        let e = tmp("cone-shard.expect");
        std::fs::write(&e, "y1: a b d\ny2: a, b, c\ny4: c\n").unwrap();
        let (ds, es) = (d.to_str().unwrap(), e.to_str().unwrap());
        for n in [2, 3, 5] {
            cone_merged_equals_one_run(&["cone", ds], n, &format!("cone-small-{n}"));
            cone_merged_equals_one_run(
                &["cone", ds, "--expect", es],
                n,
                &format!("cone-expect-{n}"),
            );
        }
        cone_merged_equals_one_run(
            &["cone", ds, "--output", "y3", "--output", "y1"],
            2,
            "cone-selected",
        );
        // The open ISCAS-85 netlists (shared data): c432 (7 outputs) and c880 (26 outputs).
        if let Some(dir) = oracle::iscas_dir() {
            for (name, n) in [("c432", 3), ("c880", 4)] {
                let f = dir.join(format!("{name}.bench"));
                cone_merged_equals_one_run(&["cone", f.to_str().unwrap()], n, name);
            }
        }
    }

    #[test]
    fn cone_merge_refuses_parts_of_other_runs() {
        let spec = "bench-circuits/examples/mux4_spec.bench";
        let tree = "bench-circuits/examples/mux4_tree.bench";
        let part = |file: &str, k: &str, name: &str| {
            let p = tmp(name);
            let o = equicone(&["cone", file, "--shard", k, "--report", p.to_str().unwrap()]);
            assert!([0, 1].contains(&code(&o)), "{}", stdout(&o));
            p.to_str().unwrap().to_string()
        };
        let a = part(spec, "1/2", "cone-refuse-1.json");
        let b = part(spec, "2/2", "cone-refuse-2.json");
        let b_tree = part(tree, "2/2", "cone-refuse-2-tree.json");
        let err = |args: &[&str]| {
            let o = equicone(args);
            assert_eq!(code(&o), 2, "{}", stdout(&o));
            String::from_utf8_lossy(&o.stderr).into_owned()
        };
        assert!(err(&["merge", &a]).contains("shards missing: 2/2"));
        assert!(err(&["merge", &a, &b, &b]).contains("again"));
        assert!(err(&["merge", &a, &b_tree]).contains("other input files"));
        assert!(err(&["cone", spec, "--shard", "1/2"]).contains("--report"));
        assert!(err(&["cone", spec, "--shard", "0/2", "--json"]).contains("K/N"));
        assert!([0, 1].contains(&code(&equicone(&["merge", &a, &b]))));
    }
}

/// Issue 15 item 8: the bench `MUX(s, a, b)` gate and the `VDD`/`GND` constants, checked against
/// the Verilog reader (`s ? a : b` and `1'b1`/`1'b0` per IEEE 1364-2005 clause 5.1.13), a
/// front-end written separately; the swapped input order is found different.
mod bench_mux_and_constants {
    use super::*;

    const BENCH: &str =
        "\u{feff}# selector with tie cells\nINPUT(s)\nINPUT(a)\nINPUT(b)\nOUTPUT(y)\nOUTPUT(k)\n\
        hi = VDD\nlo = gnd()\nm = MUX(s, a, b)\ny = AND(m, hi)\nk = OR(lo, s)\n";

    #[test]
    fn equal_to_the_verilog_reading_and_the_swap_is_different() {
        let b = tmp("mux_const.bench");
        std::fs::write(&b, BENCH).unwrap();
        let v = tmp("mux_const.v");
        std::fs::write(
            &v,
            "module m(input s, a, b, output y, k);\n  assign y = s ? a : b;\n  assign k = s | 1'b0;\nendmodule\n",
        )
        .unwrap();
        let o = equicone(&["prove", b.to_str().unwrap(), v.to_str().unwrap()]);
        assert_eq!(code(&o), 0, "{}", stdout(&o));
        let w = tmp("mux_swapped.v");
        std::fs::write(
            &w,
            "module m(input s, a, b, output y, k);\n  assign y = s ? b : a;\n  assign k = s;\nendmodule\n",
        )
        .unwrap();
        let o = equicone(&["prove", b.to_str().unwrap(), w.to_str().unwrap()]);
        assert_eq!(code(&o), 1, "{}", stdout(&o));
        let o = equicone(&["stats", b.to_str().unwrap()]);
        assert_eq!(code(&o), 0, "{}", stdout(&o));
    }
}

/// Issue 15 item 7: a spec that reads `x` for an unused select value is equivalent to itself
/// and to a selector tree (the x is a don't-care, counted in text and JSON); under
/// `--strict-unknowns` the x must be matched for every value and cannot be.
mod unknowns_as_dont_cares {
    use super::*;

    const SPEC: &str = "module m(input [1:0] s, input a, b, c, output reg y);\n  always @* case (s)\n    2'd0: y = a;\n    2'd1: y = b;\n    2'd2: y = c;\n    default: y = 1'bx;\n  endcase\nendmodule\n";

    #[test]
    fn spec_against_itself_and_the_strict_reading() {
        let spec = tmp("dc_spec.v");
        std::fs::write(&spec, SPEC).unwrap();
        let s = spec.to_str().unwrap();
        let o = equicone(&["prove", s, s]);
        assert_eq!(code(&o), 0, "{}", stdout(&o));
        assert!(
            stdout(&o).contains("don't-care  1 output pair where the reference may be x"),
            "{}",
            stdout(&o)
        );
        let o = equicone(&["prove", s, s, "--json"]);
        let v: serde_json::Value = serde_json::from_slice(&o.stdout).unwrap();
        assert_eq!(v["dont_care_pairs"], 1);
        // Against a candidate free of x, the reference's x is only a don't-care: the advice
        // about free inputs (for candidate unknowns, or all under --strict-unknowns) is not
        // printed; under --strict-unknowns it is.
        let tree = tmp("dc_tree.v");
        std::fs::write(
            &tree,
            "module m(input [1:0] s, input a, b, c, output y);\n  assign y = s[1] ? c : (s[0] ? b : a);\nendmodule\n",
        )
        .unwrap();
        let t = tree.to_str().unwrap();
        let o = equicone(&["prove", s, t]);
        assert_eq!(code(&o), 0, "{}", stdout(&o));
        assert!(!stdout(&o).contains("is a free input"), "{}", stdout(&o));
        let o = equicone(&["prove", s, t, "--strict-unknowns"]);
        assert_eq!(code(&o), 1, "{}", stdout(&o));
        assert!(stdout(&o).contains("is a free input"), "{}", stdout(&o));
        // A wrong candidate: its counterexample does not print the reference's unknown,
        // which decides none of the differing outputs (each is compared where the reference
        // is defined); the JSON keeps it for replay.
        let bad = tmp("dc_bad.v");
        std::fs::write(
            &bad,
            "module m(input [1:0] s, input a, b, c, output y);\n  assign y = s[1] ? c : (s[0] ? a : b);\nendmodule\n",
        )
        .unwrap();
        let b = bad.to_str().unwrap();
        let o = equicone(&["prove", s, b]);
        assert_eq!(code(&o), 1, "{}", stdout(&o));
        assert!(stdout(&o).contains("counterexample 1"), "{}", stdout(&o));
        let text = stdout(&o);
        let cex = text
            .split("counterexample 1")
            .nth(1)
            .and_then(|t| t.split("differing outputs").next())
            .unwrap();
        assert!(!cex.contains("x@"), "{text}");
        let o = equicone(&["prove", s, b, "--json"]);
        let v: serde_json::Value = serde_json::from_slice(&o.stdout).unwrap();
        let unknown_kept = v["counterexamples"][0]["inputs"]
            .as_array()
            .unwrap()
            .iter()
            .any(|i| i["unknown"] == true);
        assert!(unknown_kept, "{v}");
        let o = equicone(&["prove", s, s, "--strict-unknowns", "--json"]);
        assert_eq!(code(&o), 1);
        let v: serde_json::Value = serde_json::from_slice(&o.stdout).unwrap();
        assert!(v.get("dont_care_pairs").is_none());
        // A proof certificate covers the pair with its don't-care region.
        let proof = tmp("dc_spec.drat");
        let o = equicone(&["prove", s, s, "--proof", proof.to_str().unwrap()]);
        assert_eq!(code(&o), 0, "{}", String::from_utf8_lossy(&o.stderr));
        // The DIMACS miter of `cnf` has the same reading.
        let cnf = tmp("dc_spec.cnf");
        let o = equicone(&["cnf", s, s, "-o", cnf.to_str().unwrap()]);
        assert_eq!(code(&o), 0);
        let text = std::fs::read_to_string(&cnf).unwrap();
        assert!(
            text.contains("only where the reference is defined"),
            "{text}"
        );
    }
}

/// A difference found by simulation settles the verdict: the open pairs then get at most
/// `--after-difference` seconds (0 here: none), and those left open say why; `--decide-all`
/// decides them all.
mod after_a_difference {
    use super::*;

    #[test]
    fn open_pairs_are_left_open_and_decide_all_decides_them() {
        let r = tmp("ad_ref.v");
        std::fs::write(
            &r,
            "module m(input [7:0] a, b, output [8:0] s, output y);\n  assign s = a + b;\n  assign y = a[0] & b[0];\nendmodule\n",
        )
        .unwrap();
        let c = tmp("ad_cand.v");
        std::fs::write(
            &c,
            "module m(input [7:0] a, b, output [8:0] s, output y);\n  assign s = {1'b0, a ^ b} + {a & b, 1'b0};\n  assign y = a[0] | b[0];\nendmodule\n",
        )
        .unwrap();
        let (r, c) = (r.to_str().unwrap(), c.to_str().unwrap());
        let base = ["prove", r, c, "--engine", "sweep", "--json"];
        let o = equicone(&[&base[..], &["--after-difference", "0"]].concat());
        assert_eq!(code(&o), 1, "{}", stdout(&o));
        let v: serde_json::Value = serde_json::from_slice(&o.stdout).unwrap();
        let pairs = v["pairs"].as_array().unwrap();
        let left: Vec<&serde_json::Value> = pairs
            .iter()
            .filter(|p| p["stopped"] == "after_difference")
            .collect();
        assert!(!left.is_empty(), "{}", stdout(&o));
        assert!(left.iter().all(|p| p["status"] == "undecided"));
        assert_eq!(v["verdict"], "different");
        let o = equicone(&[&base[..], &["--decide-all"]].concat());
        assert_eq!(code(&o), 1, "{}", stdout(&o));
        let v: serde_json::Value = serde_json::from_slice(&o.stdout).unwrap();
        let statuses: Vec<&str> = v["pairs"]
            .as_array()
            .unwrap()
            .iter()
            .map(|p| p["status"].as_str().unwrap())
            .collect();
        assert_eq!(statuses.iter().filter(|s| **s == "equivalent").count(), 9);
        assert_eq!(statuses.iter().filter(|s| **s == "different").count(), 1);
        // The text report says why a pair is open.
        let o = equicone(&[
            "prove",
            r,
            c,
            "--engine",
            "sweep",
            "--after-difference",
            "0",
        ]);
        assert!(
            stdout(&o).contains("left open once a difference settled the verdict"),
            "{}",
            stdout(&o)
        );
    }
}

/// Registers without a reset start at free values: renamed ones (no shared name) may start
/// apart, which gives a trace that differs in cycle 0; the report says why and what to do.
mod free_initial_values {
    use super::*;

    #[test]
    fn a_trace_from_differing_power_up_values_says_so() {
        let r = tmp("sr_ref.v");
        std::fs::write(
            &r,
            "module sr(input clk, input d, output q);\n  reg [3:0] r;\n  always @(posedge clk) r <= {r[2:0], d};\n  assign q = r[3];\nendmodule\n",
        )
        .unwrap();
        let c = tmp("sr_cand.v");
        std::fs::write(
            &c,
            "module sr(input clk, input d, output q);\n  reg a, b, e, g;\n  always @(posedge clk) begin a <= d; b <= a; e <= b; g <= e; end\n  assign q = g;\nendmodule\n",
        )
        .unwrap();
        let o = equicone(&["prove", r.to_str().unwrap(), c.to_str().unwrap()]);
        assert_eq!(code(&o), 1, "{}", stdout(&o));
        assert!(
            stdout(&o).contains("only same-named registers share one value"),
            "{}",
            stdout(&o)
        );
        // The same design against itself: the same names share their free values.
        let o = equicone(&["prove", r.to_str().unwrap(), r.to_str().unwrap()]);
        assert_eq!(code(&o), 0, "{}", stdout(&o));
    }
}
