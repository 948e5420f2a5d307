// A gate-level netlist as tools write it: supply nets and delays.
module spec(input a, b, c, output y, z);
  assign y = (a & b) | c;
  assign z = ~(a ^ c);
endmodule
module impl(input a, b, c, output y, z);
  supply1 vdd;
  supply0 gnd;
  wire t, u;
  and #1 g1 (t, a, b, vdd);
  or  #2 g2 (y, t, c, gnd);
  xnor #1 g3 (u, a, c);
  buf #(1) g4 (z, u);
endmodule
module bug(input a, b, c, output y, z);
  supply1 vdd;
  supply0 gnd;
  wire t, u;
  and #1 g1 (t, a, b, gnd);
  or  #2 g2 (y, t, c, gnd);
  xnor #1 g3 (u, a, c);
  buf #(1) g4 (z, u);
endmodule
