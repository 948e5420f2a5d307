// Found by fuzzing: a 165,536-bit (here 1,000-bit) variable part-select of a 4-bit vector, and a multiplication
// 655,362 bits wide, once ran for minutes (here 8,192 bits: over the 4,096-bit limit).
module m(input [3:0] a, input [1:0] s, input [8191:0] b, output [3:0] y, output z);
  assign y = {2{a[s +: 1000]}};
  assign z = (b * a) == 0;
endmodule
