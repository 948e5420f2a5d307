// Leading zeros of a 4-bit value with casez, against a formula.
module spec(input [3:0] d, output reg [2:0] n);
  always @*
    casez (d)
      4'b1???: n = 3'd0;
      4'b01??: n = 3'd1;
      4'b001?: n = 3'd2;
      4'b0001: n = 3'd3;
      4'b0000: n = 3'd4;
    endcase
endmodule
module impl(input [3:0] d, output [2:0] n);
  wire z2 = ~d[3] & ~d[2];
  wire [1:0] half = z2 ? d[1:0] : d[3:2];
  assign n[2] = z2 & ~d[1] & ~d[0];
  assign n[1] = z2 & ~n[2];
  assign n[0] = ~n[2] & ~half[1];
endmodule
module bug(input [3:0] d, output [2:0] n);
  wire z2 = ~d[3] & ~d[2];
  wire [1:0] half = z2 ? d[1:0] : d[3:2];
  assign n[2] = z2 & ~d[1] & ~d[0];
  assign n[1] = z2;
  assign n[0] = ~n[2] & ~half[1];
endmodule
