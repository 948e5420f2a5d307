// Found by fuzzing: a stray `endgenerate` once stalled the item loop (a hang).
module m(input a, output y);
  endgenerate
  assign y = a;
endmodule
