//! The checks that `unique`, `unique0` and `priority` before a `case` or an `if` chain ask
//! for (IEEE 1800-2017 clauses 12.4.2 and 12.5.3, from memory), made while the design is
//! read and reported as warnings; the statement itself is read as the plain `case`/`if`.
//!
//! - `unique` and `unique0`: at most one item (one condition of the chain) matches. An
//!   overlap is reported with a select value (or input values) where two items match.
//! - `unique` and `priority`: some item matches, unless there is a `default` (a final
//!   `else`). A value that no item matches is reported.
//!
//! Each check is decided exactly by a SAT query over the bits the conditions read (taken as
//! free: a value that the rest of the design never produces still counts), bounded by
//! [`MAX_CONFLICTS`] conflicts per query; a query that reaches the bound is reported as not
//! decided, never as a pass.

use super::super::context::{Env, EvalContext};
use super::super::{Elaborator, UNKNOWN_BIT};
use crate::aig::{Lit, Node};
use crate::cnf::Tseitin;
use crate::front::verilog::ast::{Qualifier, Stmt};
use crate::front::verilog::pos::Pos;
use crate::sat::{ClauseSink, Limits, Sat, SatResult};
use std::collections::BTreeMap;

/// Conflicts allowed per query before a check is reported as not decided.
pub const MAX_CONFLICTS: u64 = 50_000;

/// The answer to one check.
enum Found {
    /// No such value: the check holds for every value.
    None,
    /// A model: these items match (indices), the rest as the witness says.
    Witness(Vec<usize>, String),
    /// The conflict bound was reached.
    Undecided,
}

impl Elaborator<'_> {
    /// The checks of qualifier `q` (written at `at`) over `items` (each item's match
    /// condition and where it is written); `has_default`: a `default` or final `else`;
    /// `select`: the bits shown as the witness (a case's select), else the net bits read.
    pub(crate) fn check_qualified(
        &mut self,
        q: Qualifier,
        at: Pos,
        stmt: &str,
        items: &[(Lit, Pos)],
        has_default: bool,
        select: Option<&[Lit]>,
    ) {
        let what = format!("`{} {stmt}`", q.text());
        let item_word = if stmt == "if" { "condition" } else { "item" };
        if matches!(q, Qualifier::Unique | Qualifier::Unique0) && items.len() > 1 {
            match self.find_overlap(items, select) {
                Found::Witness(ij, w) => {
                    let (a, b) = (items[ij[0]].1, items[ij[1]].1);
                    self.warn_once(
                        at,
                        format!(
                            "{what}: the {item_word}s at {}:{} and {}:{} both match when {w} (at most one may match; the statement is read as a plain `{stmt}`, the first match winning)",
                            a.line, a.col, b.line, b.col
                        ),
                    );
                }
                Found::Undecided => self.warn_once(
                    at,
                    format!("{what}: whether two {item_word}s can match at once was not decided within {MAX_CONFLICTS} conflicts"),
                ),
                Found::None => {}
            }
        }
        if matches!(q, Qualifier::Unique | Qualifier::Priority) && !has_default {
            let none = if stmt == "if" {
                "no condition holds and there is no final `else`"
            } else {
                "no item matches and there is no `default`"
            };
            match self.find_uncovered(items, select) {
                Found::Witness(_, w) => self.warn_once(
                    at,
                    format!("{what}: {none} when {w} (some {item_word} must match; the statement is read as a plain `{stmt}`)"),
                ),
                Found::Undecided => self.warn_once(
                    at,
                    format!("{what}: whether some {item_word} always matches was not decided within {MAX_CONFLICTS} conflicts"),
                ),
                Found::None => {}
            }
        }
    }

    /// The checks of a qualified `if` chain (`if ... else if ... else ...`), its conditions
    /// evaluated as the chain evaluates them (before any branch runs).
    pub(crate) fn check_if_chain(
        &mut self,
        scope: u32,
        q: Qualifier,
        at: Pos,
        st: &Stmt,
        env: &Env,
    ) {
        let mut items = Vec::new();
        let mut s = st;
        let mut has_else = false;
        // Quiet: the statement itself is run afterwards and reports its own errors.
        self.core.quiet += 1;
        while let Stmt::If(c, _, e, _) = s {
            let ctx = EvalContext {
                scope,
                env: Some(env),
                constant: false,
            };
            let l = self.eval_bool(&ctx, c);
            items.push((l, c.pos()));
            match e.as_deref() {
                Some(next @ Stmt::If(..)) => s = next,
                Some(_) => {
                    has_else = true;
                    break;
                }
                None => break,
            }
        }
        self.core.quiet -= 1;
        self.check_qualified(q, at, "if", &items, has_else, None);
    }

    /// Two items that match at once: the first pair found, in item order.
    fn find_overlap(&self, items: &[(Lit, Pos)], select: Option<&[Lit]>) -> Found {
        let limits = Limits::none();
        let mut sat = Sat::new(&limits);
        let mut ts = Tseitin::new();
        let c: Vec<_> = items
            .iter()
            .map(|(l, _)| ts.lit(&self.core.aig, &mut sat, *l))
            .collect();
        // later[i] <-> some item after i matches.
        let n = c.len();
        let mut later = vec![None; n];
        let mut acc: Option<crate::sat::CLit> = None;
        for i in (0..n).rev() {
            later[i] = acc;
            let v = sat.fresh();
            match acc {
                None => {
                    sat.clause(&[!v, c[i]]);
                    sat.clause(&[v, !c[i]]);
                }
                Some(a) => {
                    sat.clause(&[!v, c[i], a]);
                    sat.clause(&[v, !c[i]]);
                    sat.clause(&[v, !a]);
                }
            }
            acc = Some(v);
        }
        for i in 0..n {
            let Some(l) = later[i] else { continue };
            match sat.solve_within(&[c[i], l], Some(MAX_CONFLICTS)) {
                SatResult::Unsat => {}
                SatResult::Sat => {
                    let j = (i + 1..n).find(|&j| sat.value(c[j])).unwrap_or(i);
                    let w = self.witness(&sat, &mut ts, items, select);
                    return Found::Witness(vec![i, j], w);
                }
                SatResult::Stopped(_) => return Found::Undecided,
            }
        }
        Found::None
    }

    /// A value where no item matches.
    fn find_uncovered(&self, items: &[(Lit, Pos)], select: Option<&[Lit]>) -> Found {
        let limits = Limits::none();
        let mut sat = Sat::new(&limits);
        let mut ts = Tseitin::new();
        let none: Vec<_> = items
            .iter()
            .map(|(l, _)| !ts.lit(&self.core.aig, &mut sat, *l))
            .collect();
        match sat.solve_within(&none, Some(MAX_CONFLICTS)) {
            SatResult::Unsat => Found::None,
            SatResult::Sat => {
                Found::Witness(Vec::new(), self.witness(&sat, &mut ts, items, select))
            }
            SatResult::Stopped(_) => Found::Undecided,
        }
    }

    /// The witness of the last model: the select's value (`the select is 2'b10`), or the
    /// values of the net bits the conditions read (`a=1, s=2'b10`).
    fn witness(
        &self,
        sat: &Sat,
        ts: &mut Tseitin,
        items: &[(Lit, Pos)],
        select: Option<&[Lit]>,
    ) -> String {
        if let Some(bits) = select {
            let mut vals = Vec::with_capacity(bits.len());
            for &b in bits {
                let v = match ts.var_of(b.node()) {
                    Some(v) => sat.value(v) != b.is_complemented(),
                    // Not read by any condition: any value will do.
                    None => b == Lit::TRUE,
                };
                vals.push(v);
            }
            return format!("the select is {}", binary(&vals));
        }
        // The leaves of the conditions' cones.
        let mut seen = crate::hash::FastMap::default();
        let mut stack: Vec<u32> = items.iter().map(|(l, _)| l.node()).collect();
        let mut by_net: BTreeMap<u32, BTreeMap<u32, bool>> = BTreeMap::new();
        while let Some(n) = stack.pop() {
            if seen.insert(n, ()).is_some() {
                continue;
            }
            match self.core.aig.node(n) {
                Node::Const => {}
                Node::Input(leaf) => {
                    let o = self.core.owner[leaf as usize];
                    if o & UNKNOWN_BIT != 0 {
                        continue;
                    }
                    let v = ts.var_of(n).is_some_and(|v| sat.value(v));
                    let off = leaf - self.core.nets[o as usize].first;
                    by_net.entry(o).or_default().insert(off, v);
                }
                Node::And(a, b) => {
                    stack.push(a.node());
                    stack.push(b.node());
                }
            }
        }
        let mut parts = Vec::new();
        for (net, bits) in &by_net {
            let info = &self.core.nets[*net as usize];
            if info.vector && bits.len() == info.width as usize {
                let vals: Vec<bool> = bits.values().copied().collect();
                parts.push(format!("{}={}", self.core.net_name(*net), binary(&vals)));
            } else {
                for (off, v) in bits.iter().rev() {
                    parts.push(format!(
                        "{}={}",
                        self.core.bit_name(*net, *off),
                        u8::from(*v)
                    ));
                }
            }
        }
        if parts.is_empty() {
            return "every input has any value".into();
        }
        parts.join(", ")
    }

    /// A warning, once per place and text (a module instantiated twice gives it once).
    fn warn_once(&mut self, p: Pos, msg: String) {
        let sp = Some(self.core.source_pos(p));
        if self
            .core
            .warnings
            .iter()
            .any(|w| w.pos == sp && w.message == msg)
        {
            return;
        }
        self.core.warn(p, msg);
    }
}

/// `4'b1010` from bits least significant first.
fn binary(bits: &[bool]) -> String {
    let s: String = bits
        .iter()
        .rev()
        .map(|&b| if b { '1' } else { '0' })
        .collect();
    format!("{}'b{s}", bits.len())
}
