//! Exhaustive bit-parallel simulation: a complete decision for output pairs whose combined
//! structural support is small. Every one of the 2^n assignments of the group's n support
//! inputs is simulated on the union of the pairs' cones, 64 assignments per word, in blocks of
//! words so that memory stays bounded; a pair is equal when its two literals agree on every
//! assignment that satisfies the constraint, and different with the first assignment that
//! separates them (inputs outside the support are false; the caller re-simulates it on both
//! designs). The evidence of an `equal` answer is the enumeration itself: 2^n assignments,
//! nothing sampled.

use crate::aig::{Aig, Lit, Node};
use crate::sat::Limits;

/// Largest support simulated exhaustively (2^24 assignments are 262,144 words per node).
pub(crate) const MAX_INPUTS: usize = 24;

/// Largest amount of work, in node-words (cone nodes times words), one group may take.
pub(crate) const MAX_WORK: u64 = 1 << 31;

/// Bytes of simulation values alive per block: the words per node of a block are this divided
/// by eight times the nodes.
const BLOCK_BYTES: usize = 32 << 20;

/// The answer for one output pair.
#[derive(Clone, Debug, PartialEq, Eq)]
pub(crate) enum Decision {
    /// Equal on every assignment that satisfies the constraint.
    Equal,
    /// Different under these values of all inputs of the graph.
    Differ(Vec<bool>),
}

/// Why a group was not decided.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub(crate) enum Declined {
    /// The support or the work exceeds the limits.
    TooLarge,
    /// The wall-clock budget ran out.
    Timeout,
}

/// Node-words needed to enumerate the support `inputs` on a cone of `cone_nodes` nodes.
pub(crate) fn work(cone_nodes: usize, inputs: usize) -> u64 {
    let words = if inputs <= 6 { 1 } else { 1u64 << (inputs - 6) };
    cone_nodes as u64 * words
}

/// Decide every pair `(a, b)` of `pairs` by enumerating the support of all of them together
/// (with `constraint` in the cone), or decline when the support exceeds `max_inputs` or the
/// work exceeds `max_work`.
pub(crate) fn decide(
    aig: &Aig,
    pairs: &[(Lit, Lit)],
    constraint: Lit,
    max_inputs: usize,
    max_work: u64,
    limits: &Limits,
) -> Result<Vec<Decision>, Declined> {
    let mut roots: Vec<Lit> = pairs.iter().flat_map(|&(a, b)| [a, b]).collect();
    roots.push(constraint);
    let mask = aig.cone_mask(&roots);
    let support: Vec<usize> = aig
        .inputs()
        .iter()
        .enumerate()
        .filter(|(_, &n)| mask[n as usize])
        .map(|(k, _)| k)
        .collect();
    let n = support.len();
    let cone: Vec<usize> = (0..aig.len()).filter(|&i| mask[i]).collect();
    if n > max_inputs || work(cone.len(), n) > max_work {
        return Err(Declined::TooLarge);
    }
    // Local slots: cone nodes in topological order; fan-ins as (slot, complement mask).
    let mut slot = vec![u32::MAX; aig.len()];
    for (s, &i) in cone.iter().enumerate() {
        slot[i] = s as u32;
    }
    let pos_of_input: Vec<Option<usize>> = {
        let mut v = vec![None; aig.num_inputs()];
        for (j, &k) in support.iter().enumerate() {
            v[k] = Some(j);
        }
        v
    };
    enum Op {
        Zero,
        Input(usize),
        And(usize, u64, usize, u64),
    }
    let ops: Vec<Op> = cone
        .iter()
        .map(|&i| match aig.node(i as u32) {
            Node::Const => Op::Zero,
            Node::Input(k) => Op::Input(pos_of_input[k as usize].expect("support input")),
            Node::And(a, b) => Op::And(
                slot[a.index()] as usize,
                a.complement_mask(),
                slot[b.index()] as usize,
                b.complement_mask(),
            ),
        })
        .collect();
    let lit_of = |l: Lit| (slot[l.index()] as usize, l.complement_mask());
    let total_words: u64 = if n <= 6 { 1 } else { 1u64 << (n - 6) };
    let block = (BLOCK_BYTES / 8 / cone.len().max(1)).clamp(1, 1024) as u64;
    let block = block.min(total_words) as usize;
    let mut vals = vec![0u64; cone.len() * block];
    let valid_bits: u64 = if n >= 6 {
        u64::MAX
    } else {
        (1u64 << (1u32 << n)) - 1
    };
    let mut first: Vec<Option<u64>> = vec![None; pairs.len()];
    let mut open = pairs.len();
    let mut w0 = 0u64;
    while w0 < total_words && open > 0 {
        if limits.expired() {
            return Err(Declined::Timeout);
        }
        let len = block.min((total_words - w0) as usize);
        for (s, op) in ops.iter().enumerate() {
            let base = s * block;
            match *op {
                Op::Zero => vals[base..base + len].fill(0),
                Op::Input(j) => {
                    for w in 0..len {
                        vals[base + w] = crate::aig::variable_word(j, w0 + w as u64);
                    }
                }
                Op::And(a, ma, b, mb) => {
                    let (ia, ib) = (a * block, b * block);
                    for w in 0..len {
                        vals[base + w] = (vals[ia + w] ^ ma) & (vals[ib + w] ^ mb);
                    }
                }
            }
        }
        let (cs, cm) = lit_of(constraint);
        for (p, &(a, b)) in pairs.iter().enumerate() {
            if first[p].is_some() {
                continue;
            }
            let ((sa, ma), (sb, mb)) = (lit_of(a), lit_of(b));
            for w in 0..len {
                let d = ((vals[sa * block + w] ^ ma) ^ (vals[sb * block + w] ^ mb))
                    & (vals[cs * block + w] ^ cm)
                    & valid_bits;
                if d != 0 {
                    first[p] = Some((w0 + w as u64) * 64 + d.trailing_zeros() as u64);
                    open -= 1;
                    break;
                }
            }
        }
        w0 += len as u64;
    }
    Ok(first
        .into_iter()
        .map(|f| match f {
            None => Decision::Equal,
            Some(pattern) => {
                let mut values = vec![false; aig.num_inputs()];
                for (j, &k) in support.iter().enumerate() {
                    values[k] = (pattern >> j) & 1 == 1;
                }
                Decision::Differ(values)
            }
        })
        .collect())
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::aig::eval;

    /// A ripple adder and a carry-select style adder of `n` bits in one graph.
    fn adders(n: usize) -> (Aig, Vec<(Lit, Lit)>) {
        let mut g = Aig::new();
        let a: Vec<Lit> = (0..n).map(|_| g.add_input()).collect();
        let b: Vec<Lit> = (0..n).map(|_| g.add_input()).collect();
        let mut c = Lit::FALSE;
        let mut ripple = Vec::new();
        for i in 0..n {
            let p = g.xor(a[i], b[i]);
            ripple.push(g.xor(p, c));
            let t = g.and(a[i], b[i]);
            let u = g.and(p, c);
            c = g.or(t, u);
        }
        // Sum bits as XOR of the inputs and a carry computed as OR of generate-and-propagate terms.
        let mut other = Vec::new();
        for i in 0..n {
            let mut carry = Lit::FALSE;
            for j in 0..i {
                let mut term = g.and(a[j], b[j]);
                for k in j + 1..i {
                    let p = g.or(a[k], b[k]);
                    term = g.and(term, p);
                }
                carry = g.or(carry, term);
            }
            let p = g.xor(b[i], a[i]);
            other.push(g.xor(carry, p));
        }
        (g, ripple.into_iter().zip(other).collect())
    }

    #[test]
    fn adders_are_equal_and_a_flipped_bit_is_found() {
        for n in [1, 3, 6, 9] {
            let (mut g, mut pairs) = adders(n);
            let r = decide(&g, &pairs, Lit::TRUE, 24, MAX_WORK, &Limits::none()).unwrap();
            assert!(r.iter().all(|d| *d == Decision::Equal), "n = {n}");
            // A planted bug: the top sum bit ANDed with a fresh condition on two inputs.
            let last = pairs.len() - 1;
            let cond = g.and(g.input_lit(0), g.input_lit(n));
            pairs[last].1 = g.xor(pairs[last].1, cond);
            let r = decide(&g, &pairs, Lit::TRUE, 24, MAX_WORK, &Limits::none()).unwrap();
            let Decision::Differ(v) = &r[last] else {
                panic!("bug not found for n = {n}");
            };
            let vals = eval(&g, v, &[pairs[last].0, pairs[last].1]);
            assert_ne!(vals[0], vals[1], "the vector separates the pair");
        }
    }

    #[test]
    fn constraint_restricts_the_assignments() {
        let mut g = Aig::new();
        let x = g.add_input();
        let y = g.add_input();
        let and = g.and(x, y);
        // x AND y equals x when y is assumed true, not otherwise.
        let r = decide(&g, &[(and, x)], y, 24, MAX_WORK, &Limits::none()).unwrap();
        assert_eq!(r, vec![Decision::Equal]);
        let r = decide(&g, &[(and, x)], Lit::TRUE, 24, MAX_WORK, &Limits::none()).unwrap();
        assert_eq!(r, vec![Decision::Differ(vec![true, false])]);
    }

    #[test]
    fn declines_a_large_support() {
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..30).map(|_| g.add_input()).collect();
        let a = g.and_all(&ins);
        let b = g.and_all(&ins[1..]);
        assert_eq!(
            decide(&g, &[(a, b)], Lit::TRUE, 24, MAX_WORK, &Limits::none()),
            Err(Declined::TooLarge)
        );
        let c = g.and(ins[0], b);
        assert_eq!(
            decide(&g, &[(a, c)], Lit::TRUE, 30, MAX_WORK, &Limits::none()),
            Ok(vec![Decision::Equal])
        );
    }

    #[test]
    fn word_patterns_cover_every_assignment_once() {
        // 8 inputs: 4 words; every pattern number appears once with its own bits.
        for w in 0..4u64 {
            for bit in 0..64u64 {
                let p = w * 64 + bit;
                for j in 0..8 {
                    let v = (crate::aig::variable_word(j, w) >> bit) & 1;
                    assert_eq!(v, (p >> j) & 1);
                }
            }
        }
    }
}
