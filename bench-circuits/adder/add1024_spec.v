// equicone gen adder --n 1024 --style spec --seed 1
// 1024-bit adder: a[1023:0], b[1023:0] in; y[1024:0] = a + b
// style spec: `y = a + b`; in bench written as the ripple-carry adder
// mutation: none
module adder1024_spec (a, b, y);
  input [1023:0] a;
  input [1023:0] b;
  output [1024:0] y;
  assign y = a + b;
endmodule
