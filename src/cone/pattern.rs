//! Structured input patterns for the "depends" claims of the cone audit, where uniform random
//! patterns rarely sensitize an output to an input: patterns of mixed density
//! ([`crate::aig::mixed_density`]), and walks from a SAT model (lane 0 the model, the
//! other lanes the model with one to three inputs flipped, favouring the inputs with a large
//! fan-out, the control inputs such as select lines).

use super::bits::Bits;
use super::flip::Fanout;
use crate::aig::Aig;
use crate::rng::SplitMix64;

/// Flip candidates of one output's cone for walks: every cone input, and separately the
/// control-like ones (fan-out at least four times the cone's median and at most half of them).
pub(crate) struct WalkInputs {
    all: Vec<usize>,
    control: Vec<usize>,
}

impl WalkInputs {
    /// Candidates among `cone` (design input indices).
    pub(crate) fn new(aig: &Aig, fanout: &Fanout, cone: &[usize]) -> WalkInputs {
        let fo: Vec<usize> = cone
            .iter()
            .map(|&k| fanout.of(aig.inputs()[k] as usize).len())
            .collect();
        let mut sorted = fo.clone();
        sorted.sort_unstable();
        let median = sorted.get(sorted.len() / 2).copied().unwrap_or(0);
        let control: Vec<usize> = cone
            .iter()
            .zip(&fo)
            .filter(|(_, &f)| f >= 4 * median.max(1))
            .map(|(&k, _)| k)
            .collect();
        let control = if control.len() * 2 <= cone.len() {
            control
        } else {
            Vec::new()
        };
        WalkInputs {
            all: cone.to_vec(),
            control,
        }
    }
}

/// One word per input: lane 0 is `model`, lanes 1..63 are `model` with one to three inputs
/// flipped (half of the lanes flip control inputs when there are any).
pub(crate) fn walk(model: &Bits, cands: &WalkInputs, seed: u64) -> Vec<Vec<u64>> {
    let n = model.len();
    let mut s = SplitMix64::from_state(seed ^ 0x6A09_E667_F3BC_C908);
    let mut rows: Vec<Vec<u64>> = (0..n)
        .map(|k| vec![if model.get(k) { !0u64 } else { 0 }])
        .collect();
    if cands.all.is_empty() {
        return rows;
    }
    for lane in 1..64 {
        let flips = 1 + lane % 3;
        for f in 0..flips {
            let pool = if !cands.control.is_empty() && (lane + f) % 2 == 0 {
                &cands.control
            } else {
                &cands.all
            };
            let k = pool[s.below(pool.len().max(1))];
            rows[k][0] ^= 1u64 << lane;
        }
    }
    rows
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn walks_start_at_the_model_and_stay_near_it() {
        let mut g = Aig::new();
        let ins: Vec<_> = (0..10).map(|_| g.add_input()).collect();
        let _ = g.and_all(&ins);
        let fo = Fanout::new(&g);
        let model = Bits::from_bools(&[
            true, false, true, false, true, false, true, false, true, false,
        ]);
        let cands = WalkInputs::new(&g, &fo, &(0..10).collect::<Vec<_>>());
        let rows = walk(&model, &cands, 1);
        for lane in 0..64 {
            let diff = (0..10)
                .filter(|&k| (rows[k][0] >> lane & 1 == 1) != model.get(k))
                .count();
            if lane == 0 {
                assert_eq!(diff, 0);
            } else {
                // Two flips of the same input cancel, so a lane may differ in fewer places.
                assert!(diff <= 3, "lane {lane}: {diff}");
            }
        }
    }
}
