// equicone gen decoder --n 3 --style predecode --seed 1
// 3-to-8 decoder: a[2:0] in, y[7:0] out, y[i] = (a == i)
// style predecode: decode the low and high halves of a, AND one line of each (recursively)
// mutation: none
module decoder3_predecode (a, y);
  input [2:0] a;
  output [7:0] y;
  wire dec_0to0_0, dec_1to1_0, dec_2to2_0, dec_1to2_0, dec_1to2_1, dec_1to2_2, dec_1to2_3;
  not (dec_0to0_0, a[0]);
  not (dec_1to1_0, a[1]);
  not (dec_2to2_0, a[2]);
  and (dec_1to2_0, dec_1to1_0, dec_2to2_0);
  and (dec_1to2_1, a[1], dec_2to2_0);
  and (dec_1to2_2, dec_1to1_0, a[2]);
  and (dec_1to2_3, a[1], a[2]);
  and (y[0], dec_0to0_0, dec_1to2_0);
  and (y[1], a[0], dec_1to2_0);
  and (y[2], dec_0to0_0, dec_1to2_1);
  and (y[3], a[0], dec_1to2_1);
  and (y[4], dec_0to0_0, dec_1to2_2);
  and (y[5], a[0], dec_1to2_2);
  and (y[6], dec_0to0_0, dec_1to2_3);
  and (y[7], a[0], dec_1to2_3);
endmodule
