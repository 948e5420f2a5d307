// equicone gen priority --n 16 --style spec --seed 1
// 16-request priority encoder: r[15:0] in; y[3:0] = highest i with r[i] (0 if none), v = some r[i]
// style spec: a chain of ?: from r[N-1] down; in bench written as the chain style
// mutation: none
module priority16_spec (r, y, v);
  input [15:0] r;
  output [3:0] y;
  output v;
  assign v = |r;
  assign y = r[15] ? 4'd15 : r[14] ? 4'd14 : r[13] ? 4'd13 : r[12] ? 4'd12 : r[11] ? 4'd11 : r[10] ? 4'd10 : r[9] ? 4'd9 : r[8] ? 4'd8 : r[7] ? 4'd7 : r[6] ? 4'd6 : r[5] ? 4'd5 : r[4] ? 4'd4 : r[3] ? 4'd3 : r[2] ? 4'd2 : r[1] ? 4'd1 : 4'd0;
endmodule
