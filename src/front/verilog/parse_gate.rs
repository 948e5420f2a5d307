//! Parsing of gate primitive instances (`and g1 (y, a, b), g2 (z, c, d);`). Instance names
//! are skipped without interning: nothing looks them up, and a million-gate netlist would
//! otherwise hold a million more names.

use super::ast::*;
use super::lexer::{Punct, TokenKind};
use super::parser::{ParseResult, Parser};
use super::symbols::{kw, Sym};

impl Parser<'_, '_> {
    pub(super) fn gate_kind(k: Sym) -> Option<GateKind> {
        Some(match k {
            k if k == kw::AND => GateKind::And,
            k if k == kw::NAND => GateKind::Nand,
            k if k == kw::OR => GateKind::Or,
            k if k == kw::NOR => GateKind::Nor,
            k if k == kw::XOR => GateKind::Xor,
            k if k == kw::XNOR => GateKind::Xnor,
            k if k == kw::NOT => GateKind::Not,
            k if k == kw::BUF => GateKind::Buf,
            _ => return None,
        })
    }

    /// At a gate keyword of kind `g`: the keyword, one or more instances and the `;`.
    pub(super) fn gates(&mut self, g: GateKind, out: &mut Vec<Item>) -> ParseResult<()> {
        self.bump();
        let mut named = self.skip_name();
        if named.is_none() && self.peek_p(Punct::LParen) && self.strength_follows() {
            return Err(self.unsupported_here("drive strength on a gate"));
        }
        if named.is_none() && self.peek_p(Punct::Hash) {
            self.skip_delay()?;
            named = self.skip_name();
        }
        loop {
            let gpos = match named.take() {
                Some(p) => p,
                None => {
                    let p = self.peek_pos();
                    if !self.peek_p(Punct::LParen) {
                        self.ident("a gate instance name or `(`")?;
                    }
                    p
                }
            };
            if self.peek_p(Punct::LBrack) {
                return Err(self.unsupported_here("arrays of gate instances"));
            }
            self.expect_p(Punct::LParen, "`(` of the gate terminals")?;
            let mut terms = Vec::with_capacity(4);
            terms.push(self.expr()?);
            while self.eat_p(Punct::Comma) {
                terms.push(self.expr()?);
            }
            self.expect_p(Punct::RParen, "`)` closing the gate terminals")?;
            out.push(Item::Gate(g, terms.into_boxed_slice(), gpos));
            if !self.eat_p(Punct::Comma) {
                break;
            }
            named = self.skip_name();
        }
        self.expect_p(Punct::Semi, "`;` after the gate")?;
        Ok(())
    }

    /// After a gate keyword and `(`: a drive strength looks like `(strong0, ...)`.
    fn strength_follows(&mut self) -> bool {
        match self.peek2().kind {
            TokenKind::Ident(s) => {
                let n = self.names.name(s);
                n.starts_with("strong")
                    || n.starts_with("weak")
                    || n.starts_with("pull")
                    || n.starts_with("supply")
                    || n.starts_with("highz")
            }
            _ => false,
        }
    }
}
