// equicone gen decoder --n 4 --style flat --seed 1
// 4-to-16 decoder: a[3:0] in, y[15:0] out, y[i] = (a == i)
// style flat: one 4-input AND per output over shared inverters
// mutation: none
module decoder4_flat (a, y);
  input [3:0] a;
  output [15:0] y;
  wire dec_an0, dec_an1, dec_an2, dec_an3;
  not (dec_an0, a[0]);
  not (dec_an1, a[1]);
  not (dec_an2, a[2]);
  not (dec_an3, a[3]);
  and (y[0], dec_an0, dec_an1, dec_an2, dec_an3);
  and (y[1], a[0], dec_an1, dec_an2, dec_an3);
  and (y[2], dec_an0, a[1], dec_an2, dec_an3);
  and (y[3], a[0], a[1], dec_an2, dec_an3);
  and (y[4], dec_an0, dec_an1, a[2], dec_an3);
  and (y[5], a[0], dec_an1, a[2], dec_an3);
  and (y[6], dec_an0, a[1], a[2], dec_an3);
  and (y[7], a[0], a[1], a[2], dec_an3);
  and (y[8], dec_an0, dec_an1, dec_an2, a[3]);
  and (y[9], a[0], dec_an1, dec_an2, a[3]);
  and (y[10], dec_an0, a[1], dec_an2, a[3]);
  and (y[11], a[0], a[1], dec_an2, a[3]);
  and (y[12], dec_an0, dec_an1, a[2], a[3]);
  and (y[13], a[0], dec_an1, a[2], a[3]);
  and (y[14], dec_an0, a[1], a[2], a[3]);
  and (y[15], a[0], a[1], a[2], a[3]);
endmodule
