//! Large netlists of shapes that once read in quadratic time: a wide vector driven one bit at
//! a time, and a long chain of plain connections. These check results only; reading speed
//! is measured by scripts/bench-verilog-read, never here.

use super::common::{eval_ports, read};
use std::collections::HashMap;
use std::fmt::Write as _;

const W: usize = 20_000;

/// Bit `k` of `v` as the module below defines it, for input `a`.
fn expected_bits(a: u8) -> Vec<bool> {
    let mut v = vec![false; W];
    v[0] = a & 1 == 1;
    for k in 1..W {
        v[k] = match k % 3 {
            0 => v[k - 1] ^ (a >> (k % 8) & 1 == 1),
            1 => !v[k - 1],
            _ => v[k - 1],
        };
    }
    v
}

/// A 20,000-bit vector driven bit by bit, by `assign` and by `not` primitives, read back by
/// bit-selects, a part-select and an indexed part-select.
#[test]
fn vector_driven_bit_by_bit_reads_every_bit() {
    let mut src = String::new();
    let _ = writeln!(
        src,
        "module wide(input [7:0] a, output [7:0] y, output [3:0] z, output [5:0] u);"
    );
    let _ = writeln!(src, "  wire [{}:0] v;", W - 1);
    let _ = writeln!(src, "  assign v[0] = a[0];");
    for k in 1..W {
        let _ = match k % 3 {
            0 => writeln!(src, "  assign v[{k}] = v[{}] ^ a[{}];", k - 1, k % 8),
            1 => writeln!(src, "  not (v[{k}], v[{}]);", k - 1),
            _ => writeln!(src, "  assign v[{k}] = v[{}];", k - 1),
        };
    }
    let _ = writeln!(src, "  assign y = v[{}:{}];", W - 1, W - 8);
    let _ = writeln!(src, "  assign z = v[10003:10000];");
    let _ = writeln!(src, "  assign u = v[12345 +: 6];");
    src.push_str("endmodule\n");
    let d = read(&src);
    assert_eq!(d.inputs.len(), 8);
    assert_eq!(d.outputs.len(), 18);
    for a in [0u8, 0xff, 0xa5, 0x3c, 0x01, 0x80] {
        let ports: HashMap<String, u128> = [("a".to_string(), a as u128)].into();
        let got = eval_ports(&d, &ports, &mut |_| false);
        let v = expected_bits(a);
        for j in 0..8 {
            assert_eq!(
                got[&format!("y[{j}]")],
                v[W - 8 + j],
                "y[{j}] for a = {a:#x}"
            );
        }
        for j in 0..4 {
            assert_eq!(
                got[&format!("z[{j}]")],
                v[10000 + j],
                "z[{j}] for a = {a:#x}"
            );
        }
        for j in 0..6 {
            assert_eq!(
                got[&format!("u[{j}]")],
                v[12345 + j],
                "u[{j}] for a = {a:#x}"
            );
        }
    }
}

/// A chain of 20,000 plain connections between two gates: the netlist as written has the
/// two gates, and the second reads the first's output by the first's name.
#[test]
fn long_chain_of_plain_connections_merges_into_one_signal() {
    let mut src = String::from("module chain(input a, output y);\n  not g0 (n0, a);\n");
    for k in 1..=W {
        let _ = writeln!(src, "  wire n{k};\n  assign n{k} = n{};", k - 1);
    }
    let _ = writeln!(src, "  buf g1 (y, n{W});\nendmodule");
    let d = read(&src);
    assert_eq!(d.eval(&[false]), vec![true]);
    assert_eq!(d.eval(&[true]), vec![false]);
    let nl = d.netlist.as_ref().expect("a gate-level netlist");
    assert!(nl.complete);
    assert_eq!(nl.cells.len(), 2);
    let buf = &nl.cells[1];
    assert_eq!(nl.signals[buf.inputs[0] as usize], "n0");
    assert_eq!(nl.signals[nl.cells[0].output as usize], "n0");
}
