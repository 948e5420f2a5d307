// equicone gen priority --n 8 --style tree --seed 1
// 8-request priority encoder: r[7:0] in; y[2:0] = highest i with r[i] (0 if none), v = some r[i]
// style tree: (valid, index) pairs of aligned blocks merged level by level; the upper block wins through 2:1 cells
// mutation: none
module priority8_tree (r, y, v);
  input [7:0] r;
  output [2:0] y;
  output v;
  wire v1_0, v1_1, v1_2, v1_3, v2_0, i2_0_0, i2_1_0;
  or (v1_0, r[0], r[1]);
  or (v1_1, r[2], r[3]);
  or (v1_2, r[4], r[5]);
  or (v1_3, r[6], r[7]);
  or (v2_0, v1_0, v1_1);
  assign i2_0_0 = v1_1 ? r[3] : r[1];
  or (y[2], v1_2, v1_3);
  assign i2_1_0 = v1_3 ? r[7] : r[5];
  or (v, v2_0, y[2]);
  assign y[0] = y[2] ? i2_1_0 : i2_0_0;
  assign y[1] = y[2] ? v1_3 : v1_1;
endmodule
