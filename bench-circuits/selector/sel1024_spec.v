// equicone gen selector --n 1024 --width 1 --style spec --seed 1
// 1024:1 selector of 1-bit channels: d[1023:0] in (channel i is d[i]), s[9:0] selects, y[0:0] = channel s
// style spec: the one-line selection; in bench written as the decoder AND-OR (0 out of range)
// mutation: none
module selector1024x1_spec (d, s, y);
  input [1023:0] d;
  input [9:0] s;
  output [0:0] y;
  assign y = d[s];
endmodule
