// Comma-separated sensitivity list: majority of three.
module spec(input a, b, c, output reg m);
  always @(a, b, c)
    if ((a & b) | (a & c) | (b & c)) m = 1'b1;
    else m = 1'b0;
endmodule
module impl(input a, b, c, output m);
  wire ab, ac, bc;
  nand (ab, a, b);
  nand (ac, a, c);
  nand (bc, b, c);
  nand (m, ab, ac, bc);
endmodule
module bug(input a, b, c, output m);
  assign m = (a & b) | (b & c);
endmodule
