//! Decoders, priority encoders and shifters against their definitions.

use super::support::{bench, bits, eval, ports, random_vectors, value};
use equicone::gen::{clog2, GenSpec, Kind};
use rand::rngs::StdRng;
use rand::{Rng, SeedableRng};

#[test]
fn decoders_raise_exactly_the_selected_line() {
    for k in 1..=8 {
        for &style in Kind::Decoder.styles() {
            let spec = GenSpec::new(Kind::Decoder, style, k);
            let p = ports(&spec);
            let vectors: Vec<_> = (0..1u128 << k).map(|a| vec![bits(a, k)]).collect();
            for (a, o) in eval(&bench(&spec), &p, &vectors).iter().enumerate() {
                for (i, &yi) in o[0].iter().enumerate() {
                    assert_eq!(
                        yi,
                        i == a,
                        "{k}-bit {} decoder, a = {a}, y[{i}]",
                        style.name()
                    );
                }
            }
        }
    }
}

#[test]
fn priority_encoders_report_the_highest_request() {
    let mut rng = StdRng::seed_from_u64(5);
    for n in [2, 3, 4, 5, 8, 13, 16, 33, 100] {
        for &style in Kind::Priority.styles() {
            let spec = GenSpec::new(Kind::Priority, style, n);
            let p = ports(&spec);
            let mut vectors = random_vectors(&p, 100, n as u64);
            // Sparse requests: none, one, or two set bits.
            for _ in 0..100 {
                let mut r = vec![false; n];
                for _ in 0..rng.gen_range(0..3) {
                    r[rng.gen_range(0..n)] = true;
                }
                vectors.push(vec![r]);
            }
            for (v, o) in vectors.iter().zip(eval(&bench(&spec), &p, &vectors)) {
                let top = v[0].iter().rposition(|&b| b);
                let want = bits(top.unwrap_or(0) as u128, clog2(n));
                assert_eq!(
                    o[0],
                    want,
                    "{n}-request {} encoder, r = {:?}",
                    style.name(),
                    v[0]
                );
                assert_eq!(
                    o[1],
                    vec![top.is_some()],
                    "valid of {n}-request {}",
                    style.name()
                );
            }
        }
    }
}

#[test]
fn shifters_shift_left_with_zero_fill() {
    let mut rng = StdRng::seed_from_u64(6);
    for n in [2, 3, 5, 8, 12, 16, 33, 64] {
        let k = clog2(n);
        for &style in Kind::Shifter.styles() {
            let spec = GenSpec::new(Kind::Shifter, style, n);
            let p = ports(&spec);
            let mut vectors = Vec::new();
            for s in 0..1usize << k {
                for _ in 0..3 {
                    let a: Vec<bool> = (0..n).map(|_| rng.gen()).collect();
                    vectors.push(vec![a, bits(s as u128, k)]);
                }
            }
            for (v, o) in vectors.iter().zip(eval(&bench(&spec), &p, &vectors)) {
                let s = value(&v[1]) as usize;
                let want: Vec<bool> = (0..n).map(|i| i >= s && v[0][i - s]).collect();
                assert_eq!(o[0], want, "{n}-bit {} shifter, s = {s}", style.name());
            }
        }
    }
}
