// `ifdef/`else/`endif: the branch for an undefined macro is read.
`ifdef WIDE_SELECT
`define SW 3
`else
`define SW 2
`endif
module spec(input [`SW-1:0] s, input [(1<<`SW)-1:0] d, output y);
  assign y = d[s];
endmodule
module impl(input [1:0] s, input [3:0] d, output y);
  wire lo = s[0] ? d[1] : d[0];
  wire hi = s[0] ? d[3] : d[2];
  assign y = s[1] ? hi : lo;
endmodule
module bug(input [1:0] s, input [3:0] d, output y);
  wire lo = s[0] ? d[1] : d[0];
  wire hi = s[0] ? d[2] : d[3];
  assign y = s[1] ? hi : lo;
endmodule
