// A parameterized module instantiated with an override, and a localparam.
module add_n #(parameter N = 2) (input [N-1:0] a, b, output [N:0] s);
  assign s = a + b;
endmodule
module spec(input [2:0] a, b, output [3:0] s);
  add_n #(.N(3)) u (.a(a), .b(b), .s(s));
endmodule
module impl(input [2:0] a, b, output [3:0] s);
  localparam Z = 1'b0;
  wire [3:0] c;
  assign c[0] = Z;
  assign s[0] = a[0] ^ b[0];
  assign c[1] = a[0] & b[0];
  assign s[1] = a[1] ^ b[1] ^ c[1];
  assign c[2] = (a[1] & b[1]) | (c[1] & (a[1] | b[1]));
  assign s[2] = a[2] ^ b[2] ^ c[2];
  assign s[3] = (a[2] & b[2]) | (c[2] & (a[2] | b[2]));
endmodule
module bug(input [2:0] a, b, output [3:0] s);
  add_n #(.N(2)) u (.a(a[1:0]), .b(b[1:0]), .s(s[2:0]));
  assign s[3] = 1'b0;
endmodule
