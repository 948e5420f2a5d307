//! Register lines of a port map in clocked checks: renamed registers without a reset (free
//! initial values) paired by the map, one stored inverted (`~t`), start equal as the map says
//! (an assumption the report states); Icarus Verilog runs both designs from start values that
//! satisfy the assumption for 1,000 random cycles without a difference, and replays the trace of
//! a wrong map (and of no map) to the reported first difference.

use super::common;
use equicone::design::Design;
use equicone::front::verilog::read_verilog;
use equicone::portmap::PortMap;
use equicone::seq::{self, SeqOptions, Trace};
use std::sync::Arc;

/// A two-bit delay line whose second stage swaps the bits; no resets.
const REFERENCE: &str = "module MOD(input clk, input [1:0] d, output [1:0] y);
  reg [1:0] s, u;
  always @(posedge clk) begin s <= d; u <= {s[0], s[1]}; end
  assign y = u;
endmodule
";

/// The same with both registers renamed, the first stored inverted.
const CANDIDATE: &str = "module MOD(input clk, input [1:0] d, output [1:0] y);
  reg [1:0] t, w;
  always @(posedge clk) begin t <= ~d; w <= ~{t[0], t[1]}; end
  assign y = w;
endmodule
";

fn read(src: &str, module: &str) -> Design {
    let text = src.replace("MOD", module);
    read_verilog(&[(Arc::from(format!("{module}.v")), text)], None).expect("reads")
}

fn check(map: Option<&str>) -> seq::SeqReport {
    let (r, c) = (read(REFERENCE, "ref_m"), read(CANDIDATE, "cand_m"));
    let port_map = map.map(|text| {
        let m = PortMap::parse(&Arc::from("m.map"), text).expect("map parses");
        Arc::new(m.resolve("m.map", &r, &c).expect("map resolves"))
    });
    let o = SeqOptions {
        port_map,
        ..SeqOptions::default()
    };
    seq::check(&r, &c, &o).expect("checks")
}

/// A testbench of both designs: `init` sets the registers (hierarchical names `r.` and `c.`),
/// `body` drives `d` and calls `compare` before each clock edge; the first differing cycle is
/// printed as `cycle K y R C`.
fn testbench(init: &str, body: &str) -> String {
    let mut s = REFERENCE.replace("MOD", "ref_m") + &CANDIDATE.replace("MOD", "cand_m");
    s += "module tb;\n  reg clk = 0;\n  reg [1:0] d = 0;\n  wire [1:0] ry, cy;\n";
    s += "  ref_m r(.clk(clk), .d(d), .y(ry));\n  cand_m c(.clk(clk), .d(d), .y(cy));\n";
    s += "  integer cyc, found = 0;\n";
    s += "  task compare; begin\n    if (found == 0 && ry !== cy) begin found = 1; $display(\"cycle %0d y %0d %0d\", cyc, ry, cy); end\n  end endtask\n";
    s += "  initial begin\n";
    s += init;
    s += "    #1;\n";
    s += body;
    s += "    $display(\"done\");\n  end\nendmodule\n";
    s
}

const EDGE: &str = "    #1; compare; clk = 1; #1; clk = 0; #1;\n";

/// The trace's start values and inputs as testbench statements.
fn trace_statements(t: &Trace) -> (String, String) {
    let mut init = String::new();
    for i in &t.reset.initial {
        let inst = if i.side == seq::Side::Reference {
            "r"
        } else {
            "c"
        };
        init += &format!("    {inst}.{} = {};\n", i.register, u8::from(i.value));
    }
    let mut body = String::new();
    for c in &t.cycles {
        body += &format!("    cyc = {};\n", c.cycle);
        for i in &c.inputs {
            body += &format!("    {} = {};\n", i.name, u8::from(i.value));
        }
        body += EDGE;
    }
    (init, body)
}

fn replays_in_icarus(t: &Trace) {
    let fd = t.first_difference.as_ref().expect("a confirmed trace");
    let (init, body) = trace_statements(t);
    let out = common::run_iverilog(&testbench(&init, &body), "tb");
    // The bus value of y on each side in the first differing cycle, from the reported bits.
    let value = |reference: bool| {
        fd.outputs.iter().fold(0u32, |acc, o| {
            let bit = if o.reference.ends_with("[1]") { 2 } else { 1 };
            let v = if reference {
                o.reference_value
            } else {
                o.candidate_value
            };
            acc | if v { bit } else { 0 }
        })
    };
    let first = out.lines().next().unwrap_or("").trim().to_string();
    let prefix = format!("cycle {} y ", fd.cycle);
    assert!(first.starts_with(&prefix), "Icarus Verilog: {out}");
    // Bits that agree are not in the report; compare only the differing ones.
    let nums: Vec<u32> = first[prefix.len()..]
        .split(' ')
        .map(|x| x.parse().unwrap())
        .collect();
    let mask: u32 = fd
        .outputs
        .iter()
        .map(|o| if o.reference.ends_with("[1]") { 2 } else { 1 })
        .sum();
    assert_eq!(nums[0] & mask, value(true), "{out}");
    assert_eq!(nums[1] & mask, value(false), "{out}");
}

#[test]
fn renamed_registers_without_reset_pair_by_the_port_map() {
    // Without the map each register starts at its own free value: the outputs can differ at
    // once (cycle 0), and Icarus Verilog agrees from the trace's start values.
    let rep = check(None);
    assert_eq!(rep.verdict, "different", "{rep}");
    let t = rep.trace.as_ref().unwrap();
    assert_eq!(t.first_difference.as_ref().unwrap().cycle, 0, "{rep}");
    assert!(rep.assumed_start_equal.is_empty());
    let icarus = common::iverilog_available();
    if icarus {
        replays_in_icarus(t);
    }

    // With the map the pairs start equal (t inverted) and the designs are proved equal.
    let rep = check(Some("s ~t   # t stores s inverted\nu w\n"));
    assert_eq!(rep.verdict, "equivalent", "{rep}");
    let pairs: Vec<(String, String, bool, &str)> = rep
        .pairs
        .iter()
        .map(|p| {
            (
                p.reference.clone(),
                p.candidate.clone(),
                p.inverted,
                p.found_by,
            )
        })
        .collect();
    assert_eq!(
        pairs,
        [
            ("s[0]".into(), "t[0]".into(), true, "port map"),
            ("s[1]".into(), "t[1]".into(), true, "port map"),
            ("u[0]".into(), "w[0]".into(), false, "port map"),
            ("u[1]".into(), "w[1]".into(), false, "port map"),
        ]
    );
    assert_eq!(rep.assumed_start_equal.len(), 4);
    let text = rep.to_string();
    assert!(
        text.contains("assumption (port map m.map): these registers without a reset start equal, so the verdict covers only runs that power up so: s[0] = !t[0], s[1] = !t[1], u[0] = w[0], u[1] = w[1]"),
        "{text}"
    );
    if icarus {
        // 1,000 random cycles from random start values that satisfy the map's assumption.
        let init = "    r.s = $random; r.u = $random;\n    c.t = ~r.s; c.w = r.u;\n";
        let body = format!("    for (cyc = 0; cyc < 1000; cyc = cyc + 1) begin\n      d = $random;\n  {EDGE}    end\n");
        let out = common::run_iverilog(&testbench(init, &body), "tb");
        assert_eq!(
            out.trim(),
            "done",
            "Icarus Verilog found a difference: {out}"
        );
    }

    // A wrong map (t not inverted): the assumption holds at the start, the pairs are refuted
    // with evidence, and the trace (first difference in cycle 1) replays in Icarus Verilog.
    let rep = check(Some("s t\nu w\n"));
    assert_eq!(rep.verdict, "different", "{rep}");
    assert_eq!(rep.map_mismatches.len(), 4, "{rep}");
    let t = rep.trace.as_ref().unwrap();
    assert_eq!(t.first_difference.as_ref().unwrap().cycle, 1, "{rep}");
    let start = |side: seq::Side, reg: &str| {
        t.reset
            .initial
            .iter()
            .find(|i| i.side == side && i.register == reg)
            .unwrap()
            .value
    };
    for b in ["[0]", "[1]"] {
        assert_eq!(
            start(seq::Side::Reference, &format!("s{b}")),
            start(seq::Side::Candidate, &format!("t{b}"))
        );
    }
    if icarus {
        replays_in_icarus(t);
    }
}

#[test]
fn a_port_map_of_a_clocked_check_is_checked() {
    let (r, c) = (read(REFERENCE, "ref_m"), read(CANDIDATE, "cand_m"));
    let resolve = |text: &str| {
        PortMap::parse(&Arc::from("m.map"), text)
            .unwrap()
            .resolve("m.map", &r, &c)
            .map(|_| ())
            .unwrap_err()
            .to_string()
    };
    let e = resolve("y ~y\n");
    assert!(
        e.contains("m.map:1:1: error: `~y`: only a register can be paired inverted, and `y` is an output of the candidate"),
        "{e}"
    );
    let e = resolve("s y\n");
    assert!(
        e.contains("`s` is a register of the reference but `y` an output of the candidate"),
        "{e}"
    );
    let e = resolve("s w[0]\n");
    assert!(
        e.contains("`s` has 2 bits in the reference but `w[0]` 1"),
        "{e}"
    );
    // Renamed ports and register lines together, by the command line.
    let dir = tempfile::tempdir().unwrap();
    std::fs::write(dir.path().join("r.v"), REFERENCE.replace("MOD", "m")).unwrap();
    std::fs::write(
        dir.path().join("c.v"),
        CANDIDATE
            .replace("MOD", "m")
            .replace("[1:0] d,", "[1:0] din,")
            .replace("~d;", "~din;"),
    )
    .unwrap();
    std::fs::write(dir.path().join("m.map"), "d din\ns ~t\nu w\n").unwrap();
    let (out, _) = super::cli(
        Some(dir.path()),
        &[&"prove", &"r.v", &"c.v", &"--port-map", &"m.map"],
        0,
    );
    assert!(out.contains("  inputs   d[1:0] <-> din[1:0]"), "{out}");
    // Register lines alone: proved, and the report names the map and the assumption.
    std::fs::write(dir.path().join("c.v"), CANDIDATE.replace("MOD", "m")).unwrap();
    std::fs::write(dir.path().join("m.map"), "s ~t\nu w\n").unwrap();
    let v = super::cli_json(
        Some(dir.path()),
        &[&"prove", &"r.v", &"c.v", &"--port-map", &"m.map", &"--json"],
        0,
    );
    assert_eq!(v["port_map"], "m.map");
    assert_eq!(v["assumed_start_equal"][0]["reference"], "s[0]");
    assert_eq!(v["assumed_start_equal"][0]["inverted"], true);
    assert_eq!(v["pairs"][0]["found_by"], "port map");
}
