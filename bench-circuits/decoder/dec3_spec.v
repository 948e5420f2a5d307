// equicone gen decoder --n 3 --style spec --seed 1
// 3-to-8 decoder: a[2:0] in, y[7:0] out, y[i] = (a == i)
// style spec: `y = 1 << a`; in bench written as the flat decoder
// mutation: none
module decoder3_spec (a, y);
  input [2:0] a;
  output [7:0] y;
  assign y = 1 << a;
endmodule
