//! Partial products of the multiplier family, as rows of (weight, net) bits modulo 2^W:
//! the AND array (unsigned), Baugh-Wooley (signed), radix-4 Booth (signed and unsigned) and
//! the folded squarer. Bits of weight W or more are dropped (the product is taken modulo 2^W).
//!
//! Partial-product nets are `pp{i}_{j}` (row i, operand bit j); Booth recoder nets are
//! `bneg{k}`, `bone{k}`, `btwo{k}` for row k and its bits `bp{k}_{j}`.

use super::super::emit::{Net, Op};
use super::{Ctx, Plant};

/// Rows of weighted bits.
pub(super) type Rows = Vec<Vec<(usize, Net)>>;

/// Constant 1 bits at the weights `bits` (below `w`), as one row.
fn constant_row(x: &Ctx<'_>, bits: &[usize], w: usize) -> Vec<(usize, Net)> {
    bits.iter()
        .filter(|&&i| i < w)
        .map(|&i| (i, x.one))
        .collect()
}

/// The set bits of -(sum of 2^e over `exps`) modulo 2^w.
fn negated_sum(exps: &[usize], w: usize) -> Vec<usize> {
    let mut v = vec![false; w];
    for &e in exps {
        let mut i = e;
        while i < w {
            v[i] = !v[i];
            if v[i] {
                break;
            }
            i += 1;
        }
    }
    // Two's complement: invert, add one.
    for b in v.iter_mut() {
        *b = !*b;
    }
    for b in v.iter_mut() {
        *b = !*b;
        if *b {
            break;
        }
    }
    (0..w).filter(|&i| v[i]).collect()
}

/// Operand bit `j` for the wrong-partial-product bug: the next bit (wrapping) when `plant`
/// chooses this partial product.
fn operand(x: &[Net], j: usize, plant: &mut Plant, what: &str) -> Net {
    if plant.next_pp() {
        let k = (j + 1) % x.len();
        plant.note(format!(
            "wrong partial-product bit: {what} takes operand bit {k} instead of {j}"
        ));
        x[k]
    } else {
        x[j]
    }
}

/// `a * b` (n x n, into W = 2n bits): row i holds a[j] & b[i] at weight i + j; signed
/// (Baugh-Wooley, common practice): the products with exactly one sign bit inverted, and
/// constant 1s at weights n and 2n - 1.
pub(super) fn and_array(x: &mut Ctx<'_>, a: &[Net], b: &[Net], signed: bool) -> Rows {
    let n = a.len();
    let mut rows: Rows = Vec::new();
    for (i, &bi) in b.iter().enumerate() {
        let mut row = Vec::with_capacity(n);
        for j in 0..n {
            let name = format!("pp{i}_{j}");
            let aj = operand(a, j, &mut x.plant, &name);
            let op = if signed && ((i == n - 1) != (j == n - 1)) {
                Op::Nand
            } else {
                Op::And
            };
            row.push((i + j, x.c.gate(op, vec![aj, bi], name)));
        }
        rows.push(row);
    }
    if signed {
        rows.push(constant_row(x, &[n, 2 * n - 1], 2 * n));
    }
    rows
}

/// `a * a` (into W = 2n bits), folded: a[i] at weight 2i, a[i] & a[j] (i < j) once at weight
/// i + j + 1 (common practice); signed: the products with the sign bit inverted and constant
/// 1s at weights n and 2n - 1.
pub(super) fn squarer(x: &mut Ctx<'_>, a: &[Net], signed: bool) -> Rows {
    let n = a.len();
    let mut rows: Rows = Vec::new();
    for i in 0..n {
        let mut row = vec![(2 * i, a[i])];
        for j in i + 1..n {
            let name = format!("pp{i}_{j}");
            let aj = operand(a, j, &mut x.plant, &name);
            let op = if signed && j == n - 1 {
                Op::Nand
            } else {
                Op::And
            };
            row.push((i + j + 1, x.c.gate(op, vec![a[i], aj], name)));
        }
        rows.push(row);
    }
    if signed {
        rows.push(constant_row(x, &[n, 2 * n - 1], 2 * n));
    }
    rows
}

/// Radix-4 Booth rows of `a * b` into `w` bits (common practice): multiplier digits from the
/// overlapping triplets (b[2k+1], b[2k], b[2k-1]) select 0, a or 2a, inverted when the digit
/// is negative, with the negation's +1 at weight 2k. The multiplicand is extended to
/// m = n + 1 (signed) or n + 2 (unsigned) bits; each row's sign bit enters inverted and the
/// constant -sum 2^(m-1+2k) makes up for it. Unsigned operands get a zero bit on top, so
/// there are ceil(n / 2) rows signed and ceil((n + 1) / 2) unsigned.
pub(super) fn booth(x: &mut Ctx<'_>, a: &[Net], b: &[Net], signed: bool, w: usize) -> Rows {
    let n = a.len();
    let zero = x.zero;
    let m = if signed { n + 1 } else { n + 2 };
    let ext = |v: &[Net], j: usize| -> Net {
        if j < v.len() {
            v[j]
        } else if signed {
            v[v.len() - 1]
        } else {
            zero
        }
    };
    let av: Vec<Net> = (0..m).map(|j| ext(a, j)).collect();
    let rows_n = if signed {
        n.div_ceil(2)
    } else {
        (n + 1).div_ceil(2)
    };
    let mut rows: Rows = Vec::new();
    let mut weights = Vec::new();
    for k in 0..rows_n {
        let hi = ext(b, 2 * k + 1);
        let mid = ext(b, 2 * k);
        let lo = if k == 0 { zero } else { ext(b, 2 * k - 1) };
        let c = &mut *x.c;
        let neg = c.gate(Op::Buf, vec![hi], format!("bneg{k}"));
        let one = c.gate(Op::Xor, vec![mid, lo], format!("bone{k}"));
        let t1 = c.gate(Op::Nor, vec![mid, lo], format!("btl{k}"));
        let t2 = c.gate(Op::And, vec![mid, lo], format!("bth{k}"));
        let down = c.gate(Op::And, vec![hi, t1], format!("btd{k}"));
        let nhi = c.gate(Op::Not, vec![hi], format!("btn{k}"));
        let rise = c.gate(Op::And, vec![nhi, t2], format!("btr{k}"));
        let two = c.gate(Op::Or, vec![down, rise], format!("btwo{k}"));
        let sign_error = x.plant.next_booth_row();
        let mut row = Vec::with_capacity(m + 1);
        for j in 0..m {
            let name = format!("bp{k}_{j}");
            let aj = operand(&av, j, &mut x.plant, &name);
            let prev = if j == 0 { zero } else { av[j - 1] };
            let c = &mut *x.c;
            let s1 = c.gate(Op::And, vec![one, aj], format!("bs{k}_{j}"));
            let s2 = c.gate(Op::And, vec![two, prev], format!("bd{k}_{j}"));
            let sel = c.gate(Op::Or, vec![s1, s2], format!("bm{k}_{j}"));
            let invert_sign = j == m - 1 && !sign_error;
            if j == m - 1 && sign_error {
                x.plant.note(format!(
                    "Booth sign error: the sign bit {name} of row {k} enters without its inversion"
                ));
            }
            let op = if invert_sign { Op::Xnor } else { Op::Xor };
            let bit = c.gate(op, vec![sel, neg], name);
            if 2 * k + j < w {
                row.push((2 * k + j, bit));
            }
        }
        if 2 * k < w {
            row.push((2 * k, neg));
        }
        rows.push(row);
        weights.push(m - 1 + 2 * k);
    }
    let k = negated_sum(&weights, w);
    rows.push(constant_row(x, &k, w));
    rows
}
