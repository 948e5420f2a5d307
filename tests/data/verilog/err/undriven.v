module m(input a, output [1:0] y);
  wire w;
  assign y[0] = a & w;
endmodule
