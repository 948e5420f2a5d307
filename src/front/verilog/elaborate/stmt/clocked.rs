//! Clocked `always` blocks (`always @(posedge clk)`): the place where their lowering to
//! registers belongs. The parser refuses such blocks today (`Parser::event_control` and
//! the `always` item), so none reaches the elaborator; should one arrive, it is refused
//! here with the same precise message rather than read as combinational logic.

use super::super::Elaborator;
use crate::front::verilog::ast::{Always, Event};

impl Elaborator<'_> {
    /// Elaborate an `always` block whose event list names a clock edge (`edge`).
    pub(crate) fn elab_clocked(&mut self, _scope: u32, _block: &Always, edge: &Event) {
        self.error(
            edge.expr.pos(),
            "unsupported: `always` block with a clock edge (`posedge`/`negedge`) in its event list: equicone reads combinational logic",
            "compare the combinational logic between the registers: cut the design at its flip-flops, or read the next-state logic as its own module",
        );
    }
}
