// SystemVerilog packed struct: decode a 10-bit packet header (member reads, a member
// written inside a copied struct, $bits); the counterpart slices the bits by hand.
typedef struct packed {
  logic [1:0] kind;
  logic       urgent;
  logic [2:0] dest;
  logic [3:0] len;
} hdr_t;
module spec(input hdr_t h, output hdr_t fwd, output logic [3:0] words, output logic drop);
  always_comb begin
    fwd = h;
    fwd.urgent = h.urgent | (h.kind == 2'd3);
    fwd.dest = h.dest + 3'd1;
    words = h.len + (h.kind[0] ? 4'd2 : 4'd1);
    drop = (h.len == 4'd0) && ($bits(hdr_t) == 10);
  end
endmodule
module impl(input [9:0] h, output [9:0] fwd, output [3:0] words, output drop);
  assign fwd[9:8] = h[9:8];
  assign fwd[7] = h[7] | (h[9] & h[8]);
  assign fwd[6:4] = h[6:4] + 3'd1;
  assign fwd[3:0] = h[3:0];
  assign words = h[3:0] + {2'b00, h[8], ~h[8]};
  assign drop = ~|h[3:0];
endmodule
module bug(input [9:0] h, output [9:0] fwd, output [3:0] words, output drop);
  assign fwd[9:8] = h[9:8];
  assign fwd[7] = h[7] | (h[9] & h[8]);
  assign fwd[6:4] = h[6:4] + 3'd1;
  assign fwd[3:0] = h[3:0];
  assign words = h[3:0] + {2'b00, h[9], ~h[8]};
  assign drop = ~|h[3:0];
endmodule
