// A literal wider than its declared size.
module m(input [3:0] a, output [3:0] y);
  assign y = a ^ 4'h1f;
endmodule
