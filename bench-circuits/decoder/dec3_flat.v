// equicone gen decoder --n 3 --style flat --seed 1
// 3-to-8 decoder: a[2:0] in, y[7:0] out, y[i] = (a == i)
// style flat: one 3-input AND per output over shared inverters
// mutation: none
module decoder3_flat (a, y);
  input [2:0] a;
  output [7:0] y;
  wire dec_an0, dec_an1, dec_an2;
  not (dec_an0, a[0]);
  not (dec_an1, a[1]);
  not (dec_an2, a[2]);
  and (y[0], dec_an0, dec_an1, dec_an2);
  and (y[1], a[0], dec_an1, dec_an2);
  and (y[2], dec_an0, a[1], dec_an2);
  and (y[3], a[0], a[1], dec_an2);
  and (y[4], dec_an0, dec_an1, a[2]);
  and (y[5], a[0], dec_an1, a[2]);
  and (y[6], dec_an0, a[1], a[2]);
  and (y[7], a[0], a[1], a[2]);
endmodule
