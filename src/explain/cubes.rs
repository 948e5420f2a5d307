//! Difference cubes: every input vector on which one output pair differs (under the
//! assumptions), as a list of disjoint cubes. Each vector found by SAT is lifted into a cube by
//! ternary simulation and then by SAT-based lifting (an UNSAT core of the cube against "the
//! pair does not differ", then one literal at a time), a common practice in model checking;
//! the next vector is asked for outside every cube so far, until none is left (the cover is
//! complete) or a limit is reached.
//!
//! **Invariant:** every cube is contained in the differing set: the ternary root value is a
//! known 1, or the solver answered UNSAT for the cube against the negated miter. Cubes of one
//! pair are pairwise disjoint (two literals of opposite value on some input), so the count of
//! differing vectors is the sum of the cube sizes when the cover is complete.

use super::ternary::{Cone, Tern};
use crate::aig::{Aig, Lit};
use crate::cnf::Tseitin;
use crate::engine::Shared;
use crate::sat::{CLit, ClauseSink, Limits, Sat, SatResult, StopReason};
use serde::Serialize;

/// One cube: fixed values of some shared inputs; every other input is free.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct Cube {
    /// (shared input index, value), ascending by input.
    pub lits: Vec<(usize, bool)>,
}

impl Cube {
    /// Whether the full vector `v` (one value per shared input) lies in the cube.
    pub fn contains(&self, v: &[bool]) -> bool {
        self.lits.iter().all(|&(k, b)| v[k] == b)
    }

    /// Whether two cubes share no vector (some input fixed to opposite values).
    pub fn disjoint(&self, o: &Cube) -> bool {
        self.lits
            .iter()
            .any(|&(k, b)| o.lits.iter().any(|&(j, c)| j == k && c != b))
    }
}

/// Why the enumeration of one pair's cubes ended.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum CoverEnd {
    /// No differing vector lies outside the cubes: the cover is complete.
    Complete,
    /// The cube limit was reached first.
    CubeLimit,
    /// A SAT query hit the conflict or time limit.
    Stopped(StopReason),
}

/// The cubes of one output pair.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct PairCover {
    /// The output pair (index into the shared pairs).
    pub pair: usize,
    /// The shared inputs in the cone of the pair's miter and the assumptions, ascending.
    pub inputs: Vec<usize>,
    /// Disjoint cubes, in the order they were found.
    pub cubes: Vec<Cube>,
    /// Why the enumeration ended.
    pub end: CoverEnd,
    /// The exact number of differing vectors over `inputs` (complete covers of at most 127
    /// inputs only).
    pub differing: Option<u128>,
}

/// Limits of one pair's enumeration.
#[derive(Copy, Clone, Debug)]
pub struct CubeLimits {
    /// Cubes per output pair.
    pub max_cubes: usize,
    /// Work allowed for ternary lifting per cube (cone nodes times inputs); above it the
    /// lifting starts from SAT directly.
    pub ternary_work: usize,
}

impl Default for CubeLimits {
    fn default() -> CubeLimits {
        CubeLimits {
            max_cubes: 64,
            ternary_work: 20_000_000,
        }
    }
}

/// Enumerate the cubes of pair `pair`, starting from the vector `first` (one value per shared
/// input, e.g. the counterexample) when it makes the pair differ.
pub fn cover_pair(
    shared: &Shared,
    pair: usize,
    first: Option<&[bool]>,
    cl: &CubeLimits,
    limits: &Limits,
) -> PairCover {
    let mut aig = shared.aig.clone();
    let x = aig.xor(shared.ref_lits[pair], shared.cand_lits[pair]);
    let root = aig.and(x, shared.constraint);
    Enumerator::new(aig, root, limits).run(pair, first, cl)
}

/// Enumerate the cubes of `root`, a difference already built in `aig` (over all of its inputs;
/// the cover's pair index is 0), starting from the vector `first` when it sets the root.
pub fn cover_root(
    aig: Aig,
    root: Lit,
    first: Option<&[bool]>,
    cl: &CubeLimits,
    limits: &Limits,
) -> PairCover {
    Enumerator::new(aig, root, limits).run(0, first, cl)
}

struct Enumerator<'a> {
    aig: Aig,
    root: Lit,
    cone: Cone,
    /// Enumeration solver: root asserted, one blocking clause per cube.
    find: Sat<'a>,
    find_map: Tseitin,
    /// Lifting solver: the root's cone, asked under cube literals and the negated root.
    lift: Sat<'a>,
    lift_map: Tseitin,
}

impl<'a> Enumerator<'a> {
    fn new(aig: Aig, root: Lit, limits: &Limits) -> Enumerator<'a> {
        let cone = Cone::new(&aig, root);
        let mut find = Sat::new(limits);
        let mut find_map = Tseitin::new();
        let r = find_map.lit(&aig, &mut find, root);
        find.clause(&[r]);
        for &k in &cone.inputs {
            find_map.lit(&aig, &mut find, aig.input_lit(k));
        }
        let mut lift = Sat::new(limits);
        let mut lift_map = Tseitin::new();
        lift_map.lit(&aig, &mut lift, root);
        for &k in &cone.inputs {
            lift_map.lit(&aig, &mut lift, aig.input_lit(k));
        }
        Enumerator {
            aig,
            root,
            cone,
            find,
            find_map,
            lift,
            lift_map,
        }
    }

    fn run(mut self, pair: usize, first: Option<&[bool]>, cl: &CubeLimits) -> PairCover {
        let n = self.aig.num_inputs();
        let mut cubes: Vec<Cube> = Vec::new();
        let mut seed: Option<Vec<bool>> = first
            .filter(|v| v.len() == n && crate::aig::eval(&self.aig, v, &[self.root])[0])
            .map(|v| v.to_vec());
        let end = loop {
            if cubes.len() >= cl.max_cubes {
                break CoverEnd::CubeLimit;
            }
            let v = match seed.take() {
                Some(v) => v,
                None => match self.find.solve(&[]) {
                    SatResult::Unsat => break CoverEnd::Complete,
                    SatResult::Stopped(s) => break CoverEnd::Stopped(s),
                    SatResult::Sat => {
                        let mut v = vec![false; n];
                        for &k in &self.cone.inputs {
                            let l =
                                self.find_map
                                    .lit(&self.aig, &mut self.find, self.aig.input_lit(k));
                            v[k] = self.find.value(l);
                        }
                        v
                    }
                },
            };
            let cube = self.lift_vector(&v, &cubes, cl);
            let block: Vec<CLit> = cube
                .lits
                .iter()
                .map(|&(k, b)| {
                    let l = self
                        .find_map
                        .lit(&self.aig, &mut self.find, self.aig.input_lit(k));
                    if b {
                        !l
                    } else {
                        l
                    }
                })
                .collect();
            self.find.clause(&block);
            cubes.push(cube);
        };
        let inputs = self.cone.inputs.clone();
        let differing = (end == CoverEnd::Complete && inputs.len() <= 127).then(|| {
            cubes
                .iter()
                .map(|c| 1u128 << (inputs.len() - c.lits.len()))
                .sum()
        });
        PairCover {
            pair,
            inputs,
            cubes,
            end,
            differing,
        }
    }

    /// Lift the differing vector `v` (outside every cube of `prev`) into a cube inside the
    /// differing set and disjoint from `prev`.
    fn lift_vector(&mut self, v: &[bool], prev: &[Cube], cl: &CubeLimits) -> Cube {
        let ins = self.cone.inputs.clone();
        let mut cur: Vec<Option<bool>> = vec![None; v.len()];
        for &k in &ins {
            cur[k] = Some(v[k]);
        }
        // How many fixed inputs of the current cube conflict with each earlier cube; a literal
        // may go only while every count stays positive (the cubes stay disjoint).
        let mut conflicts: Vec<usize> = prev
            .iter()
            .map(|c| c.lits.iter().filter(|&&(k, b)| cur[k] == Some(!b)).count())
            .collect();
        let may_drop = |k: usize, cur: &[Option<bool>], conflicts: &[usize]| {
            prev.iter()
                .zip(conflicts)
                .all(|(c, &n)| n > 1 || !c.lits.iter().any(|&(j, b)| j == k && cur[k] == Some(!b)))
        };
        let drop = |k: usize, cur: &mut [Option<bool>], conflicts: &mut [usize]| {
            for (c, n) in prev.iter().zip(conflicts.iter_mut()) {
                if c.lits.iter().any(|&(j, b)| j == k && cur[k] == Some(!b)) {
                    *n -= 1;
                }
            }
            cur[k] = None;
        };
        // Ternary simulation: an input goes when the root stays a known 1 without it.
        if ins.len().saturating_mul(self.cone.len()) <= cl.ternary_work {
            for &k in &ins {
                if !may_drop(k, &cur, &conflicts) {
                    continue;
                }
                let keep = cur[k];
                cur[k] = None;
                let t = self
                    .cone
                    .eval(&self.aig, &|j| cur[j].map_or(Tern::X, Tern::of));
                cur[k] = keep;
                if t == Tern::One {
                    drop(k, &mut cur, &mut conflicts);
                }
            }
        }
        // SAT-based lifting: the literals of an UNSAT core against the negated root suffice.
        let not_root = !self.lift_map.lit(&self.aig, &mut self.lift, self.root);
        let lit_of = |s: &mut Self, k: usize, b: bool| {
            let l = s.lift_map.lit(&s.aig, &mut s.lift, s.aig.input_lit(k));
            if b {
                l
            } else {
                !l
            }
        };
        let mut assumptions: Vec<CLit> = vec![not_root];
        let mut order: Vec<usize> = Vec::new();
        for &k in &ins {
            if let Some(b) = cur[k] {
                assumptions.push(lit_of(self, k, b));
                order.push(k);
            }
        }
        if self.lift.solve(&assumptions) == SatResult::Unsat {
            let core = self.lift.failed_core();
            for (&k, &l) in order.iter().zip(&assumptions[1..]) {
                if !core.contains(&l) && may_drop(k, &cur, &conflicts) {
                    drop(k, &mut cur, &mut conflicts);
                }
            }
            // One literal at a time: drop it when the rest still implies a difference.
            for &k in &order {
                let Some(b) = cur[k] else { continue };
                if !may_drop(k, &cur, &conflicts) {
                    continue;
                }
                let mut a = vec![not_root];
                for &j in &ins {
                    if j != k {
                        if let Some(c) = cur[j] {
                            a.push(lit_of(self, j, c));
                        }
                    }
                }
                if self.lift.solve_within(&a, Some(10_000)) == SatResult::Unsat {
                    drop(k, &mut cur, &mut conflicts);
                }
                let _ = b;
            }
        }
        Cube {
            lits: ins.iter().filter_map(|&k| cur[k].map(|b| (k, b))).collect(),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::design::{Design, Format, InputBit, OutputBit};

    fn design(name: &str, build: impl Fn(&mut Aig, &[Lit]) -> Lit, n: usize) -> Design {
        let mut aig = Aig::new();
        let ins: Vec<Lit> = (0..n).map(|_| aig.add_input()).collect();
        let y = build(&mut aig, &ins);
        Design {
            name: name.into(),
            format: Format::Bench,
            aig,
            inputs: (0..n)
                .map(|i| InputBit::port("a", Some(i as i64), None))
                .collect(),
            outputs: vec![OutputBit::new("y", None, y, None)],
            netlist: None,
            warnings: vec![],
            registers: vec![],
            net_names: Default::default(),
        }
    }

    #[test]
    fn and_against_or_differs_where_exactly_one_input_is_set() {
        let r = design("r", |g, i| g.and(i[0], i[1]), 3);
        let c = design("c", |g, i| g.or(i[0], i[1]), 3);
        let s = crate::engine::pair(&r, &c, crate::engine::PairBy::Name, false).expect("pairs");
        let cov = cover_pair(&s, 0, None, &CubeLimits::default(), &Limits::none());
        assert_eq!(cov.end, CoverEnd::Complete);
        // a[2] is not in the cone; a[0] xor a[1] is two cubes of two literals.
        assert_eq!(cov.inputs, vec![0, 1]);
        assert_eq!(cov.differing, Some(2));
        assert_eq!(cov.cubes.len(), 2);
        assert!(cov.cubes[0].disjoint(&cov.cubes[1]));
    }
}
