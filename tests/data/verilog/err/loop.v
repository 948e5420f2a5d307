module m(input a, output y);
  wire p, q;
  nand g1 (p, a, q);
  not g2 (q, p);
  assign y = q;
endmodule
