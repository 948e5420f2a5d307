//! Unsigned n x n multipliers (`p[2n-1:0]` = a * b): the spec `a * b`, an array of rows of
//! ripple-carry adders, and Wallace and Dadda carry-save trees with a ripple-carry final adder.
//!
//! Partial products are `pp{i}_{j}` = a[j] & b[i] of weight i + j. Full and half adders are
//! named by their place: `r{row}_{j}` (array), `w{stage}_{col}_{k}` (Wallace),
//! `d{stage}_{col}_{k}` (Dadda), `f{col}` (final adder).

use super::arith::add3;
use super::emit::{Circuit, Net, Op};
use super::Style;

/// Multiplier: inputs `a[n-1:0]`, `b[n-1:0]`, output `p[2n-1:0]` = a * b.
pub(super) fn build(c: &mut Circuit, n: usize, style: Style) -> Vec<String> {
    let a = c.input("a", n);
    let b = c.input("b", n);
    let mut notes = vec![format!(
        "{n}x{n} unsigned multiplier: a[{}:0], b[{}:0] in; p[{}:0] = a * b",
        n - 1,
        n - 1,
        2 * n - 1
    )];
    let mut pp = vec![Vec::with_capacity(n); n];
    for (i, row) in pp.iter_mut().enumerate() {
        for (j, &aj) in a.iter().enumerate() {
            row.push(c.gate(Op::And, vec![aj, b[i]], format!("pp{i}_{j}")));
        }
    }
    let bits: Vec<Option<Net>> = match style {
        Style::Spec | Style::Array => {
            notes.push(if style == Style::Spec {
                "style spec: `p = a * b`; in bench written as the array multiplier".to_string()
            } else {
                "style array: row i adds partial products pp{i}_* to the running sum with a \
                 ripple-carry adder r{i}_*"
                    .to_string()
            });
            let mut acc: Vec<Option<Net>> = vec![None; 2 * n];
            for (j, &x) in pp[0].iter().enumerate() {
                acc[j] = Some(x);
            }
            for (i, row) in pp.iter().enumerate().skip(1) {
                let mut carry = None;
                for (j, &x) in row.iter().enumerate() {
                    let ins: Vec<Net> =
                        [acc[i + j], Some(x), carry].into_iter().flatten().collect();
                    let (s, co) = add3(c, &ins, &format!("r{i}_{j}"));
                    acc[i + j] = Some(s);
                    carry = co;
                }
                acc[i + n] = carry;
            }
            acc
        }
        Style::Wallace | Style::Dadda => {
            let mut cols: Vec<Vec<Net>> = vec![Vec::new(); 2 * n + 1];
            for (i, row) in pp.iter().enumerate() {
                for (j, &x) in row.iter().enumerate() {
                    cols[i + j].push(x);
                }
            }
            let stages = if style == Style::Wallace {
                wallace(c, &mut cols)
            } else {
                dadda(c, &mut cols)
            };
            notes.push(format!(
                "style {}: carry-save reduction of the partial-product columns in {stages} stages \
                 of full and half adders, then a ripple-carry final adder f*",
                style.name()
            ));
            let mut carry = None;
            (0..2 * n)
                .map(|w| {
                    let ins: Vec<Net> = cols[w].iter().copied().chain(carry).collect();
                    if ins.is_empty() {
                        carry = None;
                        return None;
                    }
                    let (s, co) = add3(c, &ins, &format!("f{w}"));
                    carry = co;
                    Some(s)
                })
                .collect()
        }
        other => unreachable!("multiplier style {other:?} passed validation"),
    };
    let p: Vec<Net> = bits
        .into_iter()
        .enumerate()
        .map(|(w, x)| x.unwrap_or_else(|| c.gate(Op::Const0, vec![], format!("zero{w}"))))
        .collect();
    c.output("p", &p);
    if style == Style::Spec {
        c.behaviour = vec!["assign p = a * b;".to_string()];
    }
    notes
}

/// Wallace: each stage puts every column's bits through full adders in threes and a half
/// adder for a remaining pair, until no column has more than two bits. Returns the stage count.
fn wallace(c: &mut Circuit, cols: &mut Vec<Vec<Net>>) -> usize {
    let mut stage = 0;
    while cols.iter().any(|col| col.len() > 2) {
        let mut next: Vec<Vec<Net>> = vec![Vec::new(); cols.len() + 1];
        for (w, col) in cols.iter().enumerate() {
            let mut rest: &[Net] = col;
            let mut k = 0;
            while rest.len() >= 2 {
                let take = rest.len().min(3);
                let (s, co) = add3(c, &rest[..take], &format!("w{stage}_{w}_{k}"));
                next[w].push(s);
                next[w + 1].extend(co);
                rest = &rest[take..];
                k += 1;
            }
            next[w].extend_from_slice(rest);
        }
        next.truncate(cols.len());
        *cols = next;
        stage += 1;
    }
    stage
}

/// Dadda: heights 2, 3, 4, 6, 9, ... (d_{j+1} = floor(3 d_j / 2)); each stage reduces every
/// column to the next lower height with as few adders as possible. Returns the stage count.
fn dadda(c: &mut Circuit, cols: &mut [Vec<Net>]) -> usize {
    let max = cols.iter().map(|col| col.len()).max().unwrap_or(0);
    let mut heights = vec![2usize];
    while *heights.last().expect("non-empty") < max {
        let d = *heights.last().expect("non-empty");
        heights.push(d * 3 / 2);
    }
    heights.pop();
    let mut stage = 0;
    for &target in heights.iter().rev() {
        for w in 0..cols.len() {
            let mut k = 0;
            while cols[w].len() > target {
                let take = if cols[w].len() == target + 1 { 2 } else { 3 };
                let ins: Vec<Net> = cols[w].drain(..take).collect();
                let (s, co) = add3(c, &ins, &format!("d{stage}_{w}_{k}"));
                cols[w].push(s);
                if let (Some(co), true) = (co, w + 1 < cols.len()) {
                    cols[w + 1].push(co);
                }
                k += 1;
            }
        }
        stage += 1;
    }
    stage
}
