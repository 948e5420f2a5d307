// equicone gen adder --n 32 --style spec --seed 1
// 32-bit adder: a[31:0], b[31:0] in; y[32:0] = a + b
// style spec: `y = a + b`; in bench written as the ripple-carry adder
// mutation: none
module adder32_spec (a, b, y);
  input [31:0] a;
  input [31:0] b;
  output [32:0] y;
  assign y = a + b;
endmodule
