// Absolute value of a signed 4-bit number against invert-and-increment.
module spec(input signed [3:0] a, output [3:0] m);
  assign m = (a < 0) ? -a : a;
endmodule
module impl(input [3:0] a, output [3:0] m);
  wire [3:0] x = a ^ {4{a[3]}};
  assign m = x + {3'b000, a[3]};
endmodule
module bug(input [3:0] a, output [3:0] m);
  wire [3:0] x = a ^ {4{a[3]}};
  assign m = x + {3'b000, a[2]};
endmodule
