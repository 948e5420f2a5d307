// A power with constant operands as a scale factor.
module spec(input [3:0] a, output [6:0] y);
  localparam K = 2 ** 3;
  assign y = a * K;
endmodule
module impl(input [3:0] a, output [6:0] y);
  assign y = {a, 3'b000};
endmodule
module bug(input [3:0] a, output [6:0] y);
  assign y = {a, 2'b00};
endmodule
