//! Bit-parallel simulation of the AIG: 64 input patterns per `u64` word.

use super::{Aig, Lit, Node};

/// Simulation values of every node, `words` words per node, node-major.
#[derive(Clone, Debug, Default)]
pub struct SimTable {
    /// Words per node.
    pub words: usize,
    /// `values[node * words + w]`.
    pub values: Vec<u64>,
}

impl SimTable {
    /// The words of node `n`.
    #[inline]
    pub fn node(&self, n: usize) -> &[u64] {
        &self.values[n * self.words..(n + 1) * self.words]
    }

    /// Word `w` of literal `l` (complemented as the literal says).
    #[inline]
    pub fn lit_word(&self, l: Lit, w: usize) -> u64 {
        let v = self.values[l.index() * self.words + w];
        if l.is_complemented() {
            !v
        } else {
            v
        }
    }

    /// Bit `p` (pattern number) of literal `l`.
    #[inline]
    pub fn lit_bit(&self, l: Lit, p: usize) -> bool {
        (self.lit_word(l, p / 64) >> (p % 64)) & 1 == 1
    }
}

/// Simulate `aig` on `inputs[k]` (one slice of `words` words per primary input).
pub fn simulate(aig: &Aig, inputs: &[Vec<u64>], words: usize) -> SimTable {
    let mut table = SimTable {
        words,
        values: Vec::new(),
    };
    simulate_into(aig, inputs, words, &mut table);
    table
}

/// [`simulate`] into an existing table, reusing its memory (for word-at-a-time passes).
pub fn simulate_into(aig: &Aig, inputs: &[Vec<u64>], words: usize, table: &mut SimTable) {
    simulate_prefix(aig, inputs, words, aig.len(), table);
}

/// [`simulate_into`] for the first `upto` nodes only (a graph that grew after the nodes of
/// interest: nodes are in topological order, so a prefix is closed under fan-in).
pub fn simulate_prefix(
    aig: &Aig,
    inputs: &[Vec<u64>],
    words: usize,
    upto: usize,
    table: &mut SimTable,
) {
    assert_eq!(inputs.len(), aig.num_inputs(), "one pattern row per input");
    let upto = upto.min(aig.len());
    let mut values = std::mem::take(&mut table.values);
    values.clear();
    values.resize(upto * words, 0);
    for (i, node) in aig.nodes()[..upto].iter().enumerate() {
        match *node {
            Node::Const => {}
            Node::Input(k) => {
                values[i * words..(i + 1) * words].copy_from_slice(&inputs[k as usize][..words]);
            }
            Node::And(a, b) => {
                let (ma, mb) = (a.complement_mask(), b.complement_mask());
                let (ia, ib) = (a.index() * words, b.index() * words);
                for w in 0..words {
                    values[i * words + w] = (values[ia + w] ^ ma) & (values[ib + w] ^ mb);
                }
            }
        }
    }
    *table = SimTable { words, values };
}

/// The truth table of variable `j` (< 6) on one 64-bit word: bit `m` is bit `j` of `m`. Word
/// `w` of a variable `j >= 6` is all ones when bit `j - 6` of `w` is set, else zero.
pub const PROJECTIONS: [u64; 6] = [
    0xAAAA_AAAA_AAAA_AAAA,
    0xCCCC_CCCC_CCCC_CCCC,
    0xF0F0_F0F0_F0F0_F0F0,
    0xFF00_FF00_FF00_FF00,
    0xFFFF_0000_FFFF_0000,
    0xFFFF_FFFF_0000_0000,
];

/// Word `w` of variable `j` in the enumeration of all assignments, pattern `64 w + bit`
/// assigning variable `j` the bit `j` of the pattern number.
#[inline]
pub fn variable_word(j: usize, w: u64) -> u64 {
    if j < 6 {
        PROJECTIONS[j]
    } else {
        0u64.wrapping_sub((w >> (j - 6)) & 1)
    }
}

/// Evaluate the literals `roots` for one input vector.
pub fn eval(aig: &Aig, inputs: &[bool], roots: &[Lit]) -> Vec<bool> {
    assert_eq!(inputs.len(), aig.num_inputs(), "one value per input");
    let mut v = vec![false; aig.len()];
    for (i, node) in aig.nodes().iter().enumerate() {
        v[i] = match *node {
            Node::Const => false,
            Node::Input(k) => inputs[k as usize],
            Node::And(a, b) => {
                (v[a.index()] ^ a.is_complemented()) & (v[b.index()] ^ b.is_complemented())
            }
        };
    }
    roots
        .iter()
        .map(|r| v[r.index()] ^ r.is_complemented())
        .collect()
}

/// Deterministic pseudo-random words (SplitMix64) for `n` inputs and `words` words each.
pub fn random_words(n: usize, words: usize, seed: u64) -> Vec<Vec<u64>> {
    let mut rng = crate::rng::SplitMix64::from_state(seed ^ crate::rng::GOLDEN);
    (0..n)
        .map(|_| (0..words).map(|_| rng.next_u64()).collect())
        .collect()
}

#[cfg(test)]
#[allow(clippy::needless_range_loop)]
mod tests {
    use super::*;

    #[test]
    fn xor_simulates_like_xor() {
        let mut g = Aig::new();
        let a = g.add_input();
        let b = g.add_input();
        let x = g.xor(a, b);
        let ins = random_words(2, 3, 1);
        let t = simulate(&g, &ins, 3);
        for w in 0..3 {
            assert_eq!(t.lit_word(x, w), ins[0][w] ^ ins[1][w]);
            assert_eq!(t.lit_word(!x, w), !(ins[0][w] ^ ins[1][w]));
        }
        assert_eq!(eval(&g, &[true, false], &[x, !x]), vec![true, false]);
    }
}
