// equicone gen multiplier --n 12 --style spec --seed 1
// 12x12 unsigned multiplier: a[11:0], b[11:0] in; p[23:0] = a * b (modulo 2^24)
// style spec: `p = a * b;` in bench written as the array
// mutation: none
module multiplier12_spec (a, b, p);
  input [11:0] a;
  input [11:0] b;
  output [23:0] p;
  assign p = a * b;
endmodule
