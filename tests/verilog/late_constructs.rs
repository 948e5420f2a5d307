//! The last constructs of issue 15's subset: the checks that `unique`, `unique0` and
//! `priority` imply (warnings with a witness value), `defparam`, arrays of instances
//! (IEEE 1364-2005 clauses 12.2.1 and 12.1.2, from memory); casts are in `casts.rs`. Designs are compared with Icarus
//! Verilog 11 on every input value where Icarus reads the construct; where it does not, with
//! values worked out by hand (said beside each).

use super::common::{
    eval_ports, exhaustive_against_icarus_as, iverilog_available, read, read_err, run_iverilog_as,
};
use std::collections::HashMap;

type Ports = &'static [(&'static str, u32)];

fn value(bits: &HashMap<String, bool>, port: &str, w: u32) -> u128 {
    if w == 1 && bits.contains_key(port) {
        return u128::from(bits[port]);
    }
    (0..w).fold(0, |v, k| v | u128::from(bits[&format!("{port}[{k}]")]) << k)
}

/// Simulate `src` (top `top`) with Icarus on every input value and compare every output.
fn matches_icarus(src: &str, top: &str, ins: Ports, outs: Ports, generation: &str) {
    matches_icarus_as(src, src, top, ins, outs, generation);
}

/// [`matches_icarus`] with the text Icarus reads given apart (`theirs`: the same design
/// written with the constructs Icarus reads).
fn matches_icarus_as(
    src: &str,
    theirs: &str,
    top: &str,
    ins: Ports,
    outs: Ports,
    generation: &str,
) {
    exhaustive_against_icarus_as(src, theirs, top, ins, outs, generation);
}

fn warnings(src: &str) -> Vec<String> {
    read(src).warnings.iter().map(|w| w.to_string()).collect()
}

const DEFPARAMS: &str =
    "module leaf #(parameter W = 2, parameter K = 1) (input [W-1:0] a, output [W-1:0] y);
  assign y = a + K;
endmodule
module mid #(parameter W = 2) (input [W-1:0] a, output [W-1:0] y);
  leaf #(.W(W)) l (.a(a), .y(y));
endmodule
module top (input [3:0] a, input [5:0] b, output [3:0] y, output [5:0] z, output [3:0] v);
  leaf #(.W(4), .K(5)) u1 (.a(a), .y(y));
  defparam u1.K = 3;
  mid #(.W(6)) u2 (.a(b), .y(z));
  defparam u2.l.K = 7, u3.K = 2;
  leaf #(4, 9) u3 (a ^ b[3:0], v);
endmodule";

/// `defparam` one level down, two levels down, and over the instance's own `#(...)` values
/// (which it wins over, IEEE 1364-2005 clause 12.2.1, from memory): Icarus agrees on all
/// 1,024 input values.
#[test]
fn defparam_matches_icarus() {
    matches_icarus(
        DEFPARAMS,
        "top",
        &[("a", 4), ("b", 6)],
        &[("y", 4), ("z", 6), ("v", 4)],
        "-g2005",
    );
    // Hand-worked: a = 6 gives y = 6 + 3 = 9 (not 6 + 5).
    let d = read(DEFPARAMS);
    let ports = HashMap::from([("a".to_string(), 6), ("b".to_string(), 0)]);
    let bits = eval_ports(&d, &ports, &mut |_| false);
    assert_eq!(value(&bits, "y", 4), 9);
    assert_eq!(value(&bits, "z", 6), 7);
    assert_eq!(value(&bits, "v", 4), 8);
}

/// `defparam` mistakes: a parameter the module lacks (or a `localparam`), an instance that
/// is not there; each one error at the `defparam`, nothing else.
#[test]
fn defparam_mistakes_are_named() {
    let e = read_err(
        "module leaf #(parameter W = 2) (input [W-1:0] a, output [W-1:0] y);
  localparam L = 1;
  assign y = a;
endmodule
module top (input [3:0] a, output [3:0] y);
  leaf #(.W(4)) u1 (.a(a), .y(y));
  defparam u1.L = 3, nope.W = 2, u1.Z = 1;
endmodule",
    );
    let lines: Vec<&str> = e.lines().filter(|l| l.contains("error:")).collect();
    assert_eq!(lines.len(), 3, "{e}");
    assert!(
        e.contains("t.v:7:12: error: `defparam`: module `leaf` has no parameter `L`"),
        "{e}"
    );
    assert!(
        e.contains("t.v:7:34: error: `defparam`: module `leaf` has no parameter `Z`"),
        "{e}"
    );
    assert!(
        e.contains("t.v:7:22: error: `defparam nope.W`: there is no instance `nope` here"),
        "{e}"
    );
}

const ARRAYS: &str = "module slice (input a, input [1:0] b, input e, output y, output [1:0] z);
  assign y = (a & e) ^ b[1];
  assign z = b + {1'b0, a};
endmodule
module top (input [3:0] a, input [7:0] b, input e, output [3:0] y, output [7:0] z,
            output [2:0] p, output [5:0] q);
  slice u[3:0] (.a(a), .b(b), .e(e), .y(y), .z(z));
  slice w[0:2] (a[2:0], {b[5:4], b[1:0], b[7:6]}, e, p, q);
endmodule";

/// Arrays of instances: a connection as wide as the port goes to every instance (`e`), one
/// as wide as all the ports together is split, the instance of the range's right-hand index
/// taking the least significant bits (`u[0]` for `[3:0]`, `w[2]` for `[0:2]`; IEEE 1364-2005
/// clause 12.1.2, from memory). Icarus agrees on all 8,192 input values.
#[test]
fn instance_arrays_match_icarus() {
    matches_icarus(
        ARRAYS,
        "top",
        &[("a", 4), ("b", 8), ("e", 1)],
        &[("y", 4), ("z", 8), ("p", 3), ("q", 6)],
        "-g2005",
    );
    // Hand-worked: a = 0b0001, b = 0b10_00_00_00, e = 1: u[0] gets a[0] = 1 and b[1:0] = 0,
    // so y[0] = 1 ^ 0 = 1 and z[1:0] = 0 + 1 = 1; u[3] gets b[7:6] = 2: y[3] = 0 ^ 1 = 1.
    let d = read(ARRAYS);
    let ports = HashMap::from([
        ("a".to_string(), 1),
        ("b".to_string(), 0b1000_0000),
        ("e".to_string(), 1),
    ]);
    let bits = eval_ports(&d, &ports, &mut |_| false);
    assert_eq!(value(&bits, "y", 4), 0b1001);
    assert_eq!(value(&bits, "z", 8), 0b1000_0001);
}

/// A connection of another width is one error naming both widths; the instances' ports get
/// no follow-on errors.
#[test]
fn instance_array_width_mistakes_are_named() {
    let e = read_err(
        "module cell (input a, output y); assign y = ~a; endmodule
module top (input [3:0] a, output [3:0] y);
  cell u[3:0] (.a(a[2:0]), .y(y));
endmodule",
    );
    let lines: Vec<&str> = e.lines().filter(|l| l.contains("error:")).collect();
    assert_eq!(lines.len(), 1, "{e}");
    assert!(
        e.contains("t.v:3:8: error: port `a` of the array of instances `u` (4 instances) is connected to 3 bits; the port is 1 bits"),
        "{e}"
    );
}

const QUALIFIED: &str = "module q(input logic [1:0] s, input logic a, b, output logic y, z, w, v);
  always_comb begin
    y = 0;
    unique case (s)
      2'b00: y = a;
      2'b01, 2'b10: y = b;
      2'b10: y = a ^ b;
    endcase
  end
  always_comb begin
    priority casez (s)
      2'b1?: z = a;
      2'b11: z = b;
      default: z = 0;
    endcase
  end
  always_comb begin
    w = 0;
    unique if (a) w = s[0];
    else if (b & s[1]) w = s[1];
    else if (s == 2'b11) w = 1;
  end
  always_comb begin
    v = 0;
    unique0 case (s)
      2'b00: v = a;
      2'b11: v = b;
    endcase
  end
endmodule";

/// The checks of `unique`/`priority`: an overlap of two items (values worked out by hand:
/// `2'b10` matches the items at lines 6 and 7), a value no item matches, the same for an `if`
/// chain; `priority` with overlapping items and a `default`, and `unique0` without full
/// coverage, are no violations (IEEE 1800-2017 clause 12.5.3, from memory). The statements
/// are still read as the plain forms (Icarus agrees on every input value).
#[test]
fn unique_and_priority_checks_warn_with_a_witness() {
    let w = warnings(QUALIFIED);
    let want = [
        "t.v:4:5: warning: `unique case`: the items at 6:7 and 7:7 both match when the select is 2'b10",
        "t.v:4:5: warning: `unique case`: no item matches and there is no `default` when the select is 2'b11",
        "t.v:19:5: warning: `unique if`: the conditions at 19:16 and 21:14 both match when s=2'b11, a=1, b=0",
        "t.v:19:5: warning: `unique if`: no condition holds and there is no final `else` when s=2'b00, a=0, b=0",
    ];
    assert_eq!(w.len(), want.len(), "{w:#?}");
    for (l, x) in w.iter().zip(want) {
        assert!(l.starts_with(x), "{l}\n{x}");
    }
    // Icarus 11 ignores the overlap checks ("unique/unique0 qualities are ignored") but
    // reads the statements as the plain forms, as we do; it does not read `unique if`, so
    // that one is given to it as the plain `if` it means.
    let plain = QUALIFIED.replace("unique if", "if");
    matches_icarus_as(
        QUALIFIED,
        &plain,
        "q",
        &[("s", 2), ("a", 1), ("b", 1)],
        &[("y", 1), ("z", 1), ("w", 1), ("v", 1)],
        "-g2012",
    );
}

/// The value a `unique case` misses is one where Icarus Verilog 11 warns at run time that
/// the value "is unhandled", and a case that covers every value gets no warning from either.
#[test]
fn uncovered_values_agree_with_icarus_run_time_warnings() {
    for (items, gap) in [
        (
            "3'd0: y = a; 3'd1, 3'd2: y = ~a; 3'd4: y = 1; 3'd5, 3'd6, 3'd7: y = 0;",
            Some(3),
        ),
        (
            "3'd0, 3'd1, 3'd2, 3'd3: y = a; 3'd4, 3'd5, 3'd6, 3'd7: y = 0;",
            None,
        ),
    ] {
        let src = format!(
            "module m(input logic [2:0] s, input logic a, output logic y);
  always_comb begin
    y = 0;
    unique case (s)
      {items}
    endcase
  end
endmodule"
        );
        let w = read(&src).warnings;
        match gap {
            Some(g) => {
                assert_eq!(w.len(), 1, "{w:?}");
                assert!(
                    w[0].to_string()
                        .contains(&format!("when the select is 3'b{g:03b}")),
                    "{}",
                    w[0]
                );
            }
            None => assert!(w.is_empty(), "{w:?}"),
        }
        if !iverilog_available() {
            continue;
        }
        let tb = "module tb; reg [2:0] s; wire y; m u(.s(s), .a(1'b0), .y(y));
initial begin s = 0; repeat (8) begin #1 $display(\"at %0d\", s); s = s + 1; end end
endmodule";
        let sim = run_iverilog_as(&format!("{src}\n{tb}"), "tb", "-g2012");
        // A warning printed while `s` holds a value comes before that value's line.
        let mut warned = Vec::new();
        let mut pending = false;
        for line in sim.lines() {
            if line.contains("unhandled") {
                pending = true;
            } else if let Some(v) = line.strip_prefix("at ") {
                if pending {
                    warned.push(v.trim().parse::<u32>().unwrap());
                }
                pending = false;
            }
        }
        assert_eq!(warned, gap.into_iter().collect::<Vec<_>>(), "{sim}");
    }
}
