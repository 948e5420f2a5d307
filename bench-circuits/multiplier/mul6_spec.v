// equicone gen multiplier --n 6 --style spec --seed 1
// 6x6 unsigned multiplier: a[5:0], b[5:0] in; p[11:0] = a * b (modulo 2^12)
// style spec: `p = a * b;` in bench written as the array
// mutation: none
module multiplier6_spec (a, b, p);
  input [5:0] a;
  input [5:0] b;
  output [11:0] p;
  assign p = a * b;
endmodule
