// equicone gen multiplier --n 16 --style spec --seed 1
// 16x16 unsigned multiplier: a[15:0], b[15:0] in; p[31:0] = a * b (modulo 2^32)
// style spec: `p = a * b;` in bench written as the array
// mutation: none
module multiplier16_spec (a, b, p);
  input [15:0] a;
  input [15:0] b;
  output [31:0] p;
  assign p = a * b;
endmodule
