// An if chain that covers every value of its selector without a final else.
module spec(input [1:0] s, input [3:0] d, output reg y);
  always @* begin
    if (s == 2'd0) y = d[0];
    else if (s == 2'd1) y = d[1];
    else if (s == 2'd2) y = d[2];
    else if (s == 2'd3) y = d[3];
  end
endmodule
module impl(input [1:0] s, input [3:0] d, output y);
  assign y = d[s];
endmodule
module bug(input [1:0] s, input [3:0] d, output y);
  assign y = d[~s];
endmodule
