//! The generators' tiny gate-netlist IR ([`Circuit`]): ports, named nets and gates in
//! topological order. It prints as readable Verilog (gate primitives, `?:` for 2:1 cells, or the
//! behavioural one-liners of the spec style) or as bench text, and simulates 64 patterns a word.
//!
//! **Invariant:** every gate reads only nets defined earlier (input bits, or outputs of gates
//! before it in [`Circuit::gates`]); every net has one name and at most one driver.
//!
//! Bench has no 2:1 cell and no constants, so the bench printer writes a 2:1 cell `o = s ? t : e`
//! as `o__t = AND(s, t)`, `o__e = AND(s__n, e)`, `o = OR(o__t, o__e)` with one shared
//! `s__n = NOT(s)` per select net, and a constant as `AND(x, const__n)` (0) or `OR(x, const__n)`
//! (1) with `const__n = NOT(x)` for the first input bit `x`: the constant then has `x` in its
//! structural cone but not in its support. Bit `i` of bus `d` is named `d[i]` in both formats.

use crate::rng::SplitMix64 as Rng;
use std::collections::HashSet;

mod print;

/// A net (signal) of a [`Circuit`].
#[derive(Copy, Clone, Debug, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub struct Net(u32);

impl Net {
    /// Index into the circuit's net table.
    pub fn index(self) -> usize {
        self.0 as usize
    }
}

/// Gate operations.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub enum Op {
    /// AND of all inputs.
    And,
    /// NAND of all inputs.
    Nand,
    /// OR of all inputs.
    Or,
    /// NOR of all inputs.
    Nor,
    /// XOR (odd parity) of all inputs.
    Xor,
    /// XNOR (even parity) of all inputs.
    Xnor,
    /// Inverter (one input).
    Not,
    /// Buffer (one input).
    Buf,
    /// 2:1 cell, inputs `[s, t, e]`: `s ? t : e`.
    Mux2,
    /// Constant 0 (no inputs).
    Const0,
    /// Constant 1 (no inputs).
    Const1,
}

impl Op {
    /// Lower-case name, as a Verilog primitive where one exists.
    pub fn name(self) -> &'static str {
        match self {
            Op::And => "and",
            Op::Nand => "nand",
            Op::Or => "or",
            Op::Nor => "nor",
            Op::Xor => "xor",
            Op::Xnor => "xnor",
            Op::Not => "not",
            Op::Buf => "buf",
            Op::Mux2 => "mux2",
            Op::Const0 => "const0",
            Op::Const1 => "const1",
        }
    }

    fn bench(self) -> &'static str {
        match self {
            Op::And => "AND",
            Op::Nand => "NAND",
            Op::Or => "OR",
            Op::Nor => "NOR",
            Op::Xor => "XOR",
            Op::Xnor => "XNOR",
            Op::Not => "NOT",
            Op::Buf => "BUFF",
            Op::Mux2 | Op::Const0 | Op::Const1 => unreachable!("expanded by the bench printer"),
        }
    }

    /// Whether `n` inputs suit the operation.
    pub fn arity_ok(self, n: usize) -> bool {
        match self {
            Op::Not | Op::Buf => n == 1,
            Op::Mux2 => n == 3,
            Op::Const0 | Op::Const1 => n == 0,
            _ => n >= 2,
        }
    }

    /// Evaluate on 64 patterns.
    fn eval(self, ins: &[u64]) -> u64 {
        match self {
            Op::And => ins.iter().fold(!0, |a, &b| a & b),
            Op::Nand => !ins.iter().fold(!0, |a, &b| a & b),
            Op::Or => ins.iter().fold(0, |a, &b| a | b),
            Op::Nor => !ins.iter().fold(0, |a, &b| a | b),
            Op::Xor => ins.iter().fold(0, |a, &b| a ^ b),
            Op::Xnor => !ins.iter().fold(0, |a, &b| a ^ b),
            Op::Not => !ins[0],
            Op::Buf => ins[0],
            Op::Mux2 => (ins[0] & ins[1]) | (!ins[0] & ins[2]),
            Op::Const0 => 0,
            Op::Const1 => !0,
        }
    }
}

/// One gate: `out = op(ins)`.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Gate {
    /// The operation.
    pub op: Op,
    /// Fan-in nets.
    pub ins: Vec<Net>,
    /// The driven net.
    pub out: Net,
}

/// A port: a bus of `width` bits, or a scalar.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Port {
    /// The port name.
    pub name: String,
    /// Number of bits.
    pub width: usize,
    /// A scalar port (declared without a range, bit named without an index).
    pub scalar: bool,
}

/// A condition on the inputs outside which the circuit's outputs are don't-cares: the value of
/// input port `port` (unsigned) is below `limit` (a selector's select in range).
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Care {
    /// Input port index.
    pub port: usize,
    /// Exclusive upper limit of its value.
    pub limit: u64,
}

#[derive(Clone, Debug, PartialEq, Eq)]
enum NetName {
    In(u32, u32),
    Out(u32, u32),
    Wire(Box<str>),
}

/// A generated circuit. See the module documentation for its invariant.
#[derive(Clone, Debug)]
pub struct Circuit {
    /// Verilog module name.
    pub module: String,
    /// Header comment lines (without comment markers).
    pub notes: Vec<String>,
    /// Verilog body of a behavioural (spec) description; empty for a gate-level one. The gates
    /// then still hold the bench form of the same function.
    pub behaviour: Vec<String>,
    /// Inputs outside this condition are don't-cares.
    pub care: Option<Care>,
    inputs: Vec<Port>,
    input_nets: Vec<Vec<Net>>,
    outputs: Vec<Port>,
    output_nets: Vec<Vec<Net>>,
    names: Vec<NetName>,
    gates: Vec<Gate>,
}

impl Circuit {
    /// An empty circuit for module `module`.
    pub fn new(module: &str) -> Circuit {
        Circuit {
            module: module.to_string(),
            notes: Vec::new(),
            behaviour: Vec::new(),
            care: None,
            inputs: Vec::new(),
            input_nets: Vec::new(),
            outputs: Vec::new(),
            output_nets: Vec::new(),
            names: Vec::new(),
            gates: Vec::new(),
        }
    }

    fn new_net(&mut self, name: NetName) -> Net {
        let n = Net(self.names.len() as u32);
        self.names.push(name);
        n
    }

    /// Declare an input bus of `width` bits; returns its bits, bit 0 first.
    pub fn input(&mut self, name: &str, width: usize) -> Vec<Net> {
        self.input_port(name, width, false)
    }

    /// Declare a scalar input.
    pub fn input_scalar(&mut self, name: &str) -> Net {
        self.input_port(name, 1, true)[0]
    }

    fn input_port(&mut self, name: &str, width: usize, scalar: bool) -> Vec<Net> {
        let p = self.inputs.len() as u32;
        let bits: Vec<Net> = (0..width as u32)
            .map(|b| self.new_net(NetName::In(p, b)))
            .collect();
        self.inputs.push(Port {
            name: name.to_string(),
            width,
            scalar,
        });
        self.input_nets.push(bits.clone());
        bits
    }

    /// Add gate `op(ins)` driving a new net named `name`.
    pub fn gate(&mut self, op: Op, ins: Vec<Net>, name: impl Into<String>) -> Net {
        assert!(
            op.arity_ok(ins.len()),
            "generator bug: {} with {} inputs",
            op.name(),
            ins.len()
        );
        let out = self.new_net(NetName::Wire(name.into().into_boxed_str()));
        self.gates.push(Gate { op, ins, out });
        out
    }

    /// `s ? t : e` as a 2:1 cell.
    pub fn mux(&mut self, s: Net, t: Net, e: Net, name: impl Into<String>) -> Net {
        self.gate(Op::Mux2, vec![s, t, e], name)
    }

    /// A balanced tree of `op` gates of at most `fanin` inputs over `items` (at least one);
    /// intermediate nets are named `{prefix}_{level}_{index}`, the root `name`.
    pub fn tree(&mut self, op: Op, items: &[Net], fanin: usize, prefix: &str, name: &str) -> Net {
        assert!(!items.is_empty() && fanin >= 2, "generator bug: empty tree");
        let mut layer = items.to_vec();
        let mut level = 0;
        while layer.len() > 1 {
            let last = layer.len() <= fanin;
            let mut next = Vec::with_capacity(layer.len().div_ceil(fanin));
            for (j, chunk) in layer.chunks(fanin).enumerate() {
                if chunk.len() == 1 {
                    next.push(chunk[0]);
                } else if last {
                    next.push(self.gate(op, chunk.to_vec(), name));
                } else {
                    next.push(self.gate(op, chunk.to_vec(), format!("{prefix}_{level}_{j}")));
                }
            }
            layer = next;
            level += 1;
        }
        layer[0]
    }

    /// Declare an output bus driven by `nets` (bit 0 first). A net that is a plain internal wire
    /// takes the output bit's name; an input bit or a net already naming an output gets a buffer.
    pub fn output(&mut self, name: &str, nets: &[Net]) {
        self.output_port(name, nets, false)
    }

    /// Declare a scalar output driven by `net`.
    pub fn output_scalar(&mut self, name: &str, net: Net) {
        self.output_port(name, &[net], true)
    }

    fn output_port(&mut self, name: &str, nets: &[Net], scalar: bool) {
        let p = self.outputs.len() as u32;
        let mut bits = Vec::with_capacity(nets.len());
        for (b, &n) in nets.iter().enumerate() {
            let here = NetName::Out(p, b as u32);
            if matches!(self.names[n.index()], NetName::Wire(_)) {
                self.names[n.index()] = here;
                bits.push(n);
            } else {
                let out = self.new_net(here);
                self.gates.push(Gate {
                    op: Op::Buf,
                    ins: vec![n],
                    out,
                });
                bits.push(out);
            }
        }
        self.outputs.push(Port {
            name: name.to_string(),
            width: nets.len(),
            scalar,
        });
        self.output_nets.push(bits);
    }

    /// Input ports, in declaration order.
    pub fn inputs(&self) -> &[Port] {
        &self.inputs
    }

    /// Output ports, in declaration order.
    pub fn outputs(&self) -> &[Port] {
        &self.outputs
    }

    /// The bits of input port `p`.
    pub fn input_bits(&self, p: usize) -> &[Net] {
        &self.input_nets[p]
    }

    /// The nets driving output port `p`.
    pub fn output_bits(&self, p: usize) -> &[Net] {
        &self.output_nets[p]
    }

    /// All input bits, port by port, bit 0 first (the order [`Circuit::simulate`] uses).
    pub fn input_order(&self) -> Vec<Net> {
        self.input_nets.iter().flatten().copied().collect()
    }

    /// The gates, in topological order.
    pub fn gates(&self) -> &[Gate] {
        &self.gates
    }

    pub(super) fn gates_mut(&mut self) -> &mut Vec<Gate> {
        &mut self.gates
    }

    /// Number of nets.
    pub fn num_nets(&self) -> usize {
        self.names.len()
    }

    /// Number of gates of operation `op`.
    pub fn count(&self, op: Op) -> usize {
        self.gates.iter().filter(|g| g.op == op).count()
    }

    /// The printed name of `net`: `d[3]`, `v` (scalar port) or the wire name.
    pub fn name(&self, net: Net) -> String {
        let bit = |ports: &[Port], p: u32, b: u32| {
            let port = &ports[p as usize];
            if port.scalar {
                port.name.clone()
            } else {
                format!("{}[{}]", port.name, b)
            }
        };
        match &self.names[net.index()] {
            NetName::In(p, b) => bit(&self.inputs, *p, *b),
            NetName::Out(p, b) => bit(&self.outputs, *p, *b),
            NetName::Wire(w) => w.to_string(),
        }
    }

    /// Whether `net` is a primary input bit.
    pub fn is_input(&self, net: Net) -> bool {
        matches!(self.names[net.index()], NetName::In(..))
    }

    /// The input port of an input bit.
    pub fn input_port_of(&self, net: Net) -> Option<usize> {
        match self.names[net.index()] {
            NetName::In(p, _) => Some(p as usize),
            _ => None,
        }
    }

    /// The net printed as `name`, if any.
    pub fn find(&self, name: &str) -> Option<Net> {
        (0..self.names.len() as u32)
            .map(Net)
            .find(|&n| self.name(n) == name)
    }

    /// Add a net for a gate inserted later with [`Circuit::insert_gate`].
    pub(super) fn fresh_wire(&mut self, name: String) -> Net {
        self.new_net(NetName::Wire(name.into_boxed_str()))
    }

    /// Insert `gate` at position `pos` of the gate list.
    pub(super) fn insert_gate(&mut self, pos: usize, gate: Gate) {
        self.gates.insert(pos, gate);
    }

    /// Remove gates outside the cones of the outputs.
    pub fn prune(&mut self) {
        let mut live = vec![false; self.names.len()];
        for n in self.output_nets.iter().flatten() {
            live[n.index()] = true;
        }
        for g in self.gates.iter().rev() {
            if live[g.out.index()] {
                for i in &g.ins {
                    live[i.index()] = true;
                }
            }
        }
        self.gates.retain(|g| live[g.out.index()]);
    }

    /// Check the invariants; `Err` names the first violation (a generator bug).
    pub fn check(&self) -> Result<(), String> {
        let mut defined = vec![false; self.names.len()];
        for n in self.input_nets.iter().flatten() {
            defined[n.index()] = true;
        }
        for g in &self.gates {
            if !g.op.arity_ok(g.ins.len()) {
                return Err(format!("{} has {} inputs", self.name(g.out), g.ins.len()));
            }
            if let Some(i) = g.ins.iter().find(|i| !defined[i.index()]) {
                return Err(format!(
                    "{} reads {} before it is defined",
                    self.name(g.out),
                    self.name(*i)
                ));
            }
            if defined[g.out.index()] {
                return Err(format!("{} has two drivers", self.name(g.out)));
            }
            defined[g.out.index()] = true;
        }
        if let Some(n) = self
            .output_nets
            .iter()
            .flatten()
            .find(|n| !defined[n.index()])
        {
            return Err(format!("output {} is not driven", self.name(*n)));
        }
        let mut seen = HashSet::new();
        for n in 0..self.names.len() as u32 {
            let name = self.name(Net(n));
            if let NetName::Wire(_) = self.names[n as usize] {
                if !is_identifier(&name) {
                    return Err(format!("wire name `{name}` is not a plain identifier"));
                }
            }
            if !seen.insert(name.clone()) {
                return Err(format!("two nets are named `{name}`"));
            }
        }
        Ok(())
    }

    /// Simulate 64 patterns: `inputs` holds one word per input bit in [`Circuit::input_order`];
    /// returns one word per output bit, port by port.
    pub fn simulate(&self, inputs: &[u64]) -> Vec<u64> {
        let mut v = vec![0u64; self.names.len()];
        for (n, w) in self.input_nets.iter().flatten().zip(inputs) {
            v[n.index()] = *w;
        }
        let mut buf = Vec::new();
        for g in &self.gates {
            buf.clear();
            buf.extend(g.ins.iter().map(|i| v[i.index()]));
            v[g.out.index()] = g.op.eval(&buf);
        }
        self.output_nets
            .iter()
            .flatten()
            .map(|n| v[n.index()])
            .collect()
    }

    /// 64 random input patterns (one word per input bit) inside the care condition.
    pub fn random_patterns(&self, rng: &mut Rng) -> Vec<u64> {
        let mut words = Vec::new();
        for (p, port) in self.inputs.iter().enumerate() {
            match &self.care {
                Some(c) if c.port == p => {
                    let mut w = vec![0u64; port.width];
                    for k in 0..64 {
                        let val = rng.next_u64() % c.limit;
                        for (b, word) in w.iter_mut().enumerate() {
                            *word |= ((val >> b) & 1) << k;
                        }
                    }
                    words.extend(w);
                }
                _ => words.extend((0..port.width).map(|_| rng.next_u64())),
            }
        }
        words
    }

    /// Longest path counted in gates for which `counts` holds (e.g. only 2:1 cells).
    pub fn depth(&self, counts: impl Fn(Op) -> bool) -> u32 {
        let mut d = vec![0u32; self.names.len()];
        for g in &self.gates {
            let m = g.ins.iter().map(|i| d[i.index()]).max().unwrap_or(0);
            d[g.out.index()] = m + counts(g.op) as u32;
        }
        self.output_nets
            .iter()
            .flatten()
            .map(|n| d[n.index()])
            .max()
            .unwrap_or(0)
    }
}

/// Verilog keywords a generator might plausibly produce as a short wire name.
const KEYWORDS: &[&str] = &[
    "and", "or", "not", "nand", "nor", "xor", "xnor", "buf", "if", "for", "do", "wire", "reg",
    "input", "output", "assign", "module", "begin", "end", "case", "else", "integer", "tri",
];

/// A plain Verilog/bench identifier: a letter or `_`, then letters, digits and `_`.
pub fn is_identifier(s: &str) -> bool {
    let mut c = s.chars();
    matches!(c.next(), Some(ch) if ch.is_ascii_alphabetic() || ch == '_')
        && c.all(|ch| ch.is_ascii_alphanumeric() || ch == '_')
        && !KEYWORDS.contains(&s)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn small() -> Circuit {
        let mut c = Circuit::new("t");
        let a = c.input("a", 2);
        let s = c.input_scalar("s");
        let m = c.mux(s, a[1], a[0], "m");
        let x = c.gate(Op::Xor, vec![a[0], a[1]], "x");
        c.output("y", &[m, x, a[0]]);
        c
    }

    #[test]
    fn outputs_take_wire_names_and_inputs_get_buffers() {
        let c = small();
        c.check().unwrap();
        let v = c.to_verilog();
        assert!(v.contains("assign y[0] = s ? a[1] : a[0];"), "{v}");
        assert!(v.contains("xor (y[1], a[0], a[1]);"), "{v}");
        assert!(v.contains("buf (y[2], a[0]);"), "{v}");
        let b = c.to_bench();
        assert!(b.contains("s__n = NOT(s)\ny_0__t = AND(s, a[1])"), "{b}");
        assert!(b.contains("y[2] = BUFF(a[0])"), "{b}");
    }

    #[test]
    fn simulation_follows_the_gates() {
        let c = small();
        // input order a[0], a[1], s
        let out = c.simulate(&[0b1100, 0b1010, 0b0110]);
        assert_eq!(
            out,
            vec![(0b0110 & 0b1010) | (!0b0110 & 0b1100), 0b0110, 0b1100]
        );
        assert_eq!(c.depth(|op| op == Op::Mux2), 1);
    }
}
