// equicone gen multiplier --n 8 --style spec --seed 1
// 8x8 unsigned multiplier: a[7:0], b[7:0] in; p[15:0] = a * b (modulo 2^16)
// style spec: `p = a * b;` in bench written as the array
// mutation: none
module multiplier8_spec (a, b, p);
  input [7:0] a;
  input [7:0] b;
  output [15:0] p;
  assign p = a * b;
endmodule
