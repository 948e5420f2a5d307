// equicone gen adder --n 128 --style spec --seed 1
// 128-bit adder: a[127:0], b[127:0] in; y[128:0] = a + b
// style spec: `y = a + b`; in bench written as the ripple-carry adder
// mutation: none
module adder128_spec (a, b, y);
  input [127:0] a;
  input [127:0] b;
  output [128:0] y;
  assign y = a + b;
endmodule
