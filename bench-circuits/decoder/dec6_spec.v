// equicone gen decoder --n 6 --style spec --seed 1
// 6-to-64 decoder: a[5:0] in, y[63:0] out, y[i] = (a == i)
// style spec: `y = 1 << a`; in bench written as the flat decoder
// mutation: none
module decoder6_spec (a, y);
  input [5:0] a;
  output [63:0] y;
  assign y = 1 << a;
endmodule
