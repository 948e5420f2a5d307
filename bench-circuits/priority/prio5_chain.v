// equicone gen priority --n 5 --style chain --seed 1
// 5-request priority encoder: r[4:0] in; y[2:0] = highest i with r[i] (0 if none), v = some r[i]
// style chain: up{i} = some request above i (an OR chain from the top), grant g{i} = r[i] and not up{i}, y[b] = OR of grants with bit b of i set
// mutation: none
module priority5_chain (r, y, v);
  input [4:0] r;
  output [2:0] y;
  output v;
  wire up2, up1, up0, nup1, g1, nup2, g2, nup3, g3;
  or (up2, r[3], r[4]);
  or (up1, r[2], up2);
  or (up0, r[1], up1);
  not (nup1, up1);
  and (g1, r[1], nup1);
  not (nup2, up2);
  and (g2, r[2], nup2);
  not (nup3, r[4]);
  and (g3, r[3], nup3);
  or (y[0], g1, g3);
  or (y[1], g2, g3);
  or (v, r[0], up0);
  buf (y[2], r[4]);
endmodule
