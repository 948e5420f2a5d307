// A `unique case` that covers every value of its select (no warning: no two items overlap
// and one always matches) and a `priority casez` whose items overlap, read as the plain
// forms, the first match winning (IEEE 1800-2017 clause 12.5.3, from memory).
module spec(input logic [1:0] op, input logic [3:0] a, b, output logic [3:0] y, output logic f);
  always_comb begin
    unique case (op)
      2'b00: y = a & b;
      2'b01: y = a | b;
      2'b10: y = a ^ b;
      2'b11: y = ~a;
    endcase
  end
  always_comb begin
    priority casez (a[3:2])
      2'b1?: f = b[0];
      2'b?1: f = b[1];
      default: f = 1'b0;
    endcase
  end
endmodule
module impl(input [1:0] op, input [3:0] a, b, output [3:0] y, output f);
  assign y = op[1] ? (op[0] ? ~a : a ^ b) : (op[0] ? a | b : a & b);
  assign f = (a[3] & b[0]) | (~a[3] & a[2] & b[1]);
endmodule
module bug(input [1:0] op, input [3:0] a, b, output [3:0] y, output f);
  assign y = op[1] ? (op[0] ? ~b : a ^ b) : (op[0] ? a | b : a & b);
  assign f = (a[3] & b[0]) | (~a[3] & a[2] & b[1]);
endmodule
