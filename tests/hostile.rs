//! Hostile inputs at the command line: a catalogue of bad inputs, one fixture per error class
//! (`tests/data/cli/err/NAME.args`, one argument per line, with the exact standard error in
//! `NAME.expected`; exit code 2 every time); unreadable files; atomic outputs (a failed or
//! interrupted write leaves neither a partial file nor a temporary one); and a deep chain
//! read, evaluated and proved against a rewritten copy without overflowing the stack.

use std::path::{Path, PathBuf};
use std::process::{Command, Output, Stdio};

fn root() -> &'static Path {
    Path::new(env!("CARGO_MANIFEST_DIR"))
}

mod runner;
use runner::{code, equicone};

fn stderr(o: &Output) -> String {
    String::from_utf8_lossy(&o.stderr).into_owned()
}

/// A fresh scratch folder for one test.
fn scratch(name: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("equicone-hostile-{}-{name}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).unwrap();
    d
}

mod catalogue {
    use super::*;

    /// Every error class gives exactly its message (position, what is wrong, what to do) on
    /// standard error, nothing on standard output, and exit code 2.
    #[test]
    fn every_cli_error_fixture_gives_its_message() {
        let dir = root().join("tests/data/cli/err");
        let mut names: Vec<PathBuf> = std::fs::read_dir(&dir)
            .unwrap()
            .map(|e| e.unwrap().path())
            .filter(|p| p.extension().is_some_and(|e| e == "args"))
            .collect();
        names.sort();
        let mut bad = Vec::new();
        for p in &names {
            let args_text = std::fs::read_to_string(p).unwrap();
            let args: Vec<&str> = args_text.lines().collect();
            let expected = std::fs::read_to_string(p.with_extension("expected"))
                .unwrap_or_else(|_| panic!("{} has no .expected beside it", p.display()));
            let o = equicone(&args);
            let got = stderr(&o);
            if code(&o) != 2 || got != expected || !o.stdout.is_empty() {
                bad.push(format!(
                    "{}: exit {}\n--- expected\n{expected}--- got\n{got}",
                    p.display(),
                    code(&o)
                ));
            }
            // Every message says what to do.
            assert!(
                got.contains("help: "),
                "{}: no help line:\n{got}",
                p.display()
            );
        }
        assert!(bad.is_empty(), "{}", bad.join("\n"));
        assert!(names.len() >= 20, "only {} fixtures", names.len());
    }

    /// A file without read permission. As root the permission bits do not stop reading, so
    /// the check there is that the file is read as a netlist like any other.
    #[test]
    fn a_file_without_read_permission() {
        use std::os::unix::fs::PermissionsExt;
        let d = scratch("perm");
        let f = d.join("locked.bench");
        std::fs::write(&f, "INPUT(a)\nOUTPUT(y)\ny = NOT(a)\n").unwrap();
        std::fs::set_permissions(&f, std::fs::Permissions::from_mode(0o000)).unwrap();
        let readable = std::fs::read(&f).is_ok();
        let o = equicone(&["eval", f.to_str().unwrap(), "--set", "a=1"]);
        if readable {
            assert_eq!(code(&o), 0, "{}", stderr(&o));
        } else {
            assert_eq!(code(&o), 2);
            assert_eq!(
                stderr(&o),
                format!(
                    "error: cannot read `{}`: permission denied\n  help: check the path and that the file is readable\n",
                    f.display()
                )
            );
        }
    }

    /// An endless device is refused at its first NUL byte instead of filling memory.
    #[test]
    fn an_endless_device_is_refused_at_once() {
        if !Path::new("/dev/zero").exists() {
            eprintln!("SKIP: no /dev/zero on this system");
            return;
        }
        let o = equicone(&["eval", "/dev/zero", "--format", "bench", "--rest", "0"]);
        assert_eq!(code(&o), 2);
        assert_eq!(
            stderr(&o),
            "/dev/zero:1:1: error: the file is not text (it holds a NUL byte)\n  help: give a netlist in bench or Verilog text form\n"
        );
    }
}

mod atomic_writes {
    use super::*;

    fn leftovers(d: &Path) -> Vec<String> {
        let mut v: Vec<String> = std::fs::read_dir(d)
            .unwrap()
            .map(|e| e.unwrap().file_name().to_string_lossy().into_owned())
            .collect();
        v.sort();
        v
    }

    /// A write that fails at the rename (the target is a folder) leaves the folder as it was:
    /// no temporary file, no partial report.
    #[test]
    fn a_failed_write_leaves_no_partial_or_temporary_file() {
        let d = scratch("failed");
        let target = d.join("report.json");
        std::fs::create_dir(&target).unwrap();
        let a = "tests/data/cli/files/ports_ab.bench";
        for args in [
            vec!["prove", a, a, "--report", target.to_str().unwrap()],
            vec!["cnf", a, a, "-o", target.to_str().unwrap()],
            vec!["gen", "adder", "--n", "4", "-o", target.to_str().unwrap()],
        ] {
            let o = equicone(&args);
            assert_eq!(code(&o), 2, "{args:?}: {}", stderr(&o));
            assert!(stderr(&o).contains("cannot write"), "{}", stderr(&o));
            assert_eq!(leftovers(&d), vec!["report.json".to_string()], "{args:?}");
            assert!(target.is_dir());
        }
    }

    /// A successful write replaces the old file whole.
    #[test]
    fn a_write_replaces_the_old_file_whole() {
        let d = scratch("replace");
        let out = d.join("miter.cnf");
        std::fs::write(
            &out,
            "old contents that must disappear entirely\n".repeat(1000),
        )
        .unwrap();
        let a = "tests/data/cli/files/ports_ab.bench";
        let o = equicone(&["cnf", a, a, "-o", out.to_str().unwrap()]);
        assert_eq!(code(&o), 0, "{}", stderr(&o));
        let text = std::fs::read_to_string(&out).unwrap();
        assert!(text.starts_with("c ") || text.starts_with("p "), "{text}");
        assert!(!text.contains("old contents"));
        assert_eq!(leftovers(&d), vec!["miter.cnf".to_string()]);
    }

    /// A run killed before it finishes leaves no report at all (the report is written whole at
    /// the end, through a temporary file and a rename).
    #[test]
    fn an_interrupted_run_leaves_no_report() {
        let d = scratch("killed");
        let (r, c) = (d.join("r.bench"), d.join("c.bench"));
        for (p, style) in [(&r, "array"), (&c, "wallace")] {
            let o = equicone(&[
                "gen",
                "multiplier",
                "--n",
                // 16 bits: 32 inputs, past exhaustive simulation.
                "16",
                "--style",
                style,
                "--format",
                "bench",
                "-o",
                p.to_str().unwrap(),
            ]);
            assert_eq!(code(&o), 0, "{}", stderr(&o));
        }
        let report = d.join("report.json");
        let mut child = Command::new(env!("CARGO_BIN_EXE_equicone"))
            .args([
                "prove",
                r.to_str().unwrap(),
                c.to_str().unwrap(),
                "--report",
                report.to_str().unwrap(),
                // The portfolio proves multiplier words by algebra in well under a second;
                // the sweep alone takes far longer on them.
                "--engine",
                "sweep",
            ])
            .stdout(Stdio::null())
            .stderr(Stdio::null())
            .spawn()
            .unwrap();
        std::thread::sleep(std::time::Duration::from_millis(1500));
        let finished = child.try_wait().unwrap().is_some();
        child.kill().ok();
        child.wait().unwrap();
        assert!(
            !finished,
            "a 16-bit multiplier pair was expected to take longer"
        );
        assert!(
            !report.exists(),
            "a report appeared from an interrupted run"
        );
        let tmp: Vec<String> = leftovers(&d)
            .into_iter()
            .filter(|n| n != "r.bench" && n != "c.bench")
            .collect();
        assert!(tmp.is_empty(), "{tmp:?}");
    }
}

mod deep {
    use super::*;

    /// A chain of `n` inverters as bench text (output `q{n}`), and the same function in
    /// NAND-NAND form: every inverter `NOT(x)` written as `NAND(x, x)`, and pairs of
    /// inverters folded into a buffer made of two NANDs with a shared input.
    fn chains(n: usize) -> (String, String) {
        let mut a = String::with_capacity(n * 24);
        let mut b = String::with_capacity(n * 40);
        a.push_str("INPUT(x)\nINPUT(e)\nOUTPUT(q)\n");
        b.push_str("INPUT(x)\nINPUT(e)\nOUTPUT(q)\n");
        a.push_str("q0 = XOR(x, e)\n");
        // XOR in NAND-NAND form (common practice: four NAND gates).
        b.push_str("m1 = NAND(x, e)\nm2 = NAND(x, m1)\nm3 = NAND(e, m1)\nq0 = NAND(m2, m3)\n");
        for i in 1..=n {
            a.push_str(&format!("q{i} = NOT(q{})\n", i - 1));
            b.push_str(&format!("q{i} = NAND(q{}, q{})\n", i - 1, i - 1));
        }
        a.push_str(&format!("q = BUFF(q{n})\n"));
        b.push_str(&format!("q = AND(q{n}, q{n})\n"));
        (a, b)
    }

    /// 200,000 gates deep through the bench reader, `eval` and `prove` (the rewritten copy is
    /// not structurally equal, so the proof runs simulation and SAT along the whole depth).
    #[test]
    fn a_200k_deep_chain_reads_evaluates_and_proves() {
        let n = 200_000;
        let d = scratch("deep");
        let (a, b) = chains(n);
        let (pa, pb) = (d.join("chain.bench"), d.join("chain_nand.bench"));
        std::fs::write(&pa, a).unwrap();
        std::fs::write(&pb, b).unwrap();
        // n inverters after x XOR e: q = (x ^ e) when n is even.
        let o = equicone(&["eval", pa.to_str().unwrap(), "--set", "x=1", "--set", "e=0"]);
        assert_eq!(code(&o), 0, "{}", stderr(&o));
        assert!(
            String::from_utf8_lossy(&o.stdout).contains("  q=1"),
            "{}",
            String::from_utf8_lossy(&o.stdout)
        );
        let o = equicone(&["prove", pa.to_str().unwrap(), pb.to_str().unwrap()]);
        assert_eq!(
            code(&o),
            0,
            "{}{}",
            String::from_utf8_lossy(&o.stdout),
            stderr(&o)
        );
        // A copy with the last inverter dropped differs, with a checked counterexample.
        let (_, b) = chains(n - 1);
        let pc = d.join("chain_short.bench");
        std::fs::write(&pc, b).unwrap();
        let o = equicone(&["prove", pa.to_str().unwrap(), pc.to_str().unwrap()]);
        assert_eq!(code(&o), 1, "{}", stderr(&o));
    }

    /// Depth through the Verilog reader: a chain of `not` primitives over scalar wires, as a
    /// gate-level netlist is written (100,000 deep: the debug build reads about 10,000 lines a
    /// second).
    #[test]
    fn a_deep_verilog_chain_reads_and_proves() {
        let n = 100_000;
        let d = scratch("deepv");
        let mut v = String::with_capacity(n * 40);
        v.push_str("module chain(input x, output q);\n  wire w0;\n  assign w0 = x;\n");
        for i in 1..=n {
            v.push_str(&format!("  wire w{i}; not g{i}(w{i}, w{});\n", i - 1));
        }
        v.push_str(&format!("  assign q = w{n};\nendmodule\n"));
        let pv = d.join("chain.v");
        std::fs::write(&pv, v).unwrap();
        let pb = d.join("wire.bench");
        std::fs::write(&pb, "INPUT(x)\nOUTPUT(q)\nq = BUFF(x)\n").unwrap();
        let o = equicone(&["eval", pv.to_str().unwrap(), "--set", "x=1"]);
        assert_eq!(code(&o), 0, "{}", stderr(&o));
        assert!(String::from_utf8_lossy(&o.stdout).contains("  q=1"));
        let o = equicone(&["prove", pv.to_str().unwrap(), pb.to_str().unwrap()]);
        assert_eq!(code(&o), 0, "{}", stderr(&o));
    }
}

mod timeouts {
    use super::*;

    /// The message of a run whose time limit ran out while reading (exit code 3).
    fn stopped_reading(file: &str) -> String {
        format!(
            "undecided: the time limit ran out while reading `{file}`; nothing was checked\n  help: the --timeout covers reading the designs too; give a larger one\n"
        )
    }

    /// `--timeout` covers reading: with a limit of one microsecond, a 300,000-gate bench file
    /// (7 MB, several reads of the file) or a Verilog file is never read to the end, and
    /// `prove`, `cone` and `stats` say so with exit code 3 and nothing on standard output.
    /// Not timed: the limit has passed before the first look at it, whatever the machine.
    #[test]
    fn a_tiny_timeout_stops_reading() {
        let d = scratch("timeout");
        let mut t = String::from("INPUT(x)\nOUTPUT(q)\nq0 = NOT(x)\n");
        for i in 1..300_000 {
            t += &format!("q{i} = NOT(q{})\n", i - 1);
        }
        t += "q = BUFF(q299999)\n";
        let big = d.join("big.bench");
        std::fs::write(&big, t).unwrap();
        let v = d.join("small.v");
        std::fs::write(
            &v,
            "module m(input x, output q);\n  assign q = ~x;\nendmodule\n",
        )
        .unwrap();
        let (big, v) = (big.to_str().unwrap(), v.to_str().unwrap());
        let runs: [&[&str]; 5] = [
            &["prove", big, big, "--timeout", "0.000001"],
            &["prove", big, big, "--timeout", "0.000001", "--json"],
            &["cone", big, "--timeout", "0.000001"],
            &["stats", big, "--timeout", "0.000001"],
            &["prove", v, big, "--timeout", "0.000001"],
        ];
        for args in runs {
            let o = equicone(args);
            assert_eq!(code(&o), 3, "{args:?}: {}", stderr(&o));
            assert_eq!(stderr(&o), stopped_reading(args[1]), "{args:?}");
            assert!(o.stdout.is_empty(), "{args:?}");
        }
        // A generous limit changes nothing.
        let o = equicone(&["prove", big, big, "--timeout", "600"]);
        assert_eq!(code(&o), 0, "{}", stderr(&o));
    }
}
