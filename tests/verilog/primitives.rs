//! Cell libraries as vendors write them: combinational user-defined primitives (tables) and
//! `specify` blocks. Each primitive is checked against Icarus Verilog on every input value.

use super::common::{eval_ports, iverilog_available, read, read_err, run_iverilog};
use std::collections::HashMap;

/// A small cell library in the style of vendor simulation models: delays, `specify` blocks,
/// `celldefine`, and tables using `?` and `b`; `MAJ` leaves the input 111 to no row, so it
/// gives x there (in Icarus as in equicone).
const CELLS: &str = "`timescale 1ns/1ps
`celldefine
module MX2 (Y, S, A, B);
  input S, A, B; output Y;
  udp_mx u (Y, S, A, B);
  specify
    specparam tpd = 0.1;
    (S => Y) = (tpd, tpd);
    (A => Y) = (0.1, 0.1);
  endspecify
endmodule
`endcelldefine
primitive udp_mx (out, s, a, b);
  output out; input s, a, b;
  table
  // s a b : out
     0 0 ? : 0;
     0 1 ? : 1;
     1 ? 0 : 0;
     1 ? 1 : 1;
     x 0 0 : 0;
     x 1 1 : 1;
  endtable
endprimitive
primitive udp_aoi (y, a, b, c);
  output y; input a, b, c;
  table
     1 1 ? : 0;
     ? ? 1 : 0;
     0 b 0 : 1;
     1 0 0 : 1;
  endtable
endprimitive
primitive udp_maj (y, a, b, c);
  output y; input a, b, c;
  table
     0 0 ? : 0;
     0 ? 0 : 0;
     ? 0 0 : 0;
     1 1 0 : 1;
     1 0 1 : 1;
     0 1 1 : 1;
  endtable
endprimitive
module top (s, a, b, c, m, n, k);
  input s, a, b, c; output m, n, k;
  MX2 u1 (.Y(m), .S(s), .A(a), .B(b));
  udp_aoi u2 (n, a, b, c);
  udp_maj u3 (k, a, b, c);
endmodule
";

/// Icarus Verilog 11 simulates the library on every input value: where it prints 0 or 1,
/// equicone's model gives the same for every value of its unknowns; where it prints x (the
/// majority's uncovered row), equicone's output is an unknown: both values occur.
#[test]
fn primitives_agree_with_icarus_on_every_input() {
    let d = read(CELLS);
    let unknowns = d.inputs.iter().filter(|b| b.is_unknown()).count();
    assert_eq!(unknowns, 1, "only the majority's uncovered row gives x");
    if !iverilog_available() {
        return;
    }
    let tb = "module tb; reg s, a, b, c; wire m, n, k; top t(s, a, b, c, m, n, k);
integer i; initial for (i = 0; i < 16; i = i + 1) begin {s, a, b, c} = i; #1 $display(\"%0d %0d %0d %0d %b %b %b\", s, a, b, c, m, n, k); end
endmodule\n";
    let out = run_iverilog(&format!("{CELLS}{tb}"), "tb");
    let mut n = 0;
    let mut x_seen = 0;
    for line in out.lines() {
        let v: Vec<&str> = line.split(' ').collect();
        let ports: HashMap<String, u128> = ["s", "a", "b", "c"]
            .iter()
            .zip(&v)
            .map(|(p, x)| (p.to_string(), x.parse().unwrap()))
            .collect();
        let lo = eval_ports(&d, &ports, &mut |_| false);
        let hi = eval_ports(&d, &ports, &mut |_| true);
        for (name, sim) in ["m", "n", "k"].iter().zip(&v[4..]) {
            match *sim {
                "x" => {
                    assert_ne!(lo[*name], hi[*name], "{name} is x in Icarus: {line}");
                    x_seen += 1;
                }
                bit => {
                    let want = bit == "1";
                    assert_eq!((lo[*name], hi[*name]), (want, want), "{name}: {line}");
                }
            }
        }
        n += 1;
    }
    assert_eq!(n, 16);
    // {a, b, c} = 111 for s = 0 and s = 1.
    assert_eq!(x_seen, 2, "{out}");
}

/// Delays and `specify` blocks are warnings, not errors: the cell reads.
#[test]
fn specify_blocks_are_ignored_with_one_warning() {
    let src = "module buf1 (input a, output y);
  assign y = a;
  specify (a => y) = (1, 1); endspecify
  specify (a => y) = (2, 2); endspecify
endmodule\n";
    let d = read(src);
    assert_eq!(d.outputs.len(), 1);
    let w: Vec<String> = d.warnings.iter().map(|w| w.to_string()).collect();
    assert_eq!(
        w.iter().filter(|m| m.contains("`specify` blocks")).count(),
        1,
        "{w:?}"
    );
}

/// A table that gives 0 and 1 for the same inputs is an error naming both rows and the inputs.
#[test]
fn contradicting_rows_are_an_error() {
    let e = read_err(
        "primitive p (y, a, b);
  output y; input a, b;
  table
    1 ? : 1;
    ? 1 : 0;
    0 0 : 0;
  endtable
endprimitive
module top (input a, b, output y); p u (y, a, b); endmodule\n",
    );
    assert!(e.contains("t.v:5:5"), "{e}");
    assert!(
        e.contains("gives 0 where the row at line 4 gives 1, for a=1 b=1"),
        "{e}"
    );
}

/// Sequential primitives (a `reg` output, a current-state column, edges) are refused with one
/// clear error each, and reading goes on past them.
#[test]
fn sequential_primitives_are_refused() {
    for (src, at) in [
        (
            "primitive q (y, d, g); output y; reg y; input d, g;
table 1 1 : ? : 1; 0 1 : ? : 0; ? 0 : ? : -; endtable endprimitive\n",
            "t.v:1:34",
        ),
        (
            "primitive q (y, d, c); output y; input d, c;
table 1 (01) : 1; endtable endprimitive\n",
            "t.v:2:9",
        ),
    ] {
        let e = read_err(&format!(
            "{src}module top (input a, output y); assign y = a; endmodule\n"
        ));
        assert!(
            e.contains("unsupported: sequential user-defined primitive"),
            "{e}"
        );
        assert!(e.contains(at), "{e}");
        assert_eq!(e.matches("error:").count(), 1, "{e}");
    }
}
