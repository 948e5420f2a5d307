// `always @(*)` priority encoder against a casez table.
module spec(input [3:0] r, output reg [1:0] idx, output reg any);
  always @(*) begin
    any = 1'b1;
    if (r[3]) idx = 2'd3;
    else if (r[2]) idx = 2'd2;
    else if (r[1]) idx = 2'd1;
    else begin idx = 2'd0; any = r[0]; end
  end
endmodule
module impl(input [3:0] r, output reg [1:0] idx, output any);
  assign any = |r;
  always @*
    casez (r)
      4'b1???: idx = 2'd3;
      4'b01??: idx = 2'd2;
      4'b001?: idx = 2'd1;
      default: idx = 2'd0;
    endcase
endmodule
module bug(input [3:0] r, output reg [1:0] idx, output any);
  assign any = |r;
  always @*
    casez (r)
      4'b1???: idx = 2'd3;
      4'b01??: idx = 2'd2;
      4'b001?: idx = 2'd2;
      default: idx = 2'd0;
    endcase
endmodule
