//! Summing the partial-product rows into W bits: an array of ripple-carry rows, or Wallace or
//! Dadda carry-save trees followed by a final adder (ripple, carry lookahead, Kogge-Stone or
//! Brent-Kung). Full and half adders are named by their place: `r{row}_{w}` (array),
//! `w{stage}_{col}_{k}` (Wallace), `d{stage}_{col}_{k}` (Dadda), `f{col}` (ripple final adder),
//! `fp{col}`, `fg{col}`, `fs{col}` and prefix `f` (other final adders).

use super::super::arith::{add3, carries};
use super::super::emit::{Net, Op};
use super::super::Style;
use super::partial::Rows;
use super::Ctx;

/// A full or half adder cell (or the bit itself), with the swapped-carry bug.
fn cell(x: &mut Ctx<'_>, bits: &[Net], name: &str) -> (Net, Option<Net>) {
    let (s, co) = add3(x.c, bits, name);
    match co {
        Some(co) if x.plant.next_cell() => {
            x.plant.note(format!(
                "swapped carry: cell {name} sends its carry to its own column and its sum to the next"
            ));
            (co, Some(s))
        }
        _ => (s, co),
    }
}

/// Array: the rows added one after the other into a running sum, each by a ripple-carry adder
/// from the row's lowest weight up.
pub(super) fn array(x: &mut Ctx<'_>, rows: &Rows, w: usize) -> Vec<Option<Net>> {
    let mut acc: Vec<Option<Net>> = vec![None; w];
    let mut queue: std::collections::VecDeque<Vec<(usize, Net)>> = rows.iter().cloned().collect();
    let mut i = 0;
    while let Some(row) = queue.pop_front() {
        let mut add: Vec<Option<Net>> = vec![None; w];
        let mut lo = w;
        let mut overflow = Vec::new();
        for (k, net) in row {
            if k >= w {
                continue;
            }
            if add[k].is_some() {
                // A second bit of one weight in a row (a Booth row's +1): the next row.
                overflow.push((k, net));
                continue;
            }
            lo = lo.min(k);
            add[k] = Some(net);
        }
        if !overflow.is_empty() {
            queue.push_front(overflow);
        }
        let mut carry = None;
        for k in lo..w {
            if add[k].is_none() && carry.is_none() {
                continue;
            }
            let ins: Vec<Net> = [acc[k], add[k], carry].into_iter().flatten().collect();
            let (s, co) = cell(x, &ins, &format!("r{i}_{k}"));
            acc[k] = Some(s);
            carry = co;
        }
        i += 1;
    }
    acc
}

/// Columns of the rows' bits by weight (below `w`).
fn columns(rows: &Rows, w: usize) -> Vec<Vec<Net>> {
    let mut cols: Vec<Vec<Net>> = vec![Vec::new(); w];
    for row in rows {
        for &(k, net) in row {
            if k < w {
                cols[k].push(net);
            }
        }
    }
    cols
}

/// Wallace or Dadda tree on the rows, then the final adder of style `fin`. Returns the sum bits
/// and the number of tree stages.
pub(super) fn tree(
    x: &mut Ctx<'_>,
    rows: &Rows,
    w: usize,
    dadda: bool,
    fin: Style,
) -> (Vec<Option<Net>>, usize) {
    let mut cols = columns(rows, w);
    let stages = if dadda {
        dadda_stages(x, &mut cols)
    } else {
        wallace_stages(x, &mut cols)
    };
    (final_adder(x, &cols, fin), stages)
}

/// Wallace: each stage puts every column's bits through full adders in threes and a half
/// adder for a remaining pair, until no column has more than two bits.
fn wallace_stages(x: &mut Ctx<'_>, cols: &mut Vec<Vec<Net>>) -> usize {
    let mut stage = 0;
    while cols.iter().any(|col| col.len() > 2) {
        let mut next: Vec<Vec<Net>> = vec![Vec::new(); cols.len() + 1];
        for (w, col) in cols.iter().enumerate() {
            let mut rest: &[Net] = col;
            let mut k = 0;
            while rest.len() >= 2 {
                let take = rest.len().min(3);
                let (s, co) = cell(x, &rest[..take], &format!("w{stage}_{w}_{k}"));
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

/// Dadda's stage heights 2, 3, 4, 6, 9, ... (d_{j+1} = floor(3 d_j / 2), common practice),
/// those below `max`, increasing.
pub fn dadda_heights(max: usize) -> Vec<usize> {
    let mut heights = vec![2usize];
    while *heights.last().expect("non-empty") < max {
        let d = *heights.last().expect("non-empty");
        heights.push(d * 3 / 2);
    }
    heights.pop();
    heights
}

/// Dadda: each stage reduces every column to the next lower height with as few adders as
/// possible.
fn dadda_stages(x: &mut Ctx<'_>, cols: &mut [Vec<Net>]) -> usize {
    let max = cols.iter().map(|col| col.len()).max().unwrap_or(0);
    let heights = dadda_heights(max);
    let mut stage = 0;
    for &target in heights.iter().rev() {
        for w in 0..cols.len() {
            let mut k = 0;
            while cols[w].len() > target {
                let take = if cols[w].len() == target + 1 { 2 } else { 3 };
                let ins: Vec<Net> = cols[w].drain(..take).collect();
                let (s, co) = cell(x, &ins, &format!("d{stage}_{w}_{k}"));
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

/// The final adder of the two rows left in `cols` (at most two bits per column).
fn final_adder(x: &mut Ctx<'_>, cols: &[Vec<Net>], fin: Style) -> Vec<Option<Net>> {
    if matches!(fin, Style::Ripple | Style::Spec) {
        let mut carry = None;
        return (0..cols.len())
            .map(|w| {
                let ins: Vec<Net> = cols[w].iter().copied().chain(carry).collect();
                if ins.is_empty() {
                    carry = None;
                    return None;
                }
                let (s, co) = cell(x, &ins, &format!("f{w}"));
                carry = co;
                Some(s)
            })
            .collect();
    }
    let (zero, c) = (x.zero, &mut *x.c);
    let mut p = Vec::with_capacity(cols.len());
    let mut g = Vec::with_capacity(cols.len());
    for (w, col) in cols.iter().enumerate() {
        let (u, v) = (
            col.first().copied().unwrap_or(zero),
            col.get(1).copied().unwrap_or(zero),
        );
        p.push(c.gate(Op::Xor, vec![u, v], format!("fp{w}")));
        g.push(c.gate(Op::And, vec![u, v], format!("fg{w}")));
    }
    let mut notes = Vec::new();
    let cy = carries(c, &g, &p, fin, "f", &mut notes);
    (0..cols.len())
        .map(|w| {
            Some(match cy[w] {
                None => p[w],
                Some(ci) => c.gate(Op::Xor, vec![p[w], ci], format!("fs{w}")),
            })
        })
        .collect()
}
