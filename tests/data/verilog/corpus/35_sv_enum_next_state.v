// SystemVerilog typedef enum: the next-state logic of a 4-state handshake controller,
// states encoded with explicit and implicit values; the counterpart is gate-level.
typedef enum logic [1:0] {IDLE, WAIT = 2'd2, SEND, DONE = 2'd1} state_t;
module spec(input state_t s, input logic req, input logic ack, output state_t nxt,
            output logic busy);
  state_t n;
  always_comb begin
    unique case (s)
      IDLE: if (req) n = WAIT; else n = IDLE;
      WAIT: n = SEND;
      SEND: if (ack) n = DONE; else n = SEND;
      DONE: n = IDLE;
    endcase
  end
  assign nxt = n;
  assign busy = (s == WAIT) || (s == SEND);
endmodule
module impl(input [1:0] s, input req, input ack, output [1:0] nxt, output busy);
  // IDLE=00, DONE=01, WAIT=10, SEND=11
  wire c0 = s[0], c1 = s[1];
  // nxt[1]: IDLE&req -> 1, WAIT -> 1, SEND&~ack -> 1, else 0
  assign nxt[1] = (~c1 & ~c0 & req) | (c1 & ~c0) | (c1 & c0 & ~ack);
  // nxt[0]: WAIT -> 1 (SEND=11), SEND -> 1 always (SEND or DONE), else 0
  assign nxt[0] = c1;
  assign busy = c1;
endmodule
module bug(input [1:0] s, input req, input ack, output [1:0] nxt, output busy);
  wire c0 = s[0], c1 = s[1];
  assign nxt[1] = (~c1 & ~c0 & req) | (c1 & ~c0) | (c1 & c0 & ack);
  assign nxt[0] = c1;
  assign busy = c1;
endmodule
