//! The real executable's `cone` and `stats` commands: exit codes, JSON, `--dot`, `--expect`
//! and bad input, run in a temporary folder.

use std::process::Output;

use crate::runner::equicone_in as equicone;

fn folder(files: &[(&str, &str)]) -> tempfile::TempDir {
    let d = tempfile::tempdir().unwrap();
    for (name, text) in files {
        std::fs::write(d.path().join(name), text).unwrap();
    }
    d
}

const MASKED: &str =
    "INPUT(a)\nINPUT(t)\nOUTPUT(y)\nn = NOT(t)\np = AND(a, t)\nq = AND(a, n)\ny = OR(p, q)\n";
const CLEAN: &str = "INPUT(a)\nINPUT(b)\nOUTPUT(y)\ny = NAND(a, b)\n";

fn out(o: &Output) -> String {
    String::from_utf8_lossy(&o.stdout).into_owned()
}

fn err(o: &Output) -> String {
    String::from_utf8_lossy(&o.stderr).into_owned()
}

#[test]
fn exit_codes_0_1_2_3() {
    let mut parity = String::from("INPUT(a)\nINPUT(t)\n");
    for i in 0..10 {
        parity.push_str(&format!("INPUT(b{i})\n"));
    }
    parity.push_str("OUTPUT(y)\nl0 = XOR(b0, b1)\n");
    for i in 2..10 {
        parity.push_str(&format!("l{} = XOR(l{}, b{i})\n", i - 1, i - 2));
    }
    parity.push_str("r0 = XOR(b8, b9)\n");
    for i in (0..8).rev() {
        parity.push_str(&format!("r{} = XOR(b{i}, r{})\n", 8 - i, 7 - i));
    }
    parity.push_str("u = AND(t, l8)\nv = AND(t, r8)\nw = XOR(u, v)\ny = XOR(a, w)\n");
    let d = folder(&[
        ("masked.bench", MASKED),
        ("clean.bench", CLEAN),
        ("parity.bench", &parity),
    ]);
    let o = equicone(d.path(), &["cone", "clean.bench"]);
    assert_eq!(o.status.code(), Some(0), "{}", err(&o));
    assert!(out(&o).ends_with("result: nothing flagged\n"));
    let o = equicone(d.path(), &["cone", "masked.bench"]);
    assert_eq!(o.status.code(), Some(1));
    let o = equicone(d.path(), &["cone", "parity.bench", "--conflict-limit", "1"]);
    assert_eq!(o.status.code(), Some(3), "{}", out(&o));
    assert!(out(&o).contains("claims undecided"));
    let o = equicone(d.path(), &["cone", "clean.bench", "--output", "nope"]);
    assert_eq!(o.status.code(), Some(2));
    assert!(
        err(&o).contains("error: --output nope: no output is named `nope`"),
        "{}",
        err(&o)
    );
    let o = equicone(d.path(), &["stats", "clean.bench"]);
    assert_eq!(o.status.code(), Some(0));
    assert!(
        out(&o).contains("gates as written: 1 = nand 1 (1x2)"),
        "{}",
        out(&o)
    );
}

#[test]
fn json_dot_and_expect_files() {
    let d = folder(&[
        ("masked.bench", MASKED),
        ("ok.txt", "y: a\n"),
        ("bad.txt", "y: a, zz\n"),
        (
            "model.json",
            "{\"gates\": {\"or\": {\"cost\": 2, \"delay\": 3}}}",
        ),
        ("badmodel.json", "{\"gates\": {\"mux\": {}}}"),
    ]);
    let o = equicone(
        d.path(),
        &[
            "cone",
            "masked.bench",
            "--json",
            "--dot",
            "y.dot",
            "--expect",
            "ok.txt",
        ],
    );
    assert_eq!(o.status.code(), Some(1));
    let v: serde_json::Value = serde_json::from_str(&out(&o)).unwrap();
    assert_eq!(v["outputs"][0]["redundant"][0], "t");
    assert_eq!(v["outputs"][0]["expected"][0], "a");
    let dot = std::fs::read_to_string(d.path().join("y.dot")).unwrap();
    assert!(dot.contains("fillcolor"), "{dot}");
    let o = equicone(d.path(), &["cone", "masked.bench", "--expect", "bad.txt"]);
    assert_eq!(o.status.code(), Some(2));
    assert!(
        err(&o).starts_with("bad.txt:1:7: error: no input is named `zz`"),
        "{}",
        err(&o)
    );
    let o = equicone(
        d.path(),
        &[
            "stats",
            "masked.bench",
            "--cost-model",
            "model.json",
            "--json",
        ],
    );
    assert_eq!(o.status.code(), Some(0), "{}", err(&o));
    let v: serde_json::Value = serde_json::from_str(&out(&o)).unwrap();
    // NOT 1 + AND 1 + AND 1 + OR 2 = 5; path NOT, AND, OR = 1 + 1 + 3 = 5.
    assert_eq!(v["written"]["total_cost"], 5.0);
    assert_eq!(v["written"]["critical_delay"], 5.0);
    let o = equicone(
        d.path(),
        &["stats", "masked.bench", "--cost-model", "badmodel.json"],
    );
    assert_eq!(o.status.code(), Some(2));
    assert!(
        err(&o).contains("badmodel.json:1:13: error: unknown gate type `mux`"),
        "{}",
        err(&o)
    );
}
