//! From drivers to the design: walks from the top's output bits back through each net bit's
//! driver (an explicit stack, so a million-gate chain is fine), builds the design's AIG,
//! creates unknown-value inputs on first use, reports undriven nets and combinational
//! loops, and derives the gate-level netlist.

use super::super::ast::Dir;
use super::super::pos::Pos;
use super::super::symbols::Sym;
use super::{Elaborator, Symbol, UNKNOWN_BIT};
use crate::aig::{Aig, Lit, Node};
use crate::design::{bit_name, Cell, Design, Format, InputBit, InputKind, Netlist, OutputBit};
use std::collections::{BTreeMap, BTreeSet, HashMap, HashSet};

const NONE: u32 = u32::MAX;

pub(super) struct Resolver {
    /// The design's AIG being built (the elaborator's leaves mapped to it).
    pub(super) design_aig: Aig,
    memo: Vec<u32>,
    busy: Vec<bool>,
    pub(super) primary: HashMap<u32, Lit>,
    pub(super) inputs: Vec<InputBit>,
    pub(super) used_names: HashSet<String>,
    undriven: BTreeSet<u32>,
}

impl Resolver {
    fn map(&self, l: Lit) -> Lit {
        let m = self.memo[l.index()];
        let base = if m == NONE {
            Lit::FALSE
        } else {
            Lit::from_raw(m)
        };
        base.xor_complement(l.is_complemented())
    }
}

impl Elaborator<'_> {
    pub(super) fn resolve(&mut self, r: &mut Resolver, root: Lit) -> Lit {
        let mut stack = vec![root.node()];
        while let Some(&n) = stack.last() {
            let ni = n as usize;
            if r.memo[ni] != NONE {
                stack.pop();
                continue;
            }
            match self.core.aig.node(n) {
                Node::Const => {
                    r.memo[ni] = Lit::FALSE.raw();
                    stack.pop();
                }
                Node::And(a, b) => {
                    let mut pushed = false;
                    for c in [a, b] {
                        if r.memo[c.index()] == NONE {
                            if r.busy[c.index()] {
                                self.report_loop(r, &stack, c.node());
                                r.memo[c.index()] = Lit::FALSE.raw();
                            } else {
                                stack.push(c.node());
                                pushed = true;
                            }
                        }
                    }
                    if !pushed {
                        let v = r.design_aig.and(r.map(a), r.map(b));
                        r.memo[ni] = v.raw();
                        stack.pop();
                    }
                }
                Node::Input(k) => {
                    let o = self.core.owner[k as usize];
                    if o & UNKNOWN_BIT != 0 {
                        let lit = self.new_unknown(r, (o & !UNKNOWN_BIT) as usize);
                        r.memo[ni] = lit.raw();
                        stack.pop();
                    } else if let Some(&p) = r.primary.get(&k) {
                        r.memo[ni] = p.raw();
                        stack.pop();
                    } else if let Some(p) = self.lowering.clocked.lazy_register(&self.core, r, k) {
                        r.memo[ni] = p.raw();
                        stack.pop();
                    } else if let Some(d) = self.core.drivers[k as usize] {
                        if !r.busy[ni] {
                            r.busy[ni] = true;
                            let c = d.lit.index();
                            if r.memo[c] == NONE {
                                if r.busy[c] {
                                    self.report_loop(r, &stack, d.lit.node());
                                    r.memo[c] = Lit::FALSE.raw();
                                } else {
                                    stack.push(d.lit.node());
                                    continue;
                                }
                            }
                        }
                        r.memo[ni] = r.map(d.lit).raw();
                        r.busy[ni] = false;
                        stack.pop();
                    } else {
                        r.undriven.insert(o);
                        r.memo[ni] = Lit::FALSE.raw();
                        stack.pop();
                    }
                }
            }
        }
        r.map(root)
    }

    fn report_loop(&mut self, r: &Resolver, stack: &[u32], back: u32) {
        let start = stack.iter().rposition(|&n| n == back).unwrap_or(0);
        let mut names = Vec::new();
        let mut pos = None;
        for &n in &stack[start..] {
            if let Node::Input(k) = self.core.aig.node(n) {
                if r.busy[n as usize] && self.core.owner[k as usize] & UNKNOWN_BIT == 0 {
                    let nm = self.core.leaf_name(k);
                    if !names.contains(&nm) {
                        names.push(nm);
                    }
                    if pos.is_none() {
                        pos = self.core.drivers[k as usize].map(|d| d.pos);
                    }
                }
            }
        }
        let shown = if names.len() > 12 {
            format!("{}, ... ({} nets)", names[..12].join(", "), names.len())
        } else {
            names.join(", ")
        };
        let msg = format!("combinational loop through {shown}");
        match pos {
            Some(p) => self
                .core
                .error(p, msg, "break the loop: a net must not depend on itself"),
            None => self.core.errors.push(
                crate::diag::Diagnostic::error(None, msg)
                    .with_help("break the loop: a net must not depend on itself"),
            ),
        }
    }

    fn new_unknown(&mut self, r: &mut Resolver, u: usize) -> Lit {
        let info = self.core.unknowns[u].clone();
        let sp = self.core.source_pos(info.pos);
        let prefix = &self.core.scopes[info.scope as usize].prefix;
        let mut port = format!("{prefix}x@{}:{}:{}", sp.file, sp.line, sp.col);
        let mut k = 1;
        while r
            .used_names
            .contains(&bit_name(&port, Some(info.bit as i64)))
        {
            k += 1;
            port = format!("{prefix}x@{}:{}:{}#{k}", sp.file, sp.line, sp.col);
        }
        let name = bit_name(&port, Some(info.bit as i64));
        r.used_names.insert(name.clone());
        let lit = r.design_aig.add_input();
        r.inputs.push(InputBit {
            name,
            port,
            index: Some(info.bit as i64),
            kind: InputKind::Unknown {
                pos: sp.clone(),
                what: info.what,
            },
            pos: Some(sp),
        });
        lit
    }
}

/// Build the design of top module `m` (elaborated in scope `scope`).
pub fn build(e: &mut Elaborator, top: Sym, ports: &[(Sym, Pos)], scope: u32) -> Design {
    let mut r = Resolver {
        design_aig: if e.core.aig.is_written() {
            Aig::as_written()
        } else {
            Aig::new()
        },
        memo: Vec::new(),
        busy: Vec::new(),
        primary: HashMap::new(),
        inputs: Vec::new(),
        used_names: HashSet::new(),
        undriven: BTreeSet::new(),
    };
    let mut outs: Vec<u32> = Vec::new();
    for (ps, ppos) in ports {
        let n = match e.core.scopes[scope as usize].syms.get(ps) {
            Some(Symbol::Net(n)) => *n,
            _ => {
                let pn = e.core.name(*ps);
                e.core.error(
                    *ppos,
                    format!("port `{pn}` has no declaration"),
                    "declare the port `input` or `output` inside the module",
                );
                continue;
            }
        };
        let net = e.core.nets[n as usize].clone();
        match net.dir {
            Some(Dir::Input) => {
                for off in 0..net.width {
                    let leaf = net.first + off;
                    if let Some(d) = e.core.drivers[leaf as usize] {
                        let pn = e.core.net_name(n);
                        e.core.error(
                            d.pos,
                            format!("input port `{pn}` is driven inside the module"),
                            "drive an internal wire instead; an input port gets its value from outside"
                        );
                    }
                    let lit = r.design_aig.add_input();
                    r.primary.insert(leaf, lit);
                    let idx = net.vector.then(|| net.index(off));
                    let pn = e.core.net_name(n);
                    r.used_names.insert(bit_name(&pn, idx));
                    r.inputs
                        .push(InputBit::port(&pn, idx, Some(e.core.source_pos(net.pos))));
                }
            }
            Some(Dir::Output) => outs.push(n),
            None => {
                let pn = e.core.name(*ps);
                e.core.error(
                    *ppos,
                    format!("port `{pn}` has no `input` or `output` declaration"),
                    "declare the port `input` or `output` inside the module",
                );
            }
        }
    }
    r.memo = vec![NONE; e.core.aig.len()];
    r.busy = vec![false; e.core.aig.len()];
    e.lowering.clocked.registers_begin(&mut e.core, &mut r);
    let mut outputs = Vec::new();
    for n in outs {
        let net = e.core.nets[n as usize].clone();
        let pn = e.core.net_name(n);
        let mut undriven = false;
        for off in 0..net.width {
            let leaf = net.first + off;
            if e.core.drivers[leaf as usize].is_none()
                && !r.primary.contains_key(&leaf)
                && !e.lowering.clocked.is_register_leaf(leaf)
            {
                undriven = true;
            }
            let root = e.core.aig.input_lit(leaf as usize);
            let lit = e.resolve(&mut r, root);
            let idx = net.vector.then(|| net.index(off));
            outputs.push(OutputBit::new(
                &pn,
                idx,
                lit,
                Some(e.core.source_pos(net.pos)),
            ));
        }
        if undriven {
            e.core.error(
                net.pos,
                format!("output `{pn}` is not driven (some or all of its bits)"),
                "assign every bit of the output",
            );
            r.undriven.remove(&n);
        }
    }
    for n in std::mem::take(&mut r.undriven) {
        let net = &e.core.nets[n as usize];
        let nm = e.core.net_name(n);
        let (pos, inport) = (net.pos, net.dir == Some(Dir::Input) && net.scope != scope);
        if inport {
            e.core.error(
                pos,
                format!("input port `{nm}` is not connected but its value is used"),
                "connect the port in the instance",
            );
        } else {
            e.core.error(
                pos,
                format!("`{nm}` is used but never driven (some or all of its bits)"),
                "assign it, or connect it to a driver",
            );
        }
    }
    let registers = e.registers_finish(&mut r);
    log::debug!(
        "verilog: design graph of {} AND nodes built; memory {}",
        r.design_aig.num_ands(),
        crate::host::now_note()
    );
    let mut netlist = netlist(e, &r, &outputs_leaves(e, ports, scope));
    // The netlist as written holds no registers: not the whole design.
    netlist.complete &= registers.is_empty();
    // A complete netlist names its own gates; RTL keeps the names of the nets instead.
    let net_names = if netlist.complete {
        Default::default()
    } else {
        net_names(e, &r)
    };
    let name = e.core.name(top).to_string();
    let d = Design {
        name,
        format: Format::Verilog,
        aig: r.design_aig,
        inputs: r.inputs,
        outputs,
        netlist: Some(netlist),
        warnings: std::mem::take(&mut e.core.warnings),
        registers,
        net_names,
    };
    if e.core.errors.is_empty() {
        d.debug_check();
    }
    d
}

/// Net names per AND node of the design's AIG (see [`Design::net_names`]): every bit of every
/// net the resolver reached, in declaration order, those carrying the node itself before those
/// carrying its complement (`~w`); at most [`NAMES_PER_NODE`] per node.
fn net_names(e: &Elaborator, r: &Resolver) -> BTreeMap<u32, Vec<String>> {
    // (node, inverted, net, bit) per named bit, in declaration order; a stable sort by node
    // and polarity keeps that order within each node's plain and inverted names. No name is
    // written for a bit past the first few of its node, and each list is allocated at its
    // length (a million-net design keeps a million of them).
    let mut named: Vec<(u32, bool, u32, u32)> = Vec::new();
    for (n, net) in e.core.nets.iter().enumerate() {
        for off in 0..net.width {
            let leaf = (net.first + off) as usize;
            let m = r.memo.get(e.core.aig.input_lit(leaf).index()).copied();
            let Some(m) = m.filter(|&m| m != NONE) else {
                continue;
            };
            let lit = Lit::from_raw(m);
            if !matches!(r.design_aig.node(lit.node()), Node::And(..)) {
                continue;
            }
            named.push((lit.node(), lit.is_complemented(), n as u32, off));
        }
    }
    named.sort_by_key(|&(node, inverted, _, _)| (node, inverted));
    named
        .chunk_by(|a, b| a.0 == b.0)
        .map(|group| {
            let names: Vec<String> = group
                .iter()
                .take(NAMES_PER_NODE)
                .map(|&(_, inverted, n, off)| {
                    let nm = e.core.bit_name(n, off);
                    if inverted {
                        format!("~{nm}")
                    } else {
                        nm
                    }
                })
                .collect();
            (group[0].0, names)
        })
        .collect()
}

/// Net names kept per AIG node at most.
const NAMES_PER_NODE: usize = 3;

fn outputs_leaves(e: &Elaborator, ports: &[(Sym, Pos)], scope: u32) -> Vec<u32> {
    let mut v = Vec::new();
    for (ps, _) in ports {
        if let Some(Symbol::Net(n)) = e.core.scopes[scope as usize].syms.get(ps) {
            let net = &e.core.nets[*n as usize];
            if net.dir == Some(Dir::Output) {
                v.extend(net.first..net.first + net.width);
            }
        }
    }
    v
}

/// The gate-level netlist: one signal per net bit after merging plain connections
/// (port connections, `assign a = b;`).
fn netlist(e: &Elaborator, r: &Resolver, outs: &[u32]) -> Netlist {
    let nleaves = e.core.owner.len();
    let mut gate_out = vec![false; nleaves];
    for gr in &e.flattening.gates {
        gate_out[gr.out as usize] = true;
    }
    let as_leaf = |l: Lit| -> Option<u32> {
        if l.is_complemented() {
            return None;
        }
        match e.core.aig.node(l.node()) {
            Node::Input(k) if e.core.owner[k as usize] & UNKNOWN_BIT == 0 => Some(k),
            _ => None,
        }
    };
    // The representative of a leaf: the first gate output or undriven leaf found by
    // following plain connections (memoized, so a long chain of `assign a = b;` is walked
    // once; a loop of plain connections, already reported, stops where it closes).
    let mut rep_of: Vec<u32> = vec![NONE; nleaves];
    let mut path: Vec<u32> = Vec::new();
    let mut rep = |k: u32| -> u32 {
        let mut cur = k;
        let found = loop {
            if rep_of[cur as usize] != NONE {
                break rep_of[cur as usize];
            }
            if gate_out[cur as usize] {
                break cur;
            }
            path.push(cur);
            // Marks the leaf as on the current path: a loop ends the walk there.
            rep_of[cur as usize] = cur;
            match e.core.drivers[cur as usize].and_then(|d| as_leaf(d.lit)) {
                Some(next) => cur = next,
                _ => break cur,
            }
        };
        for p in path.drain(..) {
            rep_of[p as usize] = found;
        }
        found
    };
    let mut complete = r.inputs.iter().all(|b| !b.is_unknown());
    let mut sig: Vec<u32> = vec![NONE; nleaves];
    let mut nl = Netlist::default();
    nl.cells.reserve(e.flattening.gates.len());
    let mut signal = |k: u32, nl: &mut Netlist| -> u32 {
        let k = rep(k) as usize;
        if sig[k] == NONE {
            nl.signals.push(e.core.leaf_name(k as u32));
            sig[k] = (nl.signals.len() - 1) as u32;
        }
        sig[k]
    };
    for &k in r.primary.keys().collect::<BTreeSet<_>>() {
        let s = signal(k, &mut nl);
        nl.inputs.push(s);
    }
    for &k in outs {
        let s = signal(k, &mut nl);
        nl.outputs.push(s);
    }
    for gr in &e.flattening.gates {
        let ins = &e.flattening.gate_ins[gr.first as usize..(gr.first + gr.count) as usize];
        let ins: Option<Vec<u32>> = ins.iter().map(|&l| as_leaf(l)).collect();
        match ins {
            Some(ins) => {
                let inputs = ins.into_iter().map(|k| signal(k, &mut nl)).collect();
                let output = signal(gr.out, &mut nl);
                nl.cells.push(Cell {
                    kind: gr.kind,
                    inputs,
                    output,
                    pos: Some(e.core.source_pos(gr.pos)),
                });
            }
            None => complete = false,
        }
    }
    // Every reached net bit must be a port input, a gate output or a plain connection.
    for (k, d) in e.core.drivers.iter().enumerate() {
        let node = e.core.aig.input_lit(k).index();
        if r.memo[node] == NONE || e.core.owner[k] & UNKNOWN_BIT != 0 {
            continue;
        }
        if let Some(d) = d {
            if !gate_out[k] && as_leaf(d.lit).is_none() {
                complete = false;
                break;
            }
        }
    }
    nl.complete = complete;
    nl
}
