// equicone gen priority --n 5 --style tree --seed 1
// 5-request priority encoder: r[4:0] in; y[2:0] = highest i with r[i] (0 if none), v = some r[i]
// style tree: (valid, index) pairs of aligned blocks merged level by level; the upper block wins through 2:1 cells
// mutation: none
module priority5_tree (r, y, v);
  input [4:0] r;
  output [2:0] y;
  output v;
  wire v1_0, v1_1, v2_0, i2_0_0, nv3_0;
  or (v1_0, r[0], r[1]);
  or (v1_1, r[2], r[3]);
  or (v2_0, v1_0, v1_1);
  assign i2_0_0 = v1_1 ? r[3] : r[1];
  or (v, v2_0, r[4]);
  not (nv3_0, r[4]);
  and (y[0], nv3_0, i2_0_0);
  and (y[1], nv3_0, v1_1);
  buf (y[2], r[4]);
endmodule
