// `===` and `!==` on operands free of x (read as `==` and `!=`), against gates.
module spec(input [2:0] a, b, output eq, ne3);
  assign eq = a === b;
  assign ne3 = (a + b) !== 3'd3;
endmodule
module impl(input [2:0] a, b, output eq, ne3);
  wire [2:0] d, s;
  xnor (d[0], a[0], b[0]);
  xnor (d[1], a[1], b[1]);
  xnor (d[2], a[2], b[2]);
  and (eq, d[0], d[1], d[2]);
  assign s = a + b;
  assign ne3 = ~(~s[2] & s[1] & s[0]);
endmodule
module bug(input [2:0] a, b, output eq, ne3);
  wire [2:0] d, s;
  xnor (d[0], a[0], b[0]);
  xnor (d[1], a[1], b[1]);
  xnor (d[2], a[2], b[2]);
  and (eq, d[0], d[1]);
  assign s = a + b;
  assign ne3 = ~(~s[2] & s[1] & s[0]);
endmodule
