// Found by fuzzing: a part-select 2^31 bits wide once ran for minutes; range bounds outside
// the 32-bit integers once overflowed.
module m(input [3:0] d, output y, output [1:0] z);
  assign y = |(d[2147483647:0]);
  wire [9223372036854775807:0] w;
  assign z = d[-9223372036854775807 +: 2];
endmodule
