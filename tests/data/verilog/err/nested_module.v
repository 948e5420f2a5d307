// Found by fuzzing: a module opened inside another once stalled the item loop (a hang).
module m(input a, output y);
  assign y = a;
module n(input b, output z);
  assign z = b;
endmodule
