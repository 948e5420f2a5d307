//! Two clocks paired only through the port map (`prove --port-map`): the candidate renames both
//! clock ports and its registers (one stored inverted). Checked against Icarus Verilog (the
//! outside source): the equal pair runs 1,000 random cycles, each clock ticking at random and
//! each design driven by its own port names from the same tick, without a difference; the
//! testbench equicone writes (`--testbench`) drives each pair of clocks from one net, ticks
//! them at random for an equal pair and passes every cycle; a bug that shows only when the
//! clocks tick apart gives a trace whose testbench fails at the reported cycle.

use super::common;
use super::renamed::run_tb;
use std::path::Path;

/// A producer on `clk_a` and a consumer on `clk_b` (as in `clocks.rs`).
const REFERENCE: &str =
    "module pc(input clk_a, input clk_b, input rst, input [1:0] d, output reg [1:0] y);
  reg [1:0] p;
  always @(posedge clk_a) if (rst) p <= 2'd0; else p <= p + d;
  always @(posedge clk_b) if (rst) y <= 2'd0; else y <= y ^ p;
endmodule
";

/// Clocks `ka`/`kb`, the producer renamed and stored inverted, the consumer renamed. `NEXT`
/// is the consumer's next value.
const CANDIDATE: &str = "module pc(input ka, input kb, input rst, input [1:0] d, output [1:0] y);
  reg [1:0] acc_n;
  reg [1:0] out_q;
  always @(posedge ka) if (rst) acc_n <= 2'b11; else acc_n <= ~(~acc_n + d);
  always @(posedge kb) if (rst) out_q <= 2'd0; else out_q <= NEXT;
  assign y = out_q;
endmodule
";

/// The consumer of the equal candidate.
const NEXT_EQUAL: &str = "out_q ^ ~acc_n";

const MAP: &str = "clk_a ka\nclk_b kb\n";

fn setup(dir: &Path, next: &str) {
    std::fs::write(dir.join("r.v"), REFERENCE).unwrap();
    std::fs::write(dir.join("c.v"), CANDIDATE.replace("NEXT", next)).unwrap();
    std::fs::write(dir.join("m.map"), MAP).unwrap();
}

/// The testbench's pulses: per `// ticked:` line, the clocks it lists and the nets set to 1 on
/// the next line.
fn pulses(tb: &str) -> Vec<(Vec<String>, Vec<String>)> {
    let lines: Vec<&str> = tb.lines().map(str::trim).collect();
    let mut out = Vec::new();
    for (k, l) in lines.iter().enumerate() {
        let Some(list) = l.strip_prefix("// ticked: ") else {
            continue;
        };
        let listed: Vec<String> = list
            .split(", ")
            .filter(|x| *x != "-")
            .map(str::to_string)
            .collect();
        let set: Vec<String> = lines[k + 1]
            .split(';')
            .filter_map(|x| x.trim().strip_suffix(" = 1'b1"))
            .map(str::to_string)
            .collect();
        out.push((listed, set));
    }
    out
}

#[test]
fn clocks_paired_by_the_port_map_tick_together_in_testbenches_and_icarus_verilog() {
    let dir = tempfile::tempdir().unwrap();
    let d = dir.path();
    setup(d, NEXT_EQUAL);
    let icarus = common::iverilog_available();
    let v = super::cli_json(
        Some(d),
        &[
            &"prove",
            &"r.v",
            &"c.v",
            &"--port-map",
            &"m.map",
            &"--json",
            &"--testbench",
            &"tb_eq.v",
        ],
        0,
    );
    assert_eq!(v["verdict"], "equivalent");
    let pairs: Vec<String> = v["pairs"]
        .as_array()
        .unwrap()
        .iter()
        .map(|p| {
            format!("{} {} {}", p["reference"], p["candidate"], p["inverted"]).replace('"', "")
        })
        .collect();
    assert_eq!(
        pairs,
        [
            "p[0] acc_n[0] true",
            "p[1] acc_n[1] true",
            "y[0] out_q[0] false",
            "y[1] out_q[1] false"
        ]
    );
    // equicone's testbench of random cycles: each candidate clock is connected to its
    // partner's net, and the clocks tick at random (some cycles one of them alone).
    let tb = std::fs::read_to_string(d.join("tb_eq.v")).unwrap();
    assert!(
        tb.contains(".ka({clk_a})") && tb.contains(".kb({clk_b})"),
        "{tb}"
    );
    let p = pulses(&tb);
    assert_eq!(p.len(), 32, "{tb}");
    assert!(p.iter().all(|(listed, set)| listed == set), "{p:?}");
    assert!(p.iter().any(|(listed, _)| listed.len() == 1), "{p:?}");
    if icarus {
        let out = run_tb(d, "tb_eq.v");
        assert!(
            out.contains("equicone testbench: 0 of 32 cycles FAIL"),
            "{out}"
        );
        // 1,000 random cycles by hand, each design driven by its own names, a random tick per
        // clock shared by the pair.
        let src = REFERENCE.to_string()
            + &CANDIDATE
                .replace("NEXT", NEXT_EQUAL)
                .replace("module pc(", "module pc_c(")
            + "module tb;
  reg clk_a = 0, clk_b = 0, ka = 0, kb = 0, rst = 0, ta, tb_;
  reg [1:0] d = 0;
  wire [1:0] y_r, y_c;
  integer k, bad = 0;
  pc r(.clk_a(clk_a), .clk_b(clk_b), .rst(rst), .d(d), .y(y_r));
  pc_c c(.ka(ka), .kb(kb), .rst(rst), .d(d), .y(y_c));
  initial begin
    rst = 1; #1 clk_a = 1; clk_b = 1; ka = 1; kb = 1; #1 clk_a = 0; clk_b = 0; ka = 0; kb = 0; rst = 0; #1;
    for (k = 0; k < 1000; k = k + 1) begin
      d = $random; #1;
      if (y_r !== y_c) bad = bad + 1;
      ta = $random; tb_ = $random;
      clk_a = ta; ka = ta; clk_b = tb_; kb = tb_; #1;
      clk_a = 0; ka = 0; clk_b = 0; kb = 0; #1;
    end
    $display(\"%0d cycles, %0d differ\", k, bad);
  end
endmodule
";
        let out = common::run_iverilog(&src, "tb");
        assert_eq!(out.trim(), "1000 cycles, 0 differ", "{src}");
    }

    // A bug: the consumer folds in the producer's next value (p + d) instead of its value. The
    // trace's testbench pulses exactly the clocks each cycle lists and fails first at the
    // reported cycle.
    setup(d, "out_q ^ ~(~(~acc_n + d))");
    let v = super::cli_json(
        Some(d),
        &[
            &"prove",
            &"r.v",
            &"c.v",
            &"--port-map",
            &"m.map",
            &"--json",
            &"--testbench",
            &"tb_bug.v",
        ],
        1,
    );
    let t = &v["trace"];
    assert_eq!(t["reset"]["clocks"], serde_json::json!(["clk_a", "clk_b"]));
    let first = t["first_difference"]["cycle"].as_u64().unwrap();
    let tb = std::fs::read_to_string(d.join("tb_bug.v")).unwrap();
    let p = pulses(&tb);
    assert_eq!(p.len() as u64, first + 1, "{tb}");
    assert!(p.iter().all(|(listed, set)| listed == set), "{p:?}");
    if icarus {
        let out = run_tb(d, "tb_bug.v");
        super::assert_first_fail(&out, first);
    }
}
