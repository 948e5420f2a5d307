// equicone gen multiplier --n 10 --style spec --seed 1
// 10x10 unsigned multiplier: a[9:0], b[9:0] in; p[19:0] = a * b (modulo 2^20)
// style spec: `p = a * b;` in bench written as the array
// mutation: none
module multiplier10_spec (a, b, p);
  input [9:0] a;
  input [9:0] b;
  output [19:0] p;
  assign p = a * b;
endmodule
