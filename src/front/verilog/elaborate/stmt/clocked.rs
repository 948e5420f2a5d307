//! Clocked `always` blocks (`always @(posedge clk)`, `always @(negedge clk or negedge rst_n)`,
//! `always_ff`): their lowering to register bits. The body runs symbolically like a
//! combinational block (`always.rs`), with non-blocking values kept apart from the values
//! that later statements read; each bit assigned becomes a register whose next value is its
//! value at the end of the block, holding where no path assigns it (an enable).
//!
//! Resets: with two events, the one the block's leading `if` tests is an asynchronous reset
//! and its branch must give constants (the reset state); with one event, a leading `if` on a
//! name containing `rst` or `reset` whose branch gives constants is a synchronous reset. A
//! reset or clock must reach a top-level input port, or a clock be a gate of one
//! (`gated_clock.rs`); checked when the design is built (`registers_begin`/`registers_finish`).
//!
//! Variables assigned with `=` in a clocked block are registers only when something reads
//! them before they are written (created on first use while resolving); a variable written
//! with both `=` and `<=`, or written with `=` in one clocked block and read by another
//! (simulation order decides which value the reader sees), is an error naming it.

use super::super::context::{BitState, Env, EvalContext};
use super::super::resolve::Resolver;
use super::super::{Core, Elaborator, UNKNOWN_BIT};
use crate::aig::{Lit, Node};
use crate::design::{ClockEdge, InputBit, InputKind, Register, RegisterReset};
use crate::front::verilog::ast::{Always, Edge, Expr, NetType, Sensitivity, Stmt};
use crate::front::verilog::pos::Pos;
use std::collections::{BTreeMap, BTreeSet};

/// The flag that marks a non-blocking value's key in an [`Env`] (reads never see it).
pub(crate) const NON_BLOCKING: u32 = 1 << 31;

/// A reset of one register bit, before the design is built.
#[derive(Clone, Copy, Debug)]
struct ResetRec {
    /// The reset condition (true: reset), in the elaborator's graph.
    cond: Lit,
    asynchronous: bool,
    value: bool,
    pos: Pos,
}

/// One register bit, before the design is built.
#[derive(Clone, Debug)]
struct RegRec {
    /// Its leaf (net bit) in the elaborator's graph.
    leaf: u32,
    next: Lit,
    /// The clock signal (one bit) and the edge.
    clock: Lit,
    edge: Edge,
    clock_pos: Pos,
    /// The clock's net bit as written in the event list (for a gated clock's warning).
    clock_name: Option<String>,
    reset: Option<ResetRec>,
    /// Assigned with `=`: a register only if something reads it.
    lazy: bool,
    /// Recorded after an error in its block (no further checks).
    broken: bool,
    pos: Pos,
}

/// One clocked block, for the check between blocks.
#[derive(Clone, Debug, Default)]
struct BlockRec {
    /// Values the block computes (their cones are what it reads).
    roots: Vec<Lit>,
    /// Nets it assigns with `=`, with where.
    blocking: Vec<(u32, Pos)>,
    pos: Pos,
}

/// The registers found so far and what the build needs of them.
#[derive(Debug, Default)]
pub(crate) struct Clocked {
    regs: Vec<RegRec>,
    by_leaf: crate::hash::FastMap<u32, usize>,
    blocks: Vec<BlockRec>,
    /// Lazy registers reached while resolving, to finish (index into `regs`, input number).
    reached: Vec<(usize, usize)>,
    /// Eager registers with their input numbers.
    eager: Vec<(usize, usize)>,
    /// Constants `initial` blocks give, by leaf, with where (`initial.rs`).
    pub(super) initial: BTreeMap<u32, (bool, Pos)>,
    /// Bits whose initial value was an error (already reported).
    pub(super) initial_broken: BTreeSet<u32>,
}

/// The leading `if` of a block body (inside a `begin`/`end` holding only it).
fn leading_if(body: &Stmt) -> Option<(&Expr, &Stmt, Option<&Stmt>, Pos)> {
    let mut s = body;
    loop {
        match s {
            Stmt::Block(v) => {
                let mut real = v.iter().filter(|x| !matches!(x, Stmt::Null));
                let first = real.next()?;
                if real.next().is_some() {
                    return None;
                }
                s = first;
            }
            Stmt::If(c, t, e, p) => return Some((c, t, e.as_deref(), *p)),
            Stmt::Qualified(_, _, inner) => s = inner,
            _ => return None,
        }
    }
}

impl Clocked {
    /// Whether leaf `k` is a register bit.
    pub(crate) fn is_register_leaf(&self, k: u32) -> bool {
        self.by_leaf.contains_key(&k)
    }

    /// After every module is elaborated: a variable written with `=` in one clocked block
    /// and read directly by another is an error (its value there depends on the order the
    /// simulator runs the blocks in).
    pub(crate) fn check_blocks(&mut self, core: &mut Core) {
        let blocks = std::mem::take(&mut self.blocks);
        let mut writer: BTreeMap<u32, (usize, Pos)> = BTreeMap::new();
        for (b, rec) in blocks.iter().enumerate() {
            for &(n, p) in &rec.blocking {
                writer.entry(n).or_insert((b, p));
            }
        }
        if writer.is_empty() || blocks.len() < 2 {
            return;
        }
        let mut marks = crate::aig::Marks::new();
        let mut reported = BTreeSet::new();
        for (b, rec) in blocks.iter().enumerate() {
            marks.start(core.aig.len());
            let mut stack: Vec<u32> = rec.roots.iter().map(|l| l.node()).collect();
            while let Some(x) = stack.pop() {
                if !marks.mark(x as usize) {
                    continue;
                }
                match core.aig.node(x) {
                    Node::And(a, c) => {
                        stack.push(a.node());
                        stack.push(c.node());
                    }
                    Node::Input(k) => {
                        let o = core.owner[k as usize];
                        if o & UNKNOWN_BIT != 0 {
                            continue;
                        }
                        if let Some(&(wb, wp)) = writer.get(&o) {
                            if wb != b && reported.insert(o) {
                                let nm = core.net_name(o);
                                let line = wp.line;
                                core.error(
                                    rec.pos,
                                    format!("`{nm}` is assigned with `=` in the clocked block at line {line} and read by this clocked block: simulation order decides whether it sees the old or the new value, synthesis reads the register"),
                                    format!("assign `{nm}` with `<=`"),
                                );
                            }
                        }
                    }
                    Node::Const => {}
                }
            }
        }
    }

    /// Before the outputs are resolved: an input of kind register for each register bit
    /// assigned with `<=` (those assigned with `=` get theirs when first read).
    pub(in crate::front::verilog::elaborate) fn registers_begin(
        &mut self,
        core: &mut Core,
        r: &mut Resolver,
    ) {
        for i in 0..self.regs.len() {
            let (leaf, pos) = (self.regs[i].leaf, self.regs[i].pos);
            if let Some(d) = core.drivers[leaf as usize] {
                let at = core.source_pos(pos);
                let nm = core.leaf_name(leaf);
                core.error(
                    d.pos,
                    format!("multiple drivers: `{nm}` is a register of the clocked block at {at} and is driven here too"),
                    "drive each net bit from exactly one assignment, gate, port or always block",
                );
            }
            if !self.regs[i].lazy {
                let k = self.register_input(core, r, i);
                self.eager.push((i, k));
            }
        }
    }

    /// The input of register `i`, created now.
    fn register_input(&mut self, core: &Core, r: &mut Resolver, i: usize) -> usize {
        let leaf = self.regs[i].leaf;
        let lit = r.design_aig.add_input();
        r.primary.insert(leaf, lit);
        let o = core.owner[leaf as usize];
        let net = &core.nets[o as usize];
        let idx = net.vector.then(|| net.index(leaf - net.first));
        let name = core.net_name(o);
        let pos = core.source_pos(self.regs[i].pos);
        let mut bit = InputBit::port(&name, idx, Some(pos));
        bit.kind = InputKind::Register;
        r.used_names.insert(bit.name.clone());
        r.inputs.push(bit);
        r.inputs.len() - 1
    }

    /// While resolving: leaf `k` read as a register assigned with `=` (its input, created on
    /// first use).
    pub(in crate::front::verilog::elaborate) fn lazy_register(
        &mut self,
        core: &Core,
        r: &mut Resolver,
        k: u32,
    ) -> Option<Lit> {
        let &i = self.by_leaf.get(&k)?;
        if !self.regs[i].lazy {
            return None;
        }
        let input = self.register_input(core, r, i);
        self.reached.push((i, input));
        r.primary.get(&k).copied()
    }
}

impl Elaborator<'_> {
    /// One bit of an event's signal.
    fn event_bit(&mut self, scope: u32, e: &Expr) -> Option<Lit> {
        let ctx = EvalContext {
            scope,
            env: None,
            constant: false,
        };
        let v = self.eval_self(&ctx, e);
        if v.bits.len() != 1 {
            self.core.error(
                e.pos(),
                format!("unsupported: a clock or reset event of {} bits", v.bits.len()),
                "name a one-bit signal after `posedge`/`negedge`, e.g. `posedge clk` or `negedge rst_n`",
            );
            return None;
        }
        Some(v.bits[0])
    }

    /// The leaf a literal reads directly (a net bit, possibly inverted).
    fn plain_leaf(&self, l: Lit) -> Option<u32> {
        match self.core.aig.node(l.node()) {
            Node::Input(k) if self.core.owner[k as usize] & UNKNOWN_BIT == 0 => Some(k),
            _ => None,
        }
    }

    /// The clock, its edge and where it is written, and the reset with its branch (`None`
    /// after an error, which is recorded).
    #[allow(clippy::type_complexity)]
    fn clock_and_reset<'b>(
        &mut self,
        scope: u32,
        block: &'b Always,
        events: &[crate::front::verilog::ast::Event],
    ) -> Option<(Lit, Edge, Pos, Option<(Lit, &'b Stmt, bool, Pos)>)> {
        let Sensitivity::List(_, at) = &block.sensitivity else {
            return None;
        };
        let mut sigs = Vec::new();
        for ev in events {
            let l = self.event_bit(scope, &ev.expr)?;
            sigs.push((ev.edge.unwrap_or(Edge::Rising), l, ev.expr.pos()));
        }
        if sigs.len() > 2 {
            self.core.error(
                *at,
                format!("unsupported: {} events in a clocked block's event list", sigs.len()),
                "write one clock and at most one asynchronous reset, e.g. `@(posedge clk or negedge rst_n)`",
            );
            return None;
        }
        let ctx = EvalContext {
            scope,
            env: None,
            constant: false,
        };
        let lead = leading_if(&block.body);
        if sigs.len() == 2 {
            let Some((c, t, _, ipos)) = lead else {
                self.core.error(
                    *at,
                    "a clocked block with two events must begin with `if` on its reset (`if (rst) ... else ...`)",
                    "write `always @(posedge clk or posedge rst) if (rst) q <= 0; else q <= d;` (or `negedge rst_n` with `if (!rst_n)`)",
                );
                return None;
            };
            let cond = self.eval_bool(&ctx, c);
            let Some(k) = sigs.iter().position(|s| s.1.node() == cond.node()) else {
                self.core.error(
                    c.pos(),
                    "the leading `if` of a block with two events must test one of them (the asynchronous reset)",
                    "test the reset named in the event list, e.g. `if (!rst_n)` for `negedge rst_n`",
                );
                return None;
            };
            let (redge, rlit, _) = sigs[k];
            if (cond == rlit) != (redge == Edge::Rising) {
                let (ev, test) = if redge == Edge::Rising {
                    ("posedge", "high")
                } else {
                    ("negedge", "low")
                };
                self.core.error(
                    c.pos(),
                    format!(
                        "the reset's event is `{ev}` but the `if` does not test it active {test}"
                    ),
                    "test `if (rst)` for `posedge rst` and `if (!rst_n)` for `negedge rst_n`",
                );
                return None;
            }
            let (edge, clock, clock_pos) = sigs[1 - k];
            return Some((clock, edge, clock_pos, Some((cond, t, true, ipos))));
        }
        let (edge, clock, clock_pos) = sigs[0];
        let mut reset = None;
        if let Some((c, t, _, ipos)) = lead {
            let cond = self.eval_bool(&ctx, c);
            if let Some(k) = self.plain_leaf(cond) {
                if super::sync_reset::is_reset_name(&self.core.leaf_name(k)) {
                    reset = Some((cond, t, false, ipos));
                }
            }
        }
        Some((clock, edge, clock_pos, reset))
    }

    /// Elaborate a clocked `always` block in scope `scope` (written at `pos`).
    pub(crate) fn elab_clocked(&mut self, scope: u32, block: &Always, pos: Pos) {
        let Sensitivity::List(events, _) = &block.sensitivity else {
            return;
        };
        // After an error in the event list or the reset, the block's registers are still
        // recorded (holding their value), so that no follow-on "not driven" error appears.
        let found = self.clock_and_reset(scope, block, events);
        let broken = found.is_none();
        let (clock, edge, clock_pos, mut reset) =
            found.unwrap_or((Lit::FALSE, Edge::Rising, pos, None));
        let clock_name = self.plain_leaf(clock).map(|k| self.core.leaf_name(k));
        // The reset branch: constants for the registers it assigns.
        let mut reset_values: BTreeMap<(u32, u32), bool> = BTreeMap::new();
        if let Some((_, t, asynchronous, _)) = reset {
            let mut env = Env::default();
            self.exec(scope, t, &mut env);
            let mut constant = true;
            'vars: for (&key, states) in &env.vars {
                let n = key & !NON_BLOCKING;
                for (off, st) in states.iter().enumerate() {
                    match st {
                        BitState::Set(l) if l.is_const() => {
                            reset_values.insert((n, off as u32), *l == Lit::TRUE);
                        }
                        BitState::Unset(None) => {}
                        _ => {
                            constant = false;
                            if asynchronous {
                                let nm = self.core.bit_name(n, off as u32);
                                self.core.error(
                                    statement_pos(t).unwrap_or(pos),
                                    format!("unsupported: the asynchronous reset branch gives `{nm}` a value that is not constant"),
                                    "assign constants in the reset branch (the reset state); load other values on the clock",
                                );
                                break 'vars;
                            }
                        }
                    }
                }
            }
            if !constant {
                // A synchronous `if` that loads data is logic, not a reset.
                reset = None;
                reset_values.clear();
            }
        }
        // The whole body: the next values.
        let mut env = Env::default();
        self.exec(scope, &block.body, &mut env);
        let mut rec = BlockRec {
            pos,
            ..BlockRec::default()
        };
        let keys: BTreeSet<u32> = env.vars.keys().map(|k| k & !NON_BLOCKING).collect();
        for n in keys {
            let nb = env.vars.get(&(n | NON_BLOCKING));
            let bl = env.vars.get(&n);
            let ty = self.core.nets[n as usize].ty;
            if nb.is_some() && bl.is_some() {
                let nm = self.core.net_name(n);
                self.core.error(
                    pos,
                    format!("`{nm}` is assigned with both `=` and `<=` in this clocked block; simulation and synthesis read such a mix differently"),
                    "assign a register with `<=` only, and use `=` only for temporaries that are written before they are read",
                );
            }
            let (states, lazy) = match (nb, bl) {
                (Some(s), _) => (s.clone(), false),
                (None, Some(s)) => {
                    if ty == NetType::Integer {
                        continue; // loop variables
                    }
                    (s.clone(), true)
                }
                (None, None) => continue,
            };
            if lazy {
                rec.blocking.push((n, pos));
            }
            for (off, st) in states.iter().enumerate() {
                let leaf = self.core.nets[n as usize].first + off as u32;
                let cur = self.core.aig.input_lit(leaf as usize);
                let next = match *st {
                    BitState::Set(v) => v,
                    BitState::Partial {
                        value, assigned, ..
                    } => self.core.aig.mux(assigned, value, cur),
                    BitState::Unset(Some(_)) => cur,
                    BitState::Unset(None) => continue,
                };
                rec.roots.push(next);
                let r = reset.and_then(|(cond, _, asynchronous, ipos)| {
                    reset_values.get(&(n, off as u32)).map(|&value| ResetRec {
                        cond,
                        asynchronous,
                        value,
                        pos: ipos,
                    })
                });
                if r.is_none() && reset.is_some_and(|x| x.2) {
                    let nm = self.core.bit_name(n, off as u32);
                    self.core.error(
                        pos,
                        format!("unsupported: `{nm}` is assigned in a block with an asynchronous reset but not in its reset branch"),
                        "give every register of the block a reset value, or move the registers without one to a block clocked without the reset",
                    );
                }
                self.add_register(
                    RegRec {
                        leaf,
                        next,
                        clock,
                        edge,
                        clock_pos,
                        clock_name: clock_name.clone(),
                        reset: r,
                        lazy,
                        broken,
                        pos,
                    },
                    n,
                    off as u32,
                );
            }
        }
        self.lowering.clocked.blocks.push(rec);
    }

    fn add_register(&mut self, r: RegRec, n: u32, off: u32) {
        if let Some(&other) = self.lowering.clocked.by_leaf.get(&r.leaf) {
            let first = self.core.source_pos(self.lowering.clocked.regs[other].pos);
            let bn = self.core.bit_name(n, off);
            self.core.error(
                r.pos,
                format!("multiple drivers: register `{bn}` is already assigned in the clocked block at {first}"),
                "assign each register bit in exactly one always block",
            );
            return;
        }
        if let Some(d) = self.core.drivers[r.leaf as usize] {
            let first = self.core.source_pos(d.pos);
            let bn = self.core.bit_name(n, off);
            self.core.error(
                r.pos,
                format!("multiple drivers: `{bn}` is already driven at {first}"),
                "drive each net bit from exactly one assignment, gate, port or always block",
            );
            return;
        }
        self.lowering
            .clocked
            .by_leaf
            .insert(r.leaf, self.lowering.clocked.regs.len());
        self.lowering.clocked.regs.push(r);
    }

    /// `lhs <= rhs;`: the value goes to the target's non-blocking slot, which later reads
    /// in the block do not see.
    pub(crate) fn non_blocking(
        &mut self,
        scope: u32,
        lhs: &Expr,
        rhs: &Expr,
        pos: Pos,
        env: &mut Env,
    ) {
        let ctx = EvalContext {
            scope,
            env: Some(env),
            constant: false,
        };
        // A variable index: `q[i] <= v` writes bit i where i is in range, and
        // `q[b +: w] <= v` the bits the base puts the value on (`window.rs`).
        if let Some(write) = self.variable_write(&ctx, lhs, rhs) {
            let Some(write) = write else {
                return;
            };
            let n = write.net;
            let width = self.core.nets[n as usize].width as usize;
            let mut slots = env
                .vars
                .get(&(n | NON_BLOCKING))
                .cloned()
                .unwrap_or_else(|| vec![BitState::Unset(None); width]);
            for (off, hit, v) in write.bits {
                let slot = &mut slots[off];
                *slot = match *slot {
                    BitState::Set(old) => BitState::Set(self.core.aig.mux(hit, v, old)),
                    BitState::Unset(_) if hit == Lit::TRUE => BitState::Set(v),
                    BitState::Unset(_) => BitState::Partial {
                        value: v,
                        assigned: hit,
                        gap: pos,
                    },
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
            env.vars.insert(n | NON_BLOCKING, slots);
            return;
        }
        let Some(targets) = self.targets(&ctx, lhs, true) else {
            return;
        };
        let t = self.expr_type(&ctx, rhs);
        let w = targets.len().max(t.width);
        let v = self.eval(&ctx, rhs, w, t.signed);
        for (k, (n, off)) in targets.iter().enumerate() {
            if let Some(off) = off {
                let width = self.core.nets[*n as usize].width as usize;
                let e = env
                    .vars
                    .entry(*n | NON_BLOCKING)
                    .or_insert_with(|| vec![BitState::Unset(None); width]);
                e[*off as usize] = BitState::Set(v[k]);
            }
        }
    }

    /// The ports that clock registers directly (of the registers assigned with `<=`).
    fn plain_clocks(&mut self, r: &mut Resolver, todo: &[(usize, usize)]) -> BTreeSet<usize> {
        let mut out = BTreeSet::new();
        for &(i, _) in todo {
            let rec = &self.lowering.clocked.regs[i];
            if rec.broken {
                continue;
            }
            let c = rec.clock;
            let c = self.resolve(r, c);
            if let Some((k, _)) = port_bit(r, c) {
                out.insert(k);
            }
        }
        out
    }

    /// After the outputs: each register's next value, clock and reset in the design's graph.
    pub(in crate::front::verilog::elaborate) fn registers_finish(
        &mut self,
        r: &mut Resolver,
    ) -> Vec<Register> {
        let mut todo: Vec<(usize, usize)> = std::mem::take(&mut self.lowering.clocked.eager);
        let plain = self.plain_clocks(r, &todo);
        let mut warned = BTreeSet::new();
        let mut out = Vec::new();
        // Initial values (`initial.rs`), by register input: the reset state of registers
        // that have no reset.
        let mut power_on = BTreeMap::new();
        let mut at = 0;
        loop {
            if at == todo.len() {
                let more = std::mem::take(&mut self.lowering.clocked.reached);
                if more.is_empty() {
                    break;
                }
                todo.extend(more);
            }
            let (i, input) = todo[at];
            at += 1;
            let rec = self.lowering.clocked.regs[i].clone();
            if rec.broken {
                continue;
            }
            let mut next = self.resolve(r, rec.next);
            let clock = self.resolve(r, rec.clock);
            let (cin, edge, gated) = match port_bit(r, clock) {
                Some((cin, cinv)) => {
                    let edge = match (rec.edge, cinv) {
                        (Edge::Rising, false) | (Edge::Falling, true) => ClockEdge::Rising,
                        _ => ClockEdge::Falling,
                    };
                    (cin, edge, false)
                }
                None => {
                    match self.gated_clock(r, input, clock, &gate_of(&rec), &plain, &mut warned) {
                        Some(g) => {
                            let cur = r.design_aig.input_lit(input);
                            next = r.design_aig.mux(g.enable, next, cur);
                            (g.port, g.edge, true)
                        }
                        None => continue,
                    }
                }
            };
            let mut init = None;
            let mut reset = None;
            // A gated register's synchronous reset acts only where the enable lets the clock
            // through: whether it gives a reset state is left to `infer_sync_resets`.
            if let Some(rs) = rec.reset.filter(|rs| rs.asynchronous || !gated) {
                let cond = self.resolve(r, rs.cond);
                match port_bit(r, cond) {
                    Some((k, inv)) => {
                        init = Some(rs.value);
                        reset = Some(RegisterReset {
                            input: k,
                            active: !inv,
                            asynchronous: rs.asynchronous,
                        });
                    }
                    None if rs.asynchronous => {
                        let nm = r.inputs[input].name.clone();
                        self.core.error(
                            rs.pos,
                            format!("unsupported: the asynchronous reset of register `{nm}` is not a top-level input port"),
                            "reset registers from an input port of the top module",
                        );
                        continue;
                    }
                    None => {}
                }
            }
            if let Some(v) = self.lowering.clocked.initial_of(rec.leaf) {
                power_on.insert(input, v);
            }
            let bit = &r.inputs[input];
            out.push(Register {
                name: bit.name.clone(),
                port: bit.port.clone(),
                index: bit.index,
                input,
                next,
                clock: Some(r.inputs[cin].name.clone()),
                edge,
                init,
                reset,
                pos: bit.pos.clone(),
            });
        }
        out.sort_by_key(|g| g.input);
        super::sync_reset::infer_sync_resets(r, &mut out);
        for g in out
            .iter_mut()
            .filter(|g| g.init.is_none() && g.reset.is_none())
        {
            g.init = power_on.get(&g.input).copied();
        }
        out
    }
}

/// What the reading of a gated clock needs of a register.
fn gate_of(rec: &RegRec) -> super::gated_clock::ClockAt<'_> {
    super::gated_clock::ClockAt {
        posedge: rec.edge == Edge::Rising,
        pos: rec.clock_pos,
        name: rec.clock_name.as_deref(),
    }
}

/// The port bit a literal of the design's graph is (number, inverted), if it is one.
fn port_bit(r: &Resolver, l: Lit) -> Option<(usize, bool)> {
    let Node::Input(k) = r.design_aig.node(l.node()) else {
        return None;
    };
    matches!(r.inputs[k as usize].kind, InputKind::Port)
        .then_some((k as usize, l.is_complemented()))
}

/// Where a statement is written, when it records that.
fn statement_pos(s: &Stmt) -> Option<Pos> {
    match s {
        Stmt::Assign(_, _, p) | Stmt::NonBlocking(_, _, p) | Stmt::If(_, _, _, p) => Some(*p),
        Stmt::Block(v) => v.iter().find_map(statement_pos),
        Stmt::Case(c) => Some(c.pos),
        Stmt::For(f) => Some(f.pos),
        Stmt::Return(_, p) => Some(*p),
        Stmt::Qualified(_, p, _) => Some(*p),
        Stmt::Null => None,
    }
}
