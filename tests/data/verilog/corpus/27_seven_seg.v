// A BCD to seven-segment decoder whose spec leaves 10..15 as x (don't-cares).
module spec(input [3:0] v, output reg [6:0] seg);
  always @*
    case (v)
      4'd0: seg = 7'b0111111;
      4'd1: seg = 7'b0000110;
      4'd2: seg = 7'b1011011;
      4'd3: seg = 7'b1001111;
      4'd4: seg = 7'b1100110;
      4'd5: seg = 7'b1101101;
      4'd6: seg = 7'b1111101;
      4'd7: seg = 7'b0000111;
      4'd8: seg = 7'b1111111;
      4'd9: seg = 7'b1101111;
      default: seg = 7'bx;
    endcase
endmodule
module impl(input [3:0] v, output [6:0] seg);
  wire a = v[3], b = v[2], c = v[1], d = v[0];
  assign seg[0] = a | c | (b & d) | (~b & ~d);
  assign seg[1] = ~b | (c & d) | (~c & ~d);
  assign seg[2] = b | ~c | d;
  assign seg[3] = a | (~b & ~d) | (~b & c) | (c & ~d) | (b & ~c & d);
  assign seg[4] = (~b & ~d) | (c & ~d);
  assign seg[5] = a | (~c & ~d) | (b & ~c) | (b & ~d);
  assign seg[6] = a | (b & ~c) | (~b & c) | (c & ~d);
endmodule
module bug(input [3:0] v, output [6:0] seg);
  wire a = v[3], b = v[2], c = v[1], d = v[0];
  assign seg[0] = a | c | (b & d) | (~b & ~d);
  assign seg[1] = ~b | (c & d) | (~c & ~d);
  assign seg[2] = b | ~c | d;
  assign seg[3] = a | (~b & ~d) | (~b & c) | (c & ~d) | (b & ~c & d);
  assign seg[4] = (~b & ~d) | (c & ~d);
  assign seg[5] = a | (~c & ~d) | (b & ~c) | (b & ~d);
  assign seg[6] = a | (b & ~c) | (~b & c) | (c & d);
endmodule
