//! Exhaustive bit-parallel simulation of two bench nets, written from the gate lines (the
//! [`super::Net`] form) without any of equicone's code: every one of the 2^n input vectors,
//! 64 per `u64` word, for up to 20 inputs. Vector `v` gives input `i` (in the first net's
//! order) the value of bit `i` of `v`; the second net's inputs pair with the first's by name.
//! [`Evaluator`] runs one net on given words (the generator tests' evaluator).

use super::Net;
use std::collections::HashMap;

/// A net compiled to gates over signal indices, inputs first, in topological order.
struct Compiled {
    /// Gate kind and fan-in signal indices; gate `g` drives signal `inputs + g`.
    gates: Vec<(Kind, Vec<usize>)>,
    /// The signal of each output.
    outputs: Vec<usize>,
    /// The signal count.
    signals: usize,
}

#[derive(Copy, Clone)]
enum Kind {
    And,
    Nand,
    Or,
    Nor,
    Xor,
    Xnor,
    Not,
    Buf,
}

impl Compiled {
    /// Compile `n`; its input `k` becomes signal `input_slot[k]` (a position in the shared
    /// input order).
    fn new(n: &Net, input_slot: &[usize], shared_inputs: usize) -> Compiled {
        let order = n.order();
        let mut index: HashMap<&str, usize> = HashMap::new();
        for (k, name) in n.inputs.iter().enumerate() {
            index.insert(name, input_slot[k]);
        }
        for (pos, &g) in order.iter().enumerate() {
            index.insert(&n.gates[g].0, shared_inputs + pos);
        }
        let gates = order
            .iter()
            .map(|&g| {
                let (_, kind, args) = &n.gates[g];
                let kind = match kind.as_str() {
                    "AND" => Kind::And,
                    "NAND" => Kind::Nand,
                    "OR" => Kind::Or,
                    "NOR" => Kind::Nor,
                    "XOR" => Kind::Xor,
                    "XNOR" => Kind::Xnor,
                    "NOT" => Kind::Not,
                    "BUF" | "BUFF" => Kind::Buf,
                    k => panic!("oracle: unknown gate {k}"),
                };
                (kind, args.iter().map(|a| index[a.as_str()]).collect())
            })
            .collect();
        Compiled {
            gates,
            outputs: n.outputs.iter().map(|o| index[o.as_str()]).collect(),
            signals: shared_inputs + order.len(),
        }
    }

    /// Simulate one word whose input words are already in `vals[..inputs]`.
    fn run(&self, vals: &mut [u64], inputs: usize) {
        for (g, (kind, args)) in self.gates.iter().enumerate() {
            let a = args.iter().map(|&s| vals[s]);
            vals[inputs + g] = match kind {
                Kind::And => a.fold(!0, |x, y| x & y),
                Kind::Nand => !a.fold(!0, |x, y| x & y),
                Kind::Or => a.fold(0, |x, y| x | y),
                Kind::Nor => !a.fold(0, |x, y| x | y),
                Kind::Xor => a.fold(0, |x, y| x ^ y),
                Kind::Xnor => !a.fold(0, |x, y| x ^ y),
                Kind::Not => !vals[args[0]],
                Kind::Buf => vals[args[0]],
            };
        }
    }
}

/// One net compiled for word-parallel evaluation: 64 patterns per word, inputs and outputs in
/// file order.
pub struct Evaluator {
    compiled: Compiled,
    /// Input names, in file order.
    pub inputs: Vec<String>,
    /// Output names, in file order.
    pub outputs: Vec<String>,
}

impl Net {
    /// The word-parallel evaluator of this net; every name must be defined once.
    pub fn evaluator(&self) -> Evaluator {
        let mut seen = std::collections::HashSet::new();
        for name in self.inputs.iter().chain(self.gates.iter().map(|g| &g.0)) {
            assert!(seen.insert(name), "`{name}` defined twice");
        }
        let n = self.inputs.len();
        let slots: Vec<usize> = (0..n).collect();
        Evaluator {
            compiled: Compiled::new(self, &slots, n),
            inputs: self.inputs.clone(),
            outputs: self.outputs.clone(),
        }
    }
}

impl Evaluator {
    /// Number of gate lines.
    pub fn gates(&self) -> usize {
        self.compiled.gates.len()
    }

    /// Evaluate: one word per input (file order) -> one word per output (file order).
    pub fn eval(&self, inputs: &[u64]) -> Vec<u64> {
        let n = self.inputs.len();
        assert_eq!(inputs.len(), n);
        let mut vals = vec![0u64; self.compiled.signals];
        vals[..n].copy_from_slice(inputs);
        self.compiled.run(&mut vals, n);
        self.compiled.outputs.iter().map(|&s| vals[s]).collect()
    }
}

/// Per output pair (by position): the first input vector on which the two nets differ, or
/// `None` when they agree on all 2^n vectors. `n` is the first net's input count (at most 20);
/// every input of the second net must be an input of the first (by name).
/// Word `w` of input `i` when all assignments are enumerated: within a word, inputs 0..6
/// follow the bit position; above that, the word index.
pub fn lane_word(i: usize, w: u64) -> u64 {
    const LOW: [u64; 6] = [
        0xAAAA_AAAA_AAAA_AAAA,
        0xCCCC_CCCC_CCCC_CCCC,
        0xF0F0_F0F0_F0F0_F0F0,
        0xFF00_FF00_FF00_FF00,
        0xFFFF_0000_FFFF_0000,
        0xFFFF_FFFF_0000_0000,
    ];
    if i < 6 {
        LOW[i]
    } else if (w >> (i - 6)) & 1 == 1 {
        !0
    } else {
        0
    }
}

pub fn exhaustive_diff(a: &Net, b: &Net) -> Vec<Option<u64>> {
    let n = a.inputs.len();
    assert!(
        n <= 20,
        "oracle: {n} inputs are too many for exhaustive simulation"
    );
    assert_eq!(
        a.outputs.len(),
        b.outputs.len(),
        "oracle: output counts differ"
    );
    let slot_a: Vec<usize> = (0..n).collect();
    let slot_b: Vec<usize> = b
        .inputs
        .iter()
        .map(|x| {
            a.inputs
                .iter()
                .position(|y| y == x)
                .unwrap_or_else(|| panic!("oracle: input {x} only in the second net"))
        })
        .collect();
    let ca = Compiled::new(a, &slot_a, n);
    let cb = Compiled::new(b, &slot_b, n);
    let mut va = vec![0u64; ca.signals];
    let mut vb = vec![0u64; cb.signals];
    let vectors = 1u64 << n;
    let words = vectors.div_ceil(64);
    let valid = if vectors >= 64 {
        !0
    } else {
        (1u64 << vectors) - 1
    };
    let mut first: Vec<Option<u64>> = vec![None; a.outputs.len()];
    for w in 0..words {
        for i in 0..n {
            let word = lane_word(i, w);
            va[i] = word;
            vb[i] = word;
        }
        ca.run(&mut va, n);
        cb.run(&mut vb, n);
        for (k, f) in first.iter_mut().enumerate() {
            if f.is_none() {
                let diff = (va[ca.outputs[k]] ^ vb[cb.outputs[k]]) & valid;
                if diff != 0 {
                    *f = Some(w * 64 + diff.trailing_zeros() as u64);
                }
            }
        }
        if first.iter().all(|f| f.is_some()) {
            break;
        }
    }
    first
}

/// The input assignment (by the first net's input names) of vector `v`.
pub fn vector(a: &Net, v: u64) -> HashMap<String, bool> {
    a.inputs
        .iter()
        .enumerate()
        .map(|(i, x)| (x.clone(), (v >> i) & 1 == 1))
        .collect()
}
