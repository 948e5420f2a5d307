// A saturating 4-bit adder.
module spec(input [3:0] a, b, output reg [3:0] s);
  reg [4:0] t;
  always @(a or b) begin
    t = a + b;
    if (t > 5'd15) s = 4'hf;
    else s = t[3:0];
  end
endmodule
module impl(input [3:0] a, b, output [3:0] s);
  wire [4:0] t = {1'b0, a} + {1'b0, b};
  assign s = t[3:0] | {4{t[4]}};
endmodule
module bug(input [3:0] a, b, output [3:0] s);
  wire [4:0] t = {1'b0, a} + {1'b0, b};
  assign s = t[3:0] | {3'b000, t[4]};
endmodule
