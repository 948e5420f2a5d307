//! What each output pair cost a proof run: wall-clock seconds and SAT conflicts
//! ([`PairCost`], in the report's `pairs`). Work done for one pair alone (its miter query, its
//! case split) is its own; work that several pairs shared (the random simulation of all pairs,
//! one enumeration or BDD manager for a group, the sweep of a group's cones, one call on the
//! whole miter) is shared out evenly among them. So the pairs' conflicts add up to the run's
//! SAT conflicts, and their seconds to the time the engine spent (with several threads, to
//! more than the wall-clock time); a pair no SAT solver worked on has 0 conflicts.

use serde::Serialize;

/// The cost of one output pair.
#[derive(Copy, Clone, Debug, Default, PartialEq, Serialize)]
pub struct PairCost {
    /// Wall-clock seconds: its own work and its share of work shared with other pairs.
    pub seconds: f64,
    /// SAT conflicts: of its own queries, and its share of shared ones.
    pub conflicts: u64,
}

impl PairCost {
    /// Add another cost to this one.
    pub fn add(&mut self, o: PairCost) {
        self.seconds += o.seconds;
        self.conflicts += o.conflicts;
    }
}

/// Share `seconds` and `conflicts` spent on `members` (indices into `costs`) evenly among
/// them: each gets the same seconds; the conflicts are split in whole numbers, the first
/// members taking one more each until the remainder is gone, so the shares add up exactly.
pub(crate) fn share(costs: &mut [PairCost], members: &[usize], seconds: f64, conflicts: u64) {
    if members.is_empty() {
        return;
    }
    let n = members.len() as u64;
    let each = seconds.max(0.0) / n as f64;
    for (j, &p) in members.iter().enumerate() {
        costs[p].seconds += each;
        costs[p].conflicts += conflicts / n + u64::from((j as u64) < conflicts % n);
    }
}

/// Share among `members` what they do not hold yet of `seconds` and `conflicts`: a group's
/// totals, once each member's own work is in `costs` (fresh for this group).
pub(crate) fn share_rest(costs: &mut [PairCost], members: &[usize], seconds: f64, conflicts: u64) {
    let (s, c) = members.iter().fold((0.0, 0u64), |(s, c), &p| {
        (s + costs[p].seconds, c + costs[p].conflicts)
    });
    share(
        costs,
        members,
        (seconds - s).max(0.0),
        conflicts.saturating_sub(c),
    );
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn shares_add_up_exactly() {
        let mut c = vec![PairCost::default(); 4];
        share(&mut c, &[0, 2, 3], 0.3, 10);
        assert_eq!(
            c.iter().map(|x| x.conflicts).collect::<Vec<_>>(),
            [4, 0, 3, 3]
        );
        assert!((c[0].seconds - 0.1).abs() < 1e-12 && c[1].seconds == 0.0);
        // The rest of a group's totals: own work stays, the remainder is shared.
        let mut g = vec![PairCost::default(); 2];
        g[0] = PairCost {
            seconds: 1.0,
            conflicts: 7,
        };
        share_rest(&mut g, &[0, 1], 1.5, 9);
        assert_eq!((g[0].conflicts, g[1].conflicts), (8, 1));
        assert!((g[0].seconds - 1.25).abs() < 1e-12 && (g[1].seconds - 0.25).abs() < 1e-12);
        // Nothing to share among nobody, and a total below the own work shares nothing.
        share(&mut g, &[], 5.0, 5);
        share_rest(&mut g, &[0, 1], 0.1, 0);
        assert_eq!(g[0].conflicts + g[1].conflicts, 9);
    }
}
