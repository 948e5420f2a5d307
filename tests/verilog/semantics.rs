//! Semantics of the subset on small hand-written modules: expression sizing (IEEE 1364-2005
//! clause 5.4), signedness (5.5), always blocks, generate, hierarchy, unknown values and
//! the error messages.

use super::common::{eval_ports, read, read_err};
use equicone::front::verilog::read_verilog;
use std::collections::HashMap;
use std::sync::Arc;

/// Evaluate with port values; unknown inputs 0. Returns output port values (LSB = offset 0).
fn run(d: &equicone::Design, ins: &[(&str, u128)]) -> HashMap<String, u128> {
    run_u(d, ins, false)
}

fn run_u(d: &equicone::Design, ins: &[(&str, u128)], unknown: bool) -> HashMap<String, u128> {
    let ports: HashMap<String, u128> = ins.iter().map(|(n, v)| (n.to_string(), *v)).collect();
    let bits = eval_ports(d, &ports, &mut |_| unknown);
    let mut out: HashMap<String, u128> = HashMap::new();
    let mut rank: HashMap<String, u32> = HashMap::new();
    for o in &d.outputs {
        let r = rank.entry(o.port.clone()).or_insert(0);
        if bits[&o.name] {
            *out.entry(o.port.clone()).or_insert(0) |= 1 << *r;
        } else {
            out.entry(o.port.clone()).or_insert(0);
        }
        *r += 1;
    }
    out
}

/// IEEE 1364-2005 clause 5.4.2 (from memory): in `(a + b) >> 1` with 16-bit operands and a
/// 16-bit target the carry is lost; adding an unsized `0` makes the expression 32 bits wide
/// and keeps it.
#[test]
fn carry_kept_or_lost_by_expression_width() {
    let d = read(
        "module m(input [15:0] a, b, output [15:0] lost, kept, output [16:0] sum, output [15:0] trunc);\n\
         assign lost = (a + b) >> 1;\n assign kept = (a + b + 0) >> 1;\n assign sum = a + b;\n assign trunc = a + b;\nendmodule",
    );
    let r = run(&d, &[("a", 0xFFFF), ("b", 0xFFFF)]);
    assert_eq!(r["lost"], 0x7FFF);
    assert_eq!(r["kept"], 0xFFFF);
    assert_eq!(r["sum"], 0x1FFFE);
    assert_eq!(r["trunc"], 0xFFFE);
}

/// IEEE 1364-2005 clause 5.4.2 (from memory): with a 4-bit `a = 4'hF`, a 6-bit `b = 6'hA` and
/// a 16-bit `c`, `c = a * b` is evaluated in 16 bits (150 = 0x96), while the self-determined
/// `a * b` in a concatenation is 6 bits (150 mod 64 = 0x16).
#[test]
fn multiplication_width_follows_context() {
    let d = read("module m(input [3:0] a, input [5:0] b, output [15:0] c, output [15:0] s);\n assign c = a * b;\n assign s = {a * b};\nendmodule");
    let r = run(&d, &[("a", 0xF), ("b", 0xA)]);
    assert_eq!(r["c"], 0x96);
    assert_eq!(r["s"], 0x16);
}

/// Clause 5.5 (from memory): an expression is signed only if all its operands are; the
/// signedness of the target does not matter.
#[test]
fn signedness_decides_extension_and_comparison() {
    let d = read(
        "module m(input signed [3:0] sb, input [3:0] ub, output [7:0] ext, mixed, output lt0, ltu, lts);\n\
         assign ext = sb;\n assign mixed = sb + ub;\n assign lt0 = sb < 0;\n assign ltu = sb < 4'd0;\n assign lts = sb < $signed(ub);\nendmodule",
    );
    let r = run(&d, &[("sb", 0xF), ("ub", 0x1)]);
    assert_eq!(r["ext"], 0xFF, "signed operand sign-extends");
    assert_eq!(
        r["mixed"], 0x10,
        "mixed signed/unsigned: both zero-extended, 15 + 1"
    );
    assert_eq!(r["lt0"], 1, "-1 < 0 signed");
    assert_eq!(r["ltu"], 0, "unsigned comparison: 15 < 0 is false");
    assert_eq!(r["lts"], 1, "-1 < 1 signed");
}

#[test]
fn arithmetic_shift_needs_signed_context() {
    let d = read(
        "module m(input signed [7:0] a, output [7:0] s, u, output signed [7:0] w);\n\
         assign s = a >>> 2;\n assign u = $unsigned(a) >>> 2;\n assign w = (a >>> 1) + 8'd0;\nendmodule",
    );
    let r = run(&d, &[("a", 0x80)]);
    assert_eq!(r["s"], 0xE0);
    assert_eq!(r["u"], 0x20);
    assert_eq!(r["w"], 0x40, "an unsigned operand makes the shift logical");
}

#[test]
fn always_case_if_for() {
    let d = read(
        "module m(input [7:0] v, input [1:0] op, output reg [3:0] cnt, output reg [2:0] hi, output reg [7:0] r);\n\
         integer i;\n\
         always @* begin\n cnt = 0;\n for (i = 0; i < 8; i = i + 1)\n cnt = cnt + v[i];\n end\n\
         always @(*) begin\n hi = 0;\n casez (v)\n 8'b1???????: hi = 7;\n 8'b01??????: hi = 6;\n 8'b001?????: hi = 5;\n default: hi = 0;\n endcase\n end\n\
         always @* begin\n case (op)\n 2'd0: r = v;\n 2'd1: r = ~v;\n 2'd2: begin r = v; r[0] = 1'b0; end\n default: if (v[0]) r = 8'hAA; else r = 8'h55;\n endcase\n end\nendmodule",
    );
    let r = run(&d, &[("v", 0b0010_1101), ("op", 2)]);
    assert_eq!(r["cnt"], 4);
    assert_eq!(r["hi"], 5);
    assert_eq!(r["r"], 0b0010_1100);
    let r = run(&d, &[("v", 0b1000_0001), ("op", 3)]);
    assert_eq!((r["cnt"], r["hi"], r["r"]), (2, 7, 0xAA));
}

#[test]
fn latch_is_an_error_naming_the_variable_and_line() {
    let e = read_err("module m(input a, b, output reg y);\nalways @* begin\n  if (a)\n    y = b;\nend\nendmodule");
    assert!(e.contains("t.v:3:3: error: `y` is not assigned on every path through the always block (the statement at line 3"), "{e}");
}

#[test]
fn generate_ripple_carry_equals_addition() {
    let d = read(
        "module fa(input a, b, ci, output s, co);\n assign s = a ^ b ^ ci;\n assign co = (a & b) | (ci & (a ^ b));\nendmodule\n\
         module add #(parameter N = 4) (input [N-1:0] x, y, output [N:0] z);\n wire [N:0] c;\n assign c[0] = 1'b0;\n genvar i;\n\
         generate for (i = 0; i < N; i = i + 1) begin : bit\n fa u(.a(x[i]), .b(y[i]), .ci(c[i]), .s(z[i]), .co(c[i+1]));\n end endgenerate\n\
         assign z[N] = c[N];\nendmodule\n\
         module top(input [7:0] p, q, output [8:0] r, output [4:0] t);\n add #(.N(8)) a8(p, q, r);\n add a4(.x(p[3:0]), .y(q[3:0]), .z(t));\nendmodule",
    );
    assert_eq!(d.name, "top");
    for (p, q) in [(0u128, 0u128), (255, 1), (200, 100), (15, 15), (170, 85)] {
        let r = run(&d, &[("p", p), ("q", q)]);
        assert_eq!(r["r"], p + q);
        assert_eq!(r["t"], (p & 15) + (q & 15));
    }
    let nl = d.netlist.as_ref().unwrap();
    assert!(!nl.complete, "assign statements are not gate primitives");
}

#[test]
fn out_of_range_select_reads_an_unknown_only_when_out_of_range() {
    // Tidewater 7 telemetry selector: 12 channels of 8 bits, 4-bit select.
    let d = read("module sel(input [95:0] ch, input [3:0] s, output [7:0] y);\n  assign y = ch[s*8 +: 8];\nendmodule");
    let unknowns: Vec<_> = d.inputs.iter().filter(|b| b.is_unknown()).collect();
    assert_eq!(unknowns.len(), 8);
    assert_eq!(unknowns[0].name, "x@t.v:2:14[0]");
    assert_eq!(d.num_port_inputs(), 100);
    let ch: u128 = (0..12)
        .map(|k| ((k as u128 * 17 + 3) & 0xFF) << (8 * k))
        .sum();
    for s in 0..16u128 {
        let lo = run_u(&d, &[("ch", ch), ("s", s)], false)["y"];
        let hi = run_u(&d, &[("ch", ch), ("s", s)], true)["y"];
        if s < 12 {
            assert_eq!((lo, hi), ((ch >> (8 * s)) & 0xFF, (ch >> (8 * s)) & 0xFF));
        } else {
            assert_eq!((lo, hi), (0, 0xFF), "select {s} reads the unknown input");
        }
    }
}

#[test]
fn x_literal_is_an_unknown_input_with_its_position() {
    let d = read("module m(input a, output [1:0] y);\nassign y = a ? 2'b1x : 2'b00;\nendmodule");
    let u: Vec<_> = d
        .inputs
        .iter()
        .filter(|b| b.is_unknown())
        .map(|b| b.name.clone())
        .collect();
    assert_eq!(u, vec!["x@t.v:2:16[0]"]);
}

#[test]
fn port_width_change_warns() {
    let d = read("module sub(input [3:0] a, output [3:0] y);\n assign y = a;\nendmodule\nmodule top(input [7:0] p, output [7:0] q);\n sub u(.a(p), .y(q));\nendmodule");
    let w: Vec<String> = d.warnings.iter().map(|w| w.to_string()).collect();
    assert_eq!(w.len(), 2, "{w:?}");
    assert!(w[0].starts_with("t.v:5:11: warning: port connection changes width: port `a` of instance `u` (module `sub`) is 4 bits, the connected expression is 8 bits"), "{w:?}");
    assert!(read_err_or_undriven(&d));
}

fn read_err_or_undriven(d: &equicone::Design) -> bool {
    // q[7:4] are driven by zero-extension of the 4-bit output port.
    let r = run(d, &[("p", 0xAB)]);
    r["q"] == 0x0B
}

#[test]
fn several_errors_are_reported_together() {
    let e = read_err("module m(input a, inout b, output y);\n assign y = a;\n always @(posedge a or b) y = 1;\n final y = 0;\nendmodule");
    let lines: Vec<&str> = e.lines().filter(|l| l.contains("error")).collect();
    assert!(lines.len() >= 3, "{e}");
    assert!(
        e.contains("t.v:1:19: error: unsupported: `inout` port"),
        "{e}"
    );
    assert!(
        e.contains(
            "t.v:3:24: error: unsupported: event list mixing clock edges with plain signals"
        ),
        "{e}"
    );
    assert!(e.contains("t.v:4:2: error: unsupported: `final`"), "{e}");
}

#[test]
fn loops_multiple_drivers_and_undriven_nets_are_errors() {
    let e = read_err("module m(input a, output y);\n wire p, q;\n assign p = q & a;\n assign q = ~p;\n assign y = p;\nendmodule");
    assert!(e.contains("error: combinational loop through "), "{e}");
    assert!(e.contains('p') && e.contains('q'), "{e}");
    let e = read_err("module m(input a, output y);\n assign y = a;\n assign y = ~a;\nendmodule");
    assert!(
        e.contains("t.v:3:2: error: multiple drivers: `y` is already driven at t.v:2:2"),
        "{e}"
    );
    let e = read_err("module m(input a, output y);\n wire w;\n assign y = a & w;\nendmodule");
    assert!(
        e.contains("t.v:2:7: error: `w` is used but never driven"),
        "{e}"
    );
    let e = read_err("module m(input a, output y);\n foo u(a, y);\nendmodule");
    assert!(e.contains("t.v:2:6: error: unknown module `foo`"), "{e}");
}

#[test]
fn deep_and_long_expressions_do_not_overflow() {
    // 200,000-term chain: a flat loop in the parser and the elaborator.
    let chain = vec!["a"; 200_000].join(" ^ ");
    let d = read(&format!(
        "module m(input a, output y);\nassign y = b ^ {chain};\nwire b = a;\nendmodule"
    ));
    assert_eq!(run(&d, &[("a", 1)])["y"], 1);
    // 100,000 nested parentheses: a clear error, no stack overflow.
    let deep = format!("{}a{}", "(".repeat(100_000), ")".repeat(100_000));
    let e = read_err(&format!(
        "module m(input a, output y);\nassign y = {deep};\nendmodule"
    ));
    assert!(e.contains("nesting deeper than 1000 levels"), "{e}");
    // 450 nested parenthesized conditionals (900 nesting levels) are fine.
    let mut x = String::from("a");
    for _ in 0..450 {
        x = format!("(a ? {x} : ~b)");
    }
    let d = read(&format!(
        "module m(input a, b, output y);\nassign y = {x};\nendmodule"
    ));
    assert_eq!(run(&d, &[("a", 0), ("b", 0)])["y"], 1);
}

#[test]
fn top_selection_and_several_files() {
    let f1 = (
        Arc::from("lib.v"),
        "module inv(input a, output y); not (y, a); endmodule\n".to_string(),
    );
    let f2 = (
        Arc::from("top.v"),
        "module t(input p, output q); inv u(.a(p), .y(q)); endmodule\n".to_string(),
    );
    let d = read_verilog(&[f1.clone(), f2.clone()], None).unwrap();
    assert_eq!(d.name, "t");
    assert_eq!(d.inputs[0].name, "p");
    let nl = d.netlist.as_ref().unwrap();
    assert!(nl.complete);
    assert_eq!(nl.cells.len(), 1);
    let d = read_verilog(&[f1.clone(), f2], Some("inv")).unwrap();
    assert_eq!(d.name, "inv");
    let f3 = (
        Arc::from("other.v"),
        "module u(input p, output q); assign q = p; endmodule\n".to_string(),
    );
    // The first file's one uninstantiated module is the top over those of the later
    // (library) files, with a warning that names the choice.
    let d = read_verilog(&[f1.clone(), f3.clone()], None).unwrap();
    assert_eq!(d.name, "inv");
    assert!(
        d.warnings
            .iter()
            .any(|w| w.to_string().contains("top module `inv` chosen")),
        "{:?}",
        d.warnings
    );
    // Two uninstantiated modules in the first file: still an error.
    let f4 = (
        Arc::from("two.v"),
        "module inv(input a, output y); not (y, a); endmodule\nmodule v(input a, output y); assign y = a; endmodule\n".to_string(),
    );
    let e = read_verilog(&[f4, f3], None).unwrap_err().to_string();
    assert!(
        e.contains("several modules could be the top: inv, v, u"),
        "{e}"
    );
}

#[test]
fn ranges_in_both_directions_and_non_ansi_ports() {
    let d = read(
        "module m(a, b, y, z);\n input [0:3] a;\n input [0:0] b;\n output [4:1] y;\n output z;\n reg [4:1] y;\n\
         always @* y = {a[0:1], a[2], b};\n assign z = a[3];\nendmodule",
    );
    let names: Vec<&str> = d.inputs.iter().map(|b| b.name.as_str()).collect();
    assert_eq!(names, vec!["a[3]", "a[2]", "a[1]", "a[0]", "b[0]"]);
    // a = 4'b1000 means a[0] = 1 (a[0] is the most significant bit).
    let r = run(&d, &[("a", 0b1000), ("b", 1)]);
    assert_eq!(r["y"], 0b1001);
    assert_eq!(r["z"], 0);
}
