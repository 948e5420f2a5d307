// Binary to Gray code and back (a loop in always @*).
module spec(input [3:0] b, output [3:0] g, output reg [3:0] back);
  integer i;
  assign g = b ^ (b >> 1);
  always @* begin
    back[3] = g[3];
    for (i = 2; i >= 0; i = i - 1) back[i] = back[i+1] ^ g[i];
  end
endmodule
module impl(input [3:0] b, output [3:0] g, output [3:0] back);
  assign g = {b[3], b[3] ^ b[2], b[2] ^ b[1], b[1] ^ b[0]};
  assign back = b;
endmodule
module bug(input [3:0] b, output [3:0] g, output [3:0] back);
  assign g = {b[3], b[3] ^ b[2], b[2] ^ b[1], b[1] ^ b[0]};
  assign back = {b[3:1], b[0] ^ b[3]};
endmodule
