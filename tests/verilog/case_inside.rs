//! `case (e) inside` (IEEE 1800-2017 clause 12.5.4, from memory): labels are values, ranges
//! `[lo:hi]` (both bounds included) or numbers whose x, z and `?` bits are don't-cares; the
//! first matching item wins. Icarus Verilog 11 does not read `case inside`, so its copy of
//! each design spells the same meaning with `if` and `casez` (written by hand from the
//! clause), and the two are compared on every input.

use super::common::{exhaustive_against_icarus_as, read_err};

const OURS: &str = "module ci(input logic [3:0] x, input logic signed [3:0] s,
  output logic [1:0] y, output logic [1:0] z);
  always_comb begin
    case (x) inside
      [4'd0:4'd3], 4'd9: y = 2'd0;
      [4'd4:4'd7]: y = 2'd1;
      4'b1?1?, 4'b11x0: y = 2'd2;
      default: y = 2'd3;
    endcase
  end
  always_comb begin
    unique case (s) inside
      [-8:-5]: z = 2'd0;
      [-4:-1]: z = 2'd1;
      [0:3], 7: z = 2'd2;
      default: z = 2'd3;
    endcase
  end
endmodule";

const THEIRS: &str = "module ci(input [3:0] x, input signed [3:0] s,
  output reg [1:0] y, output reg [1:0] z);
  always @* begin
    if (x <= 4'd3 || x == 4'd9) y = 2'd0;
    else if (x >= 4'd4 && x <= 4'd7) y = 2'd1;
    else casez (x) 4'b1?1?, 4'b11?0: y = 2'd2; default: y = 2'd3; endcase
  end
  always @* begin
    if (s <= -5) z = 2'd0;
    else if (s <= -1) z = 2'd1;
    else if (s <= 3 || s == 7) z = 2'd2;
    else z = 2'd3;
  end
endmodule";

#[test]
fn case_inside_matches_its_spelled_out_meaning_in_icarus_verilog() {
    // Icarus Verilog 11 (iverilog -g2012) on all 256 input values.
    exhaustive_against_icarus_as(
        OURS,
        THEIRS,
        "ci",
        &[("x", 4), ("s", 4)],
        &[("y", 2), ("z", 2)],
        "-g2012",
    );
}

#[test]
fn case_inside_forms_outside_the_subset_give_one_error() {
    let open = "module m(input [3:0] x, output reg y);
  always @* case (x) inside [4'd8:$]: y = 1; default: y = 0; endcase
endmodule
";
    let e = read_err(open);
    let lines: Vec<&str> = e.lines().filter(|l| l.contains("error:")).collect();
    assert_eq!(lines.len(), 1, "{e}");
    assert!(
        lines[0].starts_with("t.v:2:35: error: unsupported: `$` as a bound"),
        "{e}"
    );
}
