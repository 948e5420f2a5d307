//! Division, modulus and power as logic: `/` and `%` of any operands by the restoring
//! array divider (w steps of a w+1-bit compare and subtract; two's complement operands by
//! their magnitudes, IEEE 1364-2005 clause 5.1.5: the quotient truncates toward zero and
//! the remainder takes the sign of the dividend), and `**` with a constant exponent by
//! square and multiply.

use super::super::bits;
use crate::aig::{Aig, Lit};

/// Quotient and remainder of unsigned `a` by `b` (equal widths); a zero divisor gives an
/// all-ones quotient and `a` as the remainder (the caller puts the unknown there).
pub fn udivmod(g: &mut Aig, a: &[Lit], b: &[Lit]) -> (Vec<Lit>, Vec<Lit>) {
    let w = a.len();
    let mut bx = b.to_vec();
    bx.push(Lit::FALSE);
    let mut r = vec![Lit::FALSE; w + 1];
    let mut q = vec![Lit::FALSE; w];
    for i in (0..w).rev() {
        // r = r << 1 | a[i]; r < 2b here, so w + 1 bits hold it.
        r.pop();
        r.insert(0, a[i]);
        let fits = !bits::ult(g, &r, &bx);
        let d = bits::sub(g, &r, &bx);
        r = r
            .iter()
            .zip(&d)
            .map(|(&keep, &sub)| g.mux(fits, sub, keep))
            .collect();
        q[i] = fits;
    }
    r.pop();
    (q, r)
}

/// `a / b` or `a % b` (equal widths), signed when `signed`.
pub fn divmod(g: &mut Aig, a: &[Lit], b: &[Lit], signed: bool, want_rem: bool) -> Vec<Lit> {
    if !signed {
        let (q, r) = udivmod(g, a, b);
        return if want_rem { r } else { q };
    }
    let sa = *a.last().unwrap_or(&Lit::FALSE);
    let sb = *b.last().unwrap_or(&Lit::FALSE);
    let abs = |g: &mut Aig, v: &[Lit], s: Lit| {
        let n = bits::neg(g, v);
        v.iter()
            .zip(&n)
            .map(|(&p, &m)| g.mux(s, m, p))
            .collect::<Vec<_>>()
    };
    let ma = abs(g, a, sa);
    let mb = abs(g, b, sb);
    let (q, r) = udivmod(g, &ma, &mb);
    let (v, s) = if want_rem {
        (r, sa)
    } else {
        let s = g.xor(sa, sb);
        (q, s)
    };
    abs(g, &v, s)
}

/// `a ** e` for a constant exponent `e >= 0`, in `a.len()` bits.
pub fn pow_const(g: &mut Aig, a: &[Lit], mut e: u64) -> Vec<Lit> {
    let w = a.len();
    let mut acc = bits::constant(1, w);
    let mut sq = a.to_vec();
    while e > 0 {
        if e & 1 == 1 {
            acc = bits::mul(g, &acc, &sq);
        }
        e >>= 1;
        if e > 0 {
            sq = bits::mul(g, &sq, &sq);
        }
    }
    acc
}

#[cfg(test)]
mod tests {
    use super::*;

    fn run(w: usize, signed: bool, rem: bool, x: i64, y: i64) -> i64 {
        let mut g = Aig::new();
        let a = bits::constant(x, w);
        let b = bits::constant(y, w);
        let r = divmod(&mut g, &a, &b, signed, rem);
        bits::to_i64(&r, signed).expect("constant")
    }

    /// Every pair of 5-bit values, signed and unsigned, against Rust's own `/` and `%`
    /// (which truncate toward zero, as IEEE 1364-2005 clause 5.1.5 asks).
    #[test]
    fn divider_matches_integer_division() {
        for x in 0..32i64 {
            for y in 1..32i64 {
                assert_eq!(run(5, false, false, x, y), x / y);
                assert_eq!(run(5, false, true, x, y), x % y);
                let (sx, sy) = (
                    if x > 15 { x - 32 } else { x },
                    if y > 15 { y - 32 } else { y },
                );
                let wrap = |v: i64| ((v + 16).rem_euclid(32)) - 16;
                assert_eq!(
                    run(5, true, false, sx, sy),
                    wrap(sx.wrapping_div(sy)),
                    "{sx}/{sy}"
                );
                assert_eq!(
                    run(5, true, true, sx, sy),
                    wrap(sx.wrapping_rem(sy)),
                    "{sx}%{sy}"
                );
            }
        }
    }

    #[test]
    fn power_by_squaring() {
        let mut g = Aig::new();
        for x in 0..16i64 {
            for e in 0..9u64 {
                let r = pow_const(&mut g, &bits::constant(x, 8), e);
                assert_eq!(
                    bits::to_i64(&r, false),
                    Some(x.pow(e as u32) & 255),
                    "{x}**{e}"
                );
            }
        }
    }
}
