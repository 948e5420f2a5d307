module m(input a, output y, output z);
  assign y = a ** 2;
  assign z = a === 1'bx;
  always @(a) y = a;
endmodule
