// A left rotate by a variable amount against three stages of 2:1 selectors.
module spec(input [7:0] d, input [2:0] s, output [7:0] y);
  assign y = (d << s) | (d >> (4'd8 - s));
endmodule
module impl(input [7:0] d, input [2:0] s, output [7:0] y);
  wire [7:0] a = s[0] ? {d[6:0], d[7]} : d;
  wire [7:0] b = s[1] ? {a[5:0], a[7:6]} : a;
  assign y = s[2] ? {b[3:0], b[7:4]} : b;
endmodule
module bug(input [7:0] d, input [2:0] s, output [7:0] y);
  wire [7:0] a = s[0] ? {d[6:0], d[7]} : d;
  wire [7:0] b = s[1] ? {a[5:0], a[7:6]} : a;
  assign y = s[2] ? {b[4:0], b[7:5]} : b;
endmodule
