// Division by a constant (IEEE 1364-2005 5.1.5) against a table.
module spec(input [3:0] a, output [2:0] q);
  assign q = a / 3;
endmodule
module impl(input [3:0] a, output reg [2:0] q);
  always @*
    if (a >= 4'd15) q = 3'd5;
    else if (a >= 4'd12) q = 3'd4;
    else if (a >= 4'd9) q = 3'd3;
    else if (a >= 4'd6) q = 3'd2;
    else if (a >= 4'd3) q = 3'd1;
    else q = 3'd0;
endmodule
module bug(input [3:0] a, output reg [2:0] q);
  always @*
    if (a >= 4'd15) q = 3'd5;
    else if (a >= 4'd12) q = 3'd4;
    else if (a >= 4'd10) q = 3'd3;
    else if (a >= 4'd6) q = 3'd2;
    else if (a >= 4'd3) q = 3'd1;
    else q = 3'd0;
endmodule
