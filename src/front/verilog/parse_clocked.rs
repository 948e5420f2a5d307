//! Parsing of clocked `always` blocks (`always @(posedge clk)`, `always_ff`): the event
//! list's shape and the non-blocking assignments `lhs <= rhs;` of their bodies. What the
//! block means (registers, resets, enables) is decided by `elaborate/clocked.rs`.

use super::ast::{Expr, Sensitivity, Stmt};
use super::lexer::Punct;
use super::parser::{ParseResult, Parser};
use super::pos::Pos;

impl Parser<'_, '_> {
    /// Whether an event control names a clock edge (`posedge`/`negedge`).
    pub(super) fn has_edge(s: &Sensitivity) -> bool {
        matches!(s, Sensitivity::List(events, _) if events.iter().any(|e| e.edge.is_some()))
    }

    /// The statement of an `always` block with event control `s`: a clocked block's body
    /// may hold non-blocking assignments. An event list that mixes edges with plain
    /// signals is refused (neither a register nor combinational logic).
    pub(super) fn always_body(&mut self, s: &Sensitivity) -> ParseResult<Stmt> {
        if let Sensitivity::List(events, at) = s {
            let edges = events.iter().filter(|e| e.edge.is_some()).count();
            if edges > 0 && edges < events.len() {
                let at = *at;
                let plain = events
                    .iter()
                    .find(|e| e.edge.is_none())
                    .map(|e| e.expr.pos());
                let _ = self.unsupported(
                    plain.unwrap_or(at),
                    "event list mixing clock edges with plain signals (write `posedge`/`negedge` before every event of a clocked block, e.g. `@(posedge clk or negedge rst_n)`)",
                );
                self.skip_statement();
                return Ok(Stmt::Null);
            }
        }
        let clocked = Self::has_edge(s);
        let was = std::mem::replace(&mut self.in_clocked, clocked);
        let body = self.stmt();
        self.in_clocked = was;
        body
    }

    /// At `<=` after the target `lhs` (at `p`): the rest of a non-blocking assignment. An
    /// intra-assignment delay (`q <= #1 d;`) is skipped like every delay.
    pub(super) fn non_blocking(&mut self, lhs: Expr, p: Pos) -> ParseResult<Stmt> {
        self.bump();
        if self.peek_p(Punct::Hash) {
            self.skip_delay()?;
        }
        if self.peek_p(Punct::At) {
            let at = self.peek_pos();
            return Err(self.unsupported(at, "intra-assignment event control `@`"));
        }
        let rhs = self.expr()?;
        self.expect_p(Punct::Semi, "`;` after the assignment")?;
        Ok(Stmt::NonBlocking(lhs, rhs, p))
    }
}
