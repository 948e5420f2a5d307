// Division by a variable: x for a zero divisor (a don't-care), a restoring divider otherwise.
module spec(input [2:0] a, b, output [2:0] q);
  assign q = a / b;
endmodule
module impl(input [2:0] a, b, output [2:0] q);
  wire [5:0] bb = {3'b0, b};
  wire [5:0] r2 = {3'b0, a};
  assign q[2] = r2 >= (bb << 2);
  wire [5:0] r1 = q[2] ? r2 - (bb << 2) : r2;
  assign q[1] = r1 >= (bb << 1);
  wire [5:0] r0 = q[1] ? r1 - (bb << 1) : r1;
  assign q[0] = r0 >= bb;
endmodule
module bug(input [2:0] a, b, output [2:0] q);
  wire [5:0] bb = {3'b0, b};
  wire [5:0] r2 = {3'b0, a};
  assign q[2] = r2 >= (bb << 2);
  wire [5:0] r1 = q[2] ? r2 - (bb << 2) : r2;
  assign q[1] = r1 > (bb << 1);
  wire [5:0] r0 = q[1] ? r1 - (bb << 1) : r1;
  assign q[0] = r0 >= bb;
endmodule
