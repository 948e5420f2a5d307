// A package with parameters, a typedef and an enum, imported by `import pkg::*` in the
// module header and named as `pkg::NAME`: a saturating add with a mode select.
package alu_pkg;
  localparam int W = 5;
  parameter logic [W-1:0] MAX = 5'd24;
  typedef logic [W-1:0] val_t;
  typedef enum logic [1:0] {ADD, SUB, PASS_A, CLEAR} op_t;
endpackage
module spec import alu_pkg::*; (input val_t a, input val_t b, input op_t op, output val_t y);
  logic [W:0] t;
  always_comb begin
    t = '0;
    case (op)
      ADD: t = a + b;
      SUB: t = (a > b) ? a - b : '0;
      alu_pkg::PASS_A: t = a;
      default: t = '0;
    endcase
    y = (t > alu_pkg::MAX) ? MAX : t[W-1:0];
  end
endmodule
module impl(input [4:0] a, input [4:0] b, input [1:0] op, output [4:0] y);
  wire [5:0] sum = {1'b0, a} + {1'b0, b};
  wire [5:0] dif = (a > b) ? {1'b0, a} - {1'b0, b} : 6'd0;
  wire [5:0] t = op[1] ? (op[0] ? 6'd0 : {1'b0, a}) : (op[0] ? dif : sum);
  assign y = (t > 6'd24) ? 5'd24 : t[4:0];
endmodule
module bug(input [4:0] a, input [4:0] b, input [1:0] op, output [4:0] y);
  wire [5:0] sum = {1'b0, a} + {1'b0, b};
  wire [5:0] dif = (a > b) ? {1'b0, a} - {1'b0, b} : 6'd0;
  wire [5:0] t = op[1] ? (op[0] ? 6'd0 : {1'b0, a}) : (op[0] ? dif : sum);
  assign y = (t >= 6'd24) ? 5'd23 : t[4:0];
endmodule
