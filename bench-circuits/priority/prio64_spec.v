// equicone gen priority --n 64 --style spec --seed 1
// 64-request priority encoder: r[63:0] in; y[5:0] = highest i with r[i] (0 if none), v = some r[i]
// style spec: a chain of ?: from r[N-1] down; in bench written as the chain style
// mutation: none
module priority64_spec (r, y, v);
  input [63:0] r;
  output [5:0] y;
  output v;
  assign v = |r;
  assign y = r[63] ? 6'd63 : r[62] ? 6'd62 : r[61] ? 6'd61 : r[60] ? 6'd60 : r[59] ? 6'd59 : r[58] ? 6'd58 : r[57] ? 6'd57 : r[56] ? 6'd56 : r[55] ? 6'd55 : r[54] ? 6'd54 : r[53] ? 6'd53 : r[52] ? 6'd52 : r[51] ? 6'd51 : r[50] ? 6'd50 : r[49] ? 6'd49 : r[48] ? 6'd48 : r[47] ? 6'd47 : r[46] ? 6'd46 : r[45] ? 6'd45 : r[44] ? 6'd44 : r[43] ? 6'd43 : r[42] ? 6'd42 : r[41] ? 6'd41 : r[40] ? 6'd40 : r[39] ? 6'd39 : r[38] ? 6'd38 : r[37] ? 6'd37 : r[36] ? 6'd36 : r[35] ? 6'd35 : r[34] ? 6'd34 : r[33] ? 6'd33 : r[32] ? 6'd32 : r[31] ? 6'd31 : r[30] ? 6'd30 : r[29] ? 6'd29 : r[28] ? 6'd28 : r[27] ? 6'd27 : r[26] ? 6'd26 : r[25] ? 6'd25 : r[24] ? 6'd24 : r[23] ? 6'd23 : r[22] ? 6'd22 : r[21] ? 6'd21 : r[20] ? 6'd20 : r[19] ? 6'd19 : r[18] ? 6'd18 : r[17] ? 6'd17 : r[16] ? 6'd16 : r[15] ? 6'd15 : r[14] ? 6'd14 : r[13] ? 6'd13 : r[12] ? 6'd12 : r[11] ? 6'd11 : r[10] ? 6'd10 : r[9] ? 6'd9 : r[8] ? 6'd8 : r[7] ? 6'd7 : r[6] ? 6'd6 : r[5] ? 6'd5 : r[4] ? 6'd4 : r[3] ? 6'd3 : r[2] ? 6'd2 : r[1] ? 6'd1 : 6'd0;
endmodule
