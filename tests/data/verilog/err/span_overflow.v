// Found by fuzzing: a part-select whose bounds differ by 2^64 - 1 overflowed the width
// computation of an earlier fix (a panic in checked builds).
module m(input [3:0] d, output y);
  assign y = |d[9223372036854775807:-9223372036854775808];
endmodule
