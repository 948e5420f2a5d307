// An array of instances (IEEE 1364-2005 clause 12.1.2: the 8-bit connections split into
// 2-bit slices, u[0] taking the least significant bits; `c` goes to every slice) and a
// `defparam` that wins over the instance's own `#(...)` value (clause 12.2.1).
module addk #(parameter K = 0) (input [1:0] a, input c, output [1:0] y);
  assign y = a + K + c;
endmodule
module spec(input [7:0] a, input c, output [7:0] y, output [1:0] z);
  addk u[3:0] (.a(a), .c(c), .y(y));
  addk #(.K(2)) v (.a(a[1:0] ^ a[7:6]), .c(1'b0), .y(z));
  defparam v.K = 3;
endmodule
module impl(input [7:0] a, input c, output [7:0] y, output [1:0] z);
  assign y = {a[7:6] + c, a[5:4] + c, a[3:2] + c, a[1:0] + c};
  assign z = (a[1:0] ^ a[7:6]) - 2'd1;
endmodule
module bug(input [7:0] a, input c, output [7:0] y, output [1:0] z);
  assign y = {a[7:6] + c, a[5:4] + c, a[3:2] + c, a[1:0] + c};
  assign z = (a[1:0] ^ a[7:6]) + 2'd2;
endmodule
