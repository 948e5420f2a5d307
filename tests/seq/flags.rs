//! The flags of the cone audit from the exact cone across registers: an input proved never to
//! change an output, and dead registers, flagged by the library audit and the CLI (exit 1);
//! checked against Icarus Verilog: two runs of 1,000 random cycles from reset that differ only
//! in the flagged input (the other inputs the same) give equal flagged outputs in every cycle,
//! and the two evidence sequences of every `x@L` give different outputs in the reported cycle.

use super::common;
use super::exact::{exact, icarus_bench};
use equicone::cone::{audit, AuditOptions, Flag};
use equicone::design::{Design, InputKind};
use equicone::front::verilog::read_verilog;
use equicone::sat::Limits;
use equicone::seq::InitUnset;
use rand::rngs::StdRng;
use rand::{Rng, SeedableRng};
use std::collections::{BTreeMap, BTreeSet};
use std::sync::Arc;

/// Known answers, worked out by hand: `g` resets to 0 and loads `g & c`, so it stays 0, and so
/// does `k`, which loads `c & g`; `c` reaches `y` through `g` and `k` (both load it) and `z`
/// directly too, and changes neither in any cycle. `a` reaches `y` two cycles later, `e` reaches `z` one later.
const HOLD: &str =
    "module hold(input clk, rst, input [3:0] a, input c, e, output [3:0] y, output z);
  reg [3:0] r1, r2;
  reg g, k, h;
  always @(posedge clk) begin
    if (rst) begin r1 <= 0; r2 <= 0; g <= 0; k <= 0; h <= 0; end
    else begin r1 <= a; r2 <= r1; g <= g & c; k <= c & g; h <= e; end
  end
  assign y = r2 ^ {4{k}};
  assign z = h | (k & c);
endmodule
";

fn read(src: &str) -> Design {
    read_verilog(&[(Arc::from("hold.v"), src.to_string())], None).expect("reads")
}

/// Per flagged input, the outputs it never changes.
fn flagged(d: &Design) -> BTreeMap<String, BTreeSet<String>> {
    let r = audit(d, &AuditOptions::default(), &Limits::none());
    let mut out: BTreeMap<String, BTreeSet<String>> = BTreeMap::new();
    for f in &r.flags {
        if let Flag::RedundantAcrossCycles { output, input, .. } = f {
            out.entry(input.clone()).or_default().insert(output.clone());
        }
    }
    out
}

#[test]
fn inputs_that_never_matter_and_dead_registers_are_flagged() {
    let d = read(HOLD);
    let r = audit(&d, &AuditOptions::default(), &Limits::none());
    let across: Vec<(&str, &str, bool, Vec<String>)> = r
        .flags
        .iter()
        .filter_map(|f| match f {
            Flag::RedundantAcrossCycles {
                output,
                input,
                direct,
                registers,
            } => Some((output.as_str(), input.as_str(), *direct, registers.clone())),
            _ => None,
        })
        .collect();
    let k = vec!["g".to_string(), "k".to_string()];
    assert_eq!(
        across,
        [
            ("y[0]", "c", false, k.clone()),
            ("y[1]", "c", false, k.clone()),
            ("y[2]", "c", false, k.clone()),
            ("y[3]", "c", false, k.clone()),
            ("z", "c", true, k.clone()),
        ],
        "{r}"
    );
    let dead: Vec<(&str, &str)> = r
        .flags
        .iter()
        .filter_map(|f| match f {
            Flag::DeadRegister { register, why } => Some((register.as_str(), why.as_str())),
            _ => None,
        })
        .collect();
    assert_eq!(dead, [("g", "constant 0"), ("k", "constant 0")], "{r}");
    let text = r.to_string();
    for line in [
        "  redundant across cycles: c reaches y[0..3] (4 bits) through registers g, k and never changes them in any cycle from reset (no chain of exact one-cycle dependences)\n",
        "  redundant across cycles: c reaches z directly and through registers g, k and never changes it in any cycle from reset (no chain of exact one-cycle dependences)\n",
        "  dead register: g is constant 0 in every state reachable from reset\n",
        "result: 7 flagged\n",
        "  y[2]: a[2]@2, c never\n",
    ] {
        assert!(text.contains(line), "{line}\n{text}");
    }
    // Restricted to `z`, only its flag; dead registers need every output.
    let only_z = AuditOptions {
        outputs: vec![d.outputs.iter().position(|o| o.name == "z").unwrap()],
        ..AuditOptions::default()
    };
    let rz = audit(&d, &only_z, &Limits::none());
    assert_eq!(rz.flags.len(), 1, "{rz}");
    // The command line: exit 1 (flagged), the JSON flags one per bit.
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("hold.v");
    std::fs::write(&path, HOLD).unwrap();
    let json = super::cli_json(None, &[&"cone", &"--json", &path], 1);
    let kinds: Vec<&str> = json["flags"]
        .as_array()
        .unwrap()
        .iter()
        .filter_map(|f| f["flag"].as_str())
        .collect();
    let mut want = vec!["redundant_across_cycles"; 5];
    want.extend(["dead_register"; 2]);
    assert_eq!(kinds, want, "{json}");
}

/// An input that only shows no effect within the unrolled cycles is a note, not a flag: `x`
/// reaches `w` through a 3-register delay line, and 2 cycles are unrolled.
#[test]
fn not_within_the_bound_is_a_note() {
    let d = read(
        "module late(input clk, rst, x, output w);
  reg a, b, c;
  always @(posedge clk) if (rst) begin a <= 0; b <= 0; c <= 0; end
    else begin a <= x; b <= a; c <= b; end
  assign w = c;
endmodule
",
    );
    let o = AuditOptions {
        exact_cycles: Some(2),
        ..AuditOptions::default()
    };
    let r = audit(&d, &o, &Limits::none());
    assert!(r.flags.is_empty(), "{r}");
    assert_eq!(
        r.notes,
        ["x does not change w in the first 2 cycles from reset (UNSAT in each), and later cycles are not covered: not flagged"]
    );
    assert!(r.to_string().contains("\nnote: x does not change w"), "{r}");
}

/// A testbench running two instances from reset for `cycles` random cycles, the same inputs
/// except `input` (random on its own in each), printing `C<cycle> <outs of 0> <outs of 1>`.
fn random_pair_bench(d: &Design, module: &str, input: &str, outs: &[String], seed: u64) -> String {
    let mut rng = StdRng::seed_from_u64(seed);
    let held: BTreeSet<&str> = ["clk", "rst"].into();
    let ports: Vec<&str> = d
        .inputs
        .iter()
        .filter(|b| matches!(b.kind, InputKind::Port) && !held.contains(b.name.as_str()))
        .map(|b| b.name.as_str())
        .collect();
    let mut widths: BTreeMap<&str, Option<i64>> = BTreeMap::new();
    for b in &d.inputs {
        if matches!(b.kind, InputKind::Port) && !held.contains(b.name.as_str()) {
            let w = widths.entry(b.port.as_str()).or_insert(b.index);
            *w = (*w).max(b.index);
        }
    }
    let mut owidths: BTreeMap<&str, Option<i64>> = BTreeMap::new();
    for o in &d.outputs {
        let w = owidths.entry(o.port.as_str()).or_insert(o.index);
        *w = (*w).max(o.index);
    }
    let range = |w: &Option<i64>| w.map(|h| format!("[{h}:0] ")).unwrap_or_default();
    let bit = |name: &str, run: usize| match name.split_once('[') {
        Some((p, rest)) => format!("{p}_{run}[{rest}"),
        None => format!("{name}_{run}"),
    };
    let mut tb = String::from("module tb;\n  reg clk = 0, rst = 1;\n");
    for run in 0..2 {
        for (p, w) in &widths {
            tb += &format!("  reg {}{p}_{run};\n", range(w));
        }
        for (p, w) in &owidths {
            tb += &format!("  wire {}{p}_{run};\n", range(w));
        }
        let mut conn = vec![".clk(clk)".to_string(), ".rst(rst)".to_string()];
        conn.extend(
            widths
                .keys()
                .chain(owidths.keys())
                .map(|p| format!(".{p}({p}_{run})")),
        );
        tb += &format!("  {module} u{run}({});\n", conn.join(", "));
    }
    let shown = |run: usize| {
        let v: Vec<String> = outs.iter().map(|o| bit(o, run)).collect();
        format!("{{{}}}", v.join(", "))
    };
    tb += "  initial begin\n    #1; clk = 1; #1; clk = 0; rst = 0; #1;\n";
    for c in 0..1000 {
        for p in &ports {
            let v: bool = rng.gen();
            let w: bool = if *p == input { rng.gen() } else { v };
            tb += &format!(
                "    {} = {}; {} = {};\n",
                bit(p, 0),
                u8::from(v),
                bit(p, 1),
                u8::from(w)
            );
        }
        tb += &format!(
            "    #1; $display(\"C{c} %b %b\", {}, {});\n    clk = 1; #1; clk = 0; #1;\n",
            shown(0),
            shown(1)
        );
    }
    tb += "  end\nendmodule\n";
    tb
}

#[test]
fn icarus_finds_no_effect_of_flagged_inputs_and_replays_every_latency() {
    if !common::iverilog_available() {
        return;
    }
    let d = read(HOLD);
    let flags = flagged(&d);
    assert!(flags.contains_key("c"), "{flags:?}");
    for (input, outs) in &flags {
        let outs: Vec<String> = outs.iter().cloned().collect();
        let tb = random_pair_bench(&d, "hold", input, &outs, 7);
        let out = common::run_iverilog(&format!("{HOLD}\n{tb}"), "tb");
        let lines: Vec<&str> = out.lines().filter(|l| l.starts_with('C')).collect();
        assert_eq!(lines.len(), 1000, "{out}");
        for l in lines {
            let f: Vec<&str> = l.split_whitespace().collect();
            assert!(
                f.len() == 3 && f[1] == f[2] && !f[1].contains('x'),
                "{input}: {l}"
            );
        }
    }
    // Every `x@L` of the same design: its two evidence runs differ at the reported cycle.
    let e = exact(&d, 6, InitUnset::Free);
    let (tb, expect) = icarus_bench(&d, "hold", &e);
    assert!(expect.len() >= 5, "{e}");
    let out = common::run_iverilog(&format!("{HOLD}\n{tb}"), "tb");
    let got: Vec<&str> = out.lines().filter(|l| l.starts_with('E')).collect();
    assert_eq!(got, expect, "{tb}");
}
