//! RTL as designers write it: event lists (IEEE 1364-2005 clause 9.7), `case`/`if` chains
//! that cover every selector value without a `default`, `always_comb` (IEEE 1800-2017
//! clause 9.2.2.2, from memory), clocked blocks read with their mixes and resets checked, latches refused, and a top without outputs refused.

use super::common::{eval_ports, read, read_err};
use std::collections::HashMap;

/// Output port values of `d` for input port values `ins`.
fn outs(d: &equicone::Design, ins: &[(&str, u128)]) -> HashMap<String, u128> {
    let ports: HashMap<String, u128> = ins.iter().map(|(n, v)| (n.to_string(), *v)).collect();
    let bits = eval_ports(d, &ports, &mut |_| false);
    let mut out: HashMap<String, u128> = HashMap::new();
    let mut rank: HashMap<String, u32> = HashMap::new();
    for o in &d.outputs {
        let r = rank.entry(o.port.clone()).or_insert(0);
        let v = out.entry(o.port.clone()).or_insert(0);
        if bits[&o.name] {
            *v |= 1 << *r;
        }
        *r += 1;
    }
    out
}

fn warnings(d: &equicone::Design) -> Vec<String> {
    d.warnings.iter().map(|w| w.to_string()).collect()
}

/// A 4:1 selector written four ways; every one selects `d[sel]` for every value.
#[test]
fn event_lists_and_full_cases_read_as_combinational_logic() {
    let bodies = [
        "always @(sel or d) case (sel) 2'd0: y = d[0]; 2'd1: y = d[1]; 2'd2: y = d[2]; 2'd3: y = d[3]; endcase",
        "always @(sel, d) begin if (sel == 0) y = d[0]; else if (sel == 1) y = d[1]; else if (sel == 2) y = d[2]; else if (sel == 3) y = d[3]; end",
        "always @(*) casez (sel) 2'b0?: y = sel[0] ? d[1] : d[0]; 2'b1?: y = sel[0] ? d[3] : d[2]; endcase",
        "always_comb case (sel) 0, 1: y = d[sel]; 2: y = d[2]; 3: y = d[3]; endcase",
    ];
    for b in bodies {
        let src =
            format!("module m(input [1:0] sel, input [3:0] d, output reg y);\n{b}\nendmodule");
        let d = read(&src);
        assert!(warnings(&d).is_empty(), "{b}: {:?}", warnings(&d));
        for sel in 0..4u128 {
            for data in 0..16u128 {
                let r = outs(&d, &[("sel", sel), ("d", data)]);
                assert_eq!(r["y"], (data >> sel) & 1, "{b} sel={sel} d={data}");
            }
        }
    }
}

/// IEEE 1364-2005 clause 9.7: a list that misses a variable the block reads makes a
/// simulator skip changes of it; the design is read as synthesis reads it, with a warning.
#[test]
fn an_event_list_missing_a_read_variable_is_a_warning_naming_it() {
    let d = read(
        "module m(input a, b, c, output reg y);\nalways @(a or b)\n  y = a & b | c;\nendmodule",
    );
    let w = warnings(&d);
    assert_eq!(w.len(), 1, "{w:?}");
    assert!(
        w[0].contains("t.v:2:8: warning: the event list misses `c` (read at line 3)"),
        "{}",
        w[0]
    );
    assert!(w[0].contains("9.7"), "{}", w[0]);
    // Read as `@*`.
    assert_eq!(outs(&d, &[("a", 0), ("b", 0), ("c", 1)])["y"], 1);
}

#[test]
fn a_real_gap_is_still_a_latch_and_names_an_uncovered_value() {
    let e = read_err(
        "module m(input [1:0] s, input a, b, c, output reg y);\nalways @* case (s) 2'd0: y = a; 2'd1: y = b; 2'd3: y = c; endcase\nendmodule",
    );
    assert!(e.contains("it would infer a latch"), "{e}");
    assert!(e.contains("for example when s[1]=1, s[0]=0"), "{e}");
    let e = read_err(
        "module m(input en, a, output reg y);\nalways @(en or a) if (en) y = a;\nendmodule",
    );
    assert!(e.contains("for example when en=0"), "{e}");
}

#[test]
fn mixed_event_lists_and_latches_are_refused_precisely() {
    let e = read_err(
        "module m(input clk, d, output reg q);\nalways @(posedge clk or d) q <= d;\nendmodule",
    );
    assert!(
        e.starts_with(
            "t.v:2:25: error: unsupported: event list mixing clock edges with plain signals"
        ),
        "{e}"
    );
    assert_eq!(e.matches("error").count(), 1, "{e}");
    let e = read_err("module m(input en, d, output reg q);\nalways_latch if (en) q = d;\nassign x = ;\nendmodule");
    assert!(
        e.contains("t.v:2:1: error: unsupported: `always_latch`"),
        "{e}"
    );
}

/// Issue 13 A1: a top with no output ports has nothing to compare.
#[test]
fn a_top_without_outputs_is_an_error() {
    let e = read_err("module m(input a, b);\nwire w = a & b;\nendmodule");
    assert!(
        e.contains("t.v:1:1: error: top module `m` has no output ports: nothing to check"),
        "{e}"
    );
    assert!(e.contains("help: "), "{e}");
}

/// Issue 13 A1 through the command line: exit code 2 (bad input).
#[test]
fn prove_of_a_top_without_outputs_exits_2() {
    let dir = std::env::temp_dir().join(format!("equicone-a1-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let f = dir.join("none.v");
    std::fs::write(&f, "module m(input a);\nendmodule\n").unwrap();
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_equicone"))
        .arg("prove")
        .arg(&f)
        .arg(&f)
        .output()
        .unwrap();
    let err = String::from_utf8_lossy(&out.stderr);
    assert_eq!(out.status.code(), Some(2), "{err}");
    assert!(err.contains("nothing to check"), "{err}");
    let _ = std::fs::remove_dir_all(&dir);
}

/// Clocked blocks: blocking/non-blocking mixes that simulation and synthesis read apart are
/// errors naming the variable; so are resets the block does not test as declared.
#[test]
fn clocked_block_mixes_and_resets_are_refused_naming_the_variable() {
    let e = read_err("module m(input clk, d, output reg q);\nalways @(posedge clk) begin q = d; q <= ~d; end\nendmodule");
    assert!(
        e.starts_with(
            "t.v:2:1: error: `q` is assigned with both `=` and `<=` in this clocked block"
        ),
        "{e}"
    );
    assert_eq!(e.matches("error").count(), 1, "{e}");
    let e = read_err("module m(input clk, d, output reg q);\nreg t;\nalways @(posedge clk) t = d;\nalways @(posedge clk) q <= t;\nendmodule");
    assert!(
        e.starts_with("t.v:4:1: error: `t` is assigned with `=` in the clocked block at line 3 and read by this clocked block"),
        "{e}"
    );
    let e = read_err("module m(input clk, rst, d, output reg q);\nalways @(posedge clk or posedge rst) if (!rst) q <= 0; else q <= d;\nendmodule");
    assert!(
        e.starts_with("t.v:2:42: error: the reset's event is `posedge` but the `if` does not test it active high"),
        "{e}"
    );
    assert_eq!(e.matches("error").count(), 1, "{e}");
    let e = read_err("module m(input clk, rst, d, output reg q);\nalways @(posedge clk or posedge rst) if (rst) q <= d; else q <= ~d;\nendmodule");
    assert!(
        e.contains("error: unsupported: the asynchronous reset branch gives `q` a value that is not constant"),
        "{e}"
    );
    let e = read_err("module m(input clk, d, output reg q);\nalways_ff @* q <= d;\nendmodule");
    assert!(
        e.contains("t.v:2:1: error: unsupported: `always_ff` without a clock edge"),
        "{e}"
    );
    // A derived clock (a gated one, `clk & d`, is read as an enable: tests/seq/gated.rs).
    let e = read_err("module m(input clk, d, output reg q);\nwire g = clk ^ d;\nalways @(posedge g) q <= d;\nendmodule");
    assert!(
        e.contains("error: unsupported: the clock of register `q` is not a top-level input port"),
        "{e}"
    );
}

/// Blocking temporaries of a clocked block are not registers; a variable read before it is
/// written is one.
#[test]
fn clocked_blocking_temporaries_are_not_registers() {
    let d = read("module m(input clk, input [3:0] a, b, output reg [4:0] s, output reg [3:0] c);\nreg [4:0] t;\nalways @(posedge clk) begin t = a + b; s <= t; end\nalways @(posedge clk) c = c + 4'd1;\nendmodule");
    let names: Vec<&str> = d.registers.iter().map(|r| r.name.as_str()).collect();
    assert_eq!(
        names,
        ["s[0]", "s[1]", "s[2]", "s[3]", "s[4]", "c[0]", "c[1]", "c[2]", "c[3]"]
    );
}
