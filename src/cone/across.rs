//! The exact cone of a clocked design across registers, with this module's exact-support
//! engine lent to `seq::exact_cones` (which owns the method; `seq` needs nothing from `cone`).

use super::support::{run, Membership, SupportOptions};
use crate::design::Design;
use crate::sat::Limits;
use crate::seq::{Claim, CycleCones, Decided, ExactCones, ExactOptions};

/// The exact cones across cycles of `d` for the inputs of `structural` (its structural cones
/// across cycles), the supports decided with random patterns of `seed`. `Err` says why there
/// is none (several clocks, too large).
pub fn exact_across_cycles(
    d: &Design,
    structural: &CycleCones,
    o: &ExactOptions,
    seed: u64,
    limits: &Limits,
) -> Result<ExactCones, String> {
    let opts = SupportOptions {
        seed,
        ..SupportOptions::default()
    };
    let decide = |design: &Design, outputs: &[usize], cones: Vec<Vec<usize>>| {
        let bar = indicatif::ProgressBar::hidden();
        let (results, stats) = run(design, outputs, cones, &opts, limits, &bar);
        let decided = results
            .into_iter()
            .map(|r| Decided {
                claims: r
                    .claims
                    .iter()
                    .map(|m| match m {
                        Membership::Depends { vector, value, .. } => Claim::Depends {
                            vector: (0..design.inputs.len()).map(|i| vector.get(i)).collect(),
                            value: *value,
                        },
                        Membership::Independent(_) => Claim::Independent,
                        Membership::Undecided(_) => Claim::Undecided,
                    })
                    .collect(),
                cone: r.cone,
            })
            .collect();
        (decided, stats.claims, stats.undecided)
    };
    crate::seq::exact_cones(d, structural, o, limits, &decide)
}
