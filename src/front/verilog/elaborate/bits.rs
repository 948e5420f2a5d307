//! Bit-vector operations on AIG literals (least significant bit first): extension, adders,
//! multiplier, comparisons, shifts and selector trees. All are loops, never recursion.

use crate::aig::{Aig, Lit};

/// Extend or truncate `v` to `w` bits, sign-extending when `signed`.
pub fn extend(mut v: Vec<Lit>, w: usize, signed: bool) -> Vec<Lit> {
    let fill = if signed {
        v.last().copied().unwrap_or(Lit::FALSE)
    } else {
        Lit::FALSE
    };
    v.resize(w, fill);
    v
}

/// Constant bits of `value` (two's complement), `w` bits.
pub fn constant(value: i64, w: usize) -> Vec<Lit> {
    (0..w)
        .map(|k| {
            Lit::constant(if k < 64 {
                (value >> k) & 1 == 1
            } else {
                value < 0
            })
        })
        .collect()
}

/// The value of constant bits, if every bit is constant and it fits in an `i64`.
pub fn to_i64(v: &[Lit], signed: bool) -> Option<i64> {
    if v.iter().any(|l| !l.is_const()) {
        return None;
    }
    let neg = signed && v.last() == Some(&Lit::TRUE);
    let mut r: i64 = 0;
    for (k, l) in v.iter().enumerate() {
        let bit = *l == Lit::TRUE;
        if k >= 63 {
            if bit != neg {
                return None;
            }
        } else if bit {
            r |= 1 << k;
        }
    }
    if neg && v.len() < 64 {
        r -= 1i64 << v.len();
    } else if neg {
        r |= i64::MIN;
    }
    Some(r)
}

/// Whether every bit is constant.
pub fn is_const(v: &[Lit]) -> bool {
    v.iter().all(|l| l.is_const())
}

/// Bitwise NOT.
pub fn not(v: &[Lit]) -> Vec<Lit> {
    v.iter().map(|&l| !l).collect()
}

/// Bitwise operation of two equal-width vectors.
pub fn zip(g: &mut Aig, a: &[Lit], b: &[Lit], op: fn(&mut Aig, Lit, Lit) -> Lit) -> Vec<Lit> {
    a.iter().zip(b).map(|(&x, &y)| op(g, x, y)).collect()
}

/// `a + b + cin`, width of `a` (equal widths).
pub fn add(g: &mut Aig, a: &[Lit], b: &[Lit], cin: Lit) -> Vec<Lit> {
    let mut c = cin;
    let mut out = Vec::with_capacity(a.len());
    for (&x, &y) in a.iter().zip(b) {
        let t = g.xor(x, y);
        out.push(g.xor(t, c));
        let p = g.and(x, y);
        let q = g.and(t, c);
        c = g.or(p, q);
    }
    out
}

/// `a - b` (equal widths).
pub fn sub(g: &mut Aig, a: &[Lit], b: &[Lit]) -> Vec<Lit> {
    add(g, a, &not(b), Lit::TRUE)
}

/// `-a`.
pub fn neg(g: &mut Aig, a: &[Lit]) -> Vec<Lit> {
    let zero = vec![Lit::FALSE; a.len()];
    sub(g, &zero, a)
}

/// Low `a.len()` bits of `a * b` (equal widths; the same for signed and unsigned operands).
pub fn mul(g: &mut Aig, a: &[Lit], b: &[Lit]) -> Vec<Lit> {
    let w = a.len();
    let mut acc = vec![Lit::FALSE; w];
    for (i, &bi) in b.iter().enumerate() {
        if bi == Lit::FALSE {
            continue;
        }
        let pp: Vec<Lit> = (0..w - i).map(|k| g.and(a[k], bi)).collect();
        let hi = add(g, &acc[i..], &pp, Lit::FALSE);
        acc[i..].copy_from_slice(&hi);
    }
    acc
}

/// `a == b` (equal widths).
pub fn eq(g: &mut Aig, a: &[Lit], b: &[Lit]) -> Lit {
    let x: Vec<Lit> = a.iter().zip(b).map(|(&x, &y)| g.xnor(x, y)).collect();
    g.and_all(&x)
}

/// `a < b`, unsigned (equal widths).
pub fn ult(g: &mut Aig, a: &[Lit], b: &[Lit]) -> Lit {
    let mut lt = Lit::FALSE;
    for (&x, &y) in a.iter().zip(b) {
        let here = g.and(!x, y);
        let same = g.xnor(x, y);
        let keep = g.and(same, lt);
        lt = g.or(here, keep);
    }
    lt
}

/// `a < b`, signed two's complement (equal widths).
pub fn slt(g: &mut Aig, a: &[Lit], b: &[Lit]) -> Lit {
    let mut a2 = a.to_vec();
    let mut b2 = b.to_vec();
    if let (Some(x), Some(y)) = (a2.last_mut(), b2.last_mut()) {
        *x = !*x;
        *y = !*y;
    }
    ult(g, &a2, &b2)
}

/// Shift `a` left (`left`) or right by the unsigned amount `amt`, filling with `fill`
/// on the vacated side (a barrel shifter; amounts at or beyond the width give all `fill`).
pub fn shift(g: &mut Aig, a: &[Lit], amt: &[Lit], left: bool, fill: Lit) -> Vec<Lit> {
    let w = a.len();
    let mut acc = a.to_vec();
    let mut big = Lit::FALSE;
    for (i, &s) in amt.iter().enumerate() {
        if i >= 63 || (1usize << i) >= w {
            big = g.or(big, s);
            continue;
        }
        let d = 1usize << i;
        let shifted: Vec<Lit> = (0..w)
            .map(|k| {
                if left {
                    if k >= d {
                        acc[k - d]
                    } else {
                        Lit::FALSE
                    }
                } else if k + d < w {
                    acc[k + d]
                } else {
                    fill
                }
            })
            .collect();
        acc = (0..w).map(|k| g.mux(s, shifted[k], acc[k])).collect();
    }
    let f = if left { Lit::FALSE } else { fill };
    acc.iter().map(|&l| g.mux(big, f, l)).collect()
}

/// Selector tree: `data[sel]` for `sel` in `0..2^sel.len()`; positions past the end read
/// `pad`.
pub fn mux_tree(g: &mut Aig, data: &[Lit], sel: &[Lit], pad: Lit) -> Lit {
    let mut layer: Vec<Lit> = data.to_vec();
    for &s in sel {
        if layer.len() <= 1 {
            // Every remaining select value beyond here reads `pad`.
            let v = layer.first().copied().unwrap_or(pad);
            let rest_zero = s;
            layer = vec![g.mux(rest_zero, pad, v)];
            continue;
        }
        let mut next = Vec::with_capacity(layer.len().div_ceil(2));
        for pair in layer.chunks(2) {
            let hi = if pair.len() == 2 { pair[1] } else { pad };
            next.push(g.mux(s, hi, pair[0]));
        }
        layer = next;
    }
    layer.first().copied().unwrap_or(pad)
}

/// `a + k` for a constant `k`, same width.
pub fn add_const(g: &mut Aig, a: &[Lit], k: i64) -> Vec<Lit> {
    let c = constant(k, a.len());
    add(g, a, &c, Lit::FALSE)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn val(g: &Aig, v: &[Lit], ins: &[bool]) -> u64 {
        let r = crate::aig::eval(g, ins, v);
        r.iter().enumerate().map(|(k, &b)| (b as u64) << k).sum()
    }

    #[test]
    fn arithmetic_matches_integers_exhaustively_on_4_bits() {
        let mut g = Aig::new();
        let a: Vec<Lit> = (0..4).map(|_| g.add_input()).collect();
        let b: Vec<Lit> = (0..4).map(|_| g.add_input()).collect();
        let s = add(&mut g, &a, &b, Lit::FALSE);
        let d = sub(&mut g, &a, &b);
        let m = mul(&mut g, &a, &b);
        let lt = ult(&mut g, &a, &b);
        let slt_ = slt(&mut g, &a, &b);
        let sh = shift(&mut g, &a, &b[..3], false, a[3]);
        let mt = mux_tree(&mut g, &a[..3], &b[..2], Lit::TRUE);
        for x in 0u64..16 {
            for y in 0u64..16 {
                let ins: Vec<bool> = (0..4)
                    .map(|k| x >> k & 1 == 1)
                    .chain((0..4).map(|k| y >> k & 1 == 1))
                    .collect();
                assert_eq!(val(&g, &s, &ins), (x + y) & 15);
                assert_eq!(val(&g, &d, &ins), x.wrapping_sub(y) & 15);
                assert_eq!(val(&g, &m, &ins), (x * y) & 15);
                assert_eq!(val(&g, &[lt], &ins), (x < y) as u64);
                let (sx, sy) = (((x as i64) << 60) >> 60, ((y as i64) << 60) >> 60);
                assert_eq!(val(&g, &[slt_], &ins), (sx < sy) as u64);
                let amt = y & 7;
                assert_eq!(val(&g, &sh, &ins), ((sx >> amt.min(63)) as u64) & 15);
                let want = if (y & 3) < 3 { (x >> (y & 3)) & 1 } else { 1 };
                assert_eq!(val(&g, &[mt], &ins), want);
            }
        }
    }

    #[test]
    fn constants_round_trip() {
        assert_eq!(to_i64(&constant(-5, 8), true), Some(-5));
        assert_eq!(to_i64(&constant(-5, 8), false), Some(251));
        assert_eq!(to_i64(&constant(7, 70), true), Some(7));
        assert_eq!(to_i64(&constant(-1, 70), true), Some(-1));
    }
}
