//! Decoders (k to 2^k, flat or predecoded) and priority encoders (chain or tree), plus the
//! decoder-line builders the selector and shifter generators share.

use super::emit::{Circuit, Net, Op};
use super::{clog2, Style};

/// Decoder lines 0..count of the select bits `sel` (bit 0 first): line i is the AND of one
/// literal per select bit, over shared inverters `{inv}{j}`; lines are named `{prefix}{i}`.
/// With one select bit the lines are the inverter and the bit itself.
pub(super) fn flat_lines(
    c: &mut Circuit,
    sel: &[Net],
    count: usize,
    prefix: &str,
    inv: &str,
) -> Vec<Net> {
    let neg: Vec<Net> = sel
        .iter()
        .enumerate()
        .map(|(j, &sj)| c.gate(Op::Not, vec![sj], format!("{prefix}_{inv}{j}")))
        .collect();
    (0..count)
        .map(|i| {
            let lits: Vec<Net> = (0..sel.len())
                .map(|j| if (i >> j) & 1 == 1 { sel[j] } else { neg[j] })
                .collect();
            if lits.len() == 1 {
                lits[0]
            } else {
                c.gate(Op::And, lits, format!("{prefix}{i}"))
            }
        })
        .collect()
}

/// Decoder lines 0..count of `sel` built by predecoding: split the select bits in a low and a
/// high half, decode each half (recursively, depth log2 of the select width), and AND one line
/// of each. Top-level lines are named `{prefix}{i}`, inner ones `{prefix}_{lo}to{hi}_{i}`.
pub(super) fn predecode(c: &mut Circuit, sel: &[Net], count: usize, prefix: &str) -> Vec<Net> {
    predecode_part(c, sel, 0, count, prefix, true)
}

fn predecode_part(
    c: &mut Circuit,
    sel: &[Net],
    lo: usize,
    count: usize,
    prefix: &str,
    top: bool,
) -> Vec<Net> {
    let k = sel.len();
    let name = |i: usize| {
        if top {
            format!("{prefix}{i}")
        } else {
            format!("{prefix}_{lo}to{}_{i}", lo + k - 1)
        }
    };
    if k == 1 {
        let mut v = vec![c.gate(Op::Not, vec![sel[0]], name(0))];
        if count > 1 {
            v.push(sel[0]);
        }
        return v;
    }
    let kl = k / 2;
    let low = predecode_part(c, &sel[..kl], lo, count.min(1 << kl), prefix, false);
    let high = predecode_part(
        c,
        &sel[kl..],
        lo + kl,
        count.div_ceil(1 << kl),
        prefix,
        false,
    );
    (0..count)
        .map(|i| {
            let (l, h) = (low[i & ((1 << kl) - 1)], high[i >> kl]);
            c.gate(Op::And, vec![l, h], name(i))
        })
        .collect()
}

/// k-to-2^k decoder: input `a[k-1:0]`, output `y[2^k-1:0]` with `y[i]` = (a == i).
pub(super) fn build_decoder(c: &mut Circuit, k: usize, style: Style) -> Vec<String> {
    let a = c.input("a", k);
    let n = 1usize << k;
    let mut notes = vec![format!(
        "{k}-to-{n} decoder: a[{}:0] in, y[{}:0] out, y[i] = (a == i)",
        k - 1,
        n - 1
    )];
    let y = match style {
        Style::Spec | Style::Flat => {
            notes.push(if style == Style::Spec {
                "style spec: `y = 1 << a`; in bench written as the flat decoder".to_string()
            } else {
                format!("style flat: one {k}-input AND per output over shared inverters")
            });
            flat_lines(c, &a, n, "dec", "an")
        }
        Style::Predecode => {
            notes.push(
                "style predecode: decode the low and high halves of a, AND one line of each \
                 (recursively)"
                    .to_string(),
            );
            predecode(c, &a, n, "dec")
        }
        other => unreachable!("decoder style {other:?} passed validation"),
    };
    c.output("y", &y);
    if style == Style::Spec {
        c.behaviour = vec!["assign y = 1 << a;".to_string()];
    }
    notes
}

/// Priority encoder: input `r[N-1:0]`, outputs `y[K-1:0]` (index of the highest set request,
/// 0 when none) and `v` (some request set).
pub(super) fn build_priority(c: &mut Circuit, n: usize, style: Style) -> Vec<String> {
    let k = clog2(n);
    let r = c.input("r", n);
    let mut notes = vec![format!(
        "{n}-request priority encoder: r[{}:0] in; y[{}:0] = highest i with r[i] (0 if none), \
         v = some r[i]",
        n - 1,
        k - 1
    )];
    let (y, v) = match style {
        Style::Spec | Style::Chain => {
            notes.push(if style == Style::Spec {
                "style spec: a chain of ?: from r[N-1] down; in bench written as the chain style"
                    .to_string()
            } else {
                "style chain: up{i} = some request above i (an OR chain from the top), grant \
                 g{i} = r[i] and not up{i}, y[b] = OR of grants with bit b of i set"
                    .to_string()
            });
            chain(c, &r, k)
        }
        Style::Tree => {
            notes.push(
                "style tree: (valid, index) pairs of aligned blocks merged level by level; the \
                 upper block wins through 2:1 cells"
                    .to_string(),
            );
            tree(c, &r, k)
        }
        other => unreachable!("priority style {other:?} passed validation"),
    };
    c.output("y", &y);
    c.output_scalar("v", v);
    if style == Style::Spec {
        let mut e = String::new();
        for i in (1..n).rev() {
            e += &format!("r[{i}] ? {k}'d{i} : ");
        }
        e += &format!("{k}'d0");
        c.behaviour = vec!["assign v = |r;".to_string(), format!("assign y = {e};")];
    }
    notes
}

fn chain(c: &mut Circuit, r: &[Net], k: usize) -> (Vec<Net>, Net) {
    let n = r.len();
    // up[i]: some request above i, for i in 0..n-1.
    let mut up = vec![r[n - 1]; n - 1];
    for i in (0..n.saturating_sub(2)).rev() {
        up[i] = c.gate(Op::Or, vec![r[i + 1], up[i + 1]], format!("up{i}"));
    }
    let mut grant = vec![r[n - 1]; n];
    for i in 1..n - 1 {
        let nu = c.gate(Op::Not, vec![up[i]], format!("nup{i}"));
        grant[i] = c.gate(Op::And, vec![r[i], nu], format!("g{i}"));
    }
    let y = (0..k)
        .map(|b| {
            let terms: Vec<Net> = (1..n)
                .filter(|i| (i >> b) & 1 == 1)
                .map(|i| grant[i])
                .collect();
            c.tree(Op::Or, &terms, 4, &format!("yo{b}"), &format!("y_{b}"))
        })
        .collect();
    let v = c.gate(Op::Or, vec![r[0], up[0]], "any");
    (y, v)
}

fn tree(c: &mut Circuit, r: &[Net], k: usize) -> (Vec<Net>, Net) {
    // Each block: (valid, index bits; None = constant 0).
    let mut layer: Vec<(Net, Vec<Option<Net>>)> = r.iter().map(|&x| (x, Vec::new())).collect();
    for j in 0..k {
        let mut next = Vec::with_capacity(layer.len().div_ceil(2));
        for m in 0..layer.len().div_ceil(2) {
            let (vl, yl) = layer[2 * m].clone();
            if 2 * m + 1 >= layer.len() {
                let mut y = yl;
                y.push(None);
                next.push((vl, y));
                continue;
            }
            let (vh, yh) = layer[2 * m + 1].clone();
            let v = c.gate(Op::Or, vec![vl, vh], format!("v{}_{m}", j + 1));
            let mut y = Vec::with_capacity(j + 1);
            let mut vh_n = None;
            for b in 0..j {
                let name = format!("i{}_{m}_{b}", j + 1);
                y.push(match (yh[b], yl[b]) {
                    (Some(h), Some(l)) => Some(c.mux(vh, h, l, name)),
                    (Some(h), None) => Some(c.gate(Op::And, vec![vh, h], name)),
                    (None, Some(l)) => {
                        let nv = *vh_n.get_or_insert_with(|| {
                            c.gate(Op::Not, vec![vh], format!("nv{}_{m}", j + 1))
                        });
                        Some(c.gate(Op::And, vec![nv, l], name))
                    }
                    (None, None) => None,
                });
            }
            y.push(Some(vh));
            next.push((v, y));
        }
        layer = next;
    }
    let (v, y) = layer.pop().expect("one block at the top");
    let y = y
        .into_iter()
        .enumerate()
        .map(|(b, bit)| bit.unwrap_or_else(|| c.gate(Op::Const0, vec![], format!("zero{b}"))))
        .collect();
    (y, v)
}
