// equicone gen shifter --n 8 --style log --seed 1
// 8-bit barrel shifter: a[7:0], s[2:0] in; y[7:0] = a << s, zeros shifted in
// style log: 3 levels of 2:1 cells, level j shifts by 2^j when s[j] is set
// mutation: none
module shifter8_log (a, s, y);
  input [7:0] a;
  input [2:0] s;
  output [7:0] y;
  wire sn0, z0_0, l0_1, l0_2, l0_3, l0_4, l0_5, l0_6, l0_7, sn1, z1_0, z1_1, l1_2, l1_3, l1_4, l1_5, l1_6;
  wire l1_7, sn2;
  not (sn0, s[0]);
  and (z0_0, sn0, a[0]);
  assign l0_1 = s[0] ? a[0] : a[1];
  assign l0_2 = s[0] ? a[1] : a[2];
  assign l0_3 = s[0] ? a[2] : a[3];
  assign l0_4 = s[0] ? a[3] : a[4];
  assign l0_5 = s[0] ? a[4] : a[5];
  assign l0_6 = s[0] ? a[5] : a[6];
  assign l0_7 = s[0] ? a[6] : a[7];
  not (sn1, s[1]);
  and (z1_0, sn1, z0_0);
  and (z1_1, sn1, l0_1);
  assign l1_2 = s[1] ? z0_0 : l0_2;
  assign l1_3 = s[1] ? l0_1 : l0_3;
  assign l1_4 = s[1] ? l0_2 : l0_4;
  assign l1_5 = s[1] ? l0_3 : l0_5;
  assign l1_6 = s[1] ? l0_4 : l0_6;
  assign l1_7 = s[1] ? l0_5 : l0_7;
  not (sn2, s[2]);
  and (y[0], sn2, z1_0);
  and (y[1], sn2, z1_1);
  and (y[2], sn2, l1_2);
  and (y[3], sn2, l1_3);
  assign y[4] = s[2] ? z1_0 : l1_4;
  assign y[5] = s[2] ? z1_1 : l1_5;
  assign y[6] = s[2] ? l1_2 : l1_6;
  assign y[7] = s[2] ? l1_3 : l1_7;
endmodule
