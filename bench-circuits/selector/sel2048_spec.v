// equicone gen selector --n 2048 --width 1 --style spec --seed 1
// 2048:1 selector of 1-bit channels: d[2047:0] in (channel i is d[i]), s[10:0] selects, y[0:0] = channel s
// style spec: the one-line selection; in bench written as the decoder AND-OR (0 out of range)
// mutation: none
module selector2048x1_spec (d, s, y);
  input [2047:0] d;
  input [10:0] s;
  output [0:0] y;
  assign y = d[s];
endmodule
