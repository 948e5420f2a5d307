// A fixed-priority grant with a legacy list, against gates.
module spec(input [2:0] req, output reg [2:0] gnt);
  always @(req)
    casez (req)
      3'b??1: gnt = 3'b001;
      3'b?10: gnt = 3'b010;
      3'b100: gnt = 3'b100;
      3'b000: gnt = 3'b000;
    endcase
endmodule
module impl(input [2:0] req, output [2:0] gnt);
  wire n0, n1;
  not (n0, req[0]);
  not (n1, req[1]);
  buf (gnt[0], req[0]);
  and (gnt[1], req[1], n0);
  and (gnt[2], req[2], n1, n0);
endmodule
module bug(input [2:0] req, output [2:0] gnt);
  wire n0, n1;
  not (n0, req[0]);
  not (n1, req[1]);
  buf (gnt[0], req[0]);
  and (gnt[1], req[1], n0);
  and (gnt[2], req[2], n1);
endmodule
