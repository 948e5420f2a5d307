// A spec that reads x for the unused select value: a don't-care for the candidate.
module spec(input [1:0] s, input a, b, c, output reg y);
  always @*
    case (s)
      2'd0: y = a;
      2'd1: y = b;
      2'd2: y = c;
      default: y = 1'bx;
    endcase
endmodule
module impl(input [1:0] s, input a, b, c, output y);
  assign y = s[1] ? c : (s[0] ? b : a);
endmodule
module bug(input [1:0] s, input a, b, c, output y);
  assign y = s[1] ? (s[0] ? c : b) : (s[0] ? b : a);
endmodule
