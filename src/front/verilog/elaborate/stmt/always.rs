//! Combinational `always` blocks: symbolic execution of blocking assignments, `if`, `case`/`casez` and
//! constant-bound `for` loops; a variable left unassigned on some path is a latch error.

use super::super::bits;
use super::super::context::{BitState, Env, EvalContext};
use super::super::{span, Elaborator, Sym, Symbol, MAX_LOOP, MAX_WIDTH};
use super::coverage::{self, Coverage};
use crate::aig::Lit;
use crate::front::verilog::ast::{
    Always, CaseStmt, Expr, ForStmt, NetType, Qualifier, Select, Sensitivity, Stmt,
};
use crate::front::verilog::lexer::{B0, B1};
use crate::front::verilog::pos::Pos;
use std::collections::BTreeMap;

/// One assignment target bit: net and offset (`None` offset: outside the range, dropped).
pub type Target = (u32, Option<u32>);

impl Elaborator<'_> {
    /// Elaborate one `always` block in scope `scope`: clocked ones go to `clocked.rs`;
    /// combinational ones have their event list checked (`sensitivity.rs`) and run here.
    pub(crate) fn elab_always(&mut self, scope: u32, block: &Always, pos: Pos) {
        if let Sensitivity::List(events, at) = &block.sensitivity {
            if events.iter().any(|e| e.edge.is_some()) {
                return self.elab_clocked(scope, block, pos);
            }
            self.check_event_list(scope, events, *at, &block.body);
        }
        let body = &block.body;
        let mut env = Env::default();
        self.exec(scope, body, &mut env);
        let mut latch: BTreeMap<u32, (Pos, Option<Lit>)> = BTreeMap::new();
        for (n, states) in &env.vars {
            if self.core.nets[*n as usize].ty == NetType::Integer {
                continue;
            }
            for (off, st) in states.iter().enumerate() {
                match st {
                    BitState::Set(l) => self.core.drive(*n, off as u32, *l, pos),
                    BitState::Partial { assigned, gap, .. } => {
                        latch.entry(*n).or_insert((*gap, Some(*assigned)));
                        self.core.drive(*n, off as u32, Lit::FALSE, pos);
                    }
                    BitState::Unset(Some(p)) => {
                        latch.entry(*n).or_insert((*p, None));
                        // Reported as a latch below; a placeholder driver avoids a
                        // follow-on "never driven" message for the same bits.
                        self.core.drive(*n, off as u32, Lit::FALSE, pos);
                    }
                    BitState::Unset(None) => {}
                }
            }
        }
        for (n, (p, assigned)) in latch {
            let nm = self.core.net_name(n);
            let line = p.line;
            let when = match assigned.map(|a| self.lowering.coverage(&self.core.aig, a)) {
                Some(Coverage::Gap(g)) if !g.is_empty() => {
                    format!(
                        ", for example when {}",
                        super::coverage::gap_text(&self.core, &g)
                    )
                }
                Some(Coverage::Undecided) => format!(
                    "; its coverage reads more than {} bits and was not decided",
                    coverage::MAX_LEAVES
                ),
                _ => String::new(),
            };
            self.core.error(
                p,
                format!("`{nm}` is not assigned on every path through the always block (the statement at line {line} has a path without an assignment{when}); it would infer a latch"),
                "assign it a default value at the top of the block, or add the missing `else`/`default`",
            );
        }
    }

    pub(crate) fn exec(&mut self, scope: u32, st: &Stmt, env: &mut Env) {
        match st {
            Stmt::Null => {}
            Stmt::Block(v) => {
                for s in v {
                    self.exec(scope, s, env);
                }
            }
            Stmt::Assign(lhs, rhs, pos) => self.proc_assign(scope, lhs, rhs, *pos, env),
            Stmt::NonBlocking(lhs, rhs, pos) => self.non_blocking(scope, lhs, rhs, *pos, env),
            Stmt::If(c, t, e, pos) => {
                let cb = {
                    let ctx = EvalContext {
                        scope,
                        env: Some(env),
                        constant: false,
                    };
                    self.eval_bool(&ctx, c)
                };
                if cb == Lit::TRUE {
                    return self.exec(scope, t, env);
                }
                if cb == Lit::FALSE {
                    if let Some(e) = e {
                        self.exec(scope, e, env);
                    }
                    return;
                }
                let mut te = env.clone();
                self.exec(scope, t, &mut te);
                let mut ee = env.clone();
                if let Some(e) = e {
                    self.exec(scope, e, &mut ee);
                }
                *env = self.merge(cb, te, ee, *pos);
            }
            Stmt::Case(c) => self.exec_case(scope, c, env, None),
            Stmt::For(f) => self.exec_for(scope, f, env),
            Stmt::Return(..) => unreachable!("`return` is rewritten when a function is parsed"),
            Stmt::Qualified(q, at, inner) => match &**inner {
                Stmt::Case(c) => self.exec_case(scope, c, env, Some((*q, *at))),
                Stmt::If(..) => {
                    self.check_if_chain(scope, *q, *at, inner, env);
                    self.exec(scope, inner, env);
                }
                other => self.exec(scope, other, env),
            },
        }
    }

    /// `c ? t : e` per variable bit; a bit unset on either side stays unset.
    fn merge(&mut self, c: Lit, t: Env, e: Env, pos: Pos) -> Env {
        if c == Lit::TRUE {
            return t;
        }
        if c == Lit::FALSE {
            return e;
        }
        let mut out = Env::default();
        let keys: Vec<u32> = t.vars.keys().chain(e.vars.keys()).copied().collect();
        for n in keys {
            if out.vars.contains_key(&n) {
                continue;
            }
            let w = self.core.nets[(n & !super::clocked::NON_BLOCKING) as usize].width as usize;
            let unset = vec![BitState::Unset(None); w];
            let tv = t.vars.get(&n).unwrap_or(&unset);
            let ev = e.vars.get(&n).unwrap_or(&unset);
            let merged = tv
                .iter()
                .zip(ev)
                .map(|(a, b)| self.merge_bit(c, *a, *b, pos))
                .collect();
            out.vars.insert(n, merged);
        }
        out
    }

    /// `c ? a : b` for one bit; a bit assigned on only some paths is checked for value
    /// coverage (see `coverage.rs`) and counts as assigned when its condition always holds.
    fn merge_bit(&mut self, c: Lit, a: BitState, b: BitState, pos: Pos) -> BitState {
        use BitState::{Partial, Set, Unset};
        // Value and assignment condition of each side.
        let parts = |s: BitState| match s {
            Set(v) => Some((v, Lit::TRUE, None)),
            Partial {
                value,
                assigned,
                gap,
            } => Some((value, assigned, Some(gap))),
            Unset(_) => None,
        };
        match (parts(a), parts(b)) {
            (Some((x, _, None)), Some((y, _, None))) => Set(self.core.aig.mux(c, x, y)),
            (None, None) => match (a, b) {
                (Unset(p), Unset(q)) => Unset(p.or(q)),
                _ => Unset(None),
            },
            (pa, pb) => {
                let gap_of = |s: BitState| match s {
                    Unset(p) => p,
                    Partial { gap, .. } => Some(gap),
                    Set(_) => None,
                };
                let gap = gap_of(a).or(gap_of(b)).unwrap_or(pos);
                let (value, assigned) = match (pa, pb) {
                    (Some((x, ax, _)), Some((y, ay, _))) => {
                        (self.core.aig.mux(c, x, y), self.core.aig.mux(c, ax, ay))
                    }
                    (Some((x, ax, _)), None) => (x, self.core.aig.and(c, ax)),
                    (None, Some((y, ay, _))) => (y, self.core.aig.and(!c, ay)),
                    (None, None) => (Lit::FALSE, Lit::FALSE),
                };
                self.settle(value, assigned, gap)
            }
        }
    }

    /// A bit assigned where `assigned` holds: fully assigned when that covers every value.
    pub(super) fn settle(&mut self, value: Lit, assigned: Lit, gap: Pos) -> BitState {
        if assigned == Lit::FALSE {
            return BitState::Unset(Some(gap));
        }
        if self.lowering.coverage(&self.core.aig, assigned) == Coverage::Complete {
            BitState::Set(value)
        } else {
            BitState::Partial {
                value,
                assigned,
                gap,
            }
        }
    }

    fn proc_assign(&mut self, scope: u32, lhs: &Expr, rhs: &Expr, pos: Pos, env: &mut Env) {
        // A variable index on the left: `r[i] = v` writes bit i where i is in range, and
        // `r[b +: w] = v` the bits the base puts the value on (`window.rs`).
        let write = {
            let ctx = EvalContext {
                scope,
                env: Some(env),
                constant: false,
            };
            self.variable_write(&ctx, lhs, rhs)
        };
        if let Some(write) = write {
            let Some(write) = write else {
                return;
            };
            let w = self.core.nets[write.net as usize].width as usize;
            let entry = env
                .vars
                .entry(write.net)
                .or_insert_with(|| vec![BitState::Unset(None); w])
                .clone();
            let mut slots = entry;
            for (off, hit, v) in write.bits {
                let slot = &mut slots[off];
                *slot = match *slot {
                    BitState::Set(old) => BitState::Set(self.core.aig.mux(hit, v, old)),
                    BitState::Unset(_) if hit == Lit::TRUE => BitState::Set(v),
                    BitState::Unset(p) => BitState::Unset(Some(p.unwrap_or(pos))),
                    BitState::Partial {
                        value,
                        assigned,
                        gap,
                    } => {
                        let value = self.core.aig.mux(hit, v, value);
                        let assigned = self.core.aig.or(hit, assigned);
                        self.settle(value, assigned, gap)
                    }
                };
            }
            env.vars.insert(write.net, slots);
            return;
        }
        let ctx = EvalContext {
            scope,
            env: Some(env),
            constant: false,
        };
        let targets = match self.targets(&ctx, lhs, true) {
            Some(t) => t,
            None => return,
        };
        let t = self.expr_type(&ctx, rhs);
        let w = targets.len().max(t.width);
        let v = self.eval(&ctx, rhs, w, t.signed);
        for (k, (n, off)) in targets.iter().enumerate() {
            if let Some(off) = off {
                let width = self.core.nets[*n as usize].width as usize;
                let e = env
                    .vars
                    .entry(*n)
                    .or_insert_with(|| vec![BitState::Unset(None); width]);
                e[*off as usize] = BitState::Set(v[k]);
            }
        }
    }

    /// The net named `sym`, checked as an assignment target (`procedural`: a `reg`).
    pub(crate) fn target_net(
        &mut self,
        scope: u32,
        sym: Sym,
        pos: Pos,
        procedural: bool,
    ) -> Option<u32> {
        let nm = || self.core.name(sym);
        match self.core.lookup(scope, sym) {
            Some(&Symbol::Net(n)) => {
                let ty = self.core.nets[n as usize].ty;
                if procedural && ty == NetType::Wire {
                    let nm = nm();
                    self.core.error(
                        pos,
                        format!("procedural assignment to wire `{nm}`"),
                        "declare it `reg` to assign it in an always block",
                    );
                    return None;
                }
                if !procedural && ty != NetType::Wire && ty != NetType::Logic {
                    let nm = nm();
                    self.core.error(
                        pos,
                        format!("continuous assignment to variable `{nm}`"),
                        "declare it `wire`, or assign it in an always block",
                    );
                    return None;
                }
                Some(n)
            }
            Some(_) => {
                let nm = nm();
                self.core.error(
                    pos,
                    format!("`{nm}` is not a net or variable and cannot be assigned"),
                    "assign a net (`wire`) or a variable (`reg`); parameters and genvars are constants",
                );
                None
            }
            None => {
                let nm = nm();
                self.core.error_undeclared(pos, nm);
                None
            }
        }
    }

    /// Target bits of an assignment, least significant first.
    pub(crate) fn targets(
        &mut self,
        ctx: &EvalContext,
        lhs: &Expr,
        procedural: bool,
    ) -> Option<Vec<Target>> {
        match lhs {
            Expr::Ident(s, p) => {
                let n = self.target_net(ctx.scope, *s, *p, procedural)?;
                Some(
                    (0..self.core.nets[n as usize].width)
                        .map(|k| (n, Some(k)))
                        .collect(),
                )
            }
            Expr::Index(s, p, sel) => {
                let n = self.target_net(ctx.scope, *s, *p, procedural)?;
                let net = self.core.nets[n as usize].clone();
                let ccx = EvalContext {
                    scope: ctx.scope,
                    env: ctx.env,
                    constant: false,
                };
                let idx: Vec<i64> = match &**sel {
                    Select::Bit(i) => {
                        let v = self.eval_self(&ccx, i);
                        match bits::to_i64(&v.bits, v.signed) {
                            Some(k) => vec![k],
                            None => {
                                self.core.error(
                                    *p,
                                    "unsupported: variable index on the left of a continuous assignment",
                                    "use a constant index, or assign the vector in an `always @*` block",
                                );
                                return None;
                            }
                        }
                    }
                    Select::Part(m, l) => {
                        let (m, l) = (self.const_int(ctx.scope, m)?, self.const_int(ctx.scope, l)?);
                        if (m > l) != (net.msb >= net.lsb) && m != l && net.width > 1 {
                            self.core.error(
                                *p,
                                "part-select in the opposite direction to the declaration",
                                "write the bounds in the declaration's order, e.g. `[7:4]` for `[7:0]`"
                            );
                            return None;
                        }
                        let Some(w) = span(m, l) else {
                            self.core.error(
                                *p,
                                "part-select wider than 65536 bits",
                                "select at most the declared bits of the vector",
                            );
                            return None;
                        };
                        let step = if l <= m { 1 } else { -1 };
                        (0..w as i64).map(|j| l + j * step).collect()
                    }
                    Select::Up(b, w) | Select::Down(b, w) => {
                        let w = self.const_int(ctx.scope, w)?;
                        if w <= 0 || w as usize > MAX_WIDTH {
                            self.core.error(
                                *p,
                                "indexed part-select width must be a positive constant of at most 65536",
                                "give the number of bits to select, e.g. `d[s +: 8]`"
                            );
                            return None;
                        }
                        let v = self.eval_self(&ccx, b);
                        let b = match bits::to_i64(&v.bits, v.signed) {
                            Some(b) => b,
                            None => {
                                self.core.error(
                                    *p,
                                    "unsupported: variable indexed part-select on the left of an assignment",
                                    "use a constant base, or assign each possible window under an `if`/`case`",
                                );
                                return None;
                            }
                        };
                        let lo = if matches!(&**sel, Select::Up(..)) {
                            b
                        } else {
                            b.saturating_sub(w - 1)
                        };
                        let mut v: Vec<i64> = (0..w).map(|j| lo.saturating_add(j)).collect();
                        if net.msb < net.lsb {
                            v.reverse();
                        }
                        v
                    }
                };
                let out: Vec<Target> = idx.iter().map(|&i| (n, net.offset(i))).collect();
                if out.iter().any(|t| t.1.is_none()) {
                    self.core.warn(
                        *p,
                        "assignment to bits outside the declared range is dropped",
                    );
                }
                Some(out)
            }
            Expr::Concat(items, _) => {
                let mut out = Vec::new();
                for it in items.iter().rev() {
                    out.extend(self.targets(ctx, it, procedural)?);
                }
                Some(out)
            }
            other => {
                self.core.error(
                    other.pos(),
                    "not an assignable expression (expected a name, a select or a concatenation)",
                    "assign a name, a bit or part-select of it, or a concatenation of those",
                );
                None
            }
        }
    }

    fn exec_case(
        &mut self,
        scope: u32,
        c: &CaseStmt,
        env: &mut Env,
        qualifier: Option<(Qualifier, Pos)>,
    ) {
        let ctx = EvalContext {
            scope,
            env: Some(env),
            constant: false,
        };
        let mut t = self.expr_type(&ctx, &c.expr);
        let own_width = t.width;
        let bounds = c.ranges.iter().flat_map(|(_, lo, hi)| [lo, hi]);
        for l in c.items.iter().flat_map(|(labels, _)| labels).chain(bounds) {
            let u = self.expr_type(&ctx, l);
            t.width = t.width.max(u.width);
            t.signed = t.signed && u.signed;
        }
        let sel = self.eval(&ctx, &c.expr, t.width, t.signed);
        let mut conds = Vec::with_capacity(c.items.len());
        for (k, (labels, _)) in c.items.iter().enumerate() {
            let mut any = Lit::FALSE;
            for (_, lo, hi) in c.ranges.iter().filter(|r| r.0 == k) {
                let lo = self.eval(&ctx, lo, t.width, t.signed);
                let hi = self.eval(&ctx, hi, t.width, t.signed);
                let g = &mut self.core.aig;
                let (below, above) = if t.signed {
                    (bits::slt(g, &sel, &lo), bits::slt(g, &hi, &sel))
                } else {
                    (bits::ult(g, &sel, &lo), bits::ult(g, &hi, &sel))
                };
                let within = g.or(below, above);
                any = g.or(any, !within);
            }
            for l in labels {
                let hit = match l {
                    Expr::Num(n, p) if n.bits.iter().any(|&b| b != B0 && b != B1) => {
                        if !c.casez && !c.inside {
                            self.core.error(
                                *p,
                                format!("unsupported: x/z bits in a `case` item (`{}`)", n.text),
                                "use `casez` with `?` or `z` for don't-care bits",
                            );
                            Lit::FALSE
                        } else {
                            // Don't-care (z/?) bits are skipped; x bits are unsupported.
                            let mut b = n.bits.clone();
                            let fill = if n.signed && t.signed {
                                *b.last().unwrap_or(&B0)
                            } else {
                                B0
                            };
                            b.resize(t.width, fill);
                            let mut eqs = Vec::new();
                            for (k, &bit) in b.iter().enumerate() {
                                match bit {
                                    B0 => eqs.push(!sel[k]),
                                    B1 => eqs.push(sel[k]),
                                    crate::front::verilog::lexer::BZ => {}
                                    // In `case inside`, x bits of a label are don't-cares too.
                                    _ if c.inside => {}
                                    _ => {
                                        self.core.error(
                                            *p,
                                            format!("unsupported: x bits in a `casez` item (`{}`); use `?`", n.text),
                                            "write don't-care bits as `?` or `z` in `casez` items",
                                        );
                                        break;
                                    }
                                }
                            }
                            self.core.aig.and_all(&eqs)
                        }
                    }
                    _ => {
                        let v = self.eval(&ctx, l, t.width, t.signed);
                        bits::eq(&mut self.core.aig, &sel, &v)
                    }
                };
                any = self.core.aig.or(any, hit);
            }
            conds.push(any);
        }
        if let Some((q, at)) = qualifier {
            let items: Vec<(Lit, Pos)> = conds
                .iter()
                .zip(&c.items)
                .map(|(&l, (labels, _))| (l, labels.first().map_or(c.pos, |e| e.pos())))
                .collect();
            let shown = &sel[..own_width.min(sel.len())];
            let stmt = if c.casez {
                "casez"
            } else if c.inside {
                "case inside"
            } else {
                "case"
            };
            self.check_qualified(q, at, stmt, &items, c.default.is_some(), Some(shown));
        }
        let mut acc = env.clone();
        if let Some(d) = &c.default {
            self.exec(scope, d, &mut acc);
        }
        for (k, (_, st)) in c.items.iter().enumerate().rev() {
            let mut e = env.clone();
            self.exec(scope, st, &mut e);
            acc = self.merge(conds[k], e, acc, c.pos);
        }
        *env = acc;
    }

    fn exec_for(&mut self, scope: u32, f: &ForStmt, env: &mut Env) {
        let var = Expr::Ident(f.init.0, f.init.1);
        self.proc_assign(scope, &var, &f.init.2, f.init.1, env);
        let mut count = 0;
        loop {
            let c = {
                let ctx = EvalContext {
                    scope,
                    env: Some(env),
                    constant: false,
                };
                self.eval_bool(&ctx, &f.cond)
            };
            if c == Lit::FALSE {
                break;
            }
            if c != Lit::TRUE {
                self.core.error(
                    f.cond.pos(),
                    "for-loop condition is not constant; loop bounds must be constants",
                    "bound the loop by constants or parameters, e.g. `for (i = 0; i < N; i = i + 1)`"
                );
                break;
            }
            count += 1;
            if count > MAX_LOOP {
                self.core.error(
                    f.pos,
                    format!("for loop runs more than {} iterations", MAX_LOOP),
                    "check the loop's condition and step; equicone unrolls at most 65536 iterations"
                );
                break;
            }
            let before = self.core.errors.len();
            self.exec(scope, &f.body, env);
            let var = Expr::Ident(f.step.0, f.step.1);
            self.proc_assign(scope, &var, &f.step.2, f.step.1, env);
            if self.core.errors.len() > before {
                break;
            }
        }
    }
}
