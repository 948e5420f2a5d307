// equicone gen multiplier --n 4 --style spec --seed 1
// 4x4 unsigned multiplier: a[3:0], b[3:0] in; p[7:0] = a * b (modulo 2^8)
// style spec: `p = a * b;` in bench written as the array
// mutation: none
module multiplier4_spec (a, b, p);
  input [3:0] a;
  input [3:0] b;
  output [7:0] p;
  assign p = a * b;
endmodule
