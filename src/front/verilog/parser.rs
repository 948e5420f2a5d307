//! The recursive-descent parser: modules, declarations, instances, gates and generate
//! blocks. Errors are collected; after one, the parser skips to the next `;` or item keyword.

use super::ast::*;
use super::lexer::{Lexer, Punct, Token, TokenKind};
use super::pos::Pos;
use super::symbols::{is_keyword, kw, Interner, Sym};
use super::syntax_error::{SyntaxError, SyntaxKind};
use crate::diag::Stage;
use std::collections::VecDeque;

/// Parse failure marker: the message is already in [`Parser::errors`].
#[derive(Debug)]
pub struct Stop;

/// Result of a parse step.
pub type ParseResult<T> = Result<T, Stop>;

/// Deepest nesting of parentheses, operators and statements accepted.
pub const MAX_DEPTH: usize = 1000;

/// The parser over one file.
pub struct Parser<'s, 'n> {
    lexer: Lexer<'s>,
    /// Interned names.
    pub names: &'n mut Interner,
    look: VecDeque<Token>,
    /// Errors found: position and message.
    pub errors: Vec<SyntaxError>,
    /// Warnings (a delay ignored: one per file).
    pub warnings: Vec<SyntaxError>,
    depth: usize,
    /// Tokens taken so far (error recovery checks that it moved on).
    pub(super) taken: u64,
    /// Inside the body of a clocked `always` block (non-blocking assignments allowed).
    pub(super) in_clocked: bool,
    /// Inside the body of a function (`return` allowed).
    pub(super) in_function: bool,
    /// Loop variables declared in `for` headers (`for (int i = 0; ...)`) of the item being
    /// read; declared in the module after it (see `item`).
    pub(super) loop_decls: Vec<(Sym, Pos)>,
    /// Types and packages in force (kept across the files of a design).
    pub sv: super::sv_types::SvScope,
}

impl<'s, 'n> Parser<'s, 'n> {
    /// A parser over preprocessed text whose positions follow `marks` (see
    /// [`Lexer::with_marks`]).
    pub fn with_marks(
        src: &'s str,
        file: u32,
        marks: &'s [super::lexer::Mark],
        names: &'n mut Interner,
    ) -> Self {
        Parser {
            lexer: Lexer::with_marks(src, file, marks),
            names,
            look: VecDeque::new(),
            errors: Vec::new(),
            warnings: Vec::new(),
            depth: 0,
            taken: 0,
            in_clocked: false,
            in_function: false,
            loop_decls: Vec::new(),
            sv: Default::default(),
        }
    }

    fn fill(&mut self, k: usize) {
        while self.look.len() <= k {
            let t = self.lexer.next_token(self.names);
            self.look.push_back(t);
        }
    }

    /// The next token.
    pub fn peek(&mut self) -> &Token {
        self.fill(0);
        &self.look[0]
    }

    /// The token after the next.
    pub fn peek2(&mut self) -> &Token {
        self.fill(1);
        &self.look[1]
    }

    /// Position of the next token.
    pub fn peek_pos(&mut self) -> Pos {
        self.peek().pos
    }

    /// Consume the next token.
    pub fn bump(&mut self) -> Token {
        self.fill(0);
        self.taken += 1;
        self.look.pop_front().expect("filled")
    }

    /// Whether the next token is `p`.
    pub fn peek_p(&mut self, p: Punct) -> bool {
        self.peek().kind == TokenKind::Punct(p)
    }

    /// Whether the next token is keyword `k`.
    pub fn peek_kw(&mut self, k: Sym) -> bool {
        self.peek().kind == TokenKind::Ident(k)
    }

    /// Consume `p` if next.
    pub fn eat_p(&mut self, p: Punct) -> bool {
        if self.peek_p(p) {
            self.bump();
            true
        } else {
            false
        }
    }

    /// Consume the next token; true.
    pub(super) fn eat_p_any(&mut self) -> bool {
        self.bump();
        true
    }

    /// Consume keyword `k` if next.
    pub fn eat_kw(&mut self, k: Sym) -> bool {
        if self.peek_kw(k) {
            self.bump();
            true
        } else {
            false
        }
    }

    /// Record a syntax error.
    pub fn error(&mut self, pos: Pos, msg: impl Into<String>) -> Stop {
        self.error_of(pos, SyntaxKind::Syntax, msg)
    }

    /// Record `expected {expected}, found {found}` (a grammar error whose last part names
    /// what the text has there).
    pub fn unexpected(&mut self, pos: Pos, expected: &str, found: &str) -> Stop {
        let mut e = SyntaxError::new(
            Stage::Parse,
            pos,
            SyntaxKind::Syntax,
            format!("expected {expected}, found {found}"),
        );
        e.found_at = Some(("expected ".len() + expected.len()) as u32);
        self.errors.push(e);
        Stop
    }

    /// Record an error of a given kind.
    pub fn error_of(&mut self, pos: Pos, kind: SyntaxKind, msg: impl Into<String>) -> Stop {
        self.errors
            .push(SyntaxError::new(Stage::Parse, pos, kind, msg));
        Stop
    }

    /// Record `unsupported: {what}`.
    pub fn unsupported(&mut self, pos: Pos, what: impl AsRef<str>) -> Stop {
        let msg = format!("unsupported: {}", what.as_ref());
        self.error_of(pos, SyntaxKind::Unsupported, msg)
    }

    /// Record `unsupported: {what}` at the next token.
    pub fn unsupported_here(&mut self, what: &str) -> Stop {
        let p = self.peek_pos();
        self.unsupported(p, what)
    }

    /// How a token reads in a message.
    pub fn describe(&self, t: &TokenKind) -> String {
        match t {
            TokenKind::Ident(s) => format!("`{}`", self.names.name(*s)),
            TokenKind::SystemName(s) => format!("`{}`", self.names.name(*s)),
            TokenKind::Number(n) => format!("number `{}`", n.text),
            TokenKind::Punct(p) => format!("`{}`", punct_text(*p)),
            TokenKind::StringLiteral => "a string".into(),
            TokenKind::Real => "a real number".into(),
            TokenKind::Eof => "end of file".into(),
        }
    }

    /// Consume `p` or report what was expected.
    pub fn expect_p(&mut self, p: Punct, what: &str) -> ParseResult<()> {
        if self.eat_p(p) {
            return Ok(());
        }
        let t = self.peek().clone();
        let d = self.describe(&t.kind);
        Err(self.unexpected(t.pos, what, &d))
    }

    /// Consume keyword `k` or report.
    pub fn expect_kw(&mut self, k: Sym) -> ParseResult<()> {
        if self.eat_kw(k) {
            return Ok(());
        }
        let t = self.peek().clone();
        let d = self.describe(&t.kind);
        let want = self.names.name(k).to_string();
        Err(self.unexpected(t.pos, &format!("`{want}`"), &d))
    }

    /// An identifier (not a keyword).
    pub fn ident(&mut self, what: &str) -> ParseResult<(Sym, Pos)> {
        let t = self.peek().clone();
        if let TokenKind::Ident(s) = t.kind {
            if !is_keyword(s) {
                self.bump();
                return Ok((s, t.pos));
            }
        }
        let d = self.describe(&t.kind);
        Err(self.unexpected(t.pos, what, &d))
    }

    /// Skip a plain name without interning it (see [`Lexer::skip_name`]); only when no
    /// token is waiting in the lookahead.
    pub(super) fn skip_name(&mut self) -> Option<Pos> {
        if !self.look.is_empty() {
            return None;
        }
        let p = self.lexer.skip_name(self.names)?;
        self.taken += 1;
        Some(p)
    }

    /// Enter one level of nesting.
    pub fn enter(&mut self, pos: Pos) -> ParseResult<()> {
        self.depth += 1;
        if self.depth > MAX_DEPTH {
            self.depth -= 1;
            return Err(self.error_of(
                pos,
                SyntaxKind::TooDeep,
                format!(
                    "nesting deeper than {MAX_DEPTH} levels; split the expression or statement"
                ),
            ));
        }
        Ok(())
    }

    /// Leave one level of nesting.
    pub fn leave(&mut self) {
        self.depth -= 1;
    }

    /// Parse a whole file into modules; errors are in `self.errors` and the lexer's list.
    pub fn file(&mut self) -> Vec<Module> {
        let mut mods = Vec::new();
        loop {
            let t = self.peek().clone();
            match t.kind {
                TokenKind::Eof => break,
                TokenKind::Ident(k) if k == kw::MODULE || k == kw::MACROMODULE => {
                    self.bump();
                    if let Some(m) = self.module(t.pos) {
                        mods.push(m);
                    }
                }
                TokenKind::Ident(k) if k == kw::PRIMITIVE => {
                    self.bump();
                    if let Some(m) = self.primitive(t.pos) {
                        mods.push(m);
                    }
                }
                TokenKind::Ident(k) if self.names.name(k) == "package" => self.package(),
                TokenKind::Ident(k)
                    if matches!(self.names.name(k), "typedef" | "import")
                        || k == kw::LOCALPARAM
                        || k == kw::PARAMETER =>
                {
                    self.unit_item(k)
                }
                TokenKind::Ident(k)
                    if matches!(
                        self.names.name(k),
                        "interface"
                            | "class"
                            | "program"
                            | "checker"
                            | "config"
                            | "function"
                            | "task"
                    ) =>
                {
                    let n = self.names.name(k).to_string();
                    self.unsupported(
                        t.pos,
                        format!(
                            "`{n}` (only modules, packages, `typedef`s and parameters are read)"
                        ),
                    );
                    self.skip_construct(k);
                }
                _ => {
                    let d = self.describe(&t.kind);
                    self.unexpected(t.pos, "`module`", &d);
                    self.bump();
                    while !matches!(self.peek().kind, TokenKind::Eof)
                        && !self.peek_kw(kw::MODULE)
                        && !self.peek_kw(kw::ENDMODULE)
                    {
                        self.bump();
                    }
                    self.eat_kw(kw::ENDMODULE);
                }
            }
        }
        self.errors.append(&mut self.lexer.errors);
        mods
    }

    fn module(&mut self, pos: Pos) -> Option<Module> {
        let name = match self.ident("a module name") {
            Ok((n, _)) => n,
            Err(_) => {
                self.skip_past(kw::ENDMODULE);
                return None;
            }
        };
        let mut m = Module {
            name,
            ports: Vec::new(),
            items: Vec::new(),
            pos,
            nettype_none: false,
        };
        self.types_enter_module();
        if self.header(&mut m).is_err() {
            // Skip the rest of the header.
            while !self.peek_p(Punct::Semi)
                && !matches!(self.peek().kind, TokenKind::Eof)
                && !self.peek_kw(kw::ENDMODULE)
            {
                self.bump();
            }
            self.eat_p(Punct::Semi);
        }
        m.nettype_none = self.lexer.nettype_none;
        loop {
            let t = self.peek().clone();
            match t.kind {
                TokenKind::Eof => {
                    self.error_of(t.pos, SyntaxKind::MissingEndmodule, "missing `endmodule`");
                    break;
                }
                TokenKind::Ident(k) if k == kw::ENDMODULE => {
                    self.bump();
                    break;
                }
                TokenKind::Ident(k) if k == kw::MODULE || k == kw::MACROMODULE => {
                    // The next module starts: this one lacks its `endmodule`.
                    self.error_of(
                        t.pos,
                        SyntaxKind::MissingEndmodule,
                        "missing `endmodule` before this `module`",
                    );
                    break;
                }
                _ => self.item_or_skip(&mut m.items),
            }
        }
        self.types_leave_module(&mut m.items);
        m.items.shrink_to_fit();
        Some(m)
    }

    pub(super) fn header(&mut self, m: &mut Module) -> ParseResult<()> {
        // `module m import p::*; #(...) (...)` (IEEE 1800-2017 clause 26.4, from memory).
        while self.peek_import() {
            self.import(false)?;
        }
        if self.eat_p(Punct::Hash) {
            self.expect_p(Punct::LParen, "`(` of the parameter port list")?;
            // `#(parameter W = 8, localparam L = $clog2(W))`: a parameter without its own
            // keyword is of the kind last written (IEEE 1800-2017 clause 23.2.3, from memory).
            let mut local = false;
            loop {
                if self.eat_kw(kw::LOCALPARAM) {
                    local = true;
                } else if self.eat_kw(kw::PARAMETER) {
                    local = false;
                }
                let mut pd = self.param_head(local)?;
                let (n, p) = self.ident("a parameter name")?;
                self.expect_p(Punct::Assign, "`=`")?;
                pd.assigns.push((n, p, self.expr()?));
                m.items.push(Item::Param(Box::new(pd)));
                if !self.eat_p(Punct::Comma) {
                    break;
                }
            }
            self.expect_p(Punct::RParen, "`)` closing the parameter port list")?;
        }
        if self.eat_p(Punct::LParen) {
            if !self.peek_p(Punct::RParen) {
                let t = self.peek().clone();
                if matches!(t.kind, TokenKind::Ident(k) if k == kw::INPUT || k == kw::OUTPUT || k == kw::INOUT)
                {
                    self.ansi_ports(m)?;
                } else {
                    loop {
                        let (n, p) = self.ident("a port name")?;
                        if self.peek_p(Punct::LBrack) {
                            return Err(self.unsupported(p, "port expression in the port list"));
                        }
                        m.ports.push((n, p));
                        if !self.eat_p(Punct::Comma) {
                            break;
                        }
                    }
                }
            }
            self.expect_p(Punct::RParen, "`)` closing the port list")?;
        }
        self.expect_p(Punct::Semi, "`;` after the module header")
    }

    fn ansi_ports(&mut self, m: &mut Module) -> ParseResult<()> {
        let mut cur: Option<Decl> = None;
        let mut initial = Vec::new();
        loop {
            let t = self.peek().clone();
            let starts_decl = matches!(t.kind, TokenKind::Ident(k) if k == kw::INPUT || k == kw::OUTPUT || k == kw::INOUT);
            if starts_decl {
                if let Some(d) = cur.take() {
                    m.items.push(Item::Decl(Box::new(d)));
                }
                cur = Some(self.decl_head()?);
                for pd in self.take_pending() {
                    m.items.push(Item::Param(Box::new(pd)));
                }
            }
            let (n, p) = self.ident("a port name")?;
            let d = match cur.as_mut() {
                Some(d) => d,
                None => {
                    return Err(self.error(p, "expected a port direction (`input` or `output`)"))
                }
            };
            if self.peek_p(Punct::LBrack) {
                let name = self.names.name(n).to_string();
                return Err(self.unsupported_here(&format!("unpacked array port `{name}` (declare the port as one flat vector, e.g. `[N*W-1:0]`, and select its words with `[k*W +: W]`)")));
            }
            self.note_packed_name(n);
            d.names.push((n, p, None));
            if let Some(t) = self.sv.decl_struct.clone() {
                self.sv.decl_struct = Some(t);
                self.note_struct_names(&[(n, p, None)]);
            }
            m.ports.push((n, p));
            if self.eat_p(Punct::Assign) {
                // `output reg q = 0`: an output variable's initial value (IEEE 1364-2005
                // clause 12.3.4, from memory), read as `initial q = 0;`.
                let v = self.expr()?;
                if d.dir != Some(Dir::Output) || d.ty == Some(NetType::Wire) {
                    return Err(self.unsupported(
                        p,
                        "initial value of an input or net port (only an output variable, `output reg q = 0`, has one)",
                    ));
                }
                let at = v.pos();
                initial.push(Item::Initial(
                    Box::new(Stmt::Assign(Expr::Ident(n, p), v, at)),
                    p,
                ));
            }
            if !self.eat_p(Punct::Comma) {
                break;
            }
        }
        if let Some(d) = cur {
            m.items.push(Item::Decl(Box::new(d)));
        }
        m.items.extend(initial);
        Ok(())
    }

    /// The event control after `always`: `@*`, `@(*)`, `@(a or b)`, `@(a, b)`,
    /// `@(posedge clk)` (IEEE 1364-2005 clause 9.7).
    fn event_control(&mut self) -> ParseResult<Sensitivity> {
        let at = self.peek_pos();
        if !self.eat_p(Punct::At) {
            return Err(self.unsupported(at, "`always` without an event control `@(...)` (only `always @*` or `always @(...)` blocks are read)"));
        }
        if self.eat_p(Punct::Star) {
            return Ok(Sensitivity::Implicit);
        }
        self.expect_p(Punct::LParen, "`(` or `*` after `@`")?;
        if self.eat_p(Punct::Star) {
            self.expect_p(Punct::RParen, "`)` after `@(*`")?;
            return Ok(Sensitivity::Implicit);
        }
        let mut events = Vec::new();
        loop {
            let edge = if self.eat_kw(kw::POSEDGE) {
                Some(Edge::Rising)
            } else if self.eat_kw(kw::NEGEDGE) {
                Some(Edge::Falling)
            } else {
                None
            };
            let expr = self.expr()?;
            events.push(Event { edge, expr });
            if !(self.eat_p(Punct::Comma) || self.eat_kw(kw::OR)) {
                break;
            }
        }
        self.expect_p(
            Punct::RParen,
            "`)` closing the event list, or `or`/`,` before the next event",
        )?;
        Ok(Sensitivity::List(events, at))
    }

    /// One module item (or generate item), appended to `out`. A loop variable declared in a
    /// `for` header of the item (IEEE 1800-2017 clause 12.7.1, from memory) becomes an
    /// `integer` of the module, once per name: the loops are unrolled, so one variable serves
    /// every loop that names it.
    pub fn item(&mut self, out: &mut Vec<Item>) -> ParseResult<()> {
        let r = self.item_inner(out);
        for pd in self.take_pending() {
            out.push(Item::Param(Box::new(pd)));
        }
        for (n, p) in std::mem::take(&mut self.loop_decls) {
            let declared = out.iter().any(|it| match it {
                Item::Decl(d) => d.names.iter().any(|x| x.0 == n),
                _ => false,
            });
            if !declared {
                out.push(Item::Decl(Box::new(loop_variable(n, p))));
            }
        }
        r
    }

    fn item_inner(&mut self, out: &mut Vec<Item>) -> ParseResult<()> {
        let t = self.peek().clone();
        let pos = t.pos;
        let k = match t.kind {
            TokenKind::Ident(k) => k,
            other => {
                let d = self.describe(&other);
                return Err(self.unexpected(pos, "a module item", &d));
            }
        };
        if k == kw::INPUT
            || k == kw::OUTPUT
            || k == kw::INOUT
            || k == kw::WIRE
            || k == kw::REG
            || k == kw::INTEGER
            || self.is_int(k)
            || k == kw::TRI
            || k == kw::SUPPLY0
            || k == kw::SUPPLY1
            || self.is_sv_type(k)
            || self.starts_type()
        {
            // IEEE 1364-2005 clause 4.6: `tri` is `wire` by another name; `supply0` and
            // `supply1` nets are driven by the constants 0 and 1 (clause 4.6.7).
            let supply = [kw::SUPPLY0, kw::SUPPLY1].iter().position(|&x| x == k);
            let mut d = self.decl_head()?;
            let mut initial = Vec::new();
            loop {
                let (n, p) = self.ident("a name")?;
                if self.peek_p(Punct::LBrack) {
                    let flat = self.unpacked_decl(&d, n, p)?;
                    out.push(Item::Decl(Box::new(flat)));
                    if !self.eat_p(Punct::Comma) {
                        break;
                    }
                    continue;
                }
                self.note_packed_name(n);
                let init = if self.eat_p(Punct::Assign) {
                    if d.dir.is_some() {
                        return Err(self.unsupported(
                            p,
                            "initial value in a port declaration (give it in the module: `initial q = 0;`, or in the port list: `output reg q = 0`)",
                        ));
                    }
                    let v = self.expr()?;
                    if d.ty == Some(NetType::Wire) {
                        Some(Box::new(v))
                    } else {
                        // A variable's initial value (IEEE 1364-2005 clause 6.2.1, from
                        // memory): an assignment at time 0, as an `initial` block gives.
                        let at = v.pos();
                        initial.push(Item::Initial(
                            Box::new(Stmt::Assign(Expr::Ident(n, p), v, at)),
                            p,
                        ));
                        None
                    }
                } else {
                    None
                };
                if let Some(v) = supply {
                    out.push(Item::Assign(
                        Box::new((Expr::Ident(n, p), supply_value(v, p))),
                        p,
                    ));
                }
                d.names.push((n, p, init));
                if !self.eat_p(Punct::Comma) {
                    break;
                }
            }
            self.note_struct_names(&d.names);
            self.expect_p(Punct::Semi, "`;` after the declaration")?;
            // A netlist declares a million names, most one per declaration: keep no spare room.
            d.names.shrink_to_fit();
            out.push(Item::Decl(Box::new(d)));
            out.extend(initial);
        } else if self.peek_typedef() {
            self.module_typedef(out)?;
        } else if self.peek_import() {
            self.import(false)?;
        } else if k == kw::PARAMETER || k == kw::LOCALPARAM {
            self.bump();
            let mut pd = self.param_head(k == kw::LOCALPARAM)?;
            loop {
                let (n, p) = self.ident("a parameter name")?;
                self.expect_p(Punct::Assign, "`=` in a parameter declaration")?;
                pd.assigns.push((n, p, self.expr()?));
                if !self.eat_p(Punct::Comma) {
                    break;
                }
            }
            self.expect_p(Punct::Semi, "`;` after the parameter declaration")?;
            out.push(Item::Param(Box::new(pd)));
        } else if k == kw::DEFPARAM {
            self.defparam(out)?;
        } else if k == kw::GENVAR {
            self.bump();
            let mut v = vec![self.ident("a genvar name")?];
            while self.eat_p(Punct::Comma) {
                v.push(self.ident("a genvar name")?);
            }
            self.expect_p(Punct::Semi, "`;`")?;
            out.push(Item::Genvar(v));
        } else if k == kw::ASSIGN {
            self.bump();
            if self.peek_p(Punct::LParen) {
                return Err(self.unsupported_here("drive strength on `assign`"));
            }
            if self.peek_p(Punct::Hash) {
                self.skip_delay()?;
            }
            loop {
                let lhs = self.expr()?;
                let lhs = self.strip_signed_marker(lhs);
                self.expect_p(Punct::Assign, "`=` in a continuous assignment")?;
                let rhs = self.expr()?;
                out.push(Item::Assign(Box::new((lhs, rhs)), pos));
                if !self.eat_p(Punct::Comma) {
                    break;
                }
            }
            self.expect_p(Punct::Semi, "`;` after the assignment")?;
        } else if let Some(g) = Self::gate_kind(k) {
            self.gates(g, out)?;
        } else if k == kw::ALWAYS {
            self.bump();
            let sensitivity = self.event_control()?;
            let body = self.always_body(&sensitivity)?;
            out.push(Item::Always(Box::new(Always { sensitivity, body }), pos));
        } else if k == kw::FUNCTION {
            self.function(out);
        } else if k == kw::GENERATE {
            self.bump();
            while !self.eat_kw(kw::ENDGENERATE) {
                if matches!(self.peek().kind, TokenKind::Eof) || self.peek_kw(kw::ENDMODULE) {
                    return Err(self.error(pos, "missing `endgenerate`"));
                }
                self.item_or_skip(out);
            }
        } else if k == kw::FOR {
            self.gen_for(out)?;
        } else if k == kw::IF {
            self.gen_if(out)?;
        } else if k == kw::ENDGENERATE {
            return Err(self.error(pos, "`endgenerate` without a `generate` before it"));
        } else if k == kw::SPECIFY || k == kw::SPECPARAM {
            // Path delays and timing checks (IEEE 1364-2005 clauses 14 and 15): timing only.
            self.bump();
            if k == kw::SPECIFY {
                self.skip_past(kw::ENDSPECIFY);
            } else {
                self.skip_statement();
            }
            if !self
                .warnings
                .iter()
                .any(|w| w.kind == SyntaxKind::TimingIgnored)
            {
                self.warnings.push(SyntaxError::new(
                    Stage::Parse,
                    pos,
                    SyntaxKind::TimingIgnored,
                    "`specify` blocks and `specparam`s are ignored (this is the first; they give timing, not logic)",
                ));
            }
        } else if k == kw::INITIAL {
            // IEEE 1364-2005 clause 9.9.1 (from memory): run once at time 0. Read for the
            // constants it gives: power-on values of registers and tables of constant words.
            self.bump();
            // `initial q <= 1;` is read as `=` would be (both give the value at time 0).
            let was = std::mem::replace(&mut self.in_clocked, true);
            let body = self.stmt();
            self.in_clocked = was;
            out.push(Item::Initial(Box::new(body?), pos));
        } else if is_keyword(k) {
            let n = self.names.name(k).to_string();
            let what = match n.as_str() {
                "task" => "task declaration".to_string(),
                "begin" => "`begin` block outside a generate loop or condition".to_string(),
                _ => format!("`{n}`"),
            };
            self.unsupported(pos, what);
            let end = match n.as_str() {
                "task" => Some(kw::ENDTASK),
                "specify" => Some(kw::ENDSPECIFY),
                "case" | "casez" | "casex" => Some(kw::ENDCASE),
                _ => None,
            };
            if let Some(e) = end {
                self.skip_past(e);
                return Ok(());
            }
            if n == "begin" {
                // The whole block, so that its statements give no follow-on errors.
                self.skip_statement();
                return Ok(());
            }
            return Err(Stop);
        } else if self.names.name(k) == "always_comb" {
            // IEEE 1800-2017 clause 9.2.2.2 (from memory): combinational, every variable read.
            self.bump();
            let body = self.stmt()?;
            let sensitivity = Sensitivity::Implicit;
            out.push(Item::Always(Box::new(Always { sensitivity, body }), pos));
        } else if self.names.name(k) == "always_ff" {
            // IEEE 1800-2017 clause 9.2.2.4 (from memory): edge-triggered logic only.
            self.bump();
            let sensitivity = self.event_control()?;
            if !Self::has_edge(&sensitivity) {
                let at = match &sensitivity {
                    Sensitivity::List(_, at) => *at,
                    Sensitivity::Implicit => pos,
                };
                self.unsupported(at, "`always_ff` without a clock edge: its event list must name `posedge` or `negedge` events (use `always_comb` for combinational logic)");
                self.skip_statement();
                return Ok(());
            }
            let body = self.always_body(&sensitivity)?;
            out.push(Item::Always(Box::new(Always { sensitivity, body }), pos));
        } else if self.names.name(k) == "always_latch" {
            self.unsupported(pos, "`always_latch` (latches are not read: equicone reads combinational logic and registers clocked by an edge, `always @(posedge clk)`/`always_ff`)");
            self.bump();
            self.skip_statement();
        } else if matches!(
            self.names.name(k),
            "final"
                | "assert"
                | "assume"
                | "cover"
                | "property"
                | "sequence"
                | "covergroup"
                | "clocking"
                | "class"
                | "modport"
                | "interface"
                | "program"
                | "checker"
                | "let"
                | "union"
        ) {
            // SystemVerilog constructs outside the subset: one error, the construct skipped.
            let n = self.names.name(k).to_string();
            self.unsupported(pos, format!("`{n}`"));
            self.skip_construct(k);
        } else {
            self.instance(out)?;
        }
        Ok(())
    }
}

fn punct_text(p: Punct) -> &'static str {
    match p {
        Punct::LParen => "(",
        Punct::RParen => ")",
        Punct::LBrack => "[",
        Punct::RBrack => "]",
        Punct::LBrace => "{",
        Punct::RBrace => "}",
        Punct::Comma => ",",
        Punct::Semi => ";",
        Punct::Colon => ":",
        Punct::Dot => ".",
        Punct::Hash => "#",
        Punct::At => "@",
        Punct::Tick => "'",
        Punct::Assign => "=",
        Punct::Question => "?",
        Punct::Plus => "+",
        Punct::Minus => "-",
        Punct::Star => "*",
        Punct::Slash => "/",
        Punct::Percent => "%",
        Punct::Bang => "!",
        Punct::Tilde => "~",
        Punct::Amp => "&",
        Punct::Pipe => "|",
        Punct::Caret => "^",
        Punct::TildeAmp => "~&",
        Punct::TildePipe => "~|",
        Punct::TildeCaret => "~^",
        Punct::CaretTilde => "^~",
        Punct::AmpAmp => "&&",
        Punct::PipePipe => "||",
        Punct::EqEq => "==",
        Punct::BangEq => "!=",
        Punct::EqEqEq => "===",
        Punct::BangEqEq => "!==",
        Punct::Lt => "<",
        Punct::Le => "<=",
        Punct::Gt => ">",
        Punct::Ge => ">=",
        Punct::Shl => "<<",
        Punct::Shr => ">>",
        Punct::AShl => "<<<",
        Punct::AShr => ">>>",
        Punct::Power => "**",
        Punct::PlusColon => "+:",
        Punct::MinusColon => "-:",
    }
}

/// The constant driving a `supply0` (`v` = 0) or `supply1` (`v` = 1) net: `0` or `~0`,
/// sized by the net.
/// The declaration `integer NAME` of a `for (int NAME = ...)` loop variable, in the module or
/// function whose body holds the loop.
pub(crate) fn loop_variable(name: Sym, pos: Pos) -> Decl {
    Decl {
        dir: None,
        ty: Some(NetType::Integer),
        signed: true,
        range: None,
        names: vec![(name, pos, None)],
        pos,
    }
}

fn supply_value(v: usize, p: Pos) -> Expr {
    let zero = Expr::Num(
        Box::new(super::lexer::NumLit {
            bits: vec![super::lexer::B0; 32],
            signed: true,
            sized: false,
            text: "0".into(),
        }),
        p,
    );
    if v == 0 {
        zero
    } else {
        Expr::Unary(UnOp::Not, p, Box::new(zero))
    }
}
