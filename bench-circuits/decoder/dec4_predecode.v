// equicone gen decoder --n 4 --style predecode --seed 1
// 4-to-16 decoder: a[3:0] in, y[15:0] out, y[i] = (a == i)
// style predecode: decode the low and high halves of a, AND one line of each (recursively)
// mutation: none
module decoder4_predecode (a, y);
  input [3:0] a;
  output [15:0] y;
  wire dec_0to0_0, dec_1to1_0, dec_0to1_0, dec_0to1_1, dec_0to1_2, dec_0to1_3, dec_2to2_0, dec_3to3_0;
  wire dec_2to3_0, dec_2to3_1, dec_2to3_2, dec_2to3_3;
  not (dec_0to0_0, a[0]);
  not (dec_1to1_0, a[1]);
  and (dec_0to1_0, dec_0to0_0, dec_1to1_0);
  and (dec_0to1_1, a[0], dec_1to1_0);
  and (dec_0to1_2, dec_0to0_0, a[1]);
  and (dec_0to1_3, a[0], a[1]);
  not (dec_2to2_0, a[2]);
  not (dec_3to3_0, a[3]);
  and (dec_2to3_0, dec_2to2_0, dec_3to3_0);
  and (dec_2to3_1, a[2], dec_3to3_0);
  and (dec_2to3_2, dec_2to2_0, a[3]);
  and (dec_2to3_3, a[2], a[3]);
  and (y[0], dec_0to1_0, dec_2to3_0);
  and (y[1], dec_0to1_1, dec_2to3_0);
  and (y[2], dec_0to1_2, dec_2to3_0);
  and (y[3], dec_0to1_3, dec_2to3_0);
  and (y[4], dec_0to1_0, dec_2to3_1);
  and (y[5], dec_0to1_1, dec_2to3_1);
  and (y[6], dec_0to1_2, dec_2to3_1);
  and (y[7], dec_0to1_3, dec_2to3_1);
  and (y[8], dec_0to1_0, dec_2to3_2);
  and (y[9], dec_0to1_1, dec_2to3_2);
  and (y[10], dec_0to1_2, dec_2to3_2);
  and (y[11], dec_0to1_3, dec_2to3_2);
  and (y[12], dec_0to1_0, dec_2to3_3);
  and (y[13], dec_0to1_1, dec_2to3_3);
  and (y[14], dec_0to1_2, dec_2to3_3);
  and (y[15], dec_0to1_3, dec_2to3_3);
endmodule
