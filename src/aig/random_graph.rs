//! Test-only random AIGs: the one builder the engines' unit tests draw their random graphs
//! from (BDD package, BDD sweep, equivalence classes), so that a change to how test graphs
//! are made happens in one place. Seeded by the crate's SplitMix64, so a seed gives the same
//! graph on every machine.

use super::{Aig, Lit};
use crate::rng::SplitMix64;

/// How the fan-ins of each new node are drawn.
#[derive(Copy, Clone, Debug)]
pub(crate) struct Shape {
    /// `Some(k)`: each fan-in is one of the `k` most recent literals (a deep graph with
    /// redundant structure); `None`: any earlier literal, uniformly.
    pub recent: Option<usize>,
    /// `Some(n)`: one node in `n` (drawn) is an XOR of its two fan-ins (three AND nodes);
    /// `None`: every node is one AND.
    pub xor_one_in: Option<u64>,
}

impl Shape {
    /// Fan-ins drawn uniformly from every earlier literal, AND nodes only.
    pub(crate) const UNIFORM: Shape = Shape {
        recent: None,
        xor_one_in: None,
    };
}

/// A graph of `inputs` inputs and `steps` new nodes (each an AND, or an XOR as `shape`
/// says), fan-ins complemented at random; returns the graph and the literal of every input
/// and node in the order made.
pub(crate) fn random_aig(seed: u64, inputs: usize, steps: usize, shape: Shape) -> (Aig, Vec<Lit>) {
    let mut g = Aig::new();
    let mut lits: Vec<Lit> = (0..inputs).map(|_| g.add_input()).collect();
    let mut rng = SplitMix64::new(seed, 0);
    let pick = |r: u64, n: usize| match shape.recent {
        Some(k) => n - 1 - (r as usize % n.min(k)),
        None => r as usize % n,
    };
    for _ in 0..steps {
        let a = lits[pick(rng.next_u64(), lits.len())].xor_complement(rng.next_u64() & 1 == 1);
        let b = lits[pick(rng.next_u64(), lits.len())].xor_complement(rng.next_u64() & 1 == 1);
        let xor = shape
            .xor_one_in
            .is_some_and(|n| rng.next_u64().is_multiple_of(n));
        let l = if xor { g.xor(a, b) } else { g.and(a, b) };
        lits.push(l);
    }
    (g, lits)
}

/// `n` random input values from `rng`.
pub(crate) fn random_vector(rng: &mut SplitMix64, n: usize) -> Vec<bool> {
    (0..n).map(|_| rng.next_u64() & 1 == 1).collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::aig::Node;

    #[test]
    fn same_seed_same_graph_and_fan_ins_come_before_their_node() {
        for shape in [
            Shape::UNIFORM,
            Shape {
                recent: Some(4),
                xor_one_in: Some(3),
            },
        ] {
            let (a, la) = random_aig(5, 6, 80, shape);
            let (b, lb) = random_aig(5, 6, 80, shape);
            assert_eq!(a.nodes(), b.nodes());
            assert_eq!(la, lb);
            assert_eq!(la.len(), 86);
            assert_eq!(a.num_inputs(), 6);
            for (i, node) in a.nodes().iter().enumerate() {
                if let Node::And(x, y) = node {
                    assert!(x.index() < i && y.index() < i);
                }
            }
            let (c, _) = random_aig(6, 6, 80, shape);
            assert_ne!(a.nodes(), c.nodes(), "another seed gives another graph");
        }
    }
}
