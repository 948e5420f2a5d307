//! Population counts, majorities, recursive majorities, comparators, dividers, square roots and
//! round-robin arbiters against their definitions computed with Rust's native integer
//! arithmetic (u128 operators, `count_ones`, an integer square root by bisection), on every
//! vector where the inputs are few and on random and corner vectors otherwise, all evaluated on
//! the bench text with the test's own evaluator.

use super::support::{bench, bits, eval, ports, random_vectors, value, Vector};
use equicone::gen::{GenSpec, Kind};

/// Every vector of the spec's inputs when there are at most 14 input bits, else `random`
/// random ones plus the all-zeros and all-ones vectors.
fn vectors(spec: &GenSpec, random: usize) -> Vec<Vector> {
    let p = ports(spec);
    let total: usize = p.inputs.iter().map(|i| i.1).sum();
    let split = |x: u128| -> Vector {
        let mut at = 0;
        p.inputs
            .iter()
            .map(|(_, w, _)| {
                let v = bits(x >> at, *w);
                at += w;
                v
            })
            .collect()
    };
    if total <= 14 {
        return (0..1u128 << total).map(split).collect();
    }
    let mut v = random_vectors(&p, random, spec.n as u64 + 7);
    v.push(p.inputs.iter().map(|i| vec![false; i.1]).collect());
    v.push(p.inputs.iter().map(|i| vec![true; i.1]).collect());
    v
}

/// Check every style of `kind` at each size: `want(inputs)` gives the expected output ports.
fn check(kind: Kind, sizes: &[usize], random: usize, want: impl Fn(usize, &Vector) -> Vec<u128>) {
    for &n in sizes {
        for &style in kind.styles() {
            let spec = GenSpec::new(kind, style, n);
            let p = ports(&spec);
            let b = bench(&spec);
            let vs = vectors(&spec, random);
            for (v, o) in vs.iter().zip(eval(&b, &p, &vs)) {
                let got: Vec<u128> = o.iter().map(|x| value(x)).collect();
                assert_eq!(
                    got,
                    want(n, v),
                    "{} {} n={n} on {:?}",
                    kind.name(),
                    style.name(),
                    v.iter().map(|x| value(x)).collect::<Vec<_>>()
                );
            }
        }
    }
}

fn ones(v: &[bool]) -> u128 {
    v.iter().filter(|&&b| b).count() as u128
}

#[test]
fn population_counts_count_the_ones() {
    check(
        Kind::Popcount,
        &[2, 3, 7, 8, 13, 64, 100, 127],
        300,
        |_, v| vec![ones(&v[0])],
    );
}

#[test]
fn majorities_need_more_than_half() {
    check(
        Kind::Majority,
        &[3, 4, 5, 9, 14, 33, 100, 255],
        300,
        |n, v| vec![(ones(&v[0]) as usize > n / 2) as u128],
    );
}

#[test]
fn majority_corners_sit_at_the_threshold() {
    // Random vectors of many inputs rarely sit at the threshold; test exactly t-1 and t ones.
    for &style in Kind::Majority.styles() {
        let n = 101;
        let spec = GenSpec::new(Kind::Majority, style, n);
        let p = ports(&spec);
        let b = bench(&spec);
        let mut vs = Vec::new();
        for k in [49, 50, 51, 52] {
            for rot in [0, 17, 60] {
                let v: Vec<bool> = (0..n).map(|i| (i + rot) % n < k).collect();
                vs.push(vec![v]);
            }
        }
        for (v, o) in vs.iter().zip(eval(&b, &p, &vs)) {
            assert_eq!(value(&o[0]), (ones(&v[0]) > 50) as u128, "{}", style.name());
        }
    }
}

fn recursive_majority(x: &[bool]) -> bool {
    let mut layer = x.to_vec();
    while layer.len() > 1 {
        layer = layer
            .chunks(3)
            .map(|t| (t[0] as u8 + t[1] as u8 + t[2] as u8) >= 2)
            .collect();
    }
    layer[0]
}

#[test]
fn recursive_majorities_follow_the_definition() {
    check(
        Kind::RecursiveMajority,
        &[3, 9, 27, 81, 243],
        300,
        |_, v| vec![recursive_majority(&v[0]) as u128],
    );
}

#[test]
fn comparators_compare() {
    check(
        Kind::Comparator,
        &[1, 2, 3, 6, 7, 16, 33, 64, 127],
        300,
        |_, v| {
            let (a, b) = (value(&v[0]), value(&v[1]));
            vec![(a < b) as u128, (a == b) as u128, (a > b) as u128]
        },
    );
}

#[test]
fn dividers_divide() {
    check(Kind::Divider, &[2, 3, 5, 7, 8, 16, 33, 64], 300, |n, v| {
        let (a, b) = (value(&v[0]), value(&v[1]));
        match (a.checked_div(b), a.checked_rem(b)) {
            (Some(q), Some(r)) => vec![q, r],
            _ => vec![(1u128 << n) - 1, a],
        }
    });
}

fn isqrt(a: u128) -> u128 {
    let (mut lo, mut hi) = (0u128, 1u128 << 64);
    while hi - lo > 1 {
        let mid = (lo + hi) / 2;
        if mid.checked_mul(mid).is_some_and(|m| m <= a) {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    lo
}

#[test]
fn square_roots_are_floor_roots() {
    check(Kind::Sqrt, &[1, 2, 3, 4, 7, 8, 16, 31, 63], 300, |_, v| {
        let a = value(&v[0]);
        let s = isqrt(a);
        vec![s, a - s * s]
    });
}

#[test]
fn arbiters_grant_round_robin() {
    check(Kind::Arbiter, &[2, 3, 5, 7, 16, 40, 128], 300, |n, v| {
        let (r, p) = (&v[0], &v[1]);
        // A token enters at each set pointer bit and travels up past idle requesters.
        let mut g = vec![false; n];
        for k in (0..n).filter(|&k| p[k]) {
            for d in 0..n {
                let i = (k + d) % n;
                if r[i] {
                    g[i] = true;
                    break;
                }
            }
        }
        vec![value(&g), r.iter().any(|&x| x) as u128]
    });
}
