//! Adders and multipliers against Rust's own u128 arithmetic on random and corner vectors.

use super::support::{bench, bits, eval, ports, random_vectors, value};
use equicone::gen::{GenSpec, Kind};

fn check(kind: Kind, widths: &[usize], random: usize) -> usize {
    let mut checked = 0;
    for &n in widths {
        for &style in kind.styles() {
            let spec = GenSpec::new(kind, style, n);
            let p = ports(&spec);
            let b = bench(&spec);
            let mut vectors = random_vectors(&p, random, n as u64);
            let max = (1u128 << n) - 1;
            for (x, y) in [(0, 0), (max, max), (max, 1), (1, max), (max, 0), (0, max)] {
                vectors.push(vec![bits(x, n), bits(y, n)]);
            }
            for (v, o) in vectors.iter().zip(eval(&b, &p, &vectors)) {
                let (x, y) = (value(&v[0]), value(&v[1]));
                let want = if kind == Kind::Adder { x + y } else { x * y };
                assert_eq!(
                    value(&o[0]),
                    want,
                    "{n}-bit {} {}: {x}, {y}",
                    kind.name(),
                    style.name()
                );
                checked += 1;
            }
        }
    }
    checked
}

#[test]
fn adders_compute_the_sum() {
    // Up to 127 bits so that a + b fits in u128.
    let n = check(
        Kind::Adder,
        &[1, 2, 3, 4, 5, 7, 8, 9, 13, 16, 17, 31, 32, 33, 64, 100, 127],
        250,
    );
    eprintln!("adders: {n} vectors agree with u128 addition");
    assert!(n > 0);
}

#[test]
fn multipliers_compute_the_product() {
    // Up to 64 bits so that a * b fits in u128.
    let n = check(
        Kind::Multiplier,
        &[2, 3, 4, 5, 7, 8, 11, 16, 23, 32, 64],
        250,
    );
    eprintln!("multipliers: {n} vectors agree with u128 multiplication");
    assert!(n > 0);
}
