//! Clocked families of `equicone gen`: a registered selector, a pipelined adder, a counter, a
//! shift register and a state machine in one-hot and binary encodings of the same
//! specification, built in a small netlist of gates and registers ([`SeqNet`]) and written as
//! bench (`q = DFF(d)`) or Verilog (`always @(posedge clk)` with a synchronous reset `rst`).
//! `--rename` gives every register a new name and stores a fraction of them inverted (seeded).
//!
//! Reset state: each register has a reset value. Verilog writes it in the reset branch. Bench has
//! no reset and its flip-flops start at 0 (`prove --init-unset 0`), so a register whose reset
//! value is 1 is written as a flip-flop holding its complement (`q__n = DFF(...)`,
//! `q = NOT(q__n)`): the same behaviour from the reset state in both formats.

use super::{GenError, GenFormat, GenSpec, Kind, Style};
use crate::rng::SplitMix64;
use std::fmt::Write;

/// Gate operations of the clocked netlists.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
enum G {
    And,
    Or,
    Xor,
    Not,
}

/// What defines a signal.
#[derive(Clone, Debug)]
enum Def {
    /// Bit `bit` of input port `port`.
    Input(usize, usize),
    /// The current value of register `k`.
    Reg(usize),
    /// A gate.
    Gate(G, Vec<usize>),
}

/// One register bit.
#[derive(Clone, Debug)]
struct Reg {
    /// Bus name and bit index (None: scalar).
    name: (String, Option<usize>),
    /// Reset value.
    init: bool,
    /// Next-value signal.
    next: usize,
    /// Its signal.
    q: usize,
}

/// A netlist of gates and registers with one clock.
#[derive(Clone, Debug, Default)]
pub struct SeqNet {
    module: String,
    notes: Vec<String>,
    /// Input ports: name, width (0: scalar).
    inputs: Vec<(String, usize)>,
    /// Output ports: name, bits (one bit and not a bus when `scalar`).
    outputs: Vec<(String, bool, Vec<usize>)>,
    defs: Vec<Def>,
    regs: Vec<Reg>,
    /// Gate names: signal -> `nK`.
    names: Vec<Option<String>>,
}

impl SeqNet {
    fn new(module: &str) -> SeqNet {
        SeqNet {
            module: module.to_string(),
            ..SeqNet::default()
        }
    }

    fn add(&mut self, d: Def) -> usize {
        self.defs.push(d);
        self.names.push(None);
        self.defs.len() - 1
    }

    fn input(&mut self, name: &str, width: usize) -> Vec<usize> {
        let p = self.inputs.len();
        self.inputs.push((name.to_string(), width));
        (0..width.max(1))
            .map(|b| self.add(Def::Input(p, b)))
            .collect()
    }

    fn scalar(&mut self, name: &str) -> usize {
        self.input(name, 0)[0]
    }

    /// A register bit with reset value `init`; its next value is set later with [`SeqNet::load`].
    fn reg(&mut self, bus: &str, bit: Option<usize>, init: bool) -> usize {
        let k = self.regs.len();
        let q = self.add(Def::Reg(k));
        self.regs.push(Reg {
            name: (bus.to_string(), bit),
            init,
            next: q,
            q,
        });
        q
    }

    fn load(&mut self, q: usize, next: usize) {
        if let Def::Reg(k) = self.defs[q] {
            self.regs[k].next = next;
        }
    }

    fn gate(&mut self, g: G, ins: Vec<usize>) -> usize {
        self.add(Def::Gate(g, ins))
    }

    fn and(&mut self, a: usize, b: usize) -> usize {
        self.gate(G::And, vec![a, b])
    }

    fn or(&mut self, a: usize, b: usize) -> usize {
        self.gate(G::Or, vec![a, b])
    }

    fn xor(&mut self, a: usize, b: usize) -> usize {
        self.gate(G::Xor, vec![a, b])
    }

    fn not(&mut self, a: usize) -> usize {
        self.gate(G::Not, vec![a])
    }

    /// `s ? t : e`.
    fn mux(&mut self, s: usize, t: usize, e: usize) -> usize {
        let ns = self.not(s);
        let a = self.and(s, t);
        let b = self.and(ns, e);
        self.or(a, b)
    }

    /// OR of several signals (a 2-input tree); `None` when empty.
    fn any(&mut self, xs: &[usize]) -> Option<usize> {
        let mut v: Vec<usize> = xs.to_vec();
        while v.len() > 1 {
            let mut next = Vec::new();
            for c in v.chunks(2) {
                next.push(if c.len() == 2 {
                    self.or(c[0], c[1])
                } else {
                    c[0]
                });
            }
            v = next;
        }
        v.first().copied()
    }

    /// AND of several signals (a chain); `xs` non-empty.
    fn all(&mut self, xs: &[usize]) -> usize {
        let mut a = xs[0];
        for &x in &xs[1..] {
            a = self.and(a, x);
        }
        a
    }

    /// Decode `bits` (least significant first): one signal per value 0..n.
    fn decode(&mut self, bits: &[usize], n: usize) -> Vec<usize> {
        let inv: Vec<usize> = bits.iter().map(|&b| self.not(b)).collect();
        (0..n)
            .map(|v| {
                let lits: Vec<usize> = (0..bits.len())
                    .map(|j| if (v >> j) & 1 == 1 { bits[j] } else { inv[j] })
                    .collect();
                self.all(&lits)
            })
            .collect()
    }

    fn output(&mut self, name: &str, bits: Vec<usize>) {
        self.outputs.push((name.to_string(), false, bits));
    }

    fn output_scalar(&mut self, name: &str, bit: usize) {
        self.outputs.push((name.to_string(), true, vec![bit]));
    }

    /// Number of gates.
    pub fn gates(&self) -> usize {
        self.defs
            .iter()
            .filter(|d| matches!(d, Def::Gate(..)))
            .count()
    }

    /// Number of register bits.
    pub fn registers(&self) -> usize {
        self.regs.len()
    }

    fn reg_name(r: &Reg) -> String {
        match r.name.1 {
            Some(i) => format!("{}[{i}]", r.name.0),
            None => r.name.0.clone(),
        }
    }

    /// Name of signal `s` in both formats.
    fn name(&self, s: usize) -> String {
        match &self.defs[s] {
            Def::Input(p, b) => {
                let (n, w) = &self.inputs[*p];
                if *w == 0 {
                    n.clone()
                } else {
                    format!("{n}[{b}]")
                }
            }
            Def::Reg(k) => SeqNet::reg_name(&self.regs[*k]),
            Def::Gate(..) => self.names[s].clone().unwrap_or_else(|| format!("n{s}")),
        }
    }

    /// Give every register a new name and store about `invert` of them (a fraction, at least one
    /// when positive) inverted; the choice follows `seed`.
    pub fn rename(&mut self, invert: f64, seed: u64) -> usize {
        let mut rng = SplitMix64::new(seed, 0x4E_A3E);
        let n = self.regs.len();
        let mut order: Vec<usize> = (0..n).collect();
        for i in (1..n).rev() {
            order.swap(i, rng.below(i + 1));
        }
        let want = if invert > 0.0 {
            ((n as f64 * invert).round() as usize).clamp(1, n)
        } else {
            0
        };
        let flip: Vec<usize> = order[..want].to_vec();
        for (k, r) in self.regs.iter_mut().enumerate() {
            r.name = (
                format!("st_{}_r", order.iter().position(|&x| x == k).unwrap_or(k)),
                None,
            );
        }
        for &k in &flip {
            // The old signal becomes NOT of a new register holding the complement.
            let stored = self.add(Def::Reg(k));
            let old = self.regs[k].q;
            self.defs[old] = Def::Gate(G::Not, vec![stored]);
            let next = self.regs[k].next;
            let nn = self.not(next);
            let r = &mut self.regs[k];
            r.q = stored;
            r.next = nn;
            r.init = !r.init;
        }
        want
    }

    /// The netlist as bench text (flip-flops start at 0; see the module documentation).
    pub fn to_bench(&self) -> String {
        let mut s = String::new();
        for l in &self.notes {
            let _ = writeln!(s, "# {l}");
        }
        for (name, w) in &self.inputs {
            if *w == 0 {
                let _ = writeln!(s, "INPUT({name})");
            } else {
                for b in 0..*w {
                    let _ = writeln!(s, "INPUT({name}[{b}])");
                }
            }
        }
        for (name, scalar, bits) in &self.outputs {
            for b in 0..bits.len() {
                if *scalar {
                    let _ = writeln!(s, "OUTPUT({name})");
                } else {
                    let _ = writeln!(s, "OUTPUT({name}[{b}])");
                }
            }
        }
        s.push('\n');
        for r in &self.regs {
            let q = self.name(r.q);
            let d = self.name(r.next);
            if r.init {
                let plain = q.replace('[', "_").replace(']', "");
                let _ = writeln!(s, "{plain}__n = DFF({plain}__d)");
                let _ = writeln!(s, "{plain}__d = NOT({d})");
                let _ = writeln!(s, "{q} = NOT({plain}__n)");
            } else {
                let _ = writeln!(s, "{q} = DFF({d})");
            }
        }
        for (i, d) in self.defs.iter().enumerate() {
            if let Def::Gate(g, ins) = d {
                let op = match g {
                    G::And => "AND",
                    G::Or => "OR",
                    G::Xor => "XOR",
                    G::Not => "NOT",
                };
                let a: Vec<String> = ins.iter().map(|&x| self.name(x)).collect();
                let _ = writeln!(s, "{} = {op}({})", self.name(i), a.join(", "));
            }
        }
        for (name, scalar, bits) in &self.outputs {
            for (b, &x) in bits.iter().enumerate() {
                let o = if *scalar {
                    name.clone()
                } else {
                    format!("{name}[{b}]")
                };
                let _ = writeln!(s, "{o} = BUFF({})", self.name(x));
            }
        }
        s
    }

    /// The netlist as Verilog: gate primitives, registers in one `always @(posedge clk)` block
    /// with the synchronous reset `rst`.
    pub fn to_verilog(&self) -> String {
        let mut s = String::new();
        for l in &self.notes {
            let _ = writeln!(s, "// {l}");
        }
        let mut ports = vec!["clk".to_string(), "rst".to_string()];
        ports.extend(self.inputs.iter().map(|p| p.0.clone()));
        ports.extend(self.outputs.iter().map(|p| p.0.clone()));
        let _ = writeln!(s, "module {} ({});", self.module, ports.join(", "));
        s.push_str("  input clk;\n  input rst;\n");
        for (name, w) in &self.inputs {
            if *w == 0 {
                let _ = writeln!(s, "  input {name};");
            } else {
                let _ = writeln!(s, "  input [{}:0] {name};", w - 1);
            }
        }
        for (name, scalar, bits) in &self.outputs {
            if *scalar {
                let _ = writeln!(s, "  output {name};");
            } else {
                let _ = writeln!(s, "  output [{}:0] {name};", bits.len() - 1);
            }
        }
        // Register buses: name -> width.
        let mut buses: Vec<(String, Option<usize>)> = Vec::new();
        for r in &self.regs {
            match buses.iter_mut().find(|b| b.0 == r.name.0) {
                Some(b) => b.1 = b.1.max(r.name.1.map(|i| i + 1)),
                None => buses.push((r.name.0.clone(), r.name.1.map(|i| i + 1))),
            }
        }
        for (b, w) in &buses {
            match w {
                Some(w) => {
                    let _ = writeln!(s, "  reg [{}:0] {b};", w - 1);
                }
                None => {
                    let _ = writeln!(s, "  reg {b};");
                }
            }
        }
        for (i, d) in self.defs.iter().enumerate() {
            if let Def::Gate(g, ins) = d {
                let op = match g {
                    G::And => "and",
                    G::Or => "or",
                    G::Xor => "xor",
                    G::Not => "not",
                };
                let a: Vec<String> = ins.iter().map(|&x| self.name(x)).collect();
                let _ = writeln!(s, "  wire {};", self.name(i));
                let _ = writeln!(s, "  {op} ({}, {});", self.name(i), a.join(", "));
            }
        }
        for (name, scalar, bits) in &self.outputs {
            for (b, &x) in bits.iter().enumerate() {
                let o = if *scalar {
                    name.clone()
                } else {
                    format!("{name}[{b}]")
                };
                let _ = writeln!(s, "  assign {o} = {};", self.name(x));
            }
        }
        s.push_str("  always @(posedge clk) begin\n    if (rst) begin\n");
        for r in &self.regs {
            let _ = writeln!(s, "      {} <= 1'b{};", self.name(r.q), r.init as u8);
        }
        s.push_str("    end else begin\n");
        for r in &self.regs {
            let _ = writeln!(s, "      {} <= {};", self.name(r.q), self.name(r.next));
        }
        s.push_str("    end\n  end\nendmodule\n");
        s
    }
}

/// Bits needed for values 0..n-1.
fn bits_for(n: usize) -> usize {
    (usize::BITS - (n.max(2) - 1).leading_zeros()) as usize
}

/// Registered selector: `y` takes `d[s]` at each clock edge (0 for select values past n-1).
fn reg_selector(c: &mut SeqNet, n: usize) -> String {
    let k = bits_for(n);
    let d = c.input("d", n);
    let s = c.input("s", k);
    let sel = c.decode(&s, n);
    let terms: Vec<usize> = (0..n).map(|i| c.and(sel[i], d[i])).collect();
    let y = c.any(&terms).expect("n >= 2");
    let q = c.reg("y_q", None, false);
    c.load(q, y);
    c.output_scalar("y", q);
    format!("registered {n}:1 selector: y takes d[s] at each clock edge (0 when s >= {n})")
}

/// Pipelined ripple adder: `y = a + b`, the carry chain cut into `stages` register stages.
fn pipe_adder(c: &mut SeqNet, n: usize, stages: usize) -> String {
    let a = c.input("a", n);
    let b = c.input("b", n);
    let per = n.div_ceil(stages);
    // Values carried: computed sum bits, the carry, the operand bits not yet added.
    let mut sum: Vec<usize> = Vec::new();
    let (mut av, mut bv) = (a.clone(), b.clone());
    let mut carry: Option<usize> = None;
    for st in 0..stages {
        let lo = st * per;
        let hi = ((st + 1) * per).min(n);
        for i in lo..hi {
            let x = c.xor(av[i], bv[i]);
            let (si, co) = match carry {
                None => (x, c.and(av[i], bv[i])),
                Some(ci) => {
                    let si = c.xor(x, ci);
                    let g = c.and(av[i], bv[i]);
                    let p = c.and(x, ci);
                    (si, c.or(g, p))
                }
            };
            sum.push(si);
            carry = Some(co);
        }
        // Register everything that goes on.
        let reg = |c: &mut SeqNet, name: &str, i: Option<usize>, v: usize| {
            let q = c.reg(&format!("{name}{st}"), i, false);
            c.load(q, v);
            q
        };
        sum = sum
            .iter()
            .enumerate()
            .map(|(i, &v)| reg(c, "s", Some(i), v))
            .collect();
        if let Some(co) = carry {
            carry = Some(reg(c, "c", None, co));
        }
        for i in hi..n {
            av[i] = reg(c, "a", Some(i), av[i]);
            bv[i] = reg(c, "b", Some(i), bv[i]);
        }
    }
    let mut y = sum;
    y.push(carry.unwrap_or(a[0]));
    c.output("y", y);
    format!("{n}-bit ripple adder in {stages} register stages: y = a + b of {stages} cycles before")
}

/// Counter: `q` counts up by one in each cycle with `en` set (modulo 2^n).
fn counter(c: &mut SeqNet, n: usize) -> String {
    let en = c.scalar("en");
    let q: Vec<usize> = (0..n).map(|i| c.reg("q", Some(i), false)).collect();
    let mut carry = en;
    for &qi in &q {
        let next = c.xor(qi, carry);
        carry = c.and(qi, carry);
        c.load(qi, next);
    }
    c.output("y", q);
    format!("{n}-bit counter: y counts up by one in each cycle with en set")
}

/// Shift register: `si` enters `r[0]`, each bit moves up one place per cycle.
fn shift_register(c: &mut SeqNet, n: usize) -> String {
    let si = c.scalar("si");
    let r: Vec<usize> = (0..n).map(|i| c.reg("r", Some(i), false)).collect();
    for i in 0..n {
        let d = if i == 0 { si } else { r[i - 1] };
        c.load(r[i], d);
    }
    c.output("y", r);
    format!("{n}-bit shift register: si enters y[0], each bit moves up one place per cycle")
}

/// The state machine of `fsm`: n states from 0 (reset); `go` steps to the next (mod n), else
/// `back` to the previous, else it stays; `y[i]` is 1 in state i.
fn fsm(c: &mut SeqNet, n: usize, style: Style) -> String {
    let go = c.scalar("go");
    let back = c.scalar("back");
    let ngo = c.not(go);
    let stay_back = c.and(ngo, back);
    let nback = c.not(back);
    let stay = c.and(ngo, nback);
    match style {
        Style::Onehot => {
            let h: Vec<usize> = (0..n).map(|i| c.reg("h", Some(i), i == 0)).collect();
            for i in 0..n {
                let from_prev = c.and(go, h[(i + n - 1) % n]);
                let from_next = c.and(stay_back, h[(i + 1) % n]);
                let keep = c.and(stay, h[i]);
                let next = c.any(&[from_prev, from_next, keep]).expect("three terms");
                c.load(h[i], next);
            }
            c.output("y", h);
        }
        _ => {
            let k = bits_for(n);
            let b: Vec<usize> = (0..k).map(|j| c.reg("b", Some(j), false)).collect();
            let at = c.decode(&b, n);
            for (j, &bj) in b.iter().enumerate() {
                let pick = |c: &mut SeqNet, f: &dyn Fn(usize) -> usize| -> usize {
                    let t: Vec<usize> = (0..n)
                        .filter(|&v| (f(v) >> j) & 1 == 1)
                        .map(|v| at[v])
                        .collect();
                    match c.any(&t) {
                        Some(x) => x,
                        None => {
                            let nb = c.not(bj);
                            c.and(bj, nb)
                        }
                    }
                };
                let inc = pick(c, &|v| (v + 1) % n);
                let dec = pick(c, &|v| (v + n - 1) % n);
                let back_or_stay = c.mux(back, dec, bj);
                let next = c.mux(go, inc, back_or_stay);
                c.load(bj, next);
            }
            c.output("y", at);
        }
    }
    format!(
        "{}-encoded state machine of {n} states: go steps to the next state (mod {n}), else back to the previous, else it stays; y[i] = state is i",
        if style == Style::Onehot { "one-hot" } else { "binary" }
    )
}

/// Registers per gate of `reg-random` (1,000,000 gates: 20,000 registers).
pub const RANDOM_GATES_PER_REGISTER: usize = 50;
/// Length of the delay line of `reg-random`.
const DELAY_LINE: usize = 5;

/// Random clocked circuit: `n` gates (AND, OR, XOR, some reading a complemented fan-in) in
/// layers over the inputs `x` and the register outputs, `n / 50` register bits loaded from
/// gates of the last layers, outputs `y` from the last layer, and a delay line of 5 registers
/// (`dl[0]` loads a gate, `dl[i]` loads `dl[i-1]`, output `z` is `dl[4]`). `--bug invert`
/// stores the complement of the delay line's input: the outputs differ first at cycle 5. The
/// circuit depends on `n` and `inputs` only (as every clocked family, `--seed` picks what
/// `--rename` inverts), so a renamed copy has the same logic.
fn reg_random(c: &mut SeqNet, n: usize, inputs: usize, bug: bool) -> String {
    let mut rng = SplitMix64::new(0x5E0, 0x5E_0A4D);
    let x = c.input("x", inputs.max(1));
    let nregs = (n / RANDOM_GATES_PER_REGISTER).max(1);
    let plain = nregs.saturating_sub(DELAY_LINE).max(1);
    let regs: Vec<usize> = (0..plain)
        .map(|i| {
            let init = rng.chance(1, 4);
            c.reg("r", Some(i), init)
        })
        .collect();
    let line: Vec<usize> = if nregs > DELAY_LINE {
        (0..DELAY_LINE)
            .map(|i| c.reg("dl", Some(i), false))
            .collect()
    } else {
        Vec::new()
    };
    // Layers of `width` gates; fan-ins from the previous layer, now and then from anywhere.
    let width = ((n as f64).sqrt() as usize * 4).clamp(64, n.max(64));
    let mut all: Vec<usize> = x.iter().chain(&regs).copied().collect();
    let mut prev = all.clone();
    let mut made = 0;
    while made < n {
        let this = width.min(n - made);
        let mut layer = Vec::with_capacity(this);
        for _ in 0..this {
            let pick = |rng: &mut SplitMix64| {
                if rng.chance(1, 8) {
                    all[rng.below(all.len())]
                } else {
                    prev[rng.below(prev.len())]
                }
            };
            let a = pick(&mut rng);
            let mut b = pick(&mut rng);
            if b == a {
                b = all[rng.below(all.len())];
            }
            let g = match rng.below(3) {
                0 => G::And,
                1 => G::Or,
                _ => G::Xor,
            };
            // Keep AND and OR from drifting to constants: complement one fan-in half the time.
            let b = if g != G::Xor && rng.chance(1, 2) && made + layer.len() + 1 < n {
                layer.push(c.not(b));
                *layer.last().expect("just pushed")
            } else {
                b
            };
            layer.push(c.gate(g, vec![a, b]));
            if made + layer.len() >= n {
                break;
            }
        }
        made += layer.len();
        all.extend(&layer);
        prev = layer;
    }
    // Registers load gates of the last layers; outputs read the last layer.
    let tail = &all[all.len().saturating_sub(width * 4).max(inputs)..];
    for &q in &regs {
        let d = tail[rng.below(tail.len())];
        c.load(q, d);
    }
    let outs = prev.len().min(64);
    let y: Vec<usize> = prev[..outs].to_vec();
    c.output("y", y);
    let mut what = format!(
        "random clocked circuit: {n} gates in layers of {width}, {} register bits, {} inputs",
        regs.len() + line.len(),
        x.len()
    );
    if !line.is_empty() {
        let head = tail[rng.below(tail.len())];
        let head = if bug { c.not(head) } else { head };
        c.load(line[0], head);
        for i in 1..line.len() {
            c.load(line[i], line[i - 1]);
        }
        c.output_scalar("z", line[DELAY_LINE - 1]);
        what.push_str(", a delay line of 5 registers to output z");
        if bug {
            what.push_str(
                "; bug: the delay line stores its input inverted (first seen at cycle 5)",
            );
        }
    }
    what
}

/// Whether `kind` is one of the clocked families.
pub fn is_clocked(kind: Kind) -> bool {
    matches!(
        kind,
        Kind::RegSelector
            | Kind::PipeAdder
            | Kind::Counter
            | Kind::ShiftRegister
            | Kind::Fsm
            | Kind::RegRandom
    )
}

/// Build the clocked circuit of `spec` (renamed when asked).
pub fn build(spec: &GenSpec) -> Result<SeqNet, GenError> {
    let (min, what) = match spec.kind {
        Kind::RegSelector => (2, "a registered selector needs at least 2 channels"),
        Kind::PipeAdder => (1, "a pipelined adder needs at least 1 bit"),
        Kind::Counter => (1, "a counter needs at least 1 bit"),
        Kind::ShiftRegister => (1, "a shift register needs at least 1 bit"),
        Kind::RegRandom => (64, "a random clocked circuit needs at least 64 gates"),
        _ => (2, "a state machine needs at least 2 states"),
    };
    let max = if spec.kind == Kind::RegRandom {
        4_000_000
    } else {
        1 << 16
    };
    if spec.n < min || spec.n > max {
        return Err(GenError::new(
            format!("--n {}: {what} (and at most {max})", spec.n),
            "choose another --n",
        ));
    }
    if spec.kind == Kind::PipeAdder && (spec.stages == 0 || spec.stages > spec.n) {
        return Err(GenError::new(
            format!(
                "--stages {}: a {}-bit adder takes 1 to {} stages",
                spec.stages, spec.n, spec.n
            ),
            "choose --stages between 1 and --n",
        ));
    }
    let invert_bug = spec.kind == Kind::RegRandom && spec.bug == Some(super::Bug::Invert);
    if spec.bug.is_some() && !invert_bug {
        return Err(GenError::new(
            "--bug applies to the clocked families only as `reg-random --bug invert`",
            "leave --bug out",
        ));
    }
    let module = spec.module.clone().unwrap_or_else(|| spec.default_module());
    let mut c = SeqNet::new(&module);
    let what = match spec.kind {
        Kind::RegSelector => reg_selector(&mut c, spec.n),
        Kind::PipeAdder => pipe_adder(&mut c, spec.n, spec.stages),
        Kind::Counter => counter(&mut c, spec.n),
        Kind::ShiftRegister => shift_register(&mut c, spec.n),
        Kind::RegRandom => reg_random(&mut c, spec.n, spec.inputs, invert_bug),
        _ => fsm(&mut c, spec.n, spec.style),
    };
    c.notes.push(what);
    if let Some(f) = spec.rename {
        let k = c.rename(f as f64 / 1000.0, spec.seed);
        c.notes.push(format!(
            "registers renamed, {k} of {} stored inverted",
            c.regs.len()
        ));
    }
    Ok(c)
}

/// Generate the clocked circuit of `spec` as text.
pub fn generate(spec: &GenSpec, format: GenFormat) -> Result<super::Generated, GenError> {
    let mut c = build(spec)?;
    let description = c.notes.first().cloned().unwrap_or_default();
    c.notes.insert(0, spec.command_line(format));
    if format == GenFormat::Bench {
        c.notes
            .push("flip-flops start at 0: prove with --init-unset 0".into());
    }
    let text = match format {
        GenFormat::Verilog => c.to_verilog(),
        GenFormat::Bench => c.to_bench(),
    };
    Ok(super::Generated {
        text,
        description,
        mutation: None,
        gates: c.gates(),
    })
}
