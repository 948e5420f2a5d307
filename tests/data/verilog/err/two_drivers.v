// Two drivers for one net.
module m(input a, input b, output y);
  assign y = a;
  assign y = b;
endmodule
