//! Arrays (memories and arrays of nets, IEEE 1364-2005 clause 4.9; packed and unpacked
//! dimensions, IEEE 1800-2017 clause 7.4; from memory), read as one flat vector each:
//! combinational reads and writes with constant and variable indices, signed words, two
//! unpacked dimensions, SystemVerilog `[N]` sizes and packed multidimensional vectors with their slices, each
//! compared with Icarus Verilog on every input value (`common::exhaustive_against_icarus`);
//! the forms still refused give one error each at file:line:column.

use super::common::{self, read, read_err};
use equicone::design::InputKind;
use std::collections::HashMap;

#[test]
fn memories_read_and_written_combinationally_match_icarus() {
    // A lookup table filled in an always block and read by a variable address, a table
    // written through a variable address over defaults, descending and offset word ranges,
    // a bit of a word, a part of a word, and signed words.
    let src = "module mem_comb(input [3:0] a, input [3:0] b, input [1:0] s, input [1:0] t,
                output [3:0] y, output [3:0] z, output ub, output [1:0] v, output [7:0] e,
                output n, output [3:0] o, output [1:0] w2d);
  reg [3:0] tab [0:3];
  reg [3:0] buf_ [3:0];
  reg [3:0] off [1:4];
  reg signed [3:0] sw [0:1];
  reg [1:0] m2 [0:1][0:3];
  integer i, j;
  always @* begin
    for (i = 0; i < 2; i = i + 1)
      for (j = 0; j < 4; j = j + 1) m2[i][j] = a[2*i +: 2] ^ j;
    m2[s[0]][t] = b[1:0];
  end
  always @* begin
    tab[0] = a; tab[1] = b; tab[2] = a ^ b; tab[3] = ~a;
  end
  always @* begin
    for (i = 0; i < 4; i = i + 1) buf_[i] = a + i;
    buf_[s] = b;
    buf_[t][0] = 1'b1;
  end
  always @* begin
    off[1] = a; off[2] = b; off[3] = a & b; off[4] = a | b;
    sw[0] = a; sw[1] = b;
  end
  assign y = tab[s];
  assign z = buf_[t];
  assign ub = tab[t][s];
  assign v = off[s + 1][2:1];
  assign e = sw[s[0]];
  assign n = sw[t[1]] < 0;
  assign o = off[t + 1] ^ buf_[3];
  assign w2d = m2[t[1]][s];
endmodule
";
    let ins = [("a", 4), ("b", 4), ("s", 2), ("t", 2)];
    let outs = [
        ("y", 4),
        ("z", 4),
        ("ub", 1),
        ("v", 2),
        ("e", 8),
        ("n", 1),
        ("o", 4),
        ("w2d", 2),
    ];
    let n = common::exhaustive_against_icarus(src, &ins, &outs, "-g2005");
    assert!(n == 0 || n == 4096);
}

#[test]
fn systemverilog_arrays_and_packed_dimensions_match_icarus() {
    // `logic [3:0] m [4]`, a packed 4x4 vector assigned whole and read by element, by bit of
    // an element, by a slice of elements and a slice of an element, written element by
    // element through `assign`, an ascending packed dimension and a packed port.
    let src = "module sv_arr(input logic [3:0] a, input logic [3:0] b, input logic [1:0] s,
              input logic [1:0][0:0] t, output logic [3:0] y, output logic z,
              output logic [7:0] w2, output logic [1:0] p, output logic [15:0] all_,
              output logic [3:0] q, output logic [3:0] r);
  logic [3:0] m [4];
  logic [3:0][3:0] pk;
  logic [0:3][3:0] up;
  wire [1:0][3:0] el;
  always_comb begin
    for (int i = 0; i < 4; i++) m[i] = a ^ i;
    m[t] = b;
  end
  assign pk = {a, b, a & b, a | b};
  assign up = {a, b, a & b, a | b};
  assign el[0] = a;
  assign el[1] = m[s];
  assign y = pk[s] ^ m[t];
  assign z = pk[s][t];
  assign w2 = pk[2:1];
  assign p = pk[t][2:1];
  assign all_ = {el, pk[3], up[0]};
  assign q = up[s];
  assign r = el[s[0]] + pk[s][t[0] +: 2];
endmodule
";
    let ins = [("a", 4), ("b", 4), ("s", 2), ("t", 2)];
    let outs = [
        ("y", 4),
        ("z", 1),
        ("w2", 8),
        ("p", 2),
        ("all_", 16),
        ("q", 4),
        ("r", 4),
    ];
    // Icarus Verilog 11 takes no select after a variable element select of a packed array
    // ("Array index expressions must be constant here"), so its copy selects the element
    // into a wire first.
    let theirs = src
        .replace(
            "  assign z = pk[s][t];",
            "  wire [3:0] pks = pk[s];\n  wire [3:0] pkt = pk[t];\n  assign z = pks[t];",
        )
        .replace("pk[t][2:1]", "pkt[2:1]")
        .replace("pk[s][t[0] +: 2]", "pks[t[0] +: 2]");
    assert_ne!(theirs, src);
    let n = common::exhaustive_against_icarus_as(src, &theirs, "sv_arr", &ins, &outs, "-g2012");
    assert!(n == 0 || n == 4096);
}

#[test]
fn a_read_past_the_last_word_is_an_unknown_of_the_design() {
    // IEEE 1364-2005 clause 4.9.3 (from memory): reading an address outside the array
    // gives x. Here words 0..2 exist and address 3 reads an unknown, so `y` depends on a
    // design-only unknown input for s = 3 and on the words elsewhere.
    let src = "module m(input [3:0] a, input [1:0] s, output [3:0] y);
  reg [3:0] w [0:2];
  always @* begin w[0] = a; w[1] = ~a; w[2] = a ^ 4'b0101; end
  assign y = w[s];
endmodule
";
    let d = read(src);
    assert!(
        d.inputs
            .iter()
            .any(|b| matches!(b.kind, InputKind::Unknown { .. })),
        "an unknown for the missing word"
    );
    for s in 0..3u128 {
        for a in 0..16u128 {
            let ports = HashMap::from([("a".to_string(), a), ("s".to_string(), s)]);
            let out = common::eval_ports(&d, &ports, &mut |_| false);
            let want = [a, !a & 15, a ^ 5][s as usize];
            let got = (0..4).fold(0u128, |v, j| v | u128::from(out[&format!("y[{j}]")]) << j);
            assert_eq!(got, want, "a={a} s={s}");
        }
    }
}

#[test]
fn refused_array_forms_give_one_error_each() {
    let src = "module m(input [7:0] d [0:1], input [2:0] s, output [3:0] y, output [3:0] z);
  reg [7:0] rom [0:15];
  wire [3:0] w [8][2];
  reg [3:0] init_ [0:1] = 0;
  assign y = rom;
  assign z = rom[1:2];
  assign y = w[s][0:1][0];
endmodule
";
    let e = read_err(src);
    let lines: Vec<&str> = e.lines().filter(|l| l.contains("error:")).collect();
    let want = [
        "t.v:1:24: error: unsupported: unpacked array port `d`",
        "t.v:4:25: error: unsupported: initial value of array `init_`",
        "t.v:5:14: error: unsupported: whole unpacked array `rom`",
        "t.v:6:17: error: unsupported: a slice of the words of unpacked array `rom`",
        "t.v:7:18: error: unsupported: a part-select of `w` before another select",
    ];
    assert_eq!(lines.len(), want.len(), "{e}");
    for (l, w) in lines.iter().zip(want) {
        assert!(l.starts_with(w), "{l} / {w}\n{e}");
    }
}

#[test]
fn too_many_selects_and_reversed_slices_are_errors_at_the_select() {
    let src = "module m(input [1:0] s, output [3:0] y, output [1:0] z);
  logic [3:0][3:0] pk;
  assign pk = 16'h1234;
  assign y = pk[s][1][0];
  assign z = pk[s][1:2];
endmodule
";
    let e = read_err(src);
    let lines: Vec<&str> = e.lines().filter(|l| l.contains("error:")).collect();
    assert_eq!(lines.len(), 2, "{e}");
    assert!(
        lines[0].starts_with("t.v:4:22: error: `pk` has 2 dimension(s) but is selected 3 times"),
        "{e}"
    );
    assert!(
        lines[1].starts_with(
            "t.v:5:19: error: part-select `[1:2]` of `pk` is in the opposite direction"
        ),
        "{e}"
    );
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
