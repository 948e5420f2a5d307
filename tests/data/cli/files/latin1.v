module m(input a, output y);
  assign y = ÿ a;
endmodule
