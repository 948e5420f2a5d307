// BCD increment: values above 9 read x in the spec.
module spec(input [3:0] v, output reg [3:0] w, output reg carry);
  always @*
    if (v > 4'd9) begin w = 4'bxxxx; carry = 1'bx; end
    else if (v == 4'd9) begin w = 4'd0; carry = 1'b1; end
    else begin w = v + 4'd1; carry = 1'b0; end
endmodule
module impl(input [3:0] v, output [3:0] w, output carry);
  assign carry = v[3] & v[0];
  assign w = carry ? 4'd0 : v + 4'd1;
endmodule
module bug(input [3:0] v, output [3:0] w, output carry);
  assign carry = v[3];
  assign w = carry ? 4'd0 : v + 4'd1;
endmodule
