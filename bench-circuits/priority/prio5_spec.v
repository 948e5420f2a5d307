// equicone gen priority --n 5 --style spec --seed 1
// 5-request priority encoder: r[4:0] in; y[2:0] = highest i with r[i] (0 if none), v = some r[i]
// style spec: a chain of ?: from r[N-1] down; in bench written as the chain style
// mutation: none
module priority5_spec (r, y, v);
  input [4:0] r;
  output [2:0] y;
  output v;
  assign v = |r;
  assign y = r[4] ? 3'd4 : r[3] ? 3'd3 : r[2] ? 3'd2 : r[1] ? 3'd1 : 3'd0;
endmodule
