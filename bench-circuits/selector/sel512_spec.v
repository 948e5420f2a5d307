// equicone gen selector --n 512 --width 1 --style spec --seed 1
// 512:1 selector of 1-bit channels: d[511:0] in (channel i is d[i]), s[8:0] selects, y[0:0] = channel s
// style spec: the one-line selection; in bench written as the decoder AND-OR (0 out of range)
// mutation: none
module selector512x1_spec (d, s, y);
  input [511:0] d;
  input [8:0] s;
  output [0:0] y;
  assign y = d[s];
endmodule
