// A syntax error: a missing semicolon.
module m(input a, output y);
  wire w
  assign y = a;
endmodule
