// equicone gen priority --n 16 --style tree --seed 1
// 16-request priority encoder: r[15:0] in; y[3:0] = highest i with r[i] (0 if none), v = some r[i]
// style tree: (valid, index) pairs of aligned blocks merged level by level; the upper block wins through 2:1 cells
// mutation: none
module priority16_tree (r, y, v);
  input [15:0] r;
  output [3:0] y;
  output v;
  wire v1_0, v1_1, v1_2, v1_3, v1_4, v1_5, v1_6, v1_7, v2_0, i2_0_0, v2_1, i2_1_0, v2_2, i2_2_0, v2_3;
  wire i2_3_0, v3_0, i3_0_0, i3_0_1, i3_1_0, i3_1_1;
  or (v1_0, r[0], r[1]);
  or (v1_1, r[2], r[3]);
  or (v1_2, r[4], r[5]);
  or (v1_3, r[6], r[7]);
  or (v1_4, r[8], r[9]);
  or (v1_5, r[10], r[11]);
  or (v1_6, r[12], r[13]);
  or (v1_7, r[14], r[15]);
  or (v2_0, v1_0, v1_1);
  assign i2_0_0 = v1_1 ? r[3] : r[1];
  or (v2_1, v1_2, v1_3);
  assign i2_1_0 = v1_3 ? r[7] : r[5];
  or (v2_2, v1_4, v1_5);
  assign i2_2_0 = v1_5 ? r[11] : r[9];
  or (v2_3, v1_6, v1_7);
  assign i2_3_0 = v1_7 ? r[15] : r[13];
  or (v3_0, v2_0, v2_1);
  assign i3_0_0 = v2_1 ? i2_1_0 : i2_0_0;
  assign i3_0_1 = v2_1 ? v1_3 : v1_1;
  or (y[3], v2_2, v2_3);
  assign i3_1_0 = v2_3 ? i2_3_0 : i2_2_0;
  assign i3_1_1 = v2_3 ? v1_7 : v1_5;
  or (v, v3_0, y[3]);
  assign y[0] = y[3] ? i3_1_0 : i3_0_0;
  assign y[1] = y[3] ? i3_1_1 : i3_0_1;
  assign y[2] = y[3] ? v2_3 : v2_1;
endmodule
