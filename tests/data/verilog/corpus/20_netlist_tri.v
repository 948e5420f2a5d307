// tri nets and a delayed continuous assignment.
module spec(input [1:0] s, input d, output [3:0] y);
  assign y = {4{d}} & (4'b0001 << s);
endmodule
module impl(input [1:0] s, input d, output [3:0] y);
  tri n0, n1;
  not #1 (n0, s[0]);
  not #1 (n1, s[1]);
  and #1 (y[0], d, n1, n0);
  and #1 (y[1], d, n1, s[0]);
  and #1 (y[2], d, s[1], n0);
  assign #2 y[3] = d & s[1] & s[0];
endmodule
module bug(input [1:0] s, input d, output [3:0] y);
  tri n0, n1;
  not #1 (n0, s[0]);
  not #1 (n1, s[1]);
  and #1 (y[0], d, n1, n0);
  and #1 (y[1], d, n1, s[0]);
  and #1 (y[2], d, s[1], s[0]);
  assign #2 y[3] = d & s[1] & s[0];
endmodule
