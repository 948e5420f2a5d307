//! Gate-level netlists as tools write them (IEEE 1364-2005): `supply0`/`supply1` nets
//! (clause 4.6.7), `tri` (clause 4.6), delays on gates and assignments ignored with one
//! warning (clauses 7.14 and 6.1.3), escaped names, `assign {a, b} = ...`, unconnected
//! ports; Icarus Verilog simulates the same netlist.

use super::common::{eval_ports, iverilog_available, read, read_err, run_iverilog};
use std::collections::HashMap;

const NETLIST: &str = "`timescale 1ns/1ps
module inv_cell(input i, output o, output n);
  assign #1 o = ~i;
  buf #(1, 2) (n, i);
endmodule
module top(a, b, c, y, z);
  input a, b;
  input [1:0] c;
  output y;
  output [1:0] z;
  supply0 gnd;
  supply1 vdd;
  supply1 [2:0] ones;
  tri \\net[0] ;
  wire p, q, r;
  and #2 g1 (\\net[0] , a, vdd, ones[2]);
  nor #(1:2:3, 2:3:4) g2 (p, b, gnd);
  xor #1.5 (q, \\net[0] , p);
  inv_cell u1 (.i(q), .o(r), .n());
  assign #3 {z[1], z[0]} = {r ^ c[1], c[0] | gnd};
  or (y, r, &ones & gnd);
endmodule
";

fn model(a: u128, b: u128, c: u128) -> (u128, u128) {
    let net0 = a;
    let p = 1 - b;
    let q = net0 ^ p;
    let r = 1 - q;
    let z = ((r ^ (c >> 1)) << 1) | (c & 1);
    (r, z)
}

#[test]
fn supplies_tri_delays_and_escaped_names_read_as_written() {
    let d = read(NETLIST);
    let w: Vec<String> = d.warnings.iter().map(|w| w.to_string()).collect();
    assert_eq!(w.len(), 1, "{w:?}");
    assert!(
        w[0].contains("t.v:3:10: warning: delays are ignored"),
        "{}",
        w[0]
    );
    for a in 0..2 {
        for b in 0..2 {
            for c in 0..4 {
                let ports: HashMap<String, u128> =
                    [("a".into(), a), ("b".into(), b), ("c".into(), c)].into();
                let out = eval_ports(&d, &ports, &mut |_| false);
                let (y, z) = model(a, b, c);
                assert_eq!(u128::from(out["y"]), y);
                assert_eq!(u128::from(out["z[0]"]) | u128::from(out["z[1]"]) << 1, z);
            }
        }
    }
}

#[test]
fn strengths_and_driven_supplies_are_errors() {
    let e = read_err("module m(input a, output y);\n  and (strong0, weak1) g(y, a, a);\nendmodule");
    assert!(
        e.contains("t.v:2:7: error: unsupported: drive strength on a gate"),
        "{e}"
    );
    let e = read_err(
        "module m(input a, output y);\n  supply1 v;\n  assign v = a;\n  assign y = v;\nendmodule",
    );
    assert!(e.contains("multiple drivers"), "{e}");
    let e = read_err("module m(input a, output y);\n  wand w;\n  assign y = a;\nendmodule");
    assert!(e.contains("t.v:2:3: error: unsupported: `wand`"), "{e}");
}

/// Icarus Verilog 11 simulates the netlist (after the delays settle) on every input value.
#[test]
fn icarus_verilog_agrees_on_the_netlist() {
    if !iverilog_available() {
        return;
    }
    let tb = "module tb; reg a, b; reg [1:0] c; wire y; wire [1:0] z; top t(a, b, c, y, z);
integer i; initial for (i = 0; i < 16; i = i + 1) begin {a, b, c} = i; #20 $display(\"%0d %0d %0d %0d %0d\", a, b, c, y, z); end
endmodule\n";
    let out = run_iverilog(&format!("{NETLIST}{tb}"), "tb");
    let d = read(NETLIST);
    let mut n = 0;
    for line in out.lines() {
        let v: Vec<u128> = line.split(' ').map(|x| x.parse().unwrap()).collect();
        let ports: HashMap<String, u128> =
            [("a".into(), v[0]), ("b".into(), v[1]), ("c".into(), v[2])].into();
        let o = eval_ports(&d, &ports, &mut |_| false);
        assert_eq!(u128::from(o["y"]), v[3], "{line}");
        assert_eq!(
            u128::from(o["z[0]"]) | u128::from(o["z[1]"]) << 1,
            v[4],
            "{line}"
        );
        n += 1;
    }
    assert_eq!(n, 16);
}
