// Tidewater 7 ocean-weather buoy, telemetry chip: sensor channel selector, reference.
// Twelve 8-bit sensor channels packed into ch (channel i is ch[8*i +: 8]); the telemetry
// sequencer drives sel with 0..11 only. test_mode is a spare pin that the selector ignores.
module t7_sensor_sel (
    input  wire [3:0]  sel,
    input  wire [95:0] ch,
    input  wire        test_mode,
    output wire [7:0]  y
);
    assign y = ch[8*sel +: 8];
endmodule
