// A full adder, behavioural against gates.
module spec(input a, b, ci, output s, co);
  assign {co, s} = a + b + ci;
endmodule
module impl(input a, b, ci, output s, co);
  wire p, g, t;
  xor (p, a, b);
  xor (s, p, ci);
  and (g, a, b);
  and (t, p, ci);
  or  (co, g, t);
endmodule
module bug(input a, b, ci, output s, co);
  wire p, g, t;
  xor (p, a, b);
  xor (s, p, ci);
  and (g, a, b);
  and (t, a, ci);
  or  (co, g, t);
endmodule
