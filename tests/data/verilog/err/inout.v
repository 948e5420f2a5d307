module m(input a, inout b, output y);
  assign y = a;
endmodule
