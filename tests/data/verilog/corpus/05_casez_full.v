// casez with 2'b0? and 2'b1? covers every value: no default needed.
module spec(input [1:0] s, input a, b, output reg y);
  always @*
    casez (s)
      2'b0?: y = a;
      2'b1?: y = b;
    endcase
endmodule
module impl(input [1:0] s, input a, b, output y);
  assign y = (a & ~s[1]) | (b & s[1]);
endmodule
module bug(input [1:0] s, input a, b, output y);
  assign y = (a & ~s[0]) | (b & s[0]);
endmodule
