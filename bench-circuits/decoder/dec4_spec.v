// equicone gen decoder --n 4 --style spec --seed 1
// 4-to-16 decoder: a[3:0] in, y[15:0] out, y[i] = (a == i)
// style spec: `y = 1 << a`; in bench written as the flat decoder
// mutation: none
module decoder4_spec (a, y);
  input [3:0] a;
  output [15:0] y;
  assign y = 1 << a;
endmodule
