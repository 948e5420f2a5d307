// equicone gen decoder --n 8 --style spec --seed 1
// 8-to-256 decoder: a[7:0] in, y[255:0] out, y[i] = (a == i)
// style spec: `y = 1 << a`; in bench written as the flat decoder
// mutation: none
module decoder8_spec (a, y);
  input [7:0] a;
  output [255:0] y;
  assign y = 1 << a;
endmodule
