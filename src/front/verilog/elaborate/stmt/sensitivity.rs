//! Event lists of combinational `always` blocks (IEEE 1364-2005 clause 9.7): `@*` reads every
//! variable (9.7.5); `@(a or b)` and `@(a, b)` (9.7.2, 9.7.3) are read as synthesis reads
//! them, as if written `@*`. A list that misses a variable the block reads is a warning
//! naming it: a simulator would not wake on that variable, so simulation and synthesis
//! disagree there (common practice).

use super::super::{Elaborator, Symbol};
use crate::front::verilog::ast::NetType;
use crate::front::verilog::ast::{Event, Expr, Select, Stmt};
use crate::front::verilog::pos::Pos;
use crate::front::verilog::symbols::Sym;
use std::collections::HashSet;

/// Names read and assigned by a statement, in order of first appearance.
#[derive(Default)]
struct Uses {
    read: Vec<(Sym, Pos)>,
    assigned: HashSet<Sym>,
}

impl Uses {
    fn expr(&mut self, e: &Expr) {
        // Expressions are bounded in depth by the parser (see `ast`).
        match e {
            Expr::Ident(s, p) => self.read.push((*s, *p)),
            Expr::Num(..) => {}
            Expr::Index(s, p, sel) => {
                self.read.push((*s, *p));
                self.select(sel);
            }
            Expr::Unary(_, _, a) => self.expr(a),
            Expr::Chain(first, rest) => {
                self.expr(first);
                for (_, _, e) in rest {
                    self.expr(e);
                }
            }
            Expr::Cond(b, _) => b.iter().for_each(|e| self.expr(e)),
            Expr::Concat(v, _) | Expr::Call(_, _, v) => v.iter().for_each(|e| self.expr(e)),
            Expr::Repl(n, v, _) => {
                self.expr(n);
                v.iter().for_each(|e| self.expr(e));
            }
            Expr::Cast(c, _) => self.expr(&c.expr),
        }
    }

    fn select(&mut self, sel: &Select) {
        match sel {
            Select::Bit(i) => self.expr(i),
            Select::Part(a, b) | Select::Up(a, b) | Select::Down(a, b) => {
                self.expr(a);
                self.expr(b);
            }
        }
    }

    /// The target of an assignment: its name is assigned, its index expressions are read.
    fn target(&mut self, lhs: &Expr) {
        match lhs {
            Expr::Ident(s, _) => {
                self.assigned.insert(*s);
            }
            Expr::Index(s, _, sel) => {
                self.assigned.insert(*s);
                self.select(sel);
            }
            Expr::Concat(v, _) => v.iter().for_each(|e| self.target(e)),
            other => self.expr(other),
        }
    }

    fn stmt(&mut self, st: &Stmt) {
        match st {
            Stmt::Null => {}
            Stmt::Return(e, _) => self.expr(e),
            Stmt::Block(v) => v.iter().for_each(|s| self.stmt(s)),
            Stmt::Qualified(_, _, inner) => self.stmt(inner),
            Stmt::Assign(lhs, rhs, _) | Stmt::NonBlocking(lhs, rhs, _) => {
                self.expr(rhs);
                self.target(lhs);
            }
            Stmt::If(c, t, e, _) => {
                self.expr(c);
                self.stmt(t);
                if let Some(e) = e {
                    self.stmt(e);
                }
            }
            Stmt::Case(c) => {
                self.expr(&c.expr);
                for (labels, s) in &c.items {
                    labels.iter().for_each(|l| self.expr(l));
                    self.stmt(s);
                }
                for (_, lo, hi) in &c.ranges {
                    self.expr(lo);
                    self.expr(hi);
                }
                if let Some(d) = &c.default {
                    self.stmt(d);
                }
            }
            Stmt::For(f) => {
                self.expr(&f.init.2);
                self.assigned.insert(f.init.0);
                self.expr(&f.cond);
                self.expr(&f.step.2);
                self.assigned.insert(f.step.0);
                self.stmt(&f.body);
            }
        }
    }
}

/// The name an event watches (`a` of `a` or `a[3]`), if it is a plain name.
fn event_name(ev: &Event) -> Option<Sym> {
    match &ev.expr {
        Expr::Ident(s, _) | Expr::Index(s, _, _) => Some(*s),
        _ => None,
    }
}

impl Elaborator<'_> {
    /// Warn when the event list `events` (at `at`) misses a net that `body` reads.
    pub(crate) fn check_event_list(&mut self, scope: u32, events: &[Event], at: Pos, body: &Stmt) {
        let listed: HashSet<Sym> = events.iter().filter_map(event_name).collect();
        let mut uses = Uses::default();
        uses.stmt(body);
        let mut missing: Vec<(Sym, Pos)> = Vec::new();
        let mut seen = HashSet::new();
        for &(s, p) in &uses.read {
            if listed.contains(&s) || uses.assigned.contains(&s) || !seen.insert(s) {
                continue;
            }
            // Parameters, genvars and loop integers never change while the block runs.
            let is_signal = match self.core.lookup(scope, s) {
                Some(Symbol::Net(n)) => self.core.nets[*n as usize].ty != NetType::Integer,
                _ => false,
            };
            if is_signal {
                missing.push((s, p));
            }
        }
        if missing.is_empty() {
            return;
        }
        let names: Vec<String> = missing
            .iter()
            .map(|(s, p)| format!("`{}` (read at line {})", self.core.name(*s), p.line))
            .collect();
        self.core.warn(
            at,
            format!(
                "the event list misses {}: equicone reads the block as synthesis does (as if written `@*`); a simulator would not re-run it when only that changes (IEEE 1364-2005 clause 9.7)",
                names.join(", ")
            ),
        );
    }
}
