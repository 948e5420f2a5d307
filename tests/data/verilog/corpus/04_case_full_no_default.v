// A case covering every value of its select without a default: a 2-to-4 decoder.
module spec(input [1:0] s, input en, output reg [3:0] y);
  always @*
    case (s)
      2'd0: y = {3'b000, en};
      2'd1: y = {2'b00, en, 1'b0};
      2'd2: y = {1'b0, en, 2'b00};
      2'd3: y = {en, 3'b000};
    endcase
endmodule
module impl(input [1:0] s, input en, output [3:0] y);
  assign y = {3'b000, en} << s;
endmodule
module bug(input [1:0] s, input en, output [3:0] y);
  assign y = {3'b000, en} << (s ^ 2'b01);
endmodule
