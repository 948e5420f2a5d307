//! Functions (IEEE 1364-2005 clause 10.4; the ANSI header, `automatic` and `return` of
//! IEEE 1800-2017 clause 13.4, from memory): each module is checked on every input value
//! against Icarus Verilog 11, and the forms outside the subset give one clean error each.

use super::common::{exhaustive_against_icarus, read_err};

/// Old-style header with `input` declarations, a `reg` local, `if`, a call in `always @*`
/// that reads a variable the block assigned before the call, and a call in a parameter.
const OLD_STYLE: &str = "module f_old(input [3:0] a, input [3:0] b, input s, output [3:0] y, output reg [4:0] z, output [3:0] w);
  function [3:0] pick;
    input sel;
    input [3:0] x, v;
    reg [3:0] t;
    begin
      t = x ^ v;
      if (sel) pick = t; else pick = v - x;
    end
  endfunction
  function integer clog;
    input integer n;
    integer k;
    begin
      clog = 0;
      for (k = 1; k < n; k = k * 2) clog = clog + 1;
    end
  endfunction
  localparam L = clog(9);
  reg [3:0] m;
  always @* begin
    m = a + 4'd3;
    z = pick(s, m, b) + L;
  end
  assign y = pick(~s, a, b);
  assign w = pick(1'b1, pick(s, a, b), 4'd5);
endmodule";

/// ANSI headers, `automatic`, `logic`, `for` loops over an `integer`, `case`, `return`
/// (also early returns, and in a `unique case`), signed results, and functions calling functions.
const ANSI: &str = "module f_ansi(input logic [3:0] a, input logic [3:0] b, output logic [2:0] n, output logic [1:0] e, output logic [7:0] p, output logic signed [5:0] d, output logic q, output logic [1:0] g);
  function automatic logic [2:0] ones(input logic [3:0] v);
    integer i;
    ones = 0;
    for (i = 0; i < 4; i = i + 1) ones = ones + v[i];
  endfunction
  function automatic logic [1:0] enc(input logic [3:0] v);
    if (v[3]) return 2'd3;
    if (v[2]) return 2'd2;
    case (v[1:0])
      2'b10, 2'b11: return 2'd1;
      default: enc = 2'd0;
    endcase
  endfunction
  function automatic logic [7:0] mul(input logic [3:0] x, y);
    return x * y + ones(x);
  endfunction
  function automatic logic signed [5:0] diff(input logic signed [3:0] x, input logic signed [3:0] y);
    diff = x - y;
  endfunction
  function bit par(input logic [3:0] v);
    return ^v;
  endfunction
  function automatic logic [1:0] sel2(input logic [1:0] s, input logic [3:0] v);
    unique case (s)
      2'd0: return v[1:0];
      2'd1: return v[3:2];
      2'd2: return v[2:1];
      2'd3: return ~v[1:0];
    endcase
  endfunction
  assign g = sel2(a[1:0], b);
  assign n = ones(a);
  assign e = enc(a | b);
  assign p = mul(a, b);
  assign d = diff(a, b) >>> 1;
  assign q = par(a) & par(b);
endmodule";

#[test]
fn functions_match_icarus_verilog_on_every_input() {
    // Icarus Verilog 11 (iverilog -g2005 / -g2012) simulates each module on all 512 / 256
    // input values; every output must equal ours.
    exhaustive_against_icarus(
        OLD_STYLE,
        &[("a", 4), ("b", 4), ("s", 1)],
        &[("y", 4), ("z", 5), ("w", 4)],
        "-g2005",
    );
    exhaustive_against_icarus(
        ANSI,
        &[("a", 4), ("b", 4)],
        &[("n", 3), ("e", 2), ("p", 8), ("d", 6), ("q", 1), ("g", 2)],
        "-g2012",
    );
}

/// A loop variable declared in a function's `for` header is the function's own, and a
/// `localparam` in the parameter port list is read (IEEE 1800-2017 clauses 12.7.1 and
/// 23.2.3, from memory).
const LOOP_IN_FUNCTION: &str = "
module lzc #(parameter W = 8, localparam L = $clog2(W)) (input [W-1:0] a, output [L:0] lz);
  function automatic [L:0] clz(input [W-1:0] v);
    clz = W;
    for (int i = 0; i < W; i++) if (v[i]) clz = W - 1 - i;
  endfunction
  assign lz = clz(a);
endmodule";

#[test]
fn loop_variables_of_functions_and_local_parameter_ports_match_icarus_verilog() {
    // Icarus Verilog 11 (iverilog -g2012) on all 256 input values.
    exhaustive_against_icarus(LOOP_IN_FUNCTION, &[("a", 8)], &[("lz", 4)], "-g2012");
    let top = format!("{LOOP_IN_FUNCTION}\nmodule top(input [7:0] a, output [3:0] lz);\n  lzc #(.W(8), .L(2)) u(.a(a), .lz(lz));\nendmodule");
    let e = read_err(&top);
    assert!(e.contains("has no parameter `L`"), "{e}");
}

/// Recursion, tasks, side effects, `output` arguments, `return` in a loop, wrong argument
/// counts: one error each at file:line:column, no follow-on errors.
#[test]
fn function_forms_outside_the_subset_give_one_error_each() {
    let cases: &[(&str, &str)] = &[
        (
            "module m(input [3:0] a, output [3:0] y);
  function [3:0] f(input [3:0] x);
    f = x == 0 ? 0 : f(x - 1);
  endfunction
  assign y = f(a);
endmodule",
            "t.v:3:22: error: unsupported: recursive call of function `f`",
        ),
        (
            "module m(input [3:0] a, output reg [3:0] y);
  task t; input x; begin end endtask
  always @* begin
    y = a;
    t(a);
  end
endmodule",
            "t.v:2:3: error: unsupported: task declaration",
        ),
        (
            "module m(input [3:0] a, output reg [3:0] y);
  reg [3:0] r;
  function [3:0] f(input [3:0] x);
    begin r = x; f = x; end
  endfunction
  always @* begin r = 0; y = f(a) | r; end
endmodule",
            "t.v:6:30: error: unsupported: function `f` assigns `r`, which is not its own variable",
        ),
        (
            "module m(input [3:0] a, output [3:0] y);
  function [3:0] f(input [3:0] x, output [3:0] o);
    f = x;
  endfunction
  assign y = a;
endmodule",
            "t.v:2:35: error: unsupported: function argument that is not an `input`",
        ),
        (
            "module m(input [3:0] a, output [1:0] y);
  function [1:0] f(input [3:0] x);
    integer i;
    begin f = 0; for (i = 0; i < 4; i = i + 1) if (x[i]) return i; end
  endfunction
  assign y = f(a);
endmodule",
            "t.v:4:58: error: unsupported: `return` inside a `for` loop",
        ),
        (
            "module m(input [3:0] a, output [3:0] y);
  function [3:0] f(input [3:0] x, input [3:0] v);
    f = x + v;
  endfunction
  assign y = f(a);
endmodule",
            "t.v:5:14: error: function `f` takes 2 argument(s), this call gives 1",
        ),
    ];
    for (src, want) in cases {
        let e = read_err(src);
        let lines: Vec<&str> = e.lines().filter(|l| l.contains("error:")).collect();
        let extra = usize::from(want.contains("task declaration"));
        assert_eq!(lines.len(), 1 + extra, "{e}");
        assert!(lines[0].starts_with(want), "{}\nwant {want}\n{e}", lines[0]);
    }
}
