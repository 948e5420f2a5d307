module g(input a, b, c, output y, z);
  wire t;
  nand (t, a, b, c);
  xnor x1 (y, t, c), x2 (z, a, t);
endmodule
