// SystemVerilog: logic, always_comb, '0, i++ and += in a loop.
module spec(input logic [5:0] d, output logic [2:0] n);
  integer i;
  always_comb begin
    n = '0;
    for (i = 0; i < 6; i++) n += d[i];
  end
endmodule
module impl(input [5:0] d, output [2:0] n);
  wire [1:0] a = d[0] + d[1] + d[2];
  wire [1:0] b = d[3] + d[4] + d[5];
  assign n = a + b;
endmodule
module bug(input [5:0] d, output [2:0] n);
  wire [1:0] a = d[0] + d[1] + d[2];
  wire [1:0] b = d[3] + d[4] + d[4];
  assign n = a + b;
endmodule
