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

/// Issue 13 B4: the supports of `stats` have their own time share; with none, the counts and
/// depth are still there, the support claims are undecided (exit 3) and no bound claims more
/// than the proved inputs give.
#[test]
fn stats_support_time_bounds_the_supports() {
    let o = std::process::Command::new(env!("CARGO_BIN_EXE_equicone"))
        .args([
            "stats",
            "bench-circuits/examples/mux4_tree.bench",
            "--support-time",
            "0",
        ])
        .current_dir(env!("CARGO_MANIFEST_DIR"))
        .output()
        .unwrap();
    assert_eq!(o.status.code(), Some(3), "{}", out(&o));
    assert!(out(&o).contains("gates as written: 11"), "{}", out(&o));
    assert!(out(&o).contains("6 undecided)"), "{}", out(&o));
    assert!(
        out(&o).contains("  y       0+6?     11   0   11"),
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

/// Issue 13 A4: a Verilog input that an expression reads but that folds away is in the cone
/// (from the expressions as written) and redundant, exactly as the same logic written as bench
/// gates is; `unused ... not connected` is only for inputs nothing reads.
#[test]
fn verilog_cones_come_from_the_expressions_as_written() {
    let d = folder(&[
        (
            "a4.v",
            "module m(input a, b, input [1:0] op, input en, input spare, output y, output tie_lo);\n  assign y = a & (b | ~b);\n  assign tie_lo = op[0] & ~op[0] & en;\nendmodule\n",
        ),
        (
            "a4.bench",
            "INPUT(a)\nINPUT(b)\nOUTPUT(y)\nnb = NOT(b)\no = OR(b, nb)\ny = AND(a, o)\n",
        ),
    ]);
    let o = equicone(d.path(), &["cone", "a4.v", "--json"]);
    assert_eq!(o.status.code(), Some(1), "{}", err(&o));
    let v: serde_json::Value = serde_json::from_slice(&o.stdout).unwrap();
    assert_eq!(v["graph"], "written");
    let cone = |name: &str| -> Vec<String> {
        let out = v["outputs"]
            .as_array()
            .unwrap()
            .iter()
            .find(|x| x["name"] == name)
            .unwrap();
        let c: Vec<String> = serde_json::from_value(out["cone"].clone()).unwrap();
        c
    };
    assert_eq!(cone("y"), ["a", "b"]);
    assert_eq!(cone("tie_lo"), ["op[0]", "en"]);
    let flags = v["flags"].as_array().unwrap();
    let redundant = |o: &str, i: &str| {
        flags
            .iter()
            .any(|f| f["flag"] == "redundant_input" && f["output"] == o && f["input"] == i)
    };
    assert!(redundant("y", "b") && redundant("tie_lo", "op[0]") && redundant("tie_lo", "en"));
    let connected: Vec<(String, bool)> = flags
        .iter()
        .filter(|f| f["flag"] == "unused_input")
        .map(|f| {
            (
                f["input"].as_str().unwrap().to_string(),
                f["connected"].as_bool().unwrap(),
            )
        })
        .collect();
    for (input, wired) in &connected {
        let read = !matches!(input.as_str(), "op[1]" | "spare");
        assert_eq!(*wired, read, "{input}: {connected:?}");
    }
    // The same logic as bench gates: the same classification of b.
    let o = equicone(d.path(), &["cone", "a4.bench", "--json"]);
    let w: serde_json::Value = serde_json::from_slice(&o.stdout).unwrap();
    assert_eq!(w["graph"], "netlist");
    assert!(w["flags"]
        .as_array()
        .unwrap()
        .iter()
        .any(|f| f["flag"] == "redundant_input" && f["input"] == "b"));
    // The text names where the cones come from.
    let o = equicone(d.path(), &["cone", "a4.v"]);
    assert!(
        out(&o).contains("structural cones from the expressions as written"),
        "{}",
        out(&o)
    );
}

/// A clocked design's audit covers one cycle with register outputs read as inputs; an input
/// that reaches the output only through registers, the clock, the reset and a register on the
/// way are not `unused`; a pin that reaches nothing through any number of cycles is.
#[test]
fn clocked_inputs_used_through_registers_are_not_flagged_unused() {
    let d = folder(&[(
        "shift.v",
        "module det(input clk, input rst_n, input din, input spare, output reg hit);\n  reg [1:0] st;\n  always @(posedge clk or negedge rst_n)\n    if (!rst_n) st <= 0; else st <= {st[0], din};\n  always @(*) hit = st[1];\nendmodule\n",
    )]);
    let o = equicone(d.path(), &["cone", "shift.v", "--json"]);
    assert_eq!(o.status.code(), Some(1), "{}", err(&o));
    let v: serde_json::Value = serde_json::from_slice(&o.stdout).unwrap();
    let unused: Vec<&str> = v["flags"]
        .as_array()
        .unwrap()
        .iter()
        .filter(|f| f["flag"] == "unused_input")
        .map(|f| f["input"].as_str().unwrap())
        .collect();
    assert_eq!(unused, ["spare"], "{}", out(&o));
    assert_eq!(v["across_cycles"]["outputs"][0]["inputs"]["din"], 2);
}
