// equicone gen adder --n 64 --style spec --seed 1
// 64-bit adder: a[63:0], b[63:0] in; y[64:0] = a + b
// style spec: `y = a + b`; in bench written as the ripple-carry adder
// mutation: none
module adder64_spec (a, b, y);
  input [63:0] a;
  input [63:0] b;
  output [64:0] y;
  assign y = a + b;
endmodule
