// Tidewater 7 registered sensor selector, hand-optimized revision r4. Channels 0..7 through a
// tree of 2:1 selectors on sel[2:0], channels 8..11 through a decoder AND-OR on sel[1:0],
// sel[3] picks the half. The output register is now dout_r and the slot counter frame_r; bit 5
// of dout_r is stored inverted (it drives a pad that idles high), so it resets to 1.
module t7_sensor_reg (
    input  wire        clk,
    input  wire        rst,
    input  wire [3:0]  sel,
    input  wire [95:0] ch,
    output wire [7:0]  y,
    output wire [1:0]  slot
);
    wire [7:0] l0a = sel[0] ? ch[15:8]  : ch[7:0];
    wire [7:0] l0b = sel[0] ? ch[31:24] : ch[23:16];
    wire [7:0] l0c = sel[0] ? ch[47:40] : ch[39:32];
    wire [7:0] l0d = sel[0] ? ch[63:56] : ch[55:48];
    wire [7:0] l1a = sel[1] ? l0b : l0a;
    wire [7:0] l1b = sel[1] ? l0d : l0c;
    wire [7:0] lo  = sel[2] ? l1b : l1a;
    wire [3:0] dec = {sel[1] & sel[0], sel[1] & ~sel[0], ~sel[1] & sel[0], ~sel[1] & ~sel[0]};
    wire [7:0] hi = ({8{dec[0]}} & ch[71:64]) | ({8{dec[1]}} & ch[79:72])
                  | ({8{dec[2]}} & ch[87:80]) | ({8{dec[3]}} & ch[95:88]);
    wire [7:0] pick = sel[3] ? hi : lo;
    wire load = ~(sel[3] & sel[2]);
    reg [7:0] dout_r;
    reg [1:0] frame_r;
    always @(posedge clk) begin
        if (rst) begin
            dout_r <= 8'b0010_0000;
            frame_r <= 2'b00;
        end else begin
            if (load)
                dout_r <= pick ^ 8'b0010_0000;
            frame_r <= frame_r + 2'b01;
        end
    end
    assign y = dout_r ^ 8'b0010_0000;
    assign slot = frame_r;
endmodule
