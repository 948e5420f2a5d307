// equicone gen selector --n 128 --width 1 --style spec --seed 1
// 128:1 selector of 1-bit channels: d[127:0] in (channel i is d[i]), s[6:0] selects, y[0:0] = channel s
// style spec: the one-line selection; in bench written as the decoder AND-OR (0 out of range)
// mutation: none
module selector128x1_spec (d, s, y);
  input [127:0] d;
  input [6:0] s;
  output [0:0] y;
  assign y = d[s];
endmodule
