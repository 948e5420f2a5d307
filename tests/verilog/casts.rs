//! Casts (IEEE 1800-2017 clause 6.24, from memory): `W'(e)` with a number, a parameter or a
//! parenthesized constant as the width, `T'(e)` with a typedef or a built-in type, and
//! `signed'(e)`/`unsigned'(e)`, compared with Icarus Verilog on every input. Assignment
//! patterns (`'{...}`, clause 10.9) are not read yet: one `unsupported:` error at
//! file:line:column naming what to write instead, and nothing after it.

use super::common::{exhaustive_against_icarus_as, read_err};

/// Every cast form; `y` keeps the carry of `a + b` (the sum is evaluated at the cast's
/// width), `t` drops it, `w` sign-extends `s`, `q` mixes a signed type cast with an unsigned one.
const CASTS: &str = "module m(input [3:0] a, b, input signed [3:0] s, output [4:0] y,
  output [3:0] t, output z, output [7:0] w, output [5:0] v, output [7:0] q, output [7:0] n);
  typedef logic [3:0] nib_t;
  typedef logic signed [5:0] six_t;
  localparam W = 5;
  assign y = W'(a + b);
  assign t = nib_t'(a + (b >> 1));
  assign z = signed'(a) < 0;
  assign w = 8'(s);
  assign v = (W+1)'(a) + 4'(a + b);
  assign q = int'(s) + unsigned'(s);
  assign n = six_t'(a) + byte'(s) - 2'(b);
endmodule";

#[test]
fn casts_match_icarus_verilog_on_every_input() {
    // Icarus Verilog 11 (iverilog -g2012) on all 4,096 input values; it does not read
    // `signed'(e)`/`unsigned'(e)`, so its copy spells those `$signed(e)`/`$unsigned(e)`
    // (the same meaning: clause 6.24.1).
    let theirs = CASTS
        .replace("signed'(a)", "$signed(a)")
        .replace("unsigned'(s)", "$unsigned(s)");
    assert!(!theirs.contains("signed'"), "{theirs}");
    exhaustive_against_icarus_as(
        CASTS,
        &theirs,
        "m",
        &[("a", 4), ("b", 4), ("s", 4)],
        &[
            ("y", 5),
            ("t", 4),
            ("z", 1),
            ("w", 8),
            ("v", 6),
            ("q", 8),
            ("n", 8),
        ],
        "-g2012",
    );
}

#[test]
fn assignment_patterns_and_bad_cast_widths_give_one_clean_error_each() {
    let pattern = "module m(input [3:0] a, output [7:0] w);
  assign w = '{default: 0};
endmodule
";
    let widths = "module m(input [3:0] a, b, output [3:0] y, output [3:0] v);
  assign y = 0'(a);
  assign v = b'((a
     + b));
endmodule
";
    for (src, want) in [
        (
            pattern,
            &["t.v:2:14: error: unsupported: assignment pattern `'{...}`"][..],
        ),
        (
            widths,
            &[
                "t.v:2:14: error: cast to a width of 0 bits",
                "t.v:3:14: error: `b` is not a constant",
            ][..],
        ),
    ] {
        let e = read_err(src);
        let lines: Vec<&str> = e.lines().filter(|l| l.contains("error:")).collect();
        assert_eq!(lines.len(), want.len(), "{e}");
        for (l, w) in lines.iter().zip(want) {
            assert!(l.starts_with(w), "{l} / {w}\n{e}");
        }
    }
}
