//! The SystemVerilog that RTL uses every day (IEEE 1800-2017, from memory): `logic` and
//! `bit`, `always_comb`, `i++` / `+=` style assignments, `unique`/`priority` `case` and
//! `if` read as the plain forms. Each module is checked on every input value against
//! Icarus Verilog 11 with `-g2012`.

use super::common::{eval_ports, iverilog_available, read, run_iverilog_as};
use std::collections::HashMap;

/// (module text, input ports with widths, output ports with widths)
type Case = (
    &'static str,
    &'static [(&'static str, u32)],
    &'static [(&'static str, u32)],
);

const CASES: &[Case] = &[
    (
        "module popcount(input logic [5:0] d, output logic [2:0] n);
  integer i;
  always_comb begin
    n = '0;
    for (i = 0; i < 6; i++) n += d[i];
  end
endmodule",
        &[("d", 6)],
        &[("n", 3)],
    ),
    (
        "module dec(input bit [1:0] s, input logic en, output logic [3:0] y);
  always_comb begin
    y = 4'b0;
    if (en)
      unique case (s)
        2'd0: y[0] = 1'b1;
        2'd1: y[1] = 1'b1;
        2'd2: y[2] = 1'b1;
        2'd3: y[3] = 1'b1;
      endcase
  end
endmodule",
        &[("s", 2), ("en", 1)],
        &[("y", 4)],
    ),
    (
        "module prio(input logic [3:0] r, output logic [1:0] g, output logic v);
  always_comb begin
    v = |r;
    priority casez (r)
      4'b1???: g = 2'd3;
      4'b01??: g = 2'd2;
      4'b001?: g = 2'd1;
      default: g = 2'd0;
    endcase
  end
endmodule",
        &[("r", 4)],
        &[("g", 2), ("v", 1)],
    ),
    (
        "module acc(input logic [3:0] a, b, output logic [7:0] y);
  logic [7:0] t;
  assign y = t ^ {a, b};
  always_comb begin
    t = a;
    t *= b;
    t -= 8'd3;
    t |= {7'b0, a[0]};
    t--;
  end
endmodule",
        &[("a", 4), ("b", 4)],
        &[("y", 8)],
    ),
    (
        // typedef enum (implicit and explicit values, a base type), a typedef alias, a
        // packed struct with member reads and writes, whole-struct assignment, $bits.
        "package cfg;
  localparam int W = 4;
  typedef logic [W-1:0] nib_t;
  typedef enum logic [1:0] {IDLE, LOAD, RUN = 2'd3} state_t;
  typedef struct packed {
    nib_t       hi;
    logic       flag;
    logic [0:2] lo;
  } pkt_t;
endpackage
module typed import cfg::*; (input state_t s, input pkt_t p, output logic [7:0] y, output nib_t z);
  typedef enum {A, B, C = 5, D} e_t;
  pkt_t q;
  always_comb begin
    q = p;
    q.flag = ~p.flag;
    q.lo[0] = p.hi[3];
    q.hi[1:0] = {p.lo[1], p.lo[2]};
    unique case (s)
      IDLE: y = {p.hi, p.lo, p.flag};
      LOAD: y = q;
      cfg::RUN: y = q.hi * p.lo;
      default: y = D + $bits(e_t) + $bits(pkt_t) + $bits(q.hi);
    endcase
    z = p.hi ^ W ^ $bits(p);
  end
endmodule",
        &[("s", 2), ("p", 8)],
        &[("y", 8), ("z", 4)],
    ),
    (
        // byte/shortint members, a struct inside a struct, a $unit typedef, pkg::type,
        // an enum declared in place.
        "typedef logic [2:0] tri_t;
package p2;
  typedef logic [13:0] w_t;
  parameter K = 3;
endpackage
module nest(input p2::w_t ow, input logic [1:0] k, output logic [7:0] y, output tri_t w);
  typedef struct packed { logic [1:0] a; logic [2:0] b; } inner_t;
  typedef struct packed { logic s; inner_t in; byte c; } outer_t;
  enum logic [1:0] {X0, X1, X2} st;
  outer_t o;
  assign o = ow;
  always_comb begin
    if (k[1]) st = X2; else if (k[0]) st = X1; else st = X0;
    w = o.in.b + p2::K;
    case (st)
      X0: y = o.c;
      X1: y = {o.s, o.in, o.in.a};
      default: y = o.c >>> o.in.a;
    endcase
  end
endmodule",
        &[("ow", 14), ("k", 2)],
        &[("y", 8), ("w", 3)],
    ),
];

fn value(bits: &HashMap<String, bool>, port: &str, w: u32) -> u128 {
    if w == 1 && bits.contains_key(port) {
        return u128::from(bits[port]);
    }
    (0..w).fold(0, |v, k| v | u128::from(bits[&format!("{port}[{k}]")]) << k)
}

#[test]
fn systemverilog_rtl_matches_icarus_verilog() {
    let iv = iverilog_available();
    for (src, ins, outs) in CASES {
        let d = read(src);
        let total: u32 = ins.iter().map(|p| p.1).sum();
        let last = &src[src.rfind("module ").unwrap()..];
        let name = last.split(['(', ' ']).nth(1).unwrap();
        let mut tb = format!("module tb; reg [{}:0] vin_;\n", total - 1);
        let mut conns = Vec::new();
        let mut off = 0;
        for (p, w) in ins.iter() {
            conns.push(format!(".{p}(vin_[{}:{off}])", off + w - 1));
            off += w;
        }
        for (p, w) in outs.iter() {
            tb += &format!("wire [{}:0] {p};\n", w - 1);
            conns.push(format!(".{p}({p})"));
        }
        let shown: Vec<&str> = outs.iter().map(|p| p.0).collect();
        tb += &format!(
            "{name} u({});\ninitial begin vin_ = 0; repeat ({}) begin #1 $display(\"%0d{}\", vin_{}); vin_ = vin_ + 1; end end\nendmodule\n",
            conns.join(", "),
            1u32 << total,
            " %0d".repeat(shown.len()),
            shown.iter().map(|s| format!(", {s}")).collect::<String>()
        );
        let sim = if iv {
            run_iverilog_as(&format!("{src}\n{tb}"), "tb", "-g2012")
        } else {
            String::new()
        };
        let mut n = 0;
        for line in sim.lines() {
            let f: Vec<u128> = line.split(' ').map(|x| x.parse().unwrap()).collect();
            let mut ports = HashMap::new();
            let mut off = 0;
            for (p, w) in ins.iter() {
                ports.insert(p.to_string(), (f[0] >> off) & ((1 << w) - 1));
                off += w;
            }
            let bits = eval_ports(&d, &ports, &mut |_| false);
            for (k, (p, w)) in outs.iter().enumerate() {
                assert_eq!(value(&bits, p, *w), f[k + 1], "{name}: {p} for {line}");
            }
            n += 1;
        }
        if iv {
            assert_eq!(n, 1 << total, "{name}");
        }
    }
}

/// `.sv` files are Verilog to the command line.
#[test]
fn sv_files_are_read_by_the_command_line() {
    let dir = tempfile::tempdir().unwrap();
    let f = dir.path().join("dec.sv");
    std::fs::write(&f, CASES[1].0).unwrap();
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_equicone"))
        .arg("prove")
        .arg(&f)
        .arg(&f)
        .output()
        .unwrap();
    assert_eq!(
        out.status.code(),
        Some(0),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
}

/// A part select of a member declared low to high (`[0:2]`) reads the bits it names:
/// IEEE 1800-2017 clause 7.2.1 (from memory) packs members like a vector, so `lo[1:2]` of
/// `lo = 3'b011` (`lo[0]` = 0, `lo[1]` = 1, `lo[2]` = 1) is `2'b11`. Computed by hand:
/// Icarus Verilog 11 reads such selects wrongly (00 for 01) or stops on them, so it is not
/// the reference here.
#[test]
fn ascending_struct_members_select_the_bits_they_name() {
    let d = read(
        "module asc(input [7:0] v, output [1:0] a, output [1:0] b, output [1:0] c);
  typedef struct packed { logic [3:0] hi; logic flag; logic [0:2] lo; } pkt_t;
  pkt_t p;
  assign p = v;
  assign a = p.lo[1:2];
  assign b = p.lo[0+:2];
  assign c = p.hi[3-:2];
endmodule",
    );
    // v = 1010_0_011: hi = 1010, flag = 0, lo = 011.
    let bits = eval_ports(
        &d,
        &HashMap::from([("v".to_string(), 0b1010_0011)]),
        &mut |_| false,
    );
    assert_eq!(value(&bits, "a", 2), 0b11);
    assert_eq!(value(&bits, "b", 2), 0b01);
    assert_eq!(value(&bits, "c", 2), 0b10);
}

/// Constructs outside the subset: one `unsupported:` error each at file:line:column, the
/// construct skipped whole, no follow-on errors.
#[test]
fn unsupported_constructs_give_one_error_each() {
    let src = "interface bus_if; logic a; modport m(input a); endinterface
class C; int x; function void f(); x = 1; endfunction endclass
module m(input [3:0] a, output [3:0] y);
  initial begin y = 1; $display(\"x\"); end
  task t; #1 y = 2; endtask
  function [3:0] g(input [3:0] v); g = v + 1; endfunction
  always_latch if (a[0]) y = a;
  typedef union packed { logic [3:0] a; logic [3:0] b; } u_t;
  assign y = a;
  final begin y = 0; end
endmodule
";
    let e = super::common::read_err(src);
    let lines: Vec<&str> = e.lines().filter(|l| l.contains("error:")).collect();
    let want = [
        "t.v:1:1: error: unsupported: `interface`",
        "t.v:2:1: error: unsupported: `class`",
        // An `initial` block is read for its constants; a system task in it is not.
        "t.v:4:24: error: unsupported: system task `$display`",
        "t.v:5:3: error: unsupported: task declaration",
        "t.v:7:3: error: unsupported: `always_latch`",
        "t.v:8:11: error: unsupported: `union`",
        "t.v:10:3: error: unsupported: `final`",
    ];
    assert_eq!(lines.len(), want.len(), "{e}");
    for (l, w) in lines.iter().zip(want) {
        assert!(l.starts_with(w), "{l} / {w}\n{e}");
    }
}

/// Mistakes with the new names are errors that say what is wrong.
#[test]
fn type_and_package_mistakes_are_named() {
    let e =
        super::common::read_err("module m(input [3:0] a, output y); assign y = q::N; endmodule");
    assert!(e.contains("t.v:1:47: error: unknown package `q`"), "{e}");
    let e = super::common::read_err(
        "package q; localparam N = 1; endpackage
module m(input [3:0] a, output y); assign y = q::M; endmodule",
    );
    assert!(e.contains("package `q` declares no parameter `M`"), "{e}");
    let e = super::common::read_err(
        "module m(input [3:0] a, output y);
  typedef struct packed { logic b; logic c; } s_t;
  s_t s;
  assign s = a;
  assign y = s.d;
endmodule",
    );
    assert!(e.contains("t.v:5:16: error: `s` has no member `d`"), "{e}");
    let e = super::common::read_err(
        "module m(input [3:0] a, output y);
  typedef struct { logic b; } s_t;
  assign y = a;
endmodule",
    );
    assert!(
        e.contains("t.v:2:11: error: unsupported: unpacked `struct`"),
        "{e}"
    );
}
