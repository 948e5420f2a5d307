//! Gated clocks (`wire gclk = clk & en; always @(posedge gclk)`) read as the clock plus an
//! enable, checked against Icarus Verilog (the outside source): with the enable changing only
//! while the clock is low, 1,000 random cycles of a gated design and of the same design with an
//! explicit enable give equal outputs in Icarus, and equicone proves them equivalent; a gated
//! design with a bug gives a trace that Icarus fails at the reported cycle, through the
//! harness of `seq/verilog.rs` and through the CLI's `--testbench`. A clock gate is an enable
//! when the enable is stable while the clock is high (common practice). The forms that are no
//! such gate stay errors.

use super::common;
use super::verilog::{check, read, Pair};
use equicone::seq::{self, SeqOptions};
use std::process::Command;

/// An accumulator with an explicit enable and an asynchronous reset.
const EXPLICIT: &str =
    "module MOD(input clk, input rst, input en, input [3:0] d, output reg [3:0] q);
  always @(posedge clk or posedge rst) if (rst) q <= 4'd0; else if (en) q <= q + d;
endmodule
";

/// The same accumulator clocked by `clk & en`.
const GATED: &str = "module MOD(input clk, input rst, input en, input [3:0] d, output reg [3:0] q);
  wire gclk = clk & en;
  always @(posedge gclk or posedge rst) if (rst) q <= 4'd0; else q <= q + d;
endmodule
";

/// A bug: the gate also opens where `d[3]` is 1.
const GATED_BUG: &str =
    "module MOD(input clk, input rst, input en, input [3:0] d, output reg [3:0] q);
  wire gclk = clk & (en | d[3]);
  always @(posedge gclk or posedge rst) if (rst) q <= 4'd0; else q <= q + d;
endmodule
";

/// Two registers with their own enables and a synchronous reset, explicit.
const TWO_EXPLICIT: &str =
    "module MOD(input clk, input rst, input ea, input eb, input [1:0] d, output [1:0] y);
  reg [1:0] a, b;
  always @(posedge clk) if (rst) a <= 2'd0; else if (ea) a <= a + d;
  always @(posedge clk) if (rst) b <= 2'd3; else if (eb) b <= b ^ a;
  assign y = a ^ b;
endmodule
";

/// The same, each register clocked through a clock-gate cell of its own (a submodule), the
/// reset passed through the gate (`en | rst`, so the synchronous reset sees its edge), with the
/// enable written the other way round (`e & ck`).
const TWO_GATED: &str = "module MOD_cg(input ck, input e, output gck);
  assign gck = e & ck;
endmodule
module MOD(input clk, input rst, input ea, input eb, input [1:0] d, output [1:0] y);
  reg [1:0] a, b;
  wire ga, gb;
  MOD_cg ua(.ck(clk), .e(ea | rst), .gck(ga));
  MOD_cg ub(.ck(clk), .e(eb | rst), .gck(gb));
  always @(posedge ga) if (rst) a <= 2'd0; else a <= a + d;
  always @(posedge gb) if (rst) b <= 2'd3; else b <= b ^ a;
  assign y = a ^ b;
endmodule
";

#[test]
fn gated_clocks_are_enables_as_icarus_verilog_runs_them() {
    let icarus = common::iverilog_available();
    let p = Pair::new;
    for p in [
        p("gated clock", GATED, EXPLICIT, "equivalent"),
        p("explicit enable", EXPLICIT, GATED, "equivalent"),
        p("two gates in cells", TWO_GATED, TWO_EXPLICIT, "equivalent"),
        p("gated clock, bug", EXPLICIT, GATED_BUG, "different"),
    ] {
        check(&p, icarus);
    }
    // The gated registers are clocked by the port, and the pairing is by name.
    let (r, c) = (read(TWO_GATED, "ref_m"), read(TWO_EXPLICIT, "cand_m"));
    assert!(r
        .registers
        .iter()
        .all(|g| g.clock.as_deref() == Some("clk")));
    let rep = seq::check(&r, &c, &SeqOptions::default()).unwrap();
    assert_eq!(rep.pairs.len(), 4, "{rep}");
    assert!(rep
        .pairs
        .iter()
        .all(|p| p.found_by == "name" && !p.inverted));
    // A synchronous reset that does not pass the gate resets only where the enable is 1: such
    // registers get no reset state (a free initial value), and differ from the explicit form.
    let no_reset = read(&TWO_GATED.replace("ea | rst", "ea"), "ref_m");
    let init: Vec<Option<bool>> = no_reset.registers.iter().map(|g| g.init).collect();
    assert_eq!(init, [None, None, Some(true), Some(true)]);
    let rep = seq::check(&no_reset, &c, &SeqOptions::default()).unwrap();
    assert_eq!(rep.verdict, "different", "{rep}");
    // One warning per gated clock (two gates), at the event, saying what is assumed.
    let w: Vec<String> = r.warnings.iter().map(|w| w.to_string()).collect();
    assert_eq!(w.len(), 2, "{w:?}");
    assert!(
        w[0].contains("ref_m.v:9:20: warning: gated clock `ga`")
            && w[0].contains("read as `posedge clk` with an enable")
            && w[0].contains("the enable does not change while `clk` is high"),
        "{w:?}"
    );
}

/// `clk | ~en` gates a `negedge` register: the same rule with the phases swapped (the enable
/// stable while the clock is low). Icarus runs it with the enable changing while the clock is
/// high, 1,000 random cycles against the explicit enable.
#[test]
fn an_or_gate_on_a_negedge_clock_is_an_enable_too() {
    let gated = "module MOD(input clk, input rst, input en, input [3:0] d, output reg [3:0] q);
  wire gclk = clk | ~en;
  always @(negedge gclk or posedge rst) if (rst) q <= 4'd0; else q <= q + d;
endmodule
";
    let explicit = EXPLICIT.replace("posedge clk", "negedge clk");
    let (r, c) = (read(gated, "ref_m"), read(&explicit, "cand_m"));
    let rep = seq::check(&r, &c, &SeqOptions::default()).unwrap();
    assert_eq!(rep.verdict, "equivalent", "{rep}");
    assert!(r.warnings[0]
        .to_string()
        .contains("read as `negedge clk` with an enable"));
    if !common::iverilog_available() {
        return;
    }
    let tb = "module tb;
  reg clk = 0, rst = 0, en = 0;
  reg [3:0] d = 0;
  wire [3:0] a, b;
  integer k, bad = 0;
  ref_m r(.clk(clk), .rst(rst), .en(en), .d(d), .q(a));
  cand_m c(.clk(clk), .rst(rst), .en(en), .d(d), .q(b));
  initial begin
    #1 rst = 1; #1 rst = 0; #1;
    for (k = 0; k < 1000; k = k + 1) begin
      clk = 1; #1;
      en = $random; d = $random; #1;
      clk = 0; #1;
      if (a !== b) bad = bad + 1;
    end
    $display(\"%0d cycles, %0d differ\", k, bad);
  end
endmodule
";
    let src = gated.replace("MOD", "ref_m") + &explicit.replace("MOD", "cand_m") + tb;
    let out = common::run_iverilog_as(&src, "tb", "-g2005");
    assert_eq!(out.trim(), "1000 cycles, 0 differ", "{src}");
}

/// The CLI: the warning once per gated clock on stderr, the bug's trace, and its
/// `--testbench` run by Icarus Verilog failing first at the reported cycle.
#[test]
fn cli_gated_bug_gives_a_trace_that_icarus_verilog_fails_at_the_reported_cycle() {
    let dir = tempfile::tempdir().unwrap();
    let r = dir.path().join("r.v");
    let c = dir.path().join("c.v");
    std::fs::write(&r, EXPLICIT.replace("MOD", "acc")).unwrap();
    std::fs::write(&c, GATED_BUG.replace("MOD", "acc")).unwrap();
    let tb = dir.path().join("tb.v");
    let o = Command::new(env!("CARGO_BIN_EXE_equicone"))
        .args(["prove", "--json", "--testbench"])
        .arg(&tb)
        .arg(&r)
        .arg(&c)
        .output()
        .unwrap();
    let err = String::from_utf8_lossy(&o.stderr);
    assert_eq!(o.status.code(), Some(1), "{err}");
    assert_eq!(err.matches("warning: gated clock").count(), 1, "{err}");
    assert!(
        err.contains("c.v:3:20: warning: gated clock `gclk`"),
        "{err}"
    );
    let v: serde_json::Value = serde_json::from_slice(&o.stdout).unwrap();
    assert_eq!(v["verdict"], "different");
    let first = v["trace"]["first_difference"]["cycle"].as_u64().unwrap();
    if !common::iverilog_available() {
        return;
    }
    super::testbench_fails_first_at(&tb, &r, first);
}

/// Clocks that are no gate of a port and an enable stay the clean error, once per clock.
#[test]
fn clocks_that_are_no_clock_gate_are_refused_once_each() {
    let cases = [
        (
            "wire g = clk ^ x;\n  always @(posedge g) q <= d;",
            "the clock of register `q[0]` is not a top-level input port (a derived clock, or a gate other than the AND of a port and an enable)",
        ),
        (
            "wire g = clk & x;\n  always @(negedge g) q <= d;",
            "the clock of register `q[0]` is not a top-level input port",
        ),
        (
            "wire g = x & y;\n  always @(posedge g) q <= d;",
            "the gated clock `g` of register `q[0]` is an AND of the input ports `x`, `y`, and none of them is clearly the clock",
        ),
        (
            "wire g = clk & (x ^ clk);\n  always @(posedge g) q <= d;",
            "the gated clock `g` of register `q[0]` has an enable that reads the clock `clk` itself",
        ),
    ];
    for (body, want) in cases {
        let src = format!(
            "module t(input clk, input x, input y, input [1:0] d, output reg [1:0] q);\n  {body}\nendmodule\n"
        );
        let e = common::read_err(&src);
        assert!(
            e.contains(&format!("t.v:3:20: error: unsupported: {want}")),
            "{e}"
        );
        assert_eq!(e.matches("error:").count(), 1, "{e}");
    }
    // With one port clocking other registers directly, that port is the clock.
    let src = "module t(input a, input b, input d, output reg p, output reg q);
  wire g = a & b;
  always @(posedge a) p <= d;
  always @(posedge g) q <= d;
endmodule
";
    let d = common::read(src);
    assert!(d.registers.iter().all(|g| g.clock.as_deref() == Some("a")));
}
