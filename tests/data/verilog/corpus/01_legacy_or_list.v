// Legacy sensitivity list with `or`: a 4:1 selector, against 2:1 selectors as gates.
module spec(input [1:0] sel, input a, b, c, d, output reg y);
  always @(sel or a or b or c or d)
    case (sel)
      2'b00: y = a;
      2'b01: y = b;
      2'b10: y = c;
      2'b11: y = d;
    endcase
endmodule
module impl(input [1:0] sel, input a, b, c, d, output y);
  wire ns0, ns1, t0, t1, t2, t3, lo, hi;
  not (ns0, sel[0]);
  and (t0, a, ns0);
  and (t1, b, sel[0]);
  or  (lo, t0, t1);
  and (t2, c, ns0);
  and (t3, d, sel[0]);
  or  (hi, t2, t3);
  assign y = sel[1] ? hi : lo;
endmodule
module bug(input [1:0] sel, input a, b, c, d, output y);
  assign y = sel[1] ? (sel[0] ? c : d) : (sel[0] ? b : a);
endmodule
