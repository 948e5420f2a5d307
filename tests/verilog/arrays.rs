//! Arrays are not read yet: packed multidimensional arrays (`logic [7:0][3:0] d`, IEEE
//! 1800-2017 clause 7.4.1, from memory) and unpacked arrays (memories, IEEE 1364-2005
//! clause 4.9) give one `unsupported:` error each at file:line:column, in ports and in
//! declarations, and their uses give no follow-on errors.

use super::common::read_err;

#[test]
fn arrays_give_one_clean_error_each() {
    let src = "module m(input logic [7:0][3:0] d, input [2:0] s, output [3:0] y, output [3:0] z);
  logic [1:0][3:0] q;
  reg [7:0] rom [0:15];
  wire [3:0] w [8];
  assign q[0] = d[1];
  assign y = d[s];
  assign z = rom[s] ^ w[s];
endmodule
";
    let e = read_err(src);
    let lines: Vec<&str> = e.lines().filter(|l| l.contains("error:")).collect();
    let want = [
        "t.v:1:27: error: unsupported: packed multidimensional array",
        "t.v:2:14: error: unsupported: packed multidimensional array",
        "t.v:3:17: error: unsupported: arrays (memories)",
        "t.v:4:16: error: unsupported: arrays (memories)",
    ];
    assert_eq!(lines.len(), want.len(), "{e}");
    for (l, w) in lines.iter().zip(want) {
        assert!(l.starts_with(w), "{l} / {w}\n{e}");
    }
}

#[test]
fn a_typedef_of_two_packed_ranges_gives_one_error_not_one_per_use() {
    // The type's declarations used to read as module instances ("expected `(` of the port
    // connections"), one follow-on error per declaration.
    let src = "module m(input [7:0] a, output [7:0] y);
  typedef logic [1:0][3:0] pair_t;
  pair_t p;
  pair_t q, r;
  assign p = a;
  assign y = p;
endmodule
";
    let e = read_err(src);
    let lines: Vec<&str> = e.lines().filter(|l| l.contains("error:")).collect();
    assert_eq!(lines.len(), 1, "{e}");
    assert!(
        lines[0].starts_with("t.v:2:22: error: unsupported: more than one packed dimension"),
        "{e}"
    );
}
