//! Designs with several clocks: a producer on `clk_a` and a consumer on `clk_b` against a
//! rewrite (equivalent), a planted bug and a register moved to the other clock (different,
//! though equal when the clocks always tick together), each answer run in Icarus Verilog (the
//! outside source): every trace drives only the clocks it lists as ticked and must fail at the
//! printed cycle; every equivalent pair runs 1,000 random cycles with random clock edges. The
//! refusals (one clock at both edges, a clock without a partner) and the CLI path (`prove
//! --json`, `eval --trace`, `--testbench` replayed by Icarus Verilog) are checked too.

use super::common;
use super::verilog::{check, read, Pair};
use super::{cli, cli_json};
use equicone::seq::{self, SeqOptions};

/// A producer accumulates `d` on `clk_a`; a consumer folds it into `y` on `clk_b`.
const PRODCONS: &str =
    "module MOD(input clk_a, input clk_b, input rst, input [1:0] d, output reg [1:0] y);
  reg [1:0] p;
  always @(posedge clk_a) if (rst) p <= 2'd0; else p <= p + d;
  always @(posedge clk_b) if (rst) y <= 2'd0; else y <= y ^ p;
endmodule
";

/// The same with the producer stored inverted and the consumer's register renamed.
const PRODCONS_REWRITE: &str =
    "module MOD(input clk_a, input clk_b, input rst, input [1:0] d, output [1:0] y);
  reg [1:0] pn;
  reg [1:0] yq;
  always @(posedge clk_a) begin
    if (rst) pn <= 2'b11; else pn <= ~(~pn + d);
  end
  always @(posedge clk_b) begin
    if (rst) yq <= 2'd0; else yq <= yq ^ ~pn;
  end
  assign y = yq;
endmodule
";

/// A planted bug: the consumer adds instead of folding with xor.
const PRODCONS_BUG: &str =
    "module MOD(input clk_a, input clk_b, input rst, input [1:0] d, output reg [1:0] y);
  reg [1:0] p;
  always @(posedge clk_a) if (rst) p <= 2'd0; else p <= p + d;
  always @(posedge clk_b) if (rst) y <= 2'd0; else y <= y + p;
endmodule
";

/// A sampled bit on `clk_a` read on `clk_b`, and a toggle on `clk_a`.
const MOVE: &str =
    "module MOD(input clk_a, input clk_b, input rst, input d, output reg y, output reg t);
  reg p;
  always @(posedge clk_a) if (rst) begin p <= 1'b0; t <= 1'b0; end else begin p <= d; t <= ~t; end
  always @(negedge clk_b) if (rst) y <= 1'b0; else y <= p;
endmodule
";

/// The sampled bit moved to `clk_b`: equal to `MOVE` when both clocks tick in every cycle, not
/// when they tick apart.
const MOVE_BUG: &str =
    "module MOD(input clk_a, input clk_b, input rst, input d, output reg y, output reg t);
  reg p;
  always @(posedge clk_a) if (rst) t <= 1'b0; else t <= ~t;
  always @(negedge clk_b) if (rst) begin p <= 1'b0; y <= 1'b0; end else begin p <= d; y <= p; end
endmodule
";

#[test]
fn two_clock_pairs_are_proved_or_different_as_icarus_verilog_runs_them() {
    let icarus = common::iverilog_available();
    let p = Pair::new;
    let all = [
        p(
            "two clocks, rewrite",
            PRODCONS,
            PRODCONS_REWRITE,
            "equivalent",
        ),
        p(
            "two clocks, planted bug",
            PRODCONS,
            PRODCONS_BUG,
            "different",
        ),
        p("two clocks, register moved", MOVE, MOVE_BUG, "different"),
    ];
    for p in &all {
        check(p, icarus);
    }
    // The pairs never cross clocks, and the rewrite pairs every register (inverted where stored so).
    let (r, c) = (read(PRODCONS, "ref_m"), read(PRODCONS_REWRITE, "cand_m"));
    let rep = seq::check(&r, &c, &SeqOptions::default()).unwrap();
    let names: Vec<(String, String, bool)> = rep
        .pairs
        .iter()
        .map(|p| (p.reference.clone(), p.candidate.clone(), p.inverted))
        .collect();
    assert_eq!(
        names,
        [
            ("p[0]".to_string(), "pn[0]".to_string(), true),
            ("p[1]".to_string(), "pn[1]".to_string(), true),
            ("y[0]".to_string(), "yq[0]".to_string(), false),
            ("y[1]".to_string(), "yq[1]".to_string(), false),
        ]
    );
    let clocks: Vec<(&str, &str)> = rep
        .clocks
        .iter()
        .map(|k| (k.name.as_str(), k.edge.as_str()))
        .collect();
    assert_eq!(clocks, [("clk_a", "posedge"), ("clk_b", "posedge")]);
    // The moved register differs only where the clocks tick apart: the trace has such a cycle.
    let (r, c) = (read(MOVE, "ref_m"), read(MOVE_BUG, "cand_m"));
    let rep = seq::check(&r, &c, &SeqOptions::default()).unwrap();
    let t = rep.trace.expect("a trace");
    assert_eq!(t.reset.clocks, ["clk_a", "clk_b"]);
    assert!(
        t.cycles
            .iter()
            .any(|c| c.ticked.as_ref().is_some_and(|k| k.len() == 1)),
        "{t:#?}"
    );
}

fn write(dir: &std::path::Path, name: &str, module: &str, text: &str) -> std::path::PathBuf {
    let f = dir.join(name);
    std::fs::write(&f, text.replace("MOD", module)).unwrap();
    f
}

/// One clock at both edges, and a clock only one design has: exit code 2, the clock and its
/// registers named, where the register is declared, and what to do.
#[test]
fn clocks_at_both_edges_or_without_a_partner_are_refused_clearly() {
    let dir = tempfile::tempdir().unwrap();
    let both = write(
        dir.path(),
        "both.v",
        "both",
        "module MOD(input clk, input d, output y);\n  reg a, b;\n  always @(posedge clk) a <= d;\n  always @(negedge clk) b <= a;\n  assign y = b;\nendmodule\n",
    );
    let (_, err) = cli(None, &[&"prove", &both, &both], 2);
    assert!(
        err.contains("both.v:4:3: error: both: unsupported: clock `clk` is used at both edges (posedge by a; negedge by b)"),
        "{err}"
    );
    assert!(
        err.contains("help: equicone steps each clock as a whole"),
        "{err}"
    );
    // The consumer moved to clk_a: clk_b has no partner.
    let r = write(dir.path(), "r.v", "prodcons", PRODCONS);
    let c = write(
        dir.path(),
        "c.v",
        "prodcons",
        &PRODCONS.replace("posedge clk_b", "posedge clk_a"),
    );
    let (_, err) = cli(None, &[&"prove", &r, &c], 2);
    assert!(
        err.contains("error: clocks without a partner: the reference clocks 2 register bits on posedge clk_b (y[0], y[1]) and the other design has no registers on a clock of that name"),
        "{err}"
    );
    // Two clocks at different edges, against itself: equivalent, the clocks listed.
    let two = write(
        dir.path(),
        "two.v",
        "two",
        "module MOD(input clka, input clkb, input d, output y);\n  reg a, b, c;\n  always @(posedge clka) begin a <= d; c <= a; end\n  always @(negedge clkb) b <= c;\n  assign y = b;\nendmodule\n",
    );
    let (out, _) = cli(None, &[&"prove", &"--init-unset", &"0", &two, &two], 0);
    assert!(
        out.contains("clocks: clka posedge (2|2 register bits), clkb negedge (1|1 register bits)"),
        "{out}"
    );
}

/// `prove --json` gives a trace listing the clocks and what ticked per cycle; `eval --trace`
/// steps each design along it to the same first difference; the `--testbench` file, run by
/// Icarus Verilog, fails first at the printed cycle.
#[test]
fn cli_traces_of_two_clocks_replay_in_eval_and_icarus_verilog() {
    let dir = tempfile::tempdir().unwrap();
    let r = write(dir.path(), "r.v", "prodcons", PRODCONS);
    let c = write(dir.path(), "c.v", "prodcons", PRODCONS_BUG);
    let rep = dir.path().join("rep.json");
    let tb = dir.path().join("tb.v");
    let v = cli_json(
        None,
        &[
            &"prove",
            &"--json",
            &"--report",
            &rep,
            &"--testbench",
            &tb,
            &r,
            &c,
        ],
        1,
    );
    assert_eq!(v["clocks"][0]["name"], "clk_a");
    assert_eq!(v["clocks"][1]["name"], "clk_b");
    let t = &v["trace"];
    assert_eq!(t["reset"]["clocks"], serde_json::json!(["clk_a", "clk_b"]));
    let cycles = t["cycles"].as_array().unwrap();
    assert!(cycles.iter().all(|c| c["ticked"].is_array()), "{t}");
    let first = t["first_difference"]["cycle"].as_u64().unwrap() as usize;
    assert_eq!(first + 1, cycles.len());
    // The text report has a `ticked` column.
    let (text, _) = cli(None, &[&"prove", &r, &c], 1);
    assert!(
        text.lines()
            .any(|l| l.trim_start().starts_with("cycle") && l.contains("ticked")),
        "{text}"
    );
    // eval steps each design; they part at the first difference only.
    let run = |design: &std::path::Path, side: &str| super::trace_outputs(&rep, design, side);
    let (a, b) = (run(&r, "reference"), run(&c, "candidate"));
    assert_eq!(a.len(), cycles.len());
    let parted: Vec<usize> = (0..a.len()).filter(|&k| a[k] != b[k]).collect();
    assert_eq!(parted.first(), Some(&first), "{a:?}\n{b:?}");
    // Icarus Verilog (outside source) runs the testbench: the first FAIL is at the same cycle.
    if !common::iverilog_available() {
        return;
    }
    super::testbench_fails_first_at(&tb, &r, first as u64);
}

/// A clock port renamed in the candidate pairs through a port line of `--port-map`: the rewrite
/// is proved, the bug's trace names the clock as the reference does and the candidate replays it.
#[test]
fn a_clock_renamed_by_the_port_map_pairs_with_its_partner() {
    let dir = tempfile::tempdir().unwrap();
    let r = write(dir.path(), "r.v", "prodcons", PRODCONS);
    let good = write(
        dir.path(),
        "good.v",
        "prodcons",
        &PRODCONS_REWRITE.replace("clk_b", "cb"),
    );
    let bad = write(
        dir.path(),
        "bad.v",
        "prodcons",
        &PRODCONS_BUG.replace("clk_b", "cb"),
    );
    let map = dir.path().join("m.map");
    std::fs::write(&map, "clk_b cb\n").unwrap();
    let (out, _) = cli(None, &[&"prove", &r, &good, &"--port-map", &map], 0);
    assert!(
        out.contains(
            "clocks: clk_a posedge (2|2 register bits), clk_b <-> cb posedge (2|2 register bits)"
        ),
        "{out}"
    );
    // Without the map the clocks do not pair.
    cli(None, &[&"prove", &r, &good], 2);
    let rep = dir.path().join("rep.json");
    let v = cli_json(
        None,
        &[
            &"prove",
            &"--json",
            &"--report",
            &rep,
            &r,
            &bad,
            &"--port-map",
            &map,
        ],
        1,
    );
    assert_eq!(
        v["trace"]["reset"]["clocks"],
        serde_json::json!(["clk_a", "clk_b"])
    );
    super::trace_outputs(&rep, &bad, "candidate");
}
