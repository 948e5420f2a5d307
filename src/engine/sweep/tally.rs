//! The sweep's tallies: the figures reported ([`SweepStats`], summed over groups) and the
//! window answers counted for the debug log (four counts per query stage, then the lifted
//! partial models and the twin proofs; [`slot`] gives the index).

use serde::Serialize;

/// Stages of a candidate query: fresh tiny window, small and large persistent windows.
pub(super) const TINY: usize = 0;
pub(super) const SMALL: usize = 1;
pub(super) const LARGE: usize = 2;
/// Answer kinds of a window query.
pub(super) const EQUAL: usize = 0;
pub(super) const REFUTED: usize = 1;
pub(super) const PARTIAL: usize = 2;
pub(super) const UNKNOWN: usize = 3;
/// Partial models lifted to counterexamples.
pub(super) const LIFTS: usize = 12;
/// Proofs against a twin (a class member other than the representative).
pub(super) const TWIN_PROOFS: usize = 13;
/// Slots of the window-answer tally.
pub(super) const SLOTS: usize = 14;

/// The tally slot of answer `kind` at query `stage`.
pub(super) fn slot(stage: usize, kind: usize) -> usize {
    stage * 4 + kind
}

/// Figures of sweeping (summed over the groups).
#[derive(Clone, Debug, Default, PartialEq, Serialize)]
pub struct SweepStats {
    /// Output groups swept independently.
    pub groups: usize,
    /// Candidate classes after the first simulation.
    pub classes: usize,
    /// Nodes in those classes.
    pub candidates: usize,
    /// Candidate pairs that hashing made equal without a query.
    pub merged_by_hashing: usize,
    /// Candidate pairs proved equal by equal truth tables over a cut of anchors
    /// (`cut_match.rs`) and merged.
    pub merged_by_cut: usize,
    /// Candidate pairs proved equal by a window query (SAT, or truth tables of the window)
    /// and merged.
    pub merged_by_sat: usize,
    /// Candidate pairs separated by a counterexample.
    pub refuted: usize,
    /// Candidate pairs left open by the conflict limit.
    pub unresolved: usize,
    /// Candidate pairs kept apart without a costly query (`cut_match.rs`): no node of the
    /// other design matched the node over its cut of anchors and the tiny window did not
    /// decide them.
    pub cut_points: usize,
    /// Counterexample patterns fed back into simulation.
    pub patterns_fed_back: usize,
    /// Candidate pairs that needed a whole-cone query (the window did not decide them).
    pub whole_cone_queries: usize,
    /// AND nodes before sweeping.
    pub ands_before: usize,
    /// AND nodes of the merged graph.
    pub ands_after: usize,
}

impl SweepStats {
    /// Add another group's figures.
    pub fn add(&mut self, o: &SweepStats) {
        self.groups += o.groups;
        self.classes += o.classes;
        self.candidates += o.candidates;
        self.merged_by_hashing += o.merged_by_hashing;
        self.merged_by_cut += o.merged_by_cut;
        self.merged_by_sat += o.merged_by_sat;
        self.refuted += o.refuted;
        self.unresolved += o.unresolved;
        self.cut_points += o.cut_points;
        self.patterns_fed_back += o.patterns_fed_back;
        self.whole_cone_queries += o.whole_cone_queries;
        self.ands_before += o.ands_before;
        self.ands_after += o.ands_after;
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn slots_are_distinct_and_in_range() {
        let mut seen = [false; SLOTS];
        let mut all: Vec<usize> = [TINY, SMALL, LARGE]
            .iter()
            .flat_map(|&s| [EQUAL, REFUTED, PARTIAL, UNKNOWN].map(|k| slot(s, k)))
            .collect();
        all.extend([LIFTS, TWIN_PROOFS]);
        for k in all {
            assert!(k < SLOTS && !seen[k], "slot {k}");
            seen[k] = true;
        }
        assert!(seen.iter().all(|&x| x));
    }

    #[test]
    fn figures_add_field_by_field() {
        let a = SweepStats {
            groups: 1,
            classes: 2,
            candidates: 3,
            merged_by_hashing: 4,
            merged_by_cut: 12,
            merged_by_sat: 5,
            refuted: 6,
            unresolved: 7,
            cut_points: 13,
            patterns_fed_back: 8,
            whole_cone_queries: 9,
            ands_before: 10,
            ands_after: 11,
        };
        let mut sum = a.clone();
        sum.add(&a);
        assert_eq!(sum.groups, 2);
        assert_eq!(sum.merged_by_sat, 10);
        assert_eq!((sum.merged_by_cut, sum.cut_points), (24, 26));
        assert_eq!(sum.ands_after, 22);
        sum.add(&SweepStats::default());
        assert_eq!(sum.whole_cone_queries, 18);
    }
}
