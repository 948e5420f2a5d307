// Elaboration errors of the Tidewater 7 selector glue, each with what to do about it.
module glue(input [3:0] sel, input [7:0] d, output y, output [1:0] z);
  wire t;
  wire t;
  and g1 (y, d, sel[0]);
  assign z = q + 1;
  sub #(.WIDTH(4)) u1 (.a(sel[1]), .b(t));
  for (k = 0; k < 2; k = k + 1) begin : blk
    assign z[k] = d[k];
  end
endmodule

module sub(input a, output b);
  assign b = a;
endmodule
