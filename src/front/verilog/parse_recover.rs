//! Error recovery: after an error, skip to a place to go on from (the next statement, item,
//! declaration or module), and skip constructs outside the subset whole, so that one mistake
//! gives one error and no follow-on errors.

use super::ast::Item;
use super::lexer::{Punct, TokenKind};
use super::parser::Parser;
use super::symbols::{kw, Sym};

impl Parser<'_, '_> {
    /// After an error inside a `typedef`: skip to the `;` that ends it, past any braces
    /// (so that the members of an enum or struct give no follow-on errors).
    pub(super) fn skip_declaration(&mut self) {
        let mut depth = 0usize;
        loop {
            match self.peek().kind {
                TokenKind::Eof => return,
                TokenKind::Punct(Punct::LBrace) => depth += 1,
                TokenKind::Punct(Punct::RBrace) => depth = depth.saturating_sub(1),
                TokenKind::Punct(Punct::Semi) if depth == 0 => {
                    self.bump();
                    return;
                }
                TokenKind::Ident(k) if k == super::symbols::kw::ENDMODULE => return,
                _ => {}
            }
            self.bump();
        }
    }

    /// Skip to just past the next name `end`.
    pub(super) fn skip_to_name(&mut self, end: &str) {
        loop {
            let t = self.bump();
            match t.kind {
                TokenKind::Eof => return,
                TokenKind::Ident(k) if self.name_is(k, end) => return,
                _ => {}
            }
        }
    }

    /// After an `unsupported:` error on keyword `k` (the next token): skip the whole
    /// construct, to its end keyword or past its statement, so that its insides give no
    /// follow-on errors.
    pub(super) fn skip_construct(&mut self, k: Sym) {
        let name = self.names.name(k).to_string();
        let end = match name.as_str() {
            "function" => "endfunction",
            "task" => "endtask",
            "class" => "endclass",
            "interface" => "endinterface",
            "program" => "endprogram",
            "covergroup" => "endgroup",
            "property" => "endproperty",
            "sequence" => "endsequence",
            "checker" => "endchecker",
            "clocking" => "endclocking",
            "specify" => "endspecify",
            "primitive" => "endprimitive",
            "config" => "endconfig",
            "package" => "endpackage",
            "table" => "endtable",
            "initial" | "final" | "always_latch" | "always" | "always_comb" | "always_ff" => {
                self.bump();
                self.skip_statement();
                return;
            }
            _ => {
                self.bump();
                self.recover();
                return;
            }
        };
        self.skip_to_name(end);
        if self.eat_p(Punct::Colon) {
            let _ = self.ident("a name");
        }
    }

    /// Skip one statement (after an error on its head): a `begin ... end` block with its
    /// nested blocks, or up to the next `;`.
    pub(super) fn skip_statement(&mut self) {
        // An event control first.
        if self.eat_p(Punct::At) && !self.eat_p(Punct::Star) && self.peek_p(Punct::LParen) {
            let mut depth = 0usize;
            loop {
                match self.bump().kind {
                    TokenKind::Punct(Punct::LParen) => depth += 1,
                    TokenKind::Punct(Punct::RParen) => {
                        depth = depth.saturating_sub(1);
                        if depth == 0 {
                            break;
                        }
                    }
                    TokenKind::Eof => return,
                    _ => {}
                }
            }
        }
        let mut depth = 0usize;
        loop {
            match &self.peek().kind {
                TokenKind::Eof => return,
                TokenKind::Ident(k) if *k == kw::ENDMODULE => return,
                TokenKind::Ident(k) if *k == kw::BEGIN || *k == kw::CASE || *k == kw::CASEZ => {
                    depth += 1;
                }
                TokenKind::Ident(k) if *k == kw::END || *k == kw::ENDCASE => {
                    self.bump();
                    depth = depth.saturating_sub(1);
                    if depth == 0 && !self.peek_kw(kw::ELSE) {
                        return;
                    }
                    continue;
                }
                TokenKind::Punct(Punct::Semi) if depth == 0 => {
                    self.bump();
                    if !self.peek_kw(kw::ELSE) {
                        return;
                    }
                    continue;
                }
                _ => {}
            }
            self.bump();
        }
    }

    /// Skip to just after the next `;`, or to an item keyword or `endmodule`.
    pub fn recover(&mut self) {
        loop {
            match &self.peek().kind {
                TokenKind::Eof => return,
                TokenKind::Punct(Punct::Semi) => {
                    self.bump();
                    return;
                }
                TokenKind::Ident(k)
                    if [
                        kw::ENDMODULE,
                        kw::MODULE,
                        kw::ASSIGN,
                        kw::ALWAYS,
                        kw::ENDGENERATE,
                        kw::WIRE,
                        kw::REG,
                        kw::INPUT,
                        kw::OUTPUT,
                    ]
                    .contains(k) =>
                {
                    return
                }
                _ => {
                    self.bump();
                }
            }
        }
    }

    /// Parse one module or generate item into `out`; after an error, skip to a place to go on
    /// from, always past at least one token, so that a stray keyword (`endgenerate` outside a
    /// generate region, say) cannot stall the item loop.
    pub fn item_or_skip(&mut self, out: &mut Vec<Item>) {
        let before = self.taken;
        if self.item(out).is_err() {
            self.recover();
            if self.taken == before {
                self.bump();
            }
        }
    }

    pub(super) fn skip_past(&mut self, k: Sym) {
        loop {
            match self.bump().kind {
                TokenKind::Eof => return,
                TokenKind::Ident(s) if s == k => return,
                _ => {}
            }
        }
    }
}
