// SystemVerilog int loop variables: `int i;` in the module and `for (int j = ...)` headers.
module spec(input logic [3:0] d, output logic [2:0] n, output logic [3:0] r);
  int i;
  always_comb begin
    n = '0;
    for (i = 0; i < 4; i++) n += d[i];
  end
  always_comb for (int j = 0; j < 4; j++) r[j] = d[3 - j];
endmodule
module impl(input [3:0] d, output [2:0] n, output [3:0] r);
  assign n = (d[0] + d[1]) + (d[2] + d[3]);
  assign r = {d[0], d[1], d[2], d[3]};
endmodule
module bug(input [3:0] d, output [2:0] n, output [3:0] r);
  assign n = (d[0] + d[1]) + (d[2] + d[3]);
  assign r = {d[0], d[2], d[1], d[3]};
endmodule
