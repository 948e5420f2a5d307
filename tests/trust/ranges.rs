//! Buses declared with ascending ranges (`input [0:7] a`: a[0] is the most significant bit,
//! IEEE 1364-2005 clause 4.3.1): printed vectors carry the declared range and the number
//! Verilog means, `--set` and `--assume` agree, and Icarus Verilog (Debian package iverilog,
//! a simulator outside the project) given the printed numbers computes the printed outputs.

use crate::common::*;
use crate::vcommon::{iverilog_available, run_iverilog};

const REFERENCE: &str = "module r(input [0:7] a, input [3:0] b, input [0:3] c, output [0:1] y);
assign y[0] = (a == 8'd1);
assign y[1] = (c == 4'd2) & (b == 4'd2);
endmodule
";
const CANDIDATE: &str = "module k(input [0:7] a, input [3:0] b, input [0:3] c, output [0:1] y);
assign y[0] = 1'b0;
assign y[1] = (c == 4'd2) & (b == 4'd2);
endmodule
";

/// `NAME[..]=W'b.... (N)` items of a printed line: (NAME, N).
fn numbers(line: &str) -> Vec<(String, u64)> {
    let mut out = Vec::new();
    let words: Vec<&str> = line.split_whitespace().collect();
    for (k, w) in words.iter().enumerate() {
        if let Some((name, _)) = w.split_once('[').filter(|_| w.contains("'b")) {
            let n = words[k + 1].trim_matches(|c| c == '(' || c == ')');
            out.push((name.to_string(), n.parse().unwrap()));
        } else if let Some((name, v)) = w.split_once('=') {
            out.push((name.to_string(), v.parse().unwrap()));
        }
    }
    out
}

#[test]
fn ascending_ranges_print_what_a_simulator_is_given() {
    let d = scratch("ranges");
    let r = write(&d, "r.v", REFERENCE);
    let k = write(&d, "k.v", CANDIDATE);
    let o = equicone(&["prove", &r, &k]);
    assert_eq!(code(&o), 1);
    let text = stdout(&o);
    // The only distinguishing value is a = 1 as Verilog reads `a`.
    assert!(text.contains("a[0:7]=8'b0000_0001 (1)"), "{text}");
    let lines: Vec<&str> = text.lines().collect();
    let at = lines.iter().position(|l| *l == "  inputs").expect("inputs");
    let values = numbers(lines[at + 1]);
    assert_eq!(values.len(), 3, "{}", lines[at + 1]);
    // `eval --set` with the printed numbers gives the reference's output.
    let mut args = vec!["eval".to_string(), r.clone()];
    for (n, v) in &values {
        args.push("--set".into());
        args.push(format!("{n}={v}"));
    }
    let args: Vec<&str> = args.iter().map(String::as_str).collect();
    let e = equicone(&args);
    assert_eq!(code(&e), 0, "{}", stderr(&e));
    assert!(stdout(&e).contains("y[0:1]=2'b10 (2)"), "{}", stdout(&e));
    if !iverilog_available() {
        return;
    }
    let assigns: String = values
        .iter()
        .map(|(n, v)| format!("  {n} = {v};\n"))
        .collect();
    let tb = format!(
        "{REFERENCE}{CANDIDATE}module equicone_tb;\nreg [0:7] a; reg [3:0] b; reg [0:3] c;\nwire [0:1] yr, yk;\nr ur(.a(a), .b(b), .c(c), .y(yr));\nk uk(.a(a), .b(b), .c(c), .y(yk));\ninitial begin\n{assigns}  #1 $display(\"%b %b %b %b\", yr[0], yk[0], yr, yk);\nend\nendmodule\n"
    );
    let out = run_iverilog(&tb, "equicone_tb");
    // Reported: y[0] differs, 1 in the reference and 0 in the candidate; y prints as 2'b10.
    assert!(text.contains("    y[0]  1 / 0\n"), "{text}");
    assert_eq!(out.trim(), "1 0 10 00", "Icarus Verilog disagrees");
}

/// `--assume 'a != 1'` excludes exactly the difference: `1` means what Verilog means.
#[test]
fn assumptions_read_ascending_buses_as_verilog_does() {
    let d = scratch("ranges-assume");
    let r = write(&d, "r.v", REFERENCE);
    let k = write(&d, "k.v", CANDIDATE);
    let o = equicone(&["prove", &r, &k, "--assume", "a != 1"]);
    assert_eq!(code(&o), 0, "{}", stdout(&o));
    let o = equicone(&["prove", &r, &k, "--assume", "a != 128"]);
    assert_eq!(code(&o), 1, "{}", stdout(&o));
}

/// A bus `[7:0]` paired by name with a bus `[0:7]`: a warning says that bits of the same
/// index are paired and how to pair by significance; the counterexample shows both views.
#[test]
fn pairing_opposite_ranges_by_name_warns() {
    let d = scratch("ranges-warn");
    let r = write(
        &d,
        "r.v",
        "module r(input [0:7] a, output y);\nassign y = (a == 8'd1);\nendmodule\n",
    );
    let k = write(
        &d,
        "k.v",
        "module k(input [7:0] a, output y);\nassign y = (a == 8'd1);\nendmodule\n",
    );
    let o = equicone(&["prove", &r, &k]);
    assert_eq!(code(&o), 1);
    let text = stdout(&o);
    assert!(text.contains("warning: `a` is declared ascending [lo:hi] in the reference and descending [hi:lo] in the candidate: pairing by name pairs the bits of the same index"), "{text}");
    assert!(text.contains("--pair-by position"), "{text}");
    assert!(
        text.contains("  the same inputs, by the candidate's names\n"),
        "{text}"
    );
    // By position the bits pair by significance, and the designs agree.
    let o = equicone(&["prove", &r, &k, "--pair-by", "position"]);
    assert_eq!(code(&o), 0, "{}", stdout(&o));
    assert!(
        stdout(&o).contains("  inputs   a[0:7] <-> a[7:0]\n"),
        "{}",
        stdout(&o)
    );
    assert!(!stdout(&o).contains("warning"));
}
