// Tidewater 7 sensor channel selector, hand-optimized revision r2.
// Channels 0..7: a tree of 2:1 selectors on sel[2:0]. Channels 8..11: a decoder on sel[1:0]
// driving an AND-OR stage. sel[3] picks between the two halves. The spare test-mode pin was
// left wired into the low half, gated by sel[3], which is 0 whenever the low half is chosen.
module mux2 #(parameter W = 8) (input wire s, input wire [W-1:0] a, input wire [W-1:0] b,
                                 output wire [W-1:0] y);
    assign y = s ? b : a;
endmodule

module t7_sensor_sel (
    input  wire [3:0]  sel,
    input  wire [95:0] ch,
    input  wire        test_mode,
    output wire [7:0]  y
);
    // Low half: channels 0..7 through three levels of 2:1 selectors.
    wire [7:0] l0a, l0b, l0c, l0d, l1a, l1b, lo;
    mux2 m00 (.s(sel[0]), .a(ch[7:0]),   .b(ch[15:8]),  .y(l0a));
    mux2 m01 (.s(sel[0]), .a(ch[23:16]), .b(ch[31:24]), .y(l0b));
    mux2 m02 (.s(sel[0]), .a(ch[39:32]), .b(ch[47:40]), .y(l0c));
    mux2 m03 (.s(sel[0]), .a(ch[55:48]), .b(ch[63:56]), .y(l0d));
    mux2 m10 (.s(sel[1]), .a(l0a), .b(l0b), .y(l1a));
    mux2 m11 (.s(sel[1]), .a(l0c), .b(l0d), .y(l1b));
    mux2 m20 (.s(sel[2]), .a(l1a), .b(l1b), .y(lo));

    // High half: channels 8..11, decoder-driven AND-OR.
    wire [3:0] dec;
    assign dec[0] = ~sel[1] & ~sel[0];
    assign dec[1] = ~sel[1] &  sel[0];
    assign dec[2] =  sel[1] & ~sel[0];
    assign dec[3] =  sel[1] &  sel[0];
    wire [7:0] hi;
    assign hi = ({8{dec[0]}} & ch[71:64]) | ({8{dec[1]}} & ch[79:72])
                | ({8{dec[2]}} & ch[87:80]) | ({8{dec[3]}} & ch[95:88]);

    // Spare test-mode pin, masked: sel[3] is 0 whenever lo is selected.
    wire [7:0] lo_t;
    assign lo_t = lo | {8{test_mode & sel[3]}};

    assign y = sel[3] ? hi : lo_t;
endmodule
