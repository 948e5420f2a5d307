// equicone gen shifter --n 64 --style spec --seed 1
// 64-bit barrel shifter: a[63:0], s[5:0] in; y[63:0] = a << s, zeros shifted in
// style spec: `y = a << s`; in bench written as the log shifter
// mutation: none
module shifter64_spec (a, s, y);
  input [63:0] a;
  input [5:0] s;
  output [63:0] y;
  assign y = a << s;
endmodule
