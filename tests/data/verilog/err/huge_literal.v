// Found by fuzzing: an 18-byte literal 655,364 bits wide once took 2 s and 400 MiB.
module m(input [3:0] a, output y);
  assign y = a < 655364'so24;
endmodule
