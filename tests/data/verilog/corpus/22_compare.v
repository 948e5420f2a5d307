// Unsigned less-than against a borrow chain.
module spec(input [3:0] a, b, output lt);
  assign lt = a < b;
endmodule
module impl(input [3:0] a, b, output lt);
  wire [4:0] br;
  assign br[0] = 1'b0;
  genvar i;
  generate for (i = 0; i < 4; i = i + 1) begin : st
    assign br[i+1] = (~a[i] & b[i]) | (~(a[i] ^ b[i]) & br[i]);
  end endgenerate
  assign lt = br[4];
endmodule
module bug(input [3:0] a, b, output lt);
  wire [4:0] br;
  assign br[0] = 1'b1;
  genvar i;
  generate for (i = 0; i < 4; i = i + 1) begin : st
    assign br[i+1] = (~a[i] & b[i]) | (~(a[i] ^ b[i]) & br[i]);
  end endgenerate
  assign lt = br[4];
endmodule
