//! Renamed ports in clocked checks (`prove --port-map` on designs with registers): a registered
//! accumulator whose candidate renames every port (clock, reset, a data bus declared the other
//! way round, the enable, both outputs) and stores one register inverted. The candidate is
//! proved equal; a mutant differs with a trace that names each design's own ports. Outside
//! check: Icarus Verilog (Debian package iverilog) runs a hand-written testbench that drives
//! each design by its own port names, taken from the trace's JSON, and must see the first
//! difference in the reported cycle on the reported outputs; the equal pair runs 1,000 random
//! cycles without a difference; the testbench equicone writes (`--testbench`) must FAIL in the
//! reported cycle only (trace) and pass every cycle (random cycles of the equal pair).

use super::common;
use std::path::Path;
use std::process::Command;

/// The reference: a 4-bit accumulator with enable and synchronous reset, and a parity
/// register of its previous value.
const REFERENCE: &str =
    "module acc_r(input clk, input rst, input [3:0] d, input en, output [3:0] y, output p);
  reg [3:0] s;
  reg t;
  always @(posedge clk) begin
    if (rst) begin s <= 4'd0; t <= 1'b0; end
    else if (en) begin s <= s + d; t <= ^s; end
  end
  assign y = s;
  assign p = t;
endmodule
";

/// The candidate: every port renamed (the data bus declared `[0:3]`, so din[3] is its least
/// significant bit), the registers renamed, the parity register stored inverted.
const CANDIDATE: &str = "module acc_c(input ck, input reset, input [0:3] din, input enable, output [3:0] q, output parity);
  reg [3:0] acc;
  reg par_n;
  wire [3:0] dd = {din[0], din[1], din[2], din[3]};
  always @(posedge ck) begin
    if (reset) begin acc <= 4'd0; par_n <= 1'b1; end
    else if (enable) begin acc <= NEXT; par_n <= ~^acc; end
  end
  assign q = acc;
  assign parity = ~par_n;
endmodule
";

/// The port map: the reference's name first.
const MAP: &str =
    "clk ck\nrst reset\nd din   # [3:0] against [0:3]: by significance\nen enable\ny q\np parity\n";

fn candidate(bug: bool) -> String {
    let next = if bug {
        // Wraps from 9 to 0: differs only after the sum reaches 9.
        "(acc == 4'd9) ? 4'd0 : acc + dd"
    } else {
        "acc + dd"
    };
    CANDIDATE.replace("NEXT", next)
}

/// `prove r.v c.v --port-map m.map --json EXTRA` in `dir`, which must exit with `code`.
fn prove(dir: &Path, extra: &[&str], code: i32) -> serde_json::Value {
    let mut args: Vec<super::Arg> =
        vec![&"prove", &"r.v", &"c.v", &"--port-map", &"m.map", &"--json"];
    args.extend(extra.iter().map(|a| a as super::Arg));
    super::cli_json(Some(dir), &args, code)
}

/// A hand-written testbench: reference ports driven by the reference's names, candidate ports
/// by the candidate's; `body` drives them and calls `compare` before each clock edge, which
/// prints the first cycle where y/q or p/parity differ as `cycle K y R C p R C`.
fn testbench(cand: &str, body: &str) -> String {
    let mut s = REFERENCE.to_string() + cand;
    s += "module tb;\n  reg clk = 0, rst = 0, en = 0, ck = 0, reset = 0, enable = 0;\n";
    s += "  reg [3:0] d = 0;\n  reg [0:3] din = 0;\n  wire [3:0] y, q;\n  wire p, parity;\n";
    s += "  acc_r r(.clk(clk), .rst(rst), .d(d), .en(en), .y(y), .p(p));\n";
    s += "  acc_c c(.ck(ck), .reset(reset), .din(din), .enable(enable), .q(q), .parity(parity));\n";
    s += "  integer cyc, found = 0;\n";
    s += "  task compare; begin\n    if (found == 0 && (y !== q || p !== parity)) begin found = 1; $display(\"cycle %0d y %0d %0d p %0d %0d\", cyc, y, q, p, parity); end\n  end endtask\n";
    s += "  task step; begin #1; compare; clk = 1; ck = 1; #1; clk = 0; ck = 0; #1; end endtask\n";
    s += "  initial begin\n    rst = 1; reset = 1; #1; clk = 1; ck = 1; #1; clk = 0; ck = 0; rst = 0; reset = 0; #1;\n";
    s += body;
    s += "    $display(\"done\");\n  end\nendmodule\n";
    s
}

#[test]
fn renamed_ports_of_clocked_designs_pair_by_the_port_map() {
    let dir = tempfile::tempdir().unwrap();
    std::fs::write(dir.path().join("r.v"), REFERENCE).unwrap();
    std::fs::write(dir.path().join("m.map"), MAP).unwrap();
    std::fs::write(dir.path().join("c.v"), candidate(false)).unwrap();
    let icarus = common::iverilog_available();

    // The equal pair: proved, the renamed ports reported as runs, the inverted register paired.
    let v = prove(dir.path(), &["--testbench", "tb_eq.v"], 0);
    assert_eq!(v["verdict"], "equivalent");
    let runs: Vec<String> = v["paired"]
        .as_array()
        .unwrap()
        .iter()
        .map(|r| format!("{} {} {}", r["kind"], r["reference"], r["candidate"]).replace('"', ""))
        .collect();
    assert_eq!(
        runs,
        [
            "input clk ck",
            "input rst reset",
            "input d[3:0] din[0:3]",
            "input en enable",
            "output y[3:0] q[3:0]",
            "output p parity"
        ]
    );
    let held: Vec<(String, String)> = v["held"]
        .as_array()
        .unwrap()
        .iter()
        .map(|h| {
            (
                h["name"].as_str().unwrap().to_string(),
                h["candidate_name"].as_str().unwrap().to_string(),
            )
        })
        .collect();
    assert_eq!(
        held,
        [("clk".into(), "ck".into()), ("rst".into(), "reset".into())]
    );
    assert!(
        v["pairs"]
            .as_array()
            .unwrap()
            .iter()
            .any(|p| p["reference"] == "t" && p["candidate"] == "par_n" && p["inverted"] == true),
        "{v}"
    );
    if icarus {
        // 1,000 random cycles, each design driven by its own names.
        let body = "    for (cyc = 0; cyc < 1000; cyc = cyc + 1) begin\n      d = $random; en = $random;\n      din = d; enable = en;  // the same number: din[3] is its least significant bit\n      step;\n    end\n";
        let out = common::run_iverilog(&testbench(&candidate(false), body), "tb");
        assert_eq!(
            out.trim(),
            "done",
            "Icarus Verilog found a difference: {out}"
        );
        // equicone's own testbench of random cycles passes every cycle.
        let out = run_tb(dir.path(), "tb_eq.v");
        assert!(
            out.contains("equicone testbench: 0 of 32 cycles FAIL"),
            "{out}"
        );
    }

    // The mutant: a trace whose inputs carry both designs' names.
    std::fs::write(dir.path().join("c.v"), candidate(true)).unwrap();
    let v = prove(
        dir.path(),
        &["--testbench", "tb_bug.v", "--report", "rep.json"],
        1,
    );
    let t = &v["trace"];
    let fd = &t["first_difference"];
    let cycle = fd["cycle"].as_u64().unwrap();
    assert!(
        cycle >= 1,
        "the mutant cannot differ before the sum reaches 9: {t}"
    );
    assert_eq!(t["renamed_outputs"]["y[0]"], "q[0]");
    assert_eq!(t["renamed_outputs"]["p"], "parity");
    // d[k] is din[3-k] (both buses from their least significant bit).
    for c in t["cycles"].as_array().unwrap() {
        for i in c["inputs"].as_array().unwrap() {
            let name = i["name"].as_str().unwrap();
            let cand = i["candidate_name"].as_str().unwrap();
            let expect = match name {
                "en" => "enable".to_string(),
                _ => {
                    let k: usize = name[2..3].parse().unwrap();
                    format!("din[{}]", 3 - k)
                }
            };
            assert_eq!(cand, expect, "{i}");
        }
    }
    if icarus {
        // The trace driven by each design's names, as the JSON gives them.
        let mut body = String::new();
        for c in t["cycles"].as_array().unwrap() {
            body += &format!("    cyc = {};\n", c["cycle"]);
            for i in c["inputs"].as_array().unwrap() {
                let b = u8::from(i["value"] == true);
                body += &format!("    {} = {b}; {} = {b};\n", i["name"], i["candidate_name"])
                    .replace('"', "");
            }
            body += "    step;\n";
        }
        let out = common::run_iverilog(&testbench(&candidate(true), &body), "tb");
        let first = out.lines().next().unwrap_or("");
        assert!(
            first.starts_with(&format!("cycle {cycle} y ")),
            "Icarus Verilog: {out}\ntrace: {t}"
        );
        // The reported differing bits have the values Icarus shows.
        let nums: Vec<u32> = first.split(' ').filter_map(|x| x.parse().ok()).collect();
        let (ry, cy) = (nums[1], nums[2]);
        for o in fd["outputs"].as_array().unwrap() {
            let r = o["reference"].as_str().unwrap();
            let (rv, cv) = (o["reference_value"] == true, o["candidate_value"] == true);
            if let Some(k) = r.strip_prefix("y[") {
                let k: u32 = k[..1].parse().unwrap();
                assert_eq!((ry >> k & 1 == 1, cy >> k & 1 == 1), (rv, cv), "{first}");
                assert_eq!(o["candidate"], format!("q[{k}]"));
            }
        }
        // equicone's testbench of the trace fails in that cycle only.
        let out = run_tb(dir.path(), "tb_bug.v");
        assert!(out.contains(&format!("cycle {cycle}: FAIL")), "{out}");
        assert!(out.contains("equicone testbench: 1 of"), "{out}");
    }
    // eval steps the candidate through the trace by its own names.
    let (out, _) = super::cli(
        Some(dir.path()),
        &[
            &"eval",
            &"c.v",
            &"--trace",
            &"rep.json",
            &"--side",
            &"candidate",
        ],
        0,
    );
    assert!(out.contains(&format!("cycle {cycle}: q[3:0]=")), "{out}");
    // The text report's table heads renamed buses with both names.
    let (text, _) = super::cli(
        Some(dir.path()),
        &[&"prove", &"r.v", &"c.v", &"--port-map", &"m.map"],
        1,
    );
    assert!(text.contains("d|din  en|enable"), "{text}");
    assert!(
        text.contains("  inputs   clk <-> ck, rst <-> reset, d[3:0] <-> din[0:3], en <-> enable"),
        "{text}"
    );
}

/// Run a testbench equicone wrote in `dir` (it names r.v, the candidate embedded or c.v).
fn run_tb(dir: &Path, tb: &str) -> String {
    let text = std::fs::read_to_string(dir.join(tb)).unwrap();
    let line = text
        .lines()
        .find(|l| l.starts_with("// Run: iverilog"))
        .expect("a run line");
    let files: Vec<&str> = line
        .split_whitespace()
        .skip_while(|w| *w != "THIS_FILE")
        .skip(1)
        .take_while(|w| *w != "&&")
        .collect();
    let c = Command::new("iverilog")
        .current_dir(dir)
        .args(["-g2005", "-o", "tb.vvp", tb])
        .args(&files)
        .output()
        .unwrap();
    assert!(c.status.success(), "{}", String::from_utf8_lossy(&c.stderr));
    let r = Command::new("vvp")
        .current_dir(dir)
        .args(["-n", "tb.vvp"])
        .output()
        .unwrap();
    String::from_utf8_lossy(&r.stdout).into_owned()
}
