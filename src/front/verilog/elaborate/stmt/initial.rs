//! `initial` blocks and variables' initial values (`reg [3:0] n = 0;` is `initial n = 0;`):
//! the constants they give at time 0 (IEEE 1364-2005 clauses 6.2.1 and 9.9.1, from memory).
//!
//! The body runs symbolically like a combinational block (`always.rs`: blocking and
//! non-blocking assignments, `if`, `case`, constant `for` loops); every bit it assigns must
//! come out a constant. What a constant then means depends on what drives the bit:
//! - a register bit without a reset starts from it (its power-on value, the reset state the
//!   clocked check starts from); a register with a reset starts from the reset's value, and
//!   its initial value is not used (the reset state is the state after reset);
//! - a bit nothing else drives is that constant for good (a table of constant words read as
//!   a ROM: `reg [7:0] t [0:15]; initial begin t[0] = 8'h12; ... end`);
//! - a bit that logic drives ignores it, with a warning (synthesis drops it, and a
//!   simulator overwrites it as soon as the logic runs).
//!
//! `integer` variables assigned in the body (loop counters) are not recorded.

use super::super::context::{BitState, Env};
use super::super::{Core, Elaborator};
use super::clocked::{Clocked, NON_BLOCKING};
use crate::aig::Lit;
use crate::front::verilog::ast::{Dir, NetType, Stmt};
use crate::front::verilog::pos::Pos;
use std::collections::BTreeSet;

impl Elaborator<'_> {
    /// Run one `initial` body in scope `scope` and record the constant each bit gets.
    pub(crate) fn elab_initial(&mut self, scope: u32, body: &Stmt, pos: Pos) {
        let mut env = Env::default();
        self.exec(scope, body, &mut env);
        for (key, states) in &env.vars {
            let n = key & !NON_BLOCKING;
            let net = &self.core.nets[n as usize];
            if net.ty == NetType::Integer {
                continue;
            }
            let (first, input) = (net.first, net.dir == Some(Dir::Input));
            let nm = self.core.net_name(n);
            if input {
                self.core.error(
                    pos,
                    format!("`initial` assigns the input port `{nm}`"),
                    "give initial values to variables of the module only; inputs come from outside",
                );
                continue;
            }
            let mut problem = None;
            for (off, st) in states.iter().enumerate() {
                let leaf = first + off as u32;
                let broken = match *st {
                    BitState::Set(l) if l == Lit::TRUE || l == Lit::FALSE => {
                        let v = l == Lit::TRUE;
                        let prior = self.lowering.clocked.initial.insert(leaf, (v, pos));
                        if prior.is_some_and(|(pv, _)| pv != v) {
                            problem.get_or_insert("is given two different initial values");
                        }
                        false
                    }
                    BitState::Set(_) => {
                        problem.get_or_insert("gets an initial value that is not a constant");
                        true
                    }
                    BitState::Partial { .. } | BitState::Unset(Some(_)) => {
                        problem.get_or_insert("gets an initial value on some paths only");
                        true
                    }
                    BitState::Unset(None) => false,
                };
                if broken {
                    // Reported below; kept so that no "never driven" error follows.
                    self.lowering.clocked.initial_broken.insert(leaf);
                }
            }
            if let Some(p) = problem {
                self.core.error(
                    pos,
                    format!("`{nm}` {p}"),
                    "an `initial` block (or a declaration's `= value`) may give constants only: power-on values of registers and tables of constant words",
                );
            }
        }
    }
}

impl Clocked {
    /// After every module is elaborated: bits with an initial value that are not registers
    /// are driven by their constant when nothing else drives them (a ROM table); a bit that
    /// logic drives keeps the logic, with a warning. Registers take theirs when the design is
    /// built (`registers_finish`).
    pub(crate) fn apply_initial(&mut self, core: &mut Core) {
        let mut warned = BTreeSet::new();
        for &leaf in &self.initial_broken {
            if !self.is_register_leaf(leaf) && core.drivers[leaf as usize].is_none() {
                let o = core.owner[leaf as usize];
                let off = leaf - core.nets[o as usize].first;
                // A placeholder: the design is refused for the error already reported.
                core.drive(o, off, Lit::FALSE, core.nets[o as usize].pos);
            }
        }
        for (&leaf, &(v, pos)) in &self.initial {
            if self.is_register_leaf(leaf) {
                continue;
            }
            let o = core.owner[leaf as usize];
            if core.drivers[leaf as usize].is_some() {
                if warned.insert(o) {
                    let nm = core.net_name(o);
                    core.warn(
                        pos,
                        format!("the initial value of `{nm}` is not used: logic drives it (it is not a register)"),
                    );
                }
                continue;
            }
            let off = leaf - core.nets[o as usize].first;
            let lit = if v { Lit::TRUE } else { Lit::FALSE };
            core.drive(o, off, lit, pos);
        }
    }

    /// The initial value of the register bit at `leaf`, if an `initial` gave one.
    pub(crate) fn initial_of(&self, leaf: u32) -> Option<bool> {
        self.initial.get(&leaf).map(|&(v, _)| v)
    }
}
