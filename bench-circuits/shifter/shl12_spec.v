// equicone gen shifter --n 12 --style spec --seed 1
// 12-bit barrel shifter: a[11:0], s[3:0] in; y[11:0] = a << s, zeros shifted in (y = 0 for s >= n)
// style spec: `y = a << s`; in bench written as the log shifter
// mutation: none
module shifter12_spec (a, s, y);
  input [11:0] a;
  input [3:0] s;
  output [11:0] y;
  assign y = a << s;
endmodule
