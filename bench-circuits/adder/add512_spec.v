// equicone gen adder --n 512 --style spec --seed 1
// 512-bit adder: a[511:0], b[511:0] in; y[512:0] = a + b
// style spec: `y = a + b`; in bench written as the ripple-carry adder
// mutation: none
module adder512_spec (a, b, y);
  input [511:0] a;
  input [511:0] b;
  output [512:0] y;
  assign y = a + b;
endmodule
