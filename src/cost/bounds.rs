//! Lower bounds implied by a support (the standard counting argument, common practice): a
//! function of `n` inputs built from gates of fan-in at most `k` needs at least
//! `ceil((n-1)/(k-1))` gates (each gate joins at most `k` signals into one, so it removes at
//! most `k-1` of the `n` signals that must meet) and depth at least `ceil(log_k n)` (a tree of
//! depth `d` has at most `k^d` leaves).

/// At least this many gates of fan-in `<= k` compute a function of `n` inputs (`k >= 2`).
pub fn gate_bound(n: u64, k: u32) -> u64 {
    let k = u64::from(k.max(2));
    if n <= 1 {
        0
    } else {
        (n - 1).div_ceil(k - 1)
    }
}

/// At least this depth, in gates of fan-in `<= k`, computes a function of `n` inputs: the
/// smallest `d` with `k^d >= n` (`k >= 2`).
pub fn depth_bound(n: u64, k: u32) -> u32 {
    let k = u64::from(k.max(2));
    let mut d = 0u32;
    let mut reach = 1u64;
    while reach < n {
        reach = reach.saturating_mul(k);
        d += 1;
    }
    d
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn small_cases_by_hand() {
        // n = 0 or 1: a constant or a wire needs no gate.
        assert_eq!((gate_bound(0, 2), depth_bound(0, 2)), (0, 0));
        assert_eq!((gate_bound(1, 2), depth_bound(1, 2)), (0, 0));
        // 2-input gates: an n-input AND tree has n-1 gates and depth ceil(log2 n).
        assert_eq!((gate_bound(8, 2), depth_bound(8, 2)), (7, 3));
        assert_eq!((gate_bound(9, 2), depth_bound(9, 2)), (8, 4));
        // 4:1 selector (6 inputs) with 3-input gates: ceil(5/2) = 3 gates, depth 2.
        assert_eq!((gate_bound(6, 3), depth_bound(6, 3)), (3, 2));
        // 4108 inputs (a 4096:1 selector) with 2-input gates: 4107 gates, depth 12... 13.
        assert_eq!(depth_bound(4096, 2), 12);
        assert_eq!(depth_bound(4108, 2), 13);
        assert_eq!(depth_bound(u64::MAX, 2), 64);
    }

    #[test]
    fn bounds_are_met_by_balanced_trees() {
        // A balanced k-ary tree over n leaves has exactly these many gates when it is full,
        // and its depth is the bound: check the tree construction against the formula.
        for k in 2..6u32 {
            for n in 1..200u64 {
                let (mut layer, mut gates, mut depth) = (n, 0u64, 0u32);
                while layer > 1 {
                    let next = layer.div_ceil(u64::from(k));
                    gates += next;
                    layer = next;
                    depth += 1;
                }
                assert!(gates >= gate_bound(n, k), "n={n} k={k}");
                assert_eq!(depth, depth_bound(n, k), "n={n} k={k}");
            }
        }
    }
}
