// A 4:1 selector over a 2-bit select, for assumption fixtures.
module sel4(input [3:0] d, input [1:0] s, output y);
  assign y = d[s];
endmodule
