//! Exact functional support of output bits: for every input of an output's structural cone,
//! a decided claim with its evidence.
//!
//! Order of work: (1) inputs without a path in the AIG are independent at once; (2) rounds of
//! flip simulation prove most "depends" claims with a pattern pair: one round of uniform random
//! patterns, then rounds of mixed-density patterns (`pattern.rs`: sparse and dense vectors
//! beside uniform ones); (3) the rest go to SAT, one incremental solver per output, one query
//! per claim on the cofactor miter `f|x=0 XOR f|x=1` built in a shared copy of the AIG
//! (assumed true as the query's activation literal: UNSAT proves independence, a model is a
//! pattern pair); (4) every SAT model is replayed at once by flip simulation, with 63
//! neighbours of it (a walk that flips one to three inputs, control inputs first), on every
//! claim still open, so one model decides many claims. A query stopped by a limit leaves its
//! claim undecided; nothing is guessed.

use super::bits::Bits;
use super::cofactor::Cofactorer;
use super::flip::{Fanout, FlipSim};
use super::pattern::{walk, WalkInputs};
use crate::aig::{eval, mixed_density, random_words, Lit};
use crate::cnf::Tseitin;
use crate::design::Design;
use crate::sat::{Limits, Sat, SatResult, SatStats, StopReason};
use indicatif::ProgressBar;
use serde::Serialize;

/// How the support engine works.
#[derive(Clone, Debug)]
pub struct SupportOptions {
    /// Seed of the random patterns (the same seed gives the same report).
    pub seed: u64,
    /// Rounds of random simulation at most; a round that decides nothing new ends them.
    pub max_rounds: usize,
    /// Show a progress bar on standard error (only when it is a terminal).
    pub progress: bool,
    /// SAT queries allowed over all outputs; an output whose claims left open by simulation
    /// do not fit in what is left gets none: they stay undecided (engine limit). `None`:
    /// every open claim is queried. Prove's diagnosis sets it: the high bits of a multiplier
    /// depend on the low inputs through carry chains no random pattern sensitizes, and each
    /// such query is as hard as the multiplier.
    pub max_sat_queries: Option<usize>,
    /// An output whose cone holds more nodes than this gets no SAT queries: its claims left
    /// open by simulation stay undecided (engine limit). `None`: no such bound. Prove's
    /// diagnosis sets it, so that its cost does not grow with a wide word's cones (a 64x64
    /// multiplier's high bits: about 40,000 nodes each, a query of 1,000 conflicts there
    /// costs about half a second and decides nothing).
    pub max_sat_cone: Option<usize>,
    /// Node-words one round of flip simulation may evaluate at most, counted as the inputs
    /// with open claims times the graph's nodes times the words of the block: a wide graph
    /// gets fewer patterns per round (at least one word). `None`: no such bound. Prove's
    /// diagnosis sets it (a count, so the supports stay the same from run to run).
    pub max_flip_work: Option<u64>,
}

impl Default for SupportOptions {
    fn default() -> Self {
        SupportOptions {
            seed: 1,
            max_rounds: 64,
            progress: false,
            max_sat_queries: None,
            max_sat_cone: None,
            max_flip_work: None,
        }
    }
}

/// How a "depends on" claim was proved.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum DependsBy {
    /// Flip simulation on random patterns.
    RandomSimulation,
    /// Flip simulation on a pattern taken from an earlier SAT model.
    ReplayedSimulation,
    /// A model of the cofactor miter.
    Sat,
}

/// How a "does not depend" claim was proved.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum IndependentBy {
    /// The input has no path to the output in the AIG (structural hashing and the constant
    /// rules removed it while the design was read), so both cofactors are the same graph.
    NoPath,
    /// The cofactor miter hashed to constant false: the two cofactors are the same graph.
    CofactorsMerged,
    /// The SAT solver answered UNSAT on the cofactor miter.
    Unsat,
}

/// The answer for one (output, input) pair.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum Membership {
    /// The output depends on the input: on `vector` (every design input, the claimed input
    /// at 0) the output is `value`; with the input flipped to 1 it is `!value`.
    Depends {
        /// Values of all design inputs, in design order, with the claimed input at 0.
        vector: Bits,
        /// The output's value on `vector`.
        value: bool,
        /// Where the pattern came from.
        by: DependsBy,
    },
    /// The output does not depend on the input.
    Independent(IndependentBy),
    /// A resource limit stopped the query.
    Undecided(StopReason),
}

impl Membership {
    /// Whether this claim says "depends".
    pub fn depends(&self) -> bool {
        matches!(self, Membership::Depends { .. })
    }
    /// Whether this claim says "does not depend".
    pub fn independent(&self) -> bool {
        matches!(self, Membership::Independent(_))
    }
    /// Whether this claim is undecided.
    pub fn undecided(&self) -> bool {
        matches!(self, Membership::Undecided(_))
    }
}

/// The support of one output bit, with a claim for every input of its structural cone.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct SupportResult {
    /// Index of the output in [`Design::outputs`].
    pub output: usize,
    /// Design input indices in the structural cone, ascending.
    pub cone: Vec<usize>,
    /// One claim per cone input, in the order of `cone`.
    pub claims: Vec<Membership>,
}

impl SupportResult {
    fn filter(&self, f: fn(&Membership) -> bool) -> Vec<usize> {
        self.cone
            .iter()
            .zip(&self.claims)
            .filter(|(_, m)| f(m))
            .map(|(&k, _)| k)
            .collect()
    }
    /// Inputs the output depends on (ascending design input indices).
    pub fn support(&self) -> Vec<usize> {
        self.filter(Membership::depends)
    }
    /// Cone inputs the output does not depend on.
    pub fn redundant(&self) -> Vec<usize> {
        self.filter(Membership::independent)
    }
    /// Cone inputs whose claim is undecided.
    pub fn undecided(&self) -> Vec<usize> {
        self.filter(Membership::undecided)
    }
    /// The claim for design input `input`, if it is in the cone.
    pub fn membership(&self, input: usize) -> Option<&Membership> {
        self.cone
            .binary_search(&input)
            .ok()
            .map(|i| &self.claims[i])
    }
}

/// How the claims of a run were decided (the simulation/SAT split).
#[derive(Copy, Clone, Debug, Default, PartialEq, Eq, Serialize)]
pub struct SupportStats {
    /// Claims, one per (output, cone input).
    pub claims: u64,
    /// "Depends" proved by random flip simulation.
    pub depends_by_random_simulation: u64,
    /// "Depends" proved by replaying a SAT model in flip simulation.
    pub depends_by_replayed_simulation: u64,
    /// "Depends" proved by a SAT model.
    pub depends_by_sat: u64,
    /// "Does not depend" proved without SAT (no path, or the miter hashed to false).
    pub independent_by_structure: u64,
    /// "Does not depend" proved by an UNSAT answer.
    pub independent_by_sat: u64,
    /// Claims left undecided by a limit.
    pub undecided: u64,
    /// Random simulation rounds run.
    pub simulation_rounds: u64,
    /// Random patterns simulated.
    pub random_patterns: u64,
    /// SAT models replayed in simulation.
    pub replayed_patterns: u64,
    /// SAT solver figures, over all solvers.
    pub sat: SatStats,
}

impl SupportStats {
    /// Claims decided by simulation (random or replayed).
    pub fn by_simulation(&self) -> u64 {
        self.depends_by_random_simulation + self.depends_by_replayed_simulation
    }
    /// Claims decided by a SAT answer.
    pub fn by_sat(&self) -> u64 {
        self.depends_by_sat + self.independent_by_sat
    }
}

/// The support of one output bit (structural cone from the netlist as written where the
/// design has one). For prove's side-by-side hint and other single-output uses.
pub fn support(design: &Design, output: usize, limits: &Limits) -> SupportResult {
    let graph = super::structural::StructuralGraph::build(design);
    let cone = graph.cone(output).inputs;
    let (mut r, _) = run(
        design,
        &[output],
        vec![cone],
        &SupportOptions::default(),
        limits,
        &ProgressBar::hidden(),
    );
    r.pop().expect("one result per output")
}

/// The supports of several output bits, sharing simulation and the working graph.
pub fn supports(
    design: &Design,
    outputs: &[usize],
    opts: &SupportOptions,
    limits: &Limits,
) -> (Vec<SupportResult>, SupportStats) {
    let graph = super::structural::StructuralGraph::build(design);
    let cones = outputs.iter().map(|&o| graph.cone(o).inputs).collect();
    let bar = super::progress_bar(opts.progress, "support");
    let r = run(design, outputs, cones, opts, limits, &bar);
    bar.finish_and_clear();
    r
}

/// Decide every claim of `outputs`, whose structural cones (design input indices) are
/// `cones`; inputs of the AIG cone are added where the structural cone lacks them.
pub(crate) fn run(
    design: &Design,
    outputs: &[usize],
    cones: Vec<Vec<usize>>,
    opts: &SupportOptions,
    limits: &Limits,
    bar: &ProgressBar,
) -> (Vec<SupportResult>, SupportStats) {
    let mut e = Engine::new(design, outputs, cones, limits, bar);
    e.simulate_rounds(opts);
    e.solve_rest(opts.max_sat_queries, opts.max_sat_cone);
    e.finish()
}

type Slot = Option<Membership>;

struct Engine<'a> {
    design: &'a Design,
    limits: &'a Limits,
    bar: &'a ProgressBar,
    fanout: Fanout,
    outputs: Vec<usize>,
    roots: Vec<Lit>,
    cones: Vec<Vec<usize>>,
    claims: Vec<Vec<Slot>>,
    /// Per design input: the open claims `(audited output position, claim position)`.
    open: Vec<Vec<(u32, u32)>>,
    stats: SupportStats,
}

impl<'a> Engine<'a> {
    fn new(
        design: &'a Design,
        outputs: &[usize],
        cones: Vec<Vec<usize>>,
        limits: &'a Limits,
        bar: &'a ProgressBar,
    ) -> Engine<'a> {
        let aig = &design.aig;
        let mut open = vec![Vec::new(); aig.num_inputs()];
        let mut all_cones = Vec::with_capacity(outputs.len());
        let mut claims = Vec::with_capacity(outputs.len());
        let mut stats = SupportStats::default();
        let roots: Vec<Lit> = outputs.iter().map(|&o| design.outputs[o].lit).collect();
        for (pos, (cone, &root)) in cones.into_iter().zip(&roots).enumerate() {
            let in_aig = aig.cone_inputs(&[root]);
            let mut cone = cone;
            cone.extend(in_aig.iter().map(|&k| k as usize));
            cone.sort_unstable();
            cone.dedup();
            let mut slots = Vec::with_capacity(cone.len());
            for (ci, &k) in cone.iter().enumerate() {
                if in_aig.binary_search(&(k as u32)).is_ok() {
                    open[k].push((pos as u32, ci as u32));
                    slots.push(None);
                } else {
                    stats.independent_by_structure += 1;
                    slots.push(Some(Membership::Independent(IndependentBy::NoPath)));
                }
            }
            stats.claims += cone.len() as u64;
            all_cones.push(cone);
            claims.push(slots);
        }
        bar.set_length(stats.claims);
        bar.set_position(stats.independent_by_structure);
        Engine {
            design,
            limits,
            bar,
            fanout: Fanout::new(aig),
            outputs: outputs.to_vec(),
            roots,
            cones: all_cones,
            claims,
            open,
            stats,
        }
    }

    fn any_open(&self) -> bool {
        self.open.iter().any(|v| !v.is_empty())
    }

    /// Rounds of random flip simulation until a round decides nothing new.
    fn simulate_rounds(&mut self, opts: &SupportOptions) {
        let design = self.design;
        let aig = &design.aig;
        // Words times nodes at most 4 million (8 bytes each: 32 MiB of values per block).
        let most = (4_000_000 / aig.len().max(1)).clamp(1, 64);
        for round in 0..opts.max_rounds {
            if !self.any_open() || self.limits.expired() {
                break;
            }
            let flips = self.open.iter().filter(|v| !v.is_empty()).count() as u64;
            let words = opts.max_flip_work.map_or(most, |work| {
                let per_word = flips.max(1) * aig.len().max(1) as u64;
                most.min((work / per_word).max(1) as usize)
            });
            let seed = opts
                .seed
                .wrapping_mul(0x1000_0000_0000)
                .wrapping_add(round as u64);
            let ins = if round == 0 {
                random_words(aig.num_inputs(), words, seed)
            } else {
                mixed_density(aig.num_inputs(), words, seed)
            };
            self.stats.simulation_rounds += 1;
            self.stats.random_patterns += (words * 64) as u64;
            if self.simulate_block(ins, DependsBy::RandomSimulation) == 0 {
                break;
            }
        }
    }

    /// Flip every input with open claims on one block of patterns; returns claims decided.
    fn simulate_block(&mut self, ins: Vec<Vec<u64>>, by: DependsBy) -> u64 {
        let design = self.design;
        let mut sim = FlipSim::new(&design.aig, &self.fanout, ins);
        let mut decided = 0u64;
        for x in 0..self.open.len() {
            if self.open[x].is_empty() {
                continue;
            }
            if self.limits.expired() {
                break;
            }
            sim.flip(x);
            let mut still = Vec::new();
            for &(pos, ci) in &self.open[x] {
                let (pos_u, ci_u) = (pos as usize, ci as usize);
                if self.claims[pos_u][ci_u].is_some() {
                    continue;
                }
                let root = self.roots[pos_u];
                match sim.first_difference(root) {
                    Some(p) => {
                        let mut vector = sim.pattern(p);
                        let was_one = vector.get(x);
                        vector.set(x, false);
                        let at_p = sim.value(root, p);
                        let value = at_p ^ was_one;
                        self.claims[pos_u][ci_u] = Some(Membership::Depends { vector, value, by });
                        decided += 1;
                    }
                    None => still.push((pos, ci)),
                }
            }
            self.open[x] = still;
        }
        match by {
            DependsBy::RandomSimulation => self.stats.depends_by_random_simulation += decided,
            _ => self.stats.depends_by_replayed_simulation += decided,
        }
        self.bar.inc(decided);
        decided
    }

    /// SAT on the cofactor miter for every claim still open, output by output, within
    /// `max_queries` queries in all: an output whose open claims do not fit in what is left
    /// gets none (they stay undecided).
    fn solve_rest(&mut self, max_queries: Option<usize>, max_cone: Option<usize>) {
        let mut budget = max_queries.unwrap_or(usize::MAX);
        let design = self.design;
        let aig = &design.aig;
        let mut work = aig.clone();
        let mut cof = Cofactorer::new(aig.len());
        let mut pool: Vec<Bits> = Vec::new();
        let mut walks = 0u64;
        for pos in 0..self.outputs.len() {
            let todo: Vec<usize> = (0..self.claims[pos].len())
                .filter(|&ci| self.claims[pos][ci].is_none())
                .collect();
            if todo.is_empty() {
                continue;
            }
            let root = self.roots[pos];
            let mask = aig.cone_mask(&[root]);
            let too_wide = max_cone.is_some_and(|most| mask.iter().filter(|&&m| m).count() > most);
            if todo.len() > budget || too_wide {
                for ci in todo {
                    self.claims[pos][ci] = Some(Membership::Undecided(StopReason::EngineLimit));
                    self.stats.undecided += 1;
                    self.bar.inc(1);
                }
                continue;
            }
            budget -= todo.len();
            let mut sat = Sat::new(self.limits);
            let mut ts = Tseitin::new();
            let cands = WalkInputs::new(aig, &self.fanout, &self.cones[pos]);
            for ci in todo {
                if self.claims[pos][ci].is_some() {
                    continue; // decided by a walk from an earlier model
                }
                let x = self.cones[pos][ci];
                let m = if self.limits.expired() {
                    Membership::Undecided(StopReason::Timeout)
                } else {
                    let miter = cof.miter(&mut work, &self.fanout, &mask, root, aig.inputs()[x]);
                    self.query(&work, &mut sat, &mut ts, miter, root, x, &mut pool)
                };
                match &m {
                    Membership::Depends { .. } => self.stats.depends_by_sat += 1,
                    Membership::Independent(IndependentBy::Unsat) => {
                        self.stats.independent_by_sat += 1
                    }
                    Membership::Independent(_) => self.stats.independent_by_structure += 1,
                    Membership::Undecided(_) => self.stats.undecided += 1,
                }
                self.claims[pos][ci] = Some(m);
                self.bar.inc(1);
                if let Some(model) = pool.pop() {
                    if self.any_open() {
                        walks += 1;
                        let ins = walk(&model, &cands, walks);
                        self.stats.replayed_patterns += 64;
                        self.simulate_block(ins, DependsBy::ReplayedSimulation);
                    }
                }
            }
            self.stats.sat.add(&sat.stats());
        }
    }

    #[allow(clippy::too_many_arguments)]
    fn query(
        &self,
        work: &crate::aig::Aig,
        sat: &mut Sat<'_>,
        ts: &mut Tseitin,
        miter: Lit,
        root: Lit,
        x: usize,
        pool: &mut Vec<Bits>,
    ) -> Membership {
        if miter == Lit::FALSE {
            return Membership::Independent(IndependentBy::CofactorsMerged);
        }
        let act = ts.lit(work, sat, miter);
        match sat.solve(&[act]) {
            SatResult::Unsat => Membership::Independent(IndependentBy::Unsat),
            SatResult::Stopped(r) => Membership::Undecided(r),
            SatResult::Sat => {
                let aig = &self.design.aig;
                let mut vector: Vec<bool> = aig
                    .inputs()
                    .iter()
                    .map(|&n| ts.var_of(n).is_some_and(|v| sat.value(v)))
                    .collect();
                vector[x] = false;
                let value = eval(aig, &vector, &[root])[0];
                vector[x] = true;
                let flipped = eval(aig, &vector, &[root])[0];
                vector[x] = false;
                let vector = Bits::from_bools(&vector);
                assert_ne!(
                    value, flipped,
                    "internal error: a SAT model of a cofactor miter does not re-simulate"
                );
                pool.push(vector.clone());
                Membership::Depends {
                    vector,
                    value,
                    by: DependsBy::Sat,
                }
            }
        }
    }

    fn finish(self) -> (Vec<SupportResult>, SupportStats) {
        let results = self
            .outputs
            .iter()
            .zip(self.cones)
            .zip(self.claims)
            .map(|((&output, cone), claims)| SupportResult {
                output,
                cone,
                claims: claims
                    .into_iter()
                    .map(|c| c.expect("every claim is decided or undecided"))
                    .collect(),
            })
            .collect();
        (results, self.stats)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::front::bench::read_bench;
    use std::sync::Arc;

    fn design(text: &str) -> Design {
        read_bench(&Arc::from("t.bench"), text).unwrap()
    }

    #[test]
    fn masked_input_is_redundant_and_the_other_is_not() {
        let d = design(
            "INPUT(a)\nINPUT(t)\nOUTPUT(y)\nn = NOT(t)\np = AND(a, t)\nq = AND(a, n)\ny = OR(p, q)\n",
        );
        let r = support(&d, 0, &Limits::none());
        assert_eq!(r.cone, vec![0, 1]);
        assert_eq!(r.support(), vec![0]);
        assert_eq!(r.redundant(), vec![1]);
        let Some(Membership::Depends { vector, value, .. }) = r.membership(0) else {
            panic!("a must be in the support: {r:?}");
        };
        let mut v = vector.to_bools();
        assert_eq!(d.eval(&v)[0], *value);
        v[0] = true;
        assert_eq!(d.eval(&v)[0], !*value);
    }

    #[test]
    fn sat_decides_what_simulation_misses() {
        // y = a & (b1 & ... & b20): one pattern in 2^21 sensitizes any input, so random
        // simulation almost never decides; SAT must, and its witness must re-simulate.
        let mut t = String::new();
        for i in 0..21 {
            t.push_str(&format!("INPUT(b{i})\n"));
        }
        let ins: Vec<String> = (0..21).map(|i| format!("b{i}")).collect();
        t.push_str(&format!("OUTPUT(y)\ny = AND({})\n", ins.join(", ")));
        let d = design(&t);
        let opts = SupportOptions {
            max_rounds: 1,
            ..SupportOptions::default()
        };
        let (r, st) = supports(&d, &[0], &opts, &Limits::none());
        assert_eq!(r[0].support().len(), 21);
        assert!(st.depends_by_sat >= 1, "{st:?}");
        assert_eq!(st.claims, 21);
        assert_eq!(st.by_simulation() + st.by_sat(), 21);
    }

    /// `y = AND(b0..b20)`.
    fn and21() -> Design {
        let ins: Vec<String> = (0..21).map(|i| format!("b{i}")).collect();
        let mut t: String = ins.iter().map(|b| format!("INPUT({b})\n")).collect();
        t.push_str(&format!("OUTPUT(y)\ny = AND({})\n", ins.join(", ")));
        design(&t)
    }

    #[test]
    fn the_sat_query_budget_leaves_claims_undecided_past_it() {
        // y = AND(b0..b20): random patterns almost never sensitize an input (one in 2^21), so
        // the claims wait for SAT; a budget of 0 queries leaves all 21 undecided, one of 21
        // decides them all. The bound is a count, so prove's diagnosis cannot spend an
        // unbounded time on a wide multiplier's carry-chain claims.
        let d = and21();
        let with = |k: usize| SupportOptions {
            max_rounds: 1,
            max_sat_queries: Some(k),
            ..SupportOptions::default()
        };
        let (r, st) = supports(&d, &[0], &with(0), &Limits::none());
        assert_eq!(st.sat.calls, 0, "{st:?}");
        assert_eq!(st.undecided + st.by_simulation(), 21, "{st:?}");
        assert!(r[0]
            .claims
            .iter()
            .all(|m| m.depends() || *m == Membership::Undecided(StopReason::EngineLimit)));
        let (r, st) = supports(&d, &[0], &with(21), &Limits::none());
        assert!(st.sat.calls <= 21, "{st:?}");
        assert_eq!(st.undecided, 0, "{st:?}");
        assert_eq!(r[0].support().len(), 21);
    }

    #[test]
    fn wide_cones_get_no_sat_queries_and_fewer_patterns_under_the_work_bounds() {
        // y = AND(b0..b20) again: its cone has 21 inputs and 20 AND nodes. A cone bound of
        // 40 nodes stops the queries (claims undecided, no SAT call), 41 lets them run.
        let d = and21();
        let nodes = d
            .aig
            .cone_mask(&[d.outputs[0].lit])
            .iter()
            .filter(|&&m| m)
            .count();
        let with = |cone: usize, work: Option<u64>| SupportOptions {
            max_rounds: 1,
            max_sat_cone: Some(cone),
            max_flip_work: work,
            ..SupportOptions::default()
        };
        let (r, st) = supports(&d, &[0], &with(nodes - 1, None), &Limits::none());
        assert_eq!(st.sat.calls, 0, "{st:?}");
        assert_eq!(st.undecided + st.by_simulation(), 21, "{st:?}");
        assert!(r[0]
            .claims
            .iter()
            .all(|m| m.depends() || *m == Membership::Undecided(StopReason::EngineLimit)));
        let (r, st) = supports(&d, &[0], &with(nodes, None), &Limits::none());
        assert_eq!(st.undecided, 0, "{st:?}");
        assert_eq!(r[0].support().len(), 21);
        // Without a work bound the block has 64 words (4,096 patterns); a bound of one word
        // per flip of every open input leaves one word (64 patterns).
        assert_eq!(st.random_patterns, 4096, "{st:?}");
        let one_word = 21 * d.aig.len() as u64;
        let (_, st) = supports(&d, &[0], &with(nodes, Some(one_word)), &Limits::none());
        assert_eq!(st.random_patterns, 64, "{st:?}");
    }
}
