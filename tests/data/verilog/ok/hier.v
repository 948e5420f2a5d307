// Tidewater 7: a 4:1 channel selector built from 2:1 selectors, parameterized width.
module mux2 #(parameter W = 1) (input [W-1:0] a, b, input s, output [W-1:0] y);
  assign y = s ? b : a;
endmodule
module mux4 #(parameter W = 8) (input [W-1:0] c0, c1, c2, c3, input [1:0] s, output [W-1:0] y);
  wire [W-1:0] lo, hi;
  mux2 #(W) m0 (c0, c1, s[0], lo);
  mux2 #(.W(W)) m1 (.a(c2), .b(c3), .s(s[0]), .y(hi));
  mux2 #(W) m2 (.a(lo), .b(hi), .s(s[1]), .y(y));
endmodule
