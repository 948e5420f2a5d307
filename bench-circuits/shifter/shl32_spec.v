// equicone gen shifter --n 32 --style spec --seed 1
// 32-bit barrel shifter: a[31:0], s[4:0] in; y[31:0] = a << s, zeros shifted in
// style spec: `y = a << s`; in bench written as the log shifter
// mutation: none
module shifter32_spec (a, s, y);
  input [31:0] a;
  input [4:0] s;
  output [31:0] y;
  assign y = a << s;
endmodule
