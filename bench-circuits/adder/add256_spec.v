// equicone gen adder --n 256 --style spec --seed 1
// 256-bit adder: a[255:0], b[255:0] in; y[256:0] = a + b
// style spec: `y = a + b`; in bench written as the ripple-carry adder
// mutation: none
module adder256_spec (a, b, y);
  input [255:0] a;
  input [255:0] b;
  output [256:0] y;
  assign y = a + b;
endmodule
