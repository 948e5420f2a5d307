//! Structured input patterns for simulation, where uniform random patterns rarely reach the
//! conditions a node reacts to (an arbiter's grant needs long runs of idle requesters, a wide
//! AND needs every input set): patterns of mixed density, where each lane of a word draws its
//! bits with its own probability (sparse and dense vectors beside uniform ones), and one-hot
//! and one-cold vectors (a single input set, or a single input cleared).

use crate::rng::SplitMix64;

/// Lane masks of the density levels: even lanes are level 0 (uniform), odd lane `l` is level
/// `(l / 2) % 16`.
fn level_mask(level: usize) -> u64 {
    (0..64)
        .filter(|l| {
            if l % 2 == 0 {
                level == 0
            } else {
                (l / 2) % 16 == level
            }
        })
        .fold(0u64, |m, l| m | 1 << l)
}

/// `words` words per input of mixed-density patterns: lanes of level 0 and 8 are uniform,
/// levels 1..=7 have ones with probability 2^-level, levels 9..=15 zeros with 2^-(level-8).
pub fn mixed_density(inputs: usize, words: usize, seed: u64) -> Vec<Vec<u64>> {
    let mut s = SplitMix64::from_state(seed ^ 0xD1B5_4A32_D192_ED03);
    let masks: Vec<u64> = (0..16).map(level_mask).collect();
    (0..inputs)
        .map(|_| {
            (0..words)
                .map(|_| {
                    let mut w = s.next_u64() & (masks[0] | masks[8]);
                    let (mut and, mut or) = (!0u64, 0u64);
                    for k in 1..8 {
                        let r = s.next_u64();
                        and &= r;
                        or |= s.next_u64();
                        w |= and & masks[k];
                        w |= or & masks[8 + k];
                    }
                    w
                })
                .collect()
        })
        .collect()
}

/// `words` words per input of one-hot and one-cold vectors: lane `l` of word `w` sets (even
/// `w`) or clears (odd `w`) the single input `(first + 32 * w + l / 2) mod inputs`, and leaves
/// every other input at 0 (one-hot) or 1 (one-cold) in its even lanes; its odd lanes are the
/// same vector with one more input, drawn at random, flipped (a pair of hot or cold inputs).
pub fn one_hot_words(inputs: usize, words: usize, seed: u64) -> Vec<Vec<u64>> {
    let mut rows = vec![vec![0u64; words]; inputs];
    if inputs == 0 {
        return rows;
    }
    let mut s = SplitMix64::from_state(seed ^ 0x3C6E_F372_FE94_F82B);
    let first = s.below(inputs);
    for w in 0..words {
        let cold = w % 2 == 1;
        if cold {
            for r in rows.iter_mut() {
                r[w] = u64::MAX;
            }
        }
        for l in 0..64 {
            let k = (first + 32 * w + l / 2) % inputs;
            rows[k][w] ^= 1u64 << l;
            if l % 2 == 1 && inputs > 1 {
                let j = (k + 1 + s.below(inputs - 1)) % inputs;
                rows[j][w] ^= 1u64 << l;
            }
        }
    }
    rows
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn densities_differ_by_lane() {
        let w = mixed_density(64, 64, 3);
        let ones = |lane: usize| -> u32 {
            w.iter()
                .flat_map(|r| r.iter())
                .map(|x| (x >> lane & 1) as u32)
                .sum()
        };
        // 4096 draws per lane: lane 15 (level 7, p = 1/128) about 32 ones, lane 31 (level 15)
        // about 4064, lane 0 (uniform) about 2048.
        assert!(ones(15) < 120, "{}", ones(15));
        assert!(ones(31) > 3950, "{}", ones(31));
        assert!((1700..2400).contains(&ones(0)), "{}", ones(0));
    }

    #[test]
    #[allow(clippy::needless_range_loop)]
    fn one_hot_lanes_set_one_or_two_inputs() {
        let n = 100;
        let w = one_hot_words(n, 4, 9);
        for word in 0..4 {
            for lane in 0..64 {
                let ones = (0..n).filter(|&k| w[k][word] >> lane & 1 == 1).count();
                let hot = if word % 2 == 0 { ones } else { n - ones };
                assert_eq!(hot, 1 + lane % 2, "word {word} lane {lane}");
            }
        }
        // Consecutive even lanes walk through consecutive inputs.
        let at = |word: usize, lane: usize| (0..n).find(|&k| w[k][word] >> lane & 1 == 1);
        let (a, b) = (at(0, 0).unwrap(), at(0, 2).unwrap());
        assert_eq!((a + 1) % n, b);
        assert!(one_hot_words(0, 2, 1).is_empty());
    }
}
