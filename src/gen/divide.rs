//! Digit-recurrence arithmetic: unsigned dividers (restoring and non-restoring) and integer
//! square roots (restoring and non-restoring), one subtracter or adder-subtracter per step
//! (common practice).
//!
//! Division by zero gives the quotient of all ones and the remainder a in both divider styles
//! (what the restoring recurrence computes when every trial subtraction succeeds).

use super::fold::{Fold, Sig};
use super::{Circuit, Net, Style};

/// Divider: inputs `a[n-1:0]`, `b[n-1:0]`, outputs `q[n-1:0]` = a / b, `r[n-1:0]` = a % b.
pub(super) fn build_divider(c: &mut Circuit, n: usize, style: Style) -> Vec<String> {
    let a = c.input("a", n);
    let b = c.input("b", n);
    let mut notes = vec![format!(
        "{n}-bit unsigned divider: a[{}:0], b[{}:0] in; q = a / b, r = a % b \
         (b = 0: q all ones, r = a)",
        n - 1,
        n - 1
    )];
    let mut f = Fold::new(c, "w");
    let a: Vec<Sig> = a.iter().map(|&x| Sig::Net(x)).collect();
    let b: Vec<Sig> = b.iter().map(|&x| Sig::Net(x)).collect();
    let mut q = vec![Sig::Zero; n];
    let r = if style == Style::NonRestoring {
        notes.push(
            "style non-restoring: signed partial remainder of n+2 bits; add b when it is \
             negative, else subtract; one correcting addition at the end"
                .to_string(),
        );
        let w = n + 2;
        let mut r = vec![Sig::Zero; w];
        for i in (0..n).rev() {
            let neg = r[w - 1];
            let mut s = vec![a[i]];
            s.extend_from_slice(&r[..w - 1]);
            let r2 = add_or_sub(&mut f, &s, &b, neg);
            q[i] = f.not(r2[w - 1]);
            r = r2;
        }
        let neg = r[w - 1];
        let gated: Vec<Sig> = b.iter().map(|&x| f.and(x, neg)).collect();
        let mut fixed = f.add(&r, &gated, Sig::Zero);
        fixed.truncate(n);
        fixed
    } else {
        notes.push(
            "style restoring: per quotient bit, subtract b from the shifted remainder and keep \
             the difference when there is no borrow"
                .to_string(),
        );
        let mut r = vec![Sig::Zero; n];
        for i in (0..n).rev() {
            let mut s = vec![a[i]];
            s.extend_from_slice(&r);
            let (d, borrow) = f.sub(&s, &b);
            q[i] = f.not(borrow);
            r = (0..n).map(|j| f.mux(q[i], d[j], s[j])).collect();
        }
        r
    };
    let q: Vec<Net> = q.into_iter().map(|x| f.net(x)).collect();
    let r: Vec<Net> = r.into_iter().map(|x| f.net(x)).collect();
    c.output("q", &q);
    c.output("r", &r);
    notes
}

/// `s + b` when `add` is 1, else `s - b`, over the width of `s` (b zero-extended).
fn add_or_sub(f: &mut Fold, s: &[Sig], b: &[Sig], add: Sig) -> Vec<Sig> {
    let sub = f.not(add);
    let y: Vec<Sig> = (0..s.len())
        .map(|j| {
            let bj = b.get(j).copied().unwrap_or(Sig::Zero);
            f.xor(bj, sub)
        })
        .collect();
    let mut sum = f.add(s, &y, sub);
    sum.truncate(s.len());
    sum
}

/// Square root: input `a[2n-1:0]`, outputs `s[n-1:0]` = floor(sqrt(a)) and `r[n:0]` = a - s*s.
pub(super) fn build_sqrt(c: &mut Circuit, n: usize, style: Style) -> Vec<String> {
    let a = c.input("a", 2 * n);
    let mut notes = vec![format!(
        "integer square root of a {}-bit number: a[{}:0] in; s[{}:0] = floor(sqrt(a)), \
         r[{n}:0] = a - s*s",
        2 * n,
        2 * n - 1,
        n - 1
    )];
    let mut f = Fold::new(c, "w");
    let a: Vec<Sig> = a.iter().map(|&x| Sig::Net(x)).collect();
    // Root bits found so far, bit 0 first (the most recent digit is bit 0).
    let mut root: Vec<Sig> = Vec::new();
    let w = n + 4;
    let mut r = vec![Sig::Zero; w];
    let nonrestoring = style == Style::NonRestoring;
    notes.push(if nonrestoring {
        "style non-restoring: signed remainder; subtract 4s+1 when it is not negative, else add \
         4s+3; one correcting addition of 2s+1 at the end"
            .to_string()
    } else {
        "style restoring: per root bit, subtract 4s+1 from the shifted remainder and keep the \
         difference when there is no borrow"
            .to_string()
    });
    for i in (0..n).rev() {
        let mut shifted = vec![a[2 * i], a[2 * i + 1]];
        shifted.extend_from_slice(&r[..w - 2]);
        let digit;
        if nonrestoring {
            let neg = r[w - 1];
            // 4s + 1 when subtracting, 4s + 3 when adding: bit 1 is the sign.
            let mut d = vec![Sig::One, neg];
            d.extend_from_slice(&root);
            let r2 = add_or_sub(&mut f, &shifted, &d, neg);
            digit = f.not(r2[w - 1]);
            r = r2;
        } else {
            let mut d = vec![Sig::One, Sig::Zero];
            d.extend_from_slice(&root);
            let (diff, borrow) = f.sub(&shifted, &d);
            digit = f.not(borrow);
            r = (0..w).map(|j| f.mux(digit, diff[j], shifted[j])).collect();
        }
        root.insert(0, digit);
    }
    if nonrestoring {
        let neg = r[w - 1];
        let mut d = vec![Sig::One];
        d.extend_from_slice(&root);
        let gated: Vec<Sig> = d.iter().map(|&x| f.and(x, neg)).collect();
        let mut fixed = f.add(&r, &gated, Sig::Zero);
        fixed.truncate(w);
        r = fixed;
    }
    let s: Vec<Net> = root.into_iter().map(|x| f.net(x)).collect();
    let r: Vec<Net> = r[..=n].iter().map(|&x| f.net(x)).collect();
    c.output("s", &s);
    c.output("r", &r);
    notes
}
