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
        let name = src.split(['(', ' ']).nth(1).unwrap();
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
