// A width from a macro: a 4-bit adder against a ripple of full adders.
`define W 4
`define MSB (`W-1)
module spec(input [`MSB:0] a, b, output [`W:0] s);
  assign s = a + b;
endmodule
module impl(input [3:0] a, b, output [4:0] s);
  wire [4:0] c;
  assign c[0] = 1'b0;
  genvar i;
  generate for (i = 0; i < 4; i = i + 1) begin : fa
    assign s[i] = a[i] ^ b[i] ^ c[i];
    assign c[i+1] = (a[i] & b[i]) | (c[i] & (a[i] ^ b[i]));
  end endgenerate
  assign s[4] = c[4];
endmodule
module bug(input [3:0] a, b, output [4:0] s);
  assign s = {1'b0, a} + {1'b0, b} + {4'b0, a[0] & b[3]};
endmodule
