// SystemVerilog op= and -- : a small checksum.
module spec(input logic [3:0] a, b, output logic [3:0] s);
  always_comb begin
    s = a;
    s ^= b;
    s += 4'd3;
    s--;
  end
endmodule
module impl(input [3:0] a, b, output [3:0] s);
  assign s = (a ^ b) + 4'd2;
endmodule
module bug(input [3:0] a, b, output [3:0] s);
  assign s = (a | b) + 4'd2;
endmodule
