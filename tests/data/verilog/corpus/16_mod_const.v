// Remainder by a constant against repeated subtraction.
module spec(input [3:0] a, output [2:0] r);
  assign r = a % 5;
endmodule
module impl(input [3:0] a, output [2:0] r);
  wire [3:0] t1 = (a >= 4'd10) ? a - 4'd10 : a;
  wire [3:0] t2 = (t1 >= 4'd5) ? t1 - 4'd5 : t1;
  assign r = t2[2:0];
endmodule
module bug(input [3:0] a, output [2:0] r);
  wire [3:0] t1 = (a > 4'd10) ? a - 4'd10 : a;
  wire [3:0] t2 = (t1 >= 4'd5) ? t1 - 4'd5 : t1;
  assign r = t2[2:0];
endmodule
