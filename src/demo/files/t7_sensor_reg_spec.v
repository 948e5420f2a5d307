// Tidewater 7 ocean-weather buoy, telemetry chip: the sensor channel selector as registered on
// the chip, reference. At each clock edge the output register y takes channel sel (channel i is
// ch[8*i +: 8]) when sel is 0..11 and keeps its value otherwise; slot counts the frame slots.
// rst is the chip's synchronous reset.
module t7_sensor_reg (
    input  wire        clk,
    input  wire        rst,
    input  wire [3:0]  sel,
    input  wire [95:0] ch,
    output reg  [7:0]  y,
    output reg  [1:0]  slot
);
    wire [95:0] shifted = ch >> (8 * sel);
    always @(posedge clk) begin
        if (rst) begin
            y <= 8'h00;
            slot <= 2'd0;
        end else begin
            if (sel < 4'd12)
                y <= shifted[7:0];
            slot <= slot + 2'd1;
        end
    end
endmodule
