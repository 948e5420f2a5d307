module m(input [1:0] s, input a, b, output reg y, output reg z);
  always @* begin
    z = 1'b0;
    case (s)
      2'd0: y = a;
      2'd1: y = b;
    endcase
  end
endmodule
