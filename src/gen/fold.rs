//! A gate builder over signals that may be known constants ([`Sig`]): constants fold away at
//! generation time, so arithmetic generators can start from zero registers and pad with zeros
//! without leaving constant gates behind. Wires are named `{prefix}{counter}`; inverters of a
//! net are shared.

use super::emit::{Circuit, Net, Op};
use std::collections::HashMap;

/// A signal: a known constant or a net.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub(super) enum Sig {
    /// Constant 0.
    Zero,
    /// Constant 1.
    One,
    /// A net of the circuit.
    Net(Net),
}

impl Sig {
    /// The constant `b`.
    pub(super) fn bit(b: bool) -> Sig {
        if b {
            Sig::One
        } else {
            Sig::Zero
        }
    }
}

/// A constant-folding gate builder on a circuit.
pub(super) struct Fold<'a> {
    /// The circuit being built.
    pub c: &'a mut Circuit,
    prefix: String,
    next: usize,
    nots: HashMap<Net, Net>,
    consts: [Option<Net>; 2],
}

impl<'a> Fold<'a> {
    /// A builder whose wires are named `{prefix}0`, `{prefix}1`, ...
    pub(super) fn new(c: &'a mut Circuit, prefix: &str) -> Fold<'a> {
        Fold {
            c,
            prefix: prefix.to_string(),
            next: 0,
            nots: HashMap::new(),
            consts: [None, None],
        }
    }

    fn name(&mut self) -> String {
        let s = format!("{}{}", self.prefix, self.next);
        self.next += 1;
        s
    }

    fn gate(&mut self, op: Op, ins: Vec<Net>) -> Sig {
        let name = self.name();
        Sig::Net(self.c.gate(op, ins, name))
    }

    /// The net carrying `x` (a constant gets a constant gate, made once).
    pub(super) fn net(&mut self, x: Sig) -> Net {
        match x {
            Sig::Net(n) => n,
            Sig::Zero | Sig::One => {
                let k = (x == Sig::One) as usize;
                if let Some(n) = self.consts[k] {
                    return n;
                }
                let name = self.name();
                let op = if k == 1 { Op::Const1 } else { Op::Const0 };
                let n = self.c.gate(op, Vec::new(), name);
                self.consts[k] = Some(n);
                n
            }
        }
    }

    /// NOT x.
    pub(super) fn not(&mut self, x: Sig) -> Sig {
        match x {
            Sig::Zero => Sig::One,
            Sig::One => Sig::Zero,
            Sig::Net(n) => {
                if let Some(&m) = self.nots.get(&n) {
                    return Sig::Net(m);
                }
                let Sig::Net(m) = self.gate(Op::Not, vec![n]) else {
                    unreachable!("gate gives a net")
                };
                self.nots.insert(n, m);
                self.nots.insert(m, n);
                Sig::Net(m)
            }
        }
    }

    /// x AND y.
    pub(super) fn and(&mut self, x: Sig, y: Sig) -> Sig {
        match (x, y) {
            (Sig::Zero, _) | (_, Sig::Zero) => Sig::Zero,
            (Sig::One, z) | (z, Sig::One) => z,
            (Sig::Net(a), Sig::Net(b)) if a == b => x,
            (Sig::Net(a), Sig::Net(b)) => self.gate(Op::And, vec![a, b]),
        }
    }

    /// x OR y.
    pub(super) fn or(&mut self, x: Sig, y: Sig) -> Sig {
        match (x, y) {
            (Sig::One, _) | (_, Sig::One) => Sig::One,
            (Sig::Zero, z) | (z, Sig::Zero) => z,
            (Sig::Net(a), Sig::Net(b)) if a == b => x,
            (Sig::Net(a), Sig::Net(b)) => self.gate(Op::Or, vec![a, b]),
        }
    }

    /// x XOR y.
    pub(super) fn xor(&mut self, x: Sig, y: Sig) -> Sig {
        match (x, y) {
            (Sig::Zero, z) | (z, Sig::Zero) => z,
            (Sig::One, z) | (z, Sig::One) => self.not(z),
            (Sig::Net(a), Sig::Net(b)) if a == b => Sig::Zero,
            (Sig::Net(a), Sig::Net(b)) => self.gate(Op::Xor, vec![a, b]),
        }
    }

    /// s ? t : e.
    pub(super) fn mux(&mut self, s: Sig, t: Sig, e: Sig) -> Sig {
        match (s, t, e) {
            (Sig::One, _, _) => t,
            (Sig::Zero, _, _) => e,
            _ if t == e => t,
            (_, Sig::One, Sig::Zero) => s,
            (_, Sig::Zero, Sig::One) => self.not(s),
            (_, Sig::Zero, _) => {
                let ns = self.not(s);
                self.and(ns, e)
            }
            (_, _, Sig::Zero) => self.and(s, t),
            (_, Sig::One, _) => self.or(s, e),
            (Sig::Net(sn), _, Sig::One) => {
                let ns = self.not(Sig::Net(sn));
                self.or(ns, t)
            }
            (Sig::Net(sn), Sig::Net(tn), Sig::Net(en)) => self.gate(Op::Mux2, vec![sn, tn, en]),
        }
    }

    /// Sum and carry of a full adder.
    pub(super) fn full_add(&mut self, a: Sig, b: Sig, cin: Sig) -> (Sig, Sig) {
        let p = self.xor(a, b);
        let s = self.xor(p, cin);
        let g = self.and(a, b);
        let t = self.and(p, cin);
        (s, self.or(g, t))
    }

    /// x + y + cin over the width of the wider operand (missing bits are 0), with the carry out
    /// as the last bit.
    pub(super) fn add(&mut self, x: &[Sig], y: &[Sig], cin: Sig) -> Vec<Sig> {
        let w = x.len().max(y.len());
        let mut carry = cin;
        let mut out = Vec::with_capacity(w + 1);
        for i in 0..w {
            let a = x.get(i).copied().unwrap_or(Sig::Zero);
            let b = y.get(i).copied().unwrap_or(Sig::Zero);
            let (s, co) = self.full_add(a, b, carry);
            out.push(s);
            carry = co;
        }
        out.push(carry);
        out
    }

    /// x - y over the width of `x` (y is zero-extended or truncated): the difference and the
    /// borrow out (1 when x < y as unsigned numbers of that width).
    pub(super) fn sub(&mut self, x: &[Sig], y: &[Sig]) -> (Vec<Sig>, Sig) {
        let mut inv = Vec::with_capacity(x.len());
        for i in 0..x.len() {
            let b = y.get(i).copied().unwrap_or(Sig::Zero);
            inv.push(self.not(b));
        }
        let mut sum = self.add(x, &inv, Sig::One);
        let carry = sum.pop().expect("add gives a carry");
        (sum, self.not(carry))
    }
}

/// `bits` without the constant-zero bits at the top.
pub(super) fn trim(mut bits: Vec<Sig>) -> Vec<Sig> {
    while bits.len() > 1 && bits.last() == Some(&Sig::Zero) {
        bits.pop();
    }
    bits
}

/// The constant `value` as `width` bits, bit 0 first.
pub(super) fn constant(value: u64, width: usize) -> Vec<Sig> {
    (0..width)
        .map(|i| Sig::bit(i < 64 && (value >> i) & 1 == 1))
        .collect()
}
