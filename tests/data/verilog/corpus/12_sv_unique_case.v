// SystemVerilog unique case in always_comb: a 2-to-4 decoder with enable.
module spec(input bit [1:0] s, input logic en, output logic [3:0] y);
  always_comb begin
    y = 4'b0;
    if (en)
      unique case (s)
        2'd0: y[0] = 1'b1;
        2'd1: y[1] = 1'b1;
        2'd2: y[2] = 1'b1;
        2'd3: y[3] = 1'b1;
      endcase
  end
endmodule
module impl(input [1:0] s, input en, output [3:0] y);
  wire n0, n1;
  not (n0, s[0]);
  not (n1, s[1]);
  and (y[0], en, n1, n0);
  and (y[1], en, n1, s[0]);
  and (y[2], en, s[1], n0);
  and (y[3], en, s[1], s[0]);
endmodule
module bug(input [1:0] s, input en, output [3:0] y);
  wire n0, n1;
  not (n0, s[0]);
  not (n1, s[1]);
  and (y[0], en, n1, n0);
  and (y[1], en, n1, s[0]);
  and (y[2], en, s[1], n0);
  and (y[3], s[1], s[0]);
endmodule
