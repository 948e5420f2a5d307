// equicone gen priority --n 8 --style chain --seed 1
// 8-request priority encoder: r[7:0] in; y[2:0] = highest i with r[i] (0 if none), v = some r[i]
// style chain: up{i} = some request above i (an OR chain from the top), grant g{i} = r[i] and not up{i}, y[b] = OR of grants with bit b of i set
// mutation: none
module priority8_chain (r, y, v);
  input [7:0] r;
  output [2:0] y;
  output v;
  wire up5, up4, up3, up2, up1, up0, nup1, g1, nup2, g2, nup3, g3, nup4, g4, nup5, g5, nup6, g6;
  or (up5, r[6], r[7]);
  or (up4, r[5], up5);
  or (up3, r[4], up4);
  or (up2, r[3], up3);
  or (up1, r[2], up2);
  or (up0, r[1], up1);
  not (nup1, up1);
  and (g1, r[1], nup1);
  not (nup2, up2);
  and (g2, r[2], nup2);
  not (nup3, up3);
  and (g3, r[3], nup3);
  not (nup4, up4);
  and (g4, r[4], nup4);
  not (nup5, up5);
  and (g5, r[5], nup5);
  not (nup6, r[7]);
  and (g6, r[6], nup6);
  or (y[0], g1, g3, g5, r[7]);
  or (y[1], g2, g3, g6, r[7]);
  or (y[2], g4, g5, g6, r[7]);
  or (v, r[0], up0);
endmodule
