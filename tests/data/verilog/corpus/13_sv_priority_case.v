// SystemVerilog priority case (Icarus 11 reads it; not `priority if`) and '1: a request mask.
module spec(input logic [2:0] r, input logic all, output logic [2:0] g);
  always_comb begin
    g = '0;
    if (all) g = '1;
    else
      priority casez (r)
        3'b1??: g = 3'b100;
        3'b01?: g = 3'b010;
        3'b001: g = 3'b001;
        default: g = '0;
      endcase
  end
endmodule
module impl(input [2:0] r, input all, output [2:0] g);
  assign g[2] = all | r[2];
  assign g[1] = all | (~r[2] & r[1]);
  assign g[0] = all | (~r[2] & ~r[1] & r[0]);
endmodule
module bug(input [2:0] r, input all, output [2:0] g);
  assign g[2] = all | r[2];
  assign g[1] = all | r[1];
  assign g[0] = all | (~r[2] & ~r[1] & r[0]);
endmodule
