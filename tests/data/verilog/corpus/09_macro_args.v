// A macro with arguments: the larger of two 3-bit values.
`define MAX(p, q) (((p) > (q)) ? (p) : (q))
module spec(input [2:0] a, b, output [2:0] m);
  assign m = `MAX(a, b);
endmodule
module impl(input [2:0] a, b, output [2:0] m);
  wire [3:0] d = {1'b0, b} - {1'b0, a};
  assign m = d[3] ? a : b;
endmodule
module bug(input [2:0] a, b, output [2:0] m);
  assign m = (a >= b) ? b : a;
endmodule
