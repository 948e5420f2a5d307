// equicone gen shifter --n 8 --style spec --seed 1
// 8-bit barrel shifter: a[7:0], s[2:0] in; y[7:0] = a << s, zeros shifted in
// style spec: `y = a << s`; in bench written as the log shifter
// mutation: none
module shifter8_spec (a, s, y);
  input [7:0] a;
  input [2:0] s;
  output [7:0] y;
  assign y = a << s;
endmodule
