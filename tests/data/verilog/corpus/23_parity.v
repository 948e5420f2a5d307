// Reduction XOR against a tree of XOR gates.
module spec(input [7:0] d, output p);
  assign p = ^d;
endmodule
module impl(input [7:0] d, output p);
  wire a, b, c, e, f, g;
  xor (a, d[0], d[1]);
  xor (b, d[2], d[3]);
  xor (c, d[4], d[5]);
  xor (e, d[6], d[7]);
  xor (f, a, b);
  xor (g, c, e);
  xor (p, f, g);
endmodule
module bug(input [7:0] d, output p);
  wire a, b, c, e, f, g;
  xor (a, d[0], d[1]);
  xor (b, d[2], d[3]);
  xor (c, d[4], d[5]);
  xnor (e, d[6], d[7]);
  xor (f, a, b);
  xor (g, c, e);
  xor (p, f, g);
endmodule
