//! Gated clocks read as a clock and an enable: a register whose clock is not a top-level
//! input port but whose triggering signal (the clock, or its complement for `negedge`) is an
//! AND of a port bit and other logic (`wire gclk = clk & en; always @(posedge gclk)`, or
//! `clk | ~en` with `negedge`, through any wires, assigns and module ports) is read as clocked
//! by that port's edge and loading only where the rest of the AND (the enable) is 1.
//!
//! That reading is the usual one for a clock gate (common practice): it holds when the enable
//! does not change while the port is in the phase the AND passes (high for `clk & en`), so the
//! gated signal has an edge exactly where the port has one and the enable is 1. Each gated
//! clock gets one warning saying so. Anything else (an enable that reads the clock itself, an
//! OR of the clock, several ports none of which is clearly the clock) stays an error.

use super::super::resolve::Resolver;
use super::super::Elaborator;
use crate::aig::{Lit, Node};
use crate::design::{ClockEdge, InputKind};
use crate::front::verilog::pos::Pos;
use std::collections::BTreeSet;

/// At most this many terms in the AND of a gated clock (beyond that it is not a clock gate).
const MAX_TERMS: usize = 64;

/// A gated clock split into the port's edge and the enable.
#[derive(Clone, Copy, Debug)]
pub(super) struct Gate {
    /// The port input that clocks the register.
    pub(super) port: usize,
    pub(super) edge: ClockEdge,
    /// The enable, in the design's graph.
    pub(super) enable: Lit,
}

/// Why a clock is neither a port nor a clock gate this reader understands.
pub(super) enum Refusal {
    /// Not an AND with a port bit in it.
    NotAGate,
    /// Several ports in the AND, none of them clearly the clock (their names).
    Ambiguous(Vec<String>),
    /// The enable reads the clock port itself (its name).
    EnableReadsClock(String),
}

/// The terms of the AND that `t` is (non-complemented AND nodes opened), or `None` when it is
/// not an AND or has too many terms.
fn and_terms(r: &Resolver, t: Lit) -> Option<Vec<Lit>> {
    if t.is_complemented() || !matches!(r.design_aig.node(t.node()), Node::And(..)) {
        return None;
    }
    let mut out = Vec::new();
    let mut stack = vec![t];
    while let Some(l) = stack.pop() {
        match r.design_aig.node(l.node()) {
            Node::And(a, b) if !l.is_complemented() => {
                stack.push(b);
                stack.push(a);
            }
            _ => {
                if !out.contains(&l) {
                    out.push(l);
                }
                if out.len() > MAX_TERMS {
                    return None;
                }
            }
        }
    }
    Some(out)
}

/// The port bit a literal is (input number, inverted), if it is one.
fn port_of(r: &Resolver, l: Lit) -> Option<(usize, bool)> {
    let Node::Input(k) = r.design_aig.node(l.node()) else {
        return None;
    };
    matches!(r.inputs[k as usize].kind, InputKind::Port)
        .then_some((k as usize, l.is_complemented()))
}

/// Whether a name reads as a clock (`clk`, `clock`, any case, in its last component).
fn is_clock_name(name: &str) -> bool {
    let name = name.to_ascii_lowercase();
    let base = name.rsplit('.').next().unwrap_or(&name);
    base.contains("clk") || base.contains("clock")
}

/// Whether the cone of `root` reads input `k`.
fn reads_input(r: &Resolver, root: Lit, k: usize) -> bool {
    let mut seen = BTreeSet::new();
    let mut stack = vec![root.node()];
    while let Some(n) = stack.pop() {
        if !seen.insert(n) {
            continue;
        }
        match r.design_aig.node(n) {
            Node::And(a, b) => {
                stack.push(a.node());
                stack.push(b.node());
            }
            Node::Input(i) if i as usize == k => return true,
            _ => {}
        }
    }
    false
}

/// Split the clock `clock` (read at `edge`: `true` for `posedge`) into a port's edge and an
/// enable. `plain` holds the ports that clock other registers directly (they win when the
/// AND holds several ports).
pub(super) fn split(
    r: &mut Resolver,
    clock: Lit,
    posedge: bool,
    plain: &BTreeSet<usize>,
) -> Result<Gate, Refusal> {
    let t = clock.xor_complement(!posedge);
    let terms = and_terms(r, t).ok_or(Refusal::NotAGate)?;
    let ports: Vec<(usize, Lit)> = terms
        .iter()
        .filter_map(|&l| port_of(r, l).map(|(k, _)| (k, l)))
        .collect();
    let pick = |keep: &dyn Fn(usize) -> bool| -> Vec<(usize, Lit)> {
        ports.iter().copied().filter(|&(k, _)| keep(k)).collect()
    };
    let chosen = match ports.len() {
        0 => return Err(Refusal::NotAGate),
        1 => ports[0],
        _ => {
            let by_use = pick(&|k| plain.contains(&k));
            let by_name = pick(&|k| is_clock_name(&r.inputs[k].name));
            match (by_use.len(), by_name.len()) {
                (1, _) => by_use[0],
                (_, 1) => by_name[0],
                _ => {
                    let names = ports.iter().map(|&(k, _)| r.inputs[k].name.clone());
                    return Err(Refusal::Ambiguous(names.collect()));
                }
            }
        }
    };
    let (port, lit) = chosen;
    let mut enable = Lit::TRUE;
    for &l in terms.iter().filter(|&&l| l != lit) {
        enable = r.design_aig.and(enable, l);
    }
    if reads_input(r, enable, port) {
        return Err(Refusal::EnableReadsClock(r.inputs[port].name.clone()));
    }
    let edge = if lit.is_complemented() {
        ClockEdge::Falling
    } else {
        ClockEdge::Rising
    };
    Ok(Gate { port, edge, enable })
}

/// A register's clock as its event list writes it.
pub(super) struct ClockAt<'a> {
    /// `posedge` (else `negedge`).
    pub(super) posedge: bool,
    pub(super) pos: Pos,
    /// The net bit named in the event list, when it is one.
    pub(super) name: Option<&'a str>,
}

impl Elaborator<'_> {
    /// The gated clock of register `input` (its clock `clock` is no port): the port's edge and
    /// the enable, with one warning or error per gated clock (`warned`); `None` after an error.
    pub(super) fn gated_clock(
        &mut self,
        r: &mut Resolver,
        input: usize,
        clock: Lit,
        at: &ClockAt<'_>,
        plain: &BTreeSet<usize>,
        warned: &mut BTreeSet<u32>,
    ) -> Option<Gate> {
        let nm = r.inputs[input].name.clone();
        let gated = at.name.unwrap_or("the clock").to_string();
        let help = "clock registers from an input port of the top module, or gate it as `clk & en` (`posedge`) or `clk | ~en` (`negedge`) with `clk` an input port";
        // One message per gated clock and edge (the signal whose rising edge clocks).
        let first = warned.insert(clock.xor_complement(!at.posedge).raw());
        let found = split(r, clock, at.posedge, plain);
        if !first {
            return found.ok();
        }
        match found {
            Ok(g) => {
                let port = r.inputs[g.port].name.clone();
                let (edge, phase) = match g.edge {
                    ClockEdge::Rising => ("posedge", "high"),
                    ClockEdge::Falling => ("negedge", "low"),
                };
                self.core.warn(
                    at.pos,
                    format!("gated clock `{gated}` (of register `{nm}` and any others it clocks) read as `{edge} {port}` with an enable: the registers load where the rest of the gate is 1 and hold elsewhere; this assumes the enable does not change while `{port}` is {phase}, so that the gated clock has an edge exactly where `{port}` has one and the enable is 1"),
                );
                Some(g)
            }
            Err(Refusal::NotAGate) => {
                self.core.error(
                    at.pos,
                    format!("unsupported: the clock of register `{nm}` is not a top-level input port (a derived clock, or a gate other than the AND of a port and an enable)"),
                    help,
                );
                None
            }
            Err(Refusal::Ambiguous(ports)) => {
                let list = ports
                    .iter()
                    .map(|p| format!("`{p}`"))
                    .collect::<Vec<_>>()
                    .join(", ");
                self.core.error(
                    at.pos,
                    format!("unsupported: the gated clock `{gated}` of register `{nm}` is an AND of the input ports {list}, and none of them is clearly the clock (clocks another register directly, or is named like a clock)"),
                    "name the clock port `clk`/`clock` (or clock another register from it), or write the enable as logic: `if (en) q <= d;`",
                );
                None
            }
            Err(Refusal::EnableReadsClock(port)) => {
                self.core.error(
                    at.pos,
                    format!("unsupported: the gated clock `{gated}` of register `{nm}` has an enable that reads the clock `{port}` itself"),
                    help,
                );
                None
            }
        }
    }
}
