//! Candidate classes: random simulation, a word at a time, splits the nodes into classes
//! of equal signatures (up to complement); and the side marks that say which design's cones
//! hold each node (a node is tried against its representative only when the pair relates
//! the two designs).

use super::super::classes::{Classes, Signatures};
use super::super::pairs::PairQuery;
use crate::aig::{
    mixed_density, one_hot_words, random_words, simulate_into, Aig, Lit, Node, SimTable,
};

/// Classes of `g`'s nodes after `words` words of random and structured simulation from
/// `seed` ([`initial_words`]), and the input words simulated.
pub(super) fn initial_classes(g: &Aig, words: usize, seed: u64) -> (Classes, Vec<Vec<u64>>) {
    let ins = initial_words(g.num_inputs(), words, seed);
    // Signatures accumulated a word at a time: the partition of all words at once, with one
    // word of simulation values per node alive at a time.
    let mut table = SimTable::default();
    let mut row: Vec<Vec<u64>> = vec![vec![0]; ins.len()];
    let mut sigs = Signatures::new(g.len());
    for w in 0..ins.first().map_or(0, Vec::len) {
        for (r, i) in row.iter_mut().zip(&ins) {
            r[0] = i[w];
        }
        simulate_into(g, &row, 1, &mut table);
        sigs.add(&table.values);
    }
    drop(table);
    (Classes::from_signatures(sigs), ins)
}

/// Words of one-hot and one-cold vectors added to the first simulation.
const ONE_HOT_WORDS: usize = 2;

/// The first simulation's input words: `words` words alternating uniform random ones with
/// mixed-density ones (sparse and dense vectors), then [`ONE_HOT_WORDS`] words of one-hot
/// and one-cold vectors. Near-constant nodes (an arbiter's grant and its long runs of idle
/// requesters) react to the structured vectors, which random ones rarely reach: on a
/// 1024-requester arbiter against its remap, 15,989 classes instead of 6,915.
fn initial_words(inputs: usize, words: usize, seed: u64) -> Vec<Vec<u64>> {
    let uniform = random_words(inputs, words, seed ^ 0x5EED_5EED);
    let mixed = mixed_density(inputs, words, seed);
    let hot = one_hot_words(inputs, ONE_HOT_WORDS, seed);
    (0..inputs)
        .map(|k| {
            (0..words)
                .map(|w| {
                    if w % 2 == 0 {
                        uniform[k][w]
                    } else {
                        mixed[k][w]
                    }
                })
                .chain(hot[k].iter().copied())
                .collect()
        })
        .collect()
}

/// Side marks: in the reference's cones, in the candidate's cones.
pub(super) const REF: u8 = 1;
pub(super) const CAND: u8 = 2;
pub(super) const BOTH: u8 = 3;

/// For each node: which designs' output cones hold it (inputs count as both, the constant as
/// neither, so that a node is tried against a constant only when both designs share it).
pub(super) fn sides(g: &Aig, pairs: &[PairQuery]) -> Vec<u8> {
    let r: Vec<Lit> = pairs.iter().map(|p| p.reference).collect();
    let c: Vec<Lit> = pairs.iter().map(|p| p.candidate).collect();
    let (mr, mc) = (g.cone_mask(&r), g.cone_mask(&c));
    (0..g.len())
        .map(|n| match g.node(n as u32) {
            Node::Const => 0,
            Node::Input(_) => BOTH,
            Node::And(..) => REF * u8::from(mr[n]) + CAND * u8::from(mc[n]),
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::super::fixture::xors;
    use super::*;

    #[test]
    fn equal_functions_share_a_class_and_others_do_not() {
        let x = xors();
        let (classes, ins) = initial_classes(&x.aig, 4, 1);
        assert_eq!(ins.len(), 2);
        assert!(ins.iter().all(|w| w.len() == 4 + ONE_HOT_WORDS));
        let compl = x.x1.is_complemented() != x.x2.is_complemented();
        assert_eq!(classes.same_class(x.x1.index(), x.x2.index()), Some(compl));
        assert_eq!(classes.same_class(x.x1.index(), x.y.index()), None);
        // 256 random patterns over two inputs show all four assignments.
        assert_eq!(classes.same_class(x.y.index(), x.x2.index()), None);
    }

    #[test]
    fn sides_follow_each_designs_cone() {
        let x = xors();
        let pairs = [PairQuery {
            reference: x.x1,
            candidate: x.x2,
        }];
        let side = sides(&x.aig, &pairs);
        assert_eq!(side[0], 0, "the constant belongs to neither");
        assert_eq!((side[1], side[2]), (BOTH, BOTH), "inputs belong to both");
        assert_eq!(side[x.x1.index()], REF);
        assert_eq!(side[x.x2.index()], CAND);
        // a & b is read by the candidate's form only.
        assert_eq!(side[x.y.index()], CAND);
    }
}
