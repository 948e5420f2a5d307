module sub(input [3:0] a, output y);
  assign y = &a;
endmodule
module m(input [3:0] p, output q);
  sub u1(.a(p), .b(q));
  sub u2(p, q, p);
endmodule
