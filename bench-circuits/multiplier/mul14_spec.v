// equicone gen multiplier --n 14 --style spec --seed 1
// 14x14 unsigned multiplier: a[13:0], b[13:0] in; p[27:0] = a * b (modulo 2^28)
// style spec: `p = a * b;` in bench written as the array
// mutation: none
module multiplier14_spec (a, b, p);
  input [13:0] a;
  input [13:0] b;
  output [27:0] p;
  assign p = a * b;
endmodule
