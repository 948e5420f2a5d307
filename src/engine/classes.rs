//! Candidate equivalence classes of AIG nodes: nodes whose simulation signatures agree, up to
//! complement, are candidates for merging; every new simulation word can only split classes.
//!
//! A node's *phase* is the value of its first simulated pattern; signatures are compared after
//! complementing the nodes whose phase is 1, so a node and the complement of another land in one
//! class. The representative of a class is its smallest node index, so in a topological sweep it
//! is always decided before the other members.

#[cfg(test)]
use crate::aig::SimTable;
use crate::rng::mix;

/// No class (a singleton).
const NONE: u32 = u32::MAX;

/// The classes of one sweep.
#[derive(Clone, Debug)]
pub(crate) struct Classes {
    /// Representative of each node's class, or `NONE` for a singleton.
    rep: Vec<u32>,
    /// Phase of each node (value under the first pattern).
    phase: Vec<bool>,
    /// Nodes in classes of two or more, class by class (each class contiguous and ascending).
    active: Vec<u32>,
    /// Members of the class of each representative (0 for other nodes).
    size: Vec<u32>,
}

impl Classes {
    /// Classes from a simulation table of every node, signatures compared exactly (the
    /// reference the tests hold [`Classes::from_signatures`] to).
    #[cfg(test)]
    pub(crate) fn from_table(table: &SimTable, nodes: usize) -> Classes {
        let words = table.words;
        let phase: Vec<bool> = (0..nodes)
            .map(|n| words > 0 && table.node(n)[0] & 1 == 1)
            .collect();
        let norm = |n: usize, w: usize| {
            let v = table.node(n)[w];
            if phase[n] {
                !v
            } else {
                v
            }
        };
        let mut keyed: Vec<(u64, u32)> = (0..nodes)
            .map(|n| {
                let mut h = 0x243F_6A88_85A3_08D3u64;
                for w in 0..words {
                    h = mix(h ^ norm(n, w));
                }
                (h, n as u32)
            })
            .collect();
        keyed.sort_unstable();
        let mut rep = vec![NONE; nodes];
        let mut start = 0;
        let mut leaders: Vec<(u32, u32)> = Vec::new(); // (leader, members)
        while start < keyed.len() {
            let mut end = start + 1;
            while end < keyed.len() && keyed[end].0 == keyed[start].0 {
                end += 1;
            }
            if end - start > 1 {
                // Equal hashes: group by exact signature (collisions are rare).
                leaders.clear();
                for &(_, n) in &keyed[start..end] {
                    let same =
                        |l: u32| (0..words).all(|w| norm(l as usize, w) == norm(n as usize, w));
                    match leaders.iter_mut().find(|(l, _)| same(*l)) {
                        Some((l, k)) => {
                            rep[n as usize] = *l;
                            *k += 1;
                        }
                        None => {
                            rep[n as usize] = n;
                            leaders.push((n, 1));
                        }
                    }
                }
                for &(l, k) in &leaders {
                    if k == 1 {
                        rep[l as usize] = NONE;
                    }
                }
            }
            start = end;
        }
        let mut active: Vec<u32> = (0..nodes as u32)
            .filter(|&n| rep[n as usize] != NONE)
            .collect();
        active.sort_unstable_by_key(|&n| (rep[n as usize], n));
        Classes::with_sizes(rep, phase, active)
    }

    /// Classes from accumulated signatures: nodes with equal signatures form a class. A 64-bit
    /// collision of two different signatures (about one chance in 10^12 for a million nodes)
    /// only makes a candidate pair that the sweep refutes.
    pub(crate) fn from_signatures(sigs: Signatures) -> Classes {
        let Signatures { sig, phase, .. } = sigs;
        let nodes = sig.len();
        let mut keyed: Vec<(u64, u32)> = sig.into_iter().zip(0u32..).collect();
        keyed.sort_unstable();
        let mut rep = vec![NONE; nodes];
        // Sorted by (signature, node): the first of each run is the smallest index.
        for class in keyed.chunk_by(|x, y| x.0 == y.0).filter(|c| c.len() > 1) {
            for &(_, n) in class {
                rep[n as usize] = class[0].1;
            }
        }
        // The members, class by class, each class ascending.
        let mut active = keyed;
        active.retain(|&(_, n)| rep[n as usize] != NONE);
        let active = active.into_iter().map(|(_, n)| n).collect();
        Classes::with_sizes(rep, phase, active)
    }

    fn with_sizes(rep: Vec<u32>, phase: Vec<bool>, active: Vec<u32>) -> Classes {
        let mut c = Classes {
            size: vec![0; rep.len()],
            rep,
            phase,
            active,
        };
        c.count_sizes();
        c
    }

    fn count_sizes(&mut self) {
        for &n in &self.active {
            self.size[self.rep[n as usize] as usize] = 0;
        }
        for &n in &self.active {
            self.size[self.rep[n as usize] as usize] += 1;
        }
    }

    /// Members of `n`'s class (1 for a singleton).
    pub(crate) fn class_size(&self, n: usize) -> usize {
        match self.rep[n] {
            NONE => 1,
            r => self.size[r as usize] as usize,
        }
    }

    /// The representative of `n`'s class and whether `n` is its complement, when `n` is a
    /// member other than the representative.
    #[inline]
    pub(crate) fn candidate(&self, n: usize) -> Option<(usize, bool)> {
        let r = self.rep[n];
        if r == NONE || r as usize == n {
            return None;
        }
        Some((r as usize, self.phase[n] != self.phase[r as usize]))
    }

    /// Whether `a` and `b` are in one class: `Some(complemented)` if so.
    #[inline]
    pub(crate) fn same_class(&self, a: usize, b: usize) -> Option<bool> {
        let r = self.rep[a];
        (r != NONE && r == self.rep[b]).then(|| self.phase[a] != self.phase[b])
    }

    /// Split the classes by one more word of simulation values (`values[node]`). `done` is
    /// the sweep's position (kept for callers; every member stays, since a passed member can
    /// still represent a later node once its class splits). Classes are contiguous in
    /// `active`, so a class that the word does not split costs one comparison per member and
    /// no memory, and a split one is sorted on its own.
    pub(crate) fn refine(&mut self, values: &[u64], done: usize) {
        let _ = done;
        let phase = &self.phase;
        let norm = |n: u32| {
            let v = values[n as usize];
            if phase[n as usize] {
                !v
            } else {
                v
            }
        };
        let mut out = 0;
        let mut start = 0;
        let mut scratch: Vec<(u64, u32)> = Vec::new();
        while start < self.active.len() {
            let r = self.rep[self.active[start] as usize];
            let len = self.active[start..]
                .iter()
                .take_while(|&&n| self.rep[n as usize] == r)
                .count();
            let end = start + len;
            let lead = norm(self.active[start]);
            if self.active[start + 1..end].iter().all(|&n| norm(n) == lead) {
                self.active.copy_within(start..end, out);
                out += len;
            } else {
                scratch.clear();
                scratch.extend(self.active[start..end].iter().map(|&n| (norm(n), n)));
                scratch.sort_unstable();
                for group in scratch.chunk_by(|x, y| x.0 == y.0) {
                    if group.len() == 1 {
                        self.rep[group[0].1 as usize] = NONE;
                    } else {
                        for &(_, n) in group {
                            self.rep[n as usize] = group[0].1;
                            self.active[out] = n;
                            out += 1;
                        }
                    }
                }
            }
            start = end;
        }
        self.active.truncate(out);
        self.count_sizes();
    }

    /// Number of classes with two or more members.
    pub(crate) fn count(&self) -> usize {
        self.active
            .iter()
            .filter(|&&n| self.rep[n as usize] == n)
            .count()
    }

    /// Number of nodes in classes with two or more members.
    pub(crate) fn members(&self) -> usize {
        self.active.len()
    }
}

/// Signatures of every node built one simulation word at a time (so that only one word of
/// values per node is alive): a hash of the node's phase-normalised words.
pub(crate) struct Signatures {
    sig: Vec<u64>,
    phase: Vec<bool>,
    words: usize,
}

impl Signatures {
    /// Empty signatures of `nodes` nodes.
    pub(crate) fn new(nodes: usize) -> Signatures {
        Signatures {
            sig: vec![0x243F_6A88_85A3_08D3; nodes],
            phase: vec![false; nodes],
            words: 0,
        }
    }

    /// Add one word of simulation values (`values[node]`); the first word sets the phases.
    pub(crate) fn add(&mut self, values: &[u64]) {
        if self.words == 0 {
            for (p, &v) in self.phase.iter_mut().zip(values) {
                *p = v & 1 == 1;
            }
        }
        self.words += 1;
        for ((s, &p), &v) in self.sig.iter_mut().zip(&self.phase).zip(values) {
            *s = mix(*s ^ if p { !v } else { v });
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::aig::random_graph::{random_aig, Shape};
    use crate::aig::{random_words, simulate, Aig};

    #[test]
    fn classes_pair_complements_and_refine() {
        let mut g = Aig::new();
        let a = g.add_input();
        let b = g.add_input();
        let x = g.xor(a, b);
        // !(a xnor b) built differently: (a | b) & !(a & b)
        let o = g.or(a, b);
        let n = g.and(a, b);
        let y = g.and(o, !n);
        let ins = random_words(2, 2, 7);
        let t = simulate(&g, &ins, 2);
        let mut c = Classes::from_table(&t, g.len());
        let (r, compl) = c.candidate(y.index()).expect("y is a candidate");
        assert_eq!(r, x.index().min(y.index()));
        assert_eq!(compl, x.is_complemented() != y.is_complemented());
        assert!(c.count() >= 1);
        assert_eq!(
            c.same_class(x.index(), y.index()),
            Some(x.is_complemented() != y.is_complemented())
        );
        assert_eq!(c.same_class(a.index(), y.index()), None);
        // A word that separates them (pretend values) splits the class.
        let mut vals = vec![0u64; g.len()];
        vals[y.index()] = 1;
        c.refine(&vals, 0);
        assert!(c.candidate(y.index()).is_none());
    }

    #[test]
    fn signatures_give_the_partition_of_the_whole_table() {
        // A random graph with many equal and complementary nodes (small fan-in range).
        let (g, _) = random_aig(12345, 6, 400, Shape::UNIFORM);
        let words = 3;
        let pats = random_words(g.num_inputs(), words, 9);
        let whole = Classes::from_table(&simulate(&g, &pats, words), g.len());
        let mut sigs = Signatures::new(g.len());
        for w in 0..words {
            let one: Vec<Vec<u64>> = pats.iter().map(|p| vec![p[w]]).collect();
            sigs.add(&simulate(&g, &one, 1).values);
        }
        let by_word = Classes::from_signatures(sigs);
        // The first word's classes, split by each further word, are the same partition too.
        let first: Vec<Vec<u64>> = pats.iter().map(|p| vec![p[0]]).collect();
        let mut refined = Classes::from_table(&simulate(&g, &first, 1), g.len());
        for w in 1..words {
            let one: Vec<Vec<u64>> = pats.iter().map(|p| vec![p[w]]).collect();
            refined.refine(&simulate(&g, &one, 1).values, 0);
        }
        assert_eq!(refined.count(), whole.count());
        assert_eq!(refined.members(), whole.members());
        assert!(whole.count() > 5, "the graph should have classes");
        for a in 0..g.len() {
            assert_eq!(whole.candidate(a), by_word.candidate(a), "node {a}");
            assert_eq!(whole.candidate(a), refined.candidate(a), "node {a}");
            for b in 0..g.len() {
                assert_eq!(whole.same_class(a, b), by_word.same_class(a, b));
                assert_eq!(whole.same_class(a, b), refined.same_class(a, b));
            }
            // Class sizes counted from the pairwise relation.
            let size = (0..g.len())
                .filter(|&b| b == a || whole.same_class(a, b).is_some())
                .count();
            assert_eq!(whole.class_size(a), size, "node {a}");
            assert_eq!(by_word.class_size(a), size, "node {a}");
            assert_eq!(refined.class_size(a), size, "node {a}");
        }
    }
}
