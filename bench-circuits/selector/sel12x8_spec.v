// equicone gen selector --n 12 --width 8 --style spec --seed 1
// 12:1 selector of 8-bit channels: d[95:0] in (channel i is d[i*8 +: 8]), s[3:0] selects, y[7:0] = channel s
// select values 12..15 are out of range: the spec reads x there, gate-level styles give what their structure gives
// style spec: the one-line selection; in bench written as the decoder AND-OR (0 out of range)
// mutation: none
module selector12x8_spec (d, s, y);
  input [95:0] d;
  input [3:0] s;
  output [7:0] y;
  assign y = d[s*8 +: 8];
endmodule
