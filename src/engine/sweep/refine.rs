//! Pattern refinement: counterexamples from the window queries are queued, lifted when a
//! truncated window's model needs its other inputs, and simulated a word at a time with
//! their distance-one neighbours to split the candidate classes; debug builds check every
//! merge against every pattern simulated.

use super::super::classes::Classes;
use super::Sweeper;
use crate::aig::{simulate, Lit, Node};

/// Largest cone (nodes) simulated to extend a truncated window's model.
const LIFT_MAX_CONE: usize = 20_000;

impl Sweeper<'_> {
    /// Queue a counterexample: `pattern` if given, else `vals` over a random pattern; the
    /// window's inputs are the bits its neighbours flip.
    pub(super) fn queue(&mut self, vals: &[(u32, bool)], pattern: Option<Vec<bool>>) {
        let p = pattern.unwrap_or_else(|| {
            let mut p = self.random_pattern();
            for &(k, v) in vals {
                p[k as usize] = v;
            }
            p
        });
        self.pending.push(p);
        self.near.push(vals.iter().map(|&(k, _)| k).collect());
    }

    /// Try to extend a truncated window's model to a real counterexample: 64 patterns that
    /// keep `fixed` and draw the other inputs at random, simulated on the cones of `a` and `b`.
    pub(super) fn lift(&mut self, a: Lit, b: Lit, fixed: &[(u32, bool)]) -> Option<Vec<bool>> {
        self.marks.start(self.f.len());
        let f = &self.f;
        let mut cone = Vec::new();
        let mut stack = vec![a.node(), b.node()];
        while let Some(n) = stack.pop() {
            if !self.marks.mark(n as usize) {
                continue;
            }
            cone.push(n);
            if cone.len() > LIFT_MAX_CONE {
                return None;
            }
            if let Node::And(x, y) = f.node(n) {
                stack.push(x.node());
                stack.push(y.node());
            }
        }
        cone.sort_unstable();
        self.value.clear();
        let mut fixed_word = vec![None; 0];
        fixed_word.resize(f.num_inputs(), None);
        for &(k, v) in fixed {
            fixed_word[k as usize] = Some(if v { u64::MAX } else { 0 });
        }
        let mut rng = self.rng;
        for &n in &cone {
            let v = match f.node(n) {
                Node::Const => 0,
                Node::Input(k) => fixed_word[k as usize].unwrap_or_else(|| rng.next_u64()),
                Node::And(x, y) => {
                    let vx = self.value[&x.node()] ^ x.complement_mask();
                    let vy = self.value[&y.node()] ^ y.complement_mask();
                    vx & vy
                }
            };
            self.value.insert(n, v);
        }
        self.rng = rng;
        let word = |l: Lit| self.value[&l.node()] ^ l.complement_mask();
        let d = word(a) ^ word(b);
        if d == 0 {
            return None;
        }
        let bit = d.trailing_zeros();
        let mut p = self.random_pattern();
        for &n in &cone {
            if let Node::Input(k) = self.f.node(n) {
                p[k as usize] = (self.value[&n] >> bit) & 1 == 1;
            }
        }
        Some(p)
    }

    fn random_word(&mut self) -> u64 {
        self.rng.next_u64()
    }

    fn random_pattern(&mut self) -> Vec<bool> {
        let n = self.g.num_inputs();
        let mut out = Vec::with_capacity(n);
        let mut word = 0u64;
        for k in 0..n {
            if k % 64 == 0 {
                word = self.random_word();
            }
            out.push((word >> (k % 64)) & 1 == 1);
        }
        out
    }

    /// Simulate the queued patterns (a word per 64) and split the classes. The word's other bits
    /// are neighbours of the queued patterns at distance one, each with one input of the
    /// refuted window flipped (Mishchenko et al. 2006): a rare distinguishing pattern, such as
    /// a long carry-propagate run in an adder, usually has rare neighbours that distinguish
    /// other candidates too, which random patterns would not find.
    pub(super) fn refine(&mut self, classes: &mut Classes, done: usize) {
        // One word per 64 queued patterns.
        while self.pending.len() > 64 {
            let rest = self.pending.split_off(64);
            let rest_near = self.near.split_off(64);
            self.refine_word(classes, done);
            self.pending = rest;
            self.near = rest_near;
        }
        self.refine_word(classes, done);
    }

    /// [`Sweeper::refine`] for at most 64 queued patterns.
    fn refine_word(&mut self, classes: &mut Classes, done: usize) {
        let n = self.g.num_inputs();
        let q = self.pending.len();
        let mut row: Vec<Vec<u64>> = vec![vec![0u64]; n];
        let set = |row: &mut Vec<Vec<u64>>, j: usize, p: &[bool]| {
            for k in 0..n {
                row[k][0] |= u64::from(p[k]) << j;
            }
        };
        for (j, p) in self.pending.iter().enumerate() {
            set(&mut row, j, p);
        }
        for j in q..64 {
            let src = j % q.max(1);
            let r = self.random_word();
            match (self.pending.get(src), self.near.get(src)) {
                (Some(p), Some(near)) if !near.is_empty() => {
                    let mut p = p.clone();
                    let k = near[(r % near.len() as u64) as usize] as usize;
                    p[k] = !p[k];
                    set(&mut row, j, &p);
                }
                _ => {
                    let p = self.random_pattern();
                    set(&mut row, j, &p);
                }
            }
        }
        self.pending.clear();
        self.near.clear();
        let table = simulate(self.g, &row, 1);
        classes.refine(&table.values, done);
        if cfg!(debug_assertions) {
            for (k, r) in row.into_iter().enumerate() {
                self.stored[k].push(r[0]);
            }
        }
    }

    /// Debug check: every node of the original graph and its image in the merged graph agree
    /// on every stored pattern, so no merge contradicts a counterexample.
    #[cfg(debug_assertions)]
    pub(super) fn check_merges(&self) {
        let words = self.stored.first().map_or(0, |r| r.len());
        if words == 0 {
            return;
        }
        let tg = simulate(self.g, &self.stored, words);
        let tf = simulate(&self.f, &self.stored, words);
        for (i, &m) in self.map.iter().enumerate() {
            for w in 0..words {
                assert_eq!(
                    tg.node(i)[w],
                    tf.lit_word(m, w),
                    "sweep merged node {i} against a stored pattern"
                );
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::super::fixture::{copied, xors};
    use super::*;
    use crate::sat::Limits;

    #[test]
    fn a_queued_counterexample_refines_its_class() {
        let x = xors();
        let limits = Limits::none();
        let mut sw = copied(&x.aig, &limits);
        // One all-zero pattern: x1, x2 and y are all 0, so one class holds them.
        let table = simulate(&x.aig, &[vec![0], vec![0]], 1);
        let mut classes = Classes::from_table(&table, x.aig.len());
        assert!(classes.same_class(x.x1.index(), x.y.index()).is_some());
        // a = 1, b = 0 separates the XORs from the AND.
        sw.queue(&[(0, true), (1, false)], None);
        assert_eq!(sw.pending[0][..2], [true, false]);
        sw.refine(&mut classes, 0);
        assert!(sw.pending.is_empty() && sw.near.is_empty());
        assert_eq!(classes.same_class(x.x1.index(), x.y.index()), None);
        let compl = x.x1.is_complemented() != x.x2.is_complemented();
        assert_eq!(classes.same_class(x.x1.index(), x.x2.index()), Some(compl));
    }

    #[test]
    fn a_lifted_model_is_a_real_counterexample() {
        let x = xors();
        let limits = Limits::none();
        let mut sw = copied(&x.aig, &limits);
        let (a, b) = (sw.map[x.x1.index()], sw.map[x.y.index()]);
        let (a, b) = (
            a.xor_complement(x.x1.is_complemented()),
            b.xor_complement(x.y.is_complemented()),
        );
        // Input a fixed to 1: b = 0 separates them, found among 64 random completions.
        let p = sw
            .lift(a, b, &[(0, true)])
            .expect("a separating completion");
        assert!(p[0]);
        assert_ne!(
            super::super::fixture::value(&x.aig, x.x1, &p),
            super::super::fixture::value(&x.aig, x.y, &p)
        );
        // Equal functions: nothing to lift.
        let c = sw.map[x.x2.index()].xor_complement(x.x2.is_complemented());
        assert_eq!(sw.lift(a, c, &[]), None);
    }
}
