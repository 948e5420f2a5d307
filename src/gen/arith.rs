//! Adders of two n-bit numbers (`y[n:0]` = a + b, no carry-in): the spec `a + b`, ripple carry,
//! hierarchical carry lookahead in groups of 4, and the Kogge-Stone and Brent-Kung parallel
//! prefix networks; plus the full and half adder cells the multipliers share.
//!
//! Bit i has propagate `p{i}` = a[i] ^ b[i] and generate `g{i}` = a[i] & b[i]; the sum bit is
//! `p{i} ^ carry{i}` and the carry out of bits [i:0] is the group generate G[i:0], with
//! (G, P)[hi] o (G, P)[lo] = (G_hi | P_hi & G_lo, P_hi & P_lo) (common practice).

use super::emit::{Circuit, Net, Op};
use super::Style;

/// Sum and carry of up to three bits of equal weight: a full adder for three (nets
/// `{name}_p`, `_s`, `_g`, `_t`, `_c`), a half adder for two (`{name}_s`, `_c`), the bit itself
/// for one.
pub(super) fn add3(c: &mut Circuit, bits: &[Net], name: &str) -> (Net, Option<Net>) {
    match *bits {
        [x] => (x, None),
        [x, y] => {
            let s = c.gate(Op::Xor, vec![x, y], format!("{name}_s"));
            let co = c.gate(Op::And, vec![x, y], format!("{name}_c"));
            (s, Some(co))
        }
        [x, y, z] => {
            let p = c.gate(Op::Xor, vec![x, y], format!("{name}_p"));
            let s = c.gate(Op::Xor, vec![p, z], format!("{name}_s"));
            let g = c.gate(Op::And, vec![x, y], format!("{name}_g"));
            let t = c.gate(Op::And, vec![p, z], format!("{name}_t"));
            let co = c.gate(Op::Or, vec![g, t], format!("{name}_c"));
            (s, Some(co))
        }
        _ => unreachable!("add3 takes one to three bits"),
    }
}

/// Adder: inputs `a[n-1:0]`, `b[n-1:0]`, output `y[n:0]` = a + b.
pub(super) fn build(c: &mut Circuit, n: usize, style: Style) -> Vec<String> {
    let a = c.input("a", n);
    let b = c.input("b", n);
    let mut notes = vec![format!(
        "{n}-bit adder: a[{}:0], b[{}:0] in; y[{n}:0] = a + b",
        n - 1,
        n - 1
    )];
    let p: Vec<Net> = (0..n)
        .map(|i| c.gate(Op::Xor, vec![a[i], b[i]], format!("p{i}")))
        .collect();
    let g: Vec<Net> = (0..n)
        .map(|i| c.gate(Op::And, vec![a[i], b[i]], format!("g{i}")))
        .collect();
    // carry[i]: carry into bit i (carry[0] = 0), carry[n]: carry out.
    let carry = carries(c, &g, &p, style, "", &mut notes);
    let mut y: Vec<Net> = (0..n)
        .map(|i| match carry[i] {
            None => p[i],
            Some(ci) => c.gate(Op::Xor, vec![p[i], ci], format!("s{i}")),
        })
        .collect();
    y.push(carry[n].expect("carry out exists"));
    c.output("y", &y);
    if style == Style::Spec {
        c.behaviour = vec!["assign y = a + b;".to_string()];
    }
    notes
}

/// Carries of the sum of two words with generate `g[i]` and propagate `p[i]` in adder style
/// `style` (ripple for the spec style): carry[i] into bit i (carry[0] = None, no carry-in),
/// carry[n] out. Net names start with `pre`.
pub(super) fn carries(
    c: &mut Circuit,
    g: &[Net],
    p: &[Net],
    style: Style,
    pre: &str,
    notes: &mut Vec<String>,
) -> Vec<Option<Net>> {
    let n = g.len();
    match style {
        Style::Spec | Style::Ripple => {
            notes.push(if style == Style::Spec {
                "style spec: `y = a + b`; in bench written as the ripple-carry adder".to_string()
            } else {
                "style ripple: c{i+1} = g{i} | p{i} & c{i}, one bit after the other".to_string()
            });
            let mut cy = vec![None, Some(g[0])];
            for i in 1..n {
                let ci = cy[i].expect("carry into bit i >= 1 exists");
                let t = c.gate(Op::And, vec![p[i], ci], format!("{pre}t{i}"));
                cy.push(Some(c.gate(
                    Op::Or,
                    vec![g[i], t],
                    format!("{pre}c{}", i + 1),
                )));
            }
            cy
        }
        Style::Cla => {
            notes.push(
                "style cla: carry lookahead: group generate/propagate G{L}_{q}, P{L}_{q} over 4 \
                 groups of level L-1, carries c{L}_{q} computed top-down from the group values"
                    .to_string(),
            );
            cla(c, g, p, pre)
        }
        Style::KoggeStone | Style::BrentKung => {
            let mut nodes: Vec<(Net, Net)> = g.iter().copied().zip(p.iter().copied()).collect();
            if style == Style::KoggeStone {
                notes.push(
                    "style kogge-stone: prefix levels L = 0, 1, ...: node i o= node i-2^L for \
                     every i >= 2^L"
                        .to_string(),
                );
                let mut d = 1;
                let mut level = 0;
                while d < n {
                    let prev = nodes.clone();
                    for i in d..n {
                        nodes[i] = combine(c, prev[i], prev[i - d], level, i, pre);
                    }
                    d *= 2;
                    level += 1;
                }
            } else {
                notes.push(
                    "style brent-kung: prefix up-sweep on nodes i = 2d-1 mod 2d, then a down-sweep \
                     on i = 3d-1, 5d-1, ..."
                        .to_string(),
                );
                let mut d = 1;
                let mut level = 0;
                while d < n {
                    for i in (2 * d - 1..n).step_by(2 * d) {
                        nodes[i] = combine(c, nodes[i], nodes[i - d], level, i, pre);
                    }
                    d *= 2;
                    level += 1;
                }
                while d > 1 {
                    d /= 2;
                    for i in (3 * d - 1..n).step_by(2 * d) {
                        nodes[i] = combine(c, nodes[i], nodes[i - d], level, i, pre);
                    }
                    level += 1;
                }
            }
            std::iter::once(None)
                .chain(nodes.iter().map(|&(gg, _)| Some(gg)))
                .collect()
        }
        other => unreachable!("adder style {other:?} passed validation"),
    }
}

/// (G, P) of `hi` o `lo`, nets `G{level}_{i}`, `P{level}_{i}`, `u{level}_{i}`.
fn combine(
    c: &mut Circuit,
    hi: (Net, Net),
    lo: (Net, Net),
    level: usize,
    i: usize,
    pre: &str,
) -> (Net, Net) {
    let u = c.gate(Op::And, vec![hi.1, lo.0], format!("{pre}u{level}_{i}"));
    let gg = c.gate(Op::Or, vec![hi.0, u], format!("{pre}G{level}_{i}"));
    let pp = c.gate(Op::And, vec![hi.1, lo.1], format!("{pre}P{level}_{i}"));
    (gg, pp)
}

/// Hierarchical carry lookahead over groups of 4; returns carry[0..=n].
fn cla(c: &mut Circuit, g: &[Net], p: &[Net], pre: &str) -> Vec<Option<Net>> {
    let n = g.len();
    let mut levels: Vec<Vec<(Net, Net)>> = vec![g.iter().copied().zip(p.iter().copied()).collect()];
    while levels.last().map_or(0, |l| l.len()) > 1 {
        let lv = levels.len();
        let below = levels.last().expect("a level").clone();
        let mut up = Vec::with_capacity(below.len().div_ceil(4));
        for (q, kids) in below.chunks(4).enumerate() {
            if kids.len() == 1 {
                up.push(kids[0]);
                continue;
            }
            let t = kids.len();
            // G = G_{t-1} | P_{t-1} G_{t-2} | ... | P_{t-1}..P_1 G_0
            let mut terms = vec![kids[t - 1].0];
            for j in (0..t - 1).rev() {
                let mut lits: Vec<Net> = kids[j + 1..].iter().map(|k| k.1).collect();
                lits.push(kids[j].0);
                terms.push(c.gate(Op::And, lits, format!("{pre}k{lv}_{q}_{j}")));
            }
            let gg = c.gate(Op::Or, terms, format!("{pre}G{lv}_{q}"));
            let pp = c.gate(
                Op::And,
                kids.iter().map(|k| k.1).collect(),
                format!("{pre}P{lv}_{q}"),
            );
            up.push((gg, pp));
        }
        levels.push(up);
    }
    // Carries into the nodes of each level, top-down; the top node's carry-in is 0.
    let top = levels.len() - 1;
    let mut cin: Vec<Option<Net>> = vec![None];
    for lv in (1..=top).rev() {
        let below = &levels[lv - 1];
        let mut next = vec![None; below.len()];
        for (q, &cq) in cin.iter().enumerate() {
            let first = 4 * q;
            let t = 4.min(below.len() - first);
            next[first] = cq;
            for j in 1..t {
                // c_j = G_{j-1} | P_{j-1} G_{j-2} | ... | P_{j-1}..P_0 c
                let mut terms = vec![below[first + j - 1].0];
                for m in (0..j - 1).rev() {
                    let mut lits: Vec<Net> = (m + 1..j).map(|x| below[first + x].1).collect();
                    lits.push(below[first + m].0);
                    terms.push(c.gate(
                        Op::And,
                        lits,
                        format!("{pre}ck{}_{}_{m}", lv - 1, first + j),
                    ));
                }
                if let Some(cc) = cq {
                    let mut lits: Vec<Net> = (0..j).map(|x| below[first + x].1).collect();
                    lits.push(cc);
                    terms.push(c.gate(Op::And, lits, format!("{pre}ck{}_{}_c", lv - 1, first + j)));
                }
                next[first + j] = Some(if terms.len() == 1 {
                    terms[0]
                } else {
                    c.gate(Op::Or, terms, format!("{pre}c{}_{}", lv - 1, first + j))
                });
            }
        }
        cin = next;
    }
    cin.push(Some(levels[top][0].0));
    debug_assert_eq!(cin.len(), n + 1);
    cin
}
