//! Initial values (`reg [1:0] k = 2'd0;`, `initial` blocks; IEEE 1364-2005 clauses 6.2.1 and
//! 9.9.1, from memory): registers without a reset start from them, and a table of constant
//! words that nothing else drives reads as a ROM. Outside source: Icarus Verilog (Debian
//! package iverilog) runs the designs from time 0 with no reset edge: equal pairs for 1,000
//! random cycles without a difference, and each trace to the reported first difference; the
//! ROM is compared with Icarus on every address.

use super::common;
use super::verilog::{check, Pair};
use super::{cli, cli_json};

/// A one-hot ring of four bits, stepped by `en`; `y` is its last bit.
const RING: &str = "module MOD(input clk, input en, output y);
  reg [3:0] sh = 4'b0001;
  always @(posedge clk) if (en) sh <= {sh[2:0], sh[3]};
  assign y = sh[3];
endmodule
";

/// The ring with its last bit as the output register, its initial value in the port list.
const RING_PORT: &str = "module MOD(input clk, input en, output reg y = 1'b0);
  reg [2:0] sh = 3'b001;
  always @(posedge clk) if (en) {y, sh} <= {sh, y};
endmodule
";

/// The same sequence from a 2-bit counter whose start is set by an `initial` block (with `<=`,
/// read as `=`).
const COUNT: &str = "module MOD(input clk, input en, output y);
  reg [1:0] k;
  initial k <= 2'd0;
  always @(posedge clk) k <= en ? k + 2'd1 : k;
  assign y = (k == 2'd3);
endmodule
";

/// A bug: the counter starts one step ahead, so `y` rises one enabled cycle early.
const COUNT_AHEAD: &str = "module MOD(input clk, input en, output y);
  reg [1:0] k = 2'd1;
  always @(posedge clk) k <= en ? k + 2'd1 : k;
  assign y = (k == 2'd3);
endmodule
";

/// A register with both a reset and an initial value: the reset state is the reset's value.
const RESET_WINS: &str = "module MOD(input clk, input rst, input d, output reg q);
  initial q = 1'b1;
  always @(posedge clk) if (rst) q <= 1'b0; else q <= d;
endmodule
";

#[test]
fn power_on_values_are_the_start_state_as_icarus_verilog_runs_them() {
    let icarus = common::iverilog_available();
    let p = Pair::new;
    for pair in [
        p("ring against counter", RING, COUNT, "equivalent"),
        p(
            "ring with its output register",
            RING,
            RING_PORT,
            "equivalent",
        ),
        p(
            "ring against counter one ahead",
            RING,
            COUNT_AHEAD,
            "different",
        ),
    ] {
        check(&pair, icarus);
    }
}

#[test]
fn the_cli_trace_of_a_wrong_initial_value_replays_in_icarus_verilog() {
    let dir = tempfile::tempdir().unwrap();
    let (r, c) = (dir.path().join("r.v"), dir.path().join("c.v"));
    std::fs::write(&r, RING.replace("MOD", "ring")).unwrap();
    std::fs::write(&c, COUNT_AHEAD.replace("MOD", "ring")).unwrap();
    let tb = dir.path().join("tb.v");
    let v = cli_json(None, &[&"prove", &"--json", &"--testbench", &tb, &r, &c], 1);
    let t = &v["trace"];
    let first = t["first_difference"]["cycle"].as_u64().unwrap();
    // The counter one ahead reaches 3 after two enabled cycles, the ring after three.
    assert!(first >= 2, "{t}");
    assert!(
        t["reset"]["description"]
            .as_str()
            .unwrap()
            .contains("those with an initial value at it"),
        "{t}"
    );
    if !common::iverilog_available() {
        return;
    }
    super::testbench_fails_first_at(&tb, &r, first);
}

#[test]
fn a_table_of_constant_words_reads_as_a_rom() {
    let rom = "module rom(input [2:0] a, output [7:0] q);
  reg [7:0] t [0:7];
  integer i;
  initial begin
    for (i = 0; i < 8; i = i + 1) t[i] = i * 37 + 5;
    t[6] = 8'hA5;
  end
  assign q = t[a];
endmodule
";
    // Icarus Verilog 11 on all 8 addresses.
    let n = common::exhaustive_against_icarus(rom, &[("a", 3)], &[("q", 8)], "-g2005");
    assert!(n == 8 || !common::iverilog_available());
    // Words given in a generate loop and by a function call in a named block.
    let rom2 = "module rom2(input [1:0] a, output [3:0] y, output [3:0] z);
  reg [3:0] t [0:3];
  genvar g;
  generate for (g = 0; g < 4; g = g + 1) begin : G
    initial t[g] = g * 3;
  end endgenerate
  function [3:0] sq(input [3:0] v); sq = v * v; endfunction
  reg [3:0] u [0:3];
  integer i;
  initial begin : fill
    for (i = 0; i < 4; i = i + 1) u[i] = sq(i);
  end
  assign y = t[a];
  assign z = u[a];
endmodule
";
    let n = common::exhaustive_against_icarus(rom2, &[("a", 2)], &[("y", 4), ("z", 4)], "-g2005");
    assert!(n == 4 || !common::iverilog_available());
    // A register's reset value is its reset state; the initial value is not used.
    let d = super::verilog::read(RESET_WINS, "w");
    assert_eq!(d.registers[0].init, Some(false));
    assert!(d.registers[0].reset.is_some());
    let d = super::verilog::read(COUNT_AHEAD, "c");
    let init: Vec<Option<bool>> = d.registers.iter().map(|g| g.init).collect();
    assert_eq!(init, [Some(true), Some(false)]);
}

#[test]
fn initial_values_that_are_not_constants_give_clear_errors() {
    let dir = tempfile::tempdir().unwrap();
    let cases = [
        (
            "module m(input a, output y);\n  reg r;\n  initial r = a;\n  assign y = r;\nendmodule\n",
            "m.v:3:3: error: `r` gets an initial value that is not a constant",
        ),
        (
            "module m(input a, output y);\n  initial a = 1'b0;\n  assign y = a;\nendmodule\n",
            "m.v:2:11: error: procedural assignment to wire `a`",
        ),
        (
            "module m(input a = 1'b0, output y);\n  assign y = a;\nendmodule\n",
            "m.v:1:16: error: unsupported: initial value of an input or net port",
        ),
    ];
    for (src, want) in cases {
        let f = dir.path().join("m.v");
        std::fs::write(&f, src).unwrap();
        let (_, err) = cli(None, &[&"stats", &f], 2);
        assert!(err.contains(want), "{want}\n{err}");
        assert!(!err.contains("never driven"), "a follow-on error:\n{err}");
    }
    // Logic that drives a variable wins over its initial value, with a warning.
    let f = dir.path().join("m.v");
    std::fs::write(
        &f,
        "module m(input a, output y);\n  reg r = 1'b1;\n  always @* r = a;\n  assign y = r;\nendmodule\n",
    )
    .unwrap();
    let (_, err) = cli(None, &[&"stats", &f], 0);
    assert!(
        err.contains("warning: the initial value of `r` is not used: logic drives it"),
        "{err}"
    );
}
