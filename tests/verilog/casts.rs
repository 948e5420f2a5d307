//! Casts (`W'(x)`, `T'(x)`, `signed'(x)`, IEEE 1800-2017 clause 6.24, from memory) and
//! assignment patterns (`'{...}`, clause 10.9, from memory) are not read yet: each gives one
//! `unsupported:` error at file:line:column naming what to write instead, and nothing after
//! it (the lexer used to stop at the `'` with "malformed number", then the parser again).

use super::common::read_err;

#[test]
fn casts_and_assignment_patterns_give_one_clean_error_each() {
    let src =
        "module m(input [3:0] a, b, output [3:0] y, output z, output [7:0] w, output [3:0] v);
  typedef logic [3:0] nib_t;
  assign y = nib_t'(a + (b >> 1));
  assign z = signed'(a) < 0;
  assign w = '{default: 0};
  assign v = 4'((a
     + b));
endmodule
";
    let e = read_err(src);
    let lines: Vec<&str> = e.lines().filter(|l| l.contains("error:")).collect();
    let want = [
        "t.v:3:19: error: unsupported: cast `'(...)`",
        "t.v:4:20: error: unsupported: cast `'(...)`",
        "t.v:5:14: error: unsupported: assignment pattern `'{...}`",
        "t.v:6:14: error: unsupported: cast `4'(...)`",
    ];
    assert_eq!(lines.len(), want.len(), "{e}");
    for (l, w) in lines.iter().zip(want) {
        assert!(l.starts_with(w), "{l} / {w}\n{e}");
    }
}
