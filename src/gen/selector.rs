//! N:1 selectors of W-bit channels (any N >= 2): the one-line spec, decoder-driven AND-OR,
//! tree of 2:1 cells, one-hot AND-OR with a separate predecoded decoder, and mixed styles.
//!
//! Net names: `sn{j}` inverted select bits, `dec{i}`/`hot{i}` decoder lines, `a{i}`/`t{i}`
//! AND terms, `m{level}_{node}` 2:1 cells, `o_...` OR trees; a `_{b}` suffix names the bit of
//! the channel when W > 1.

use super::decoder::{flat_lines, predecode};
use super::emit::{Care, Circuit, Net, Op};
use super::{clog2, Style};
use crate::rng::SplitMix64 as Rng;

/// Build the selector; returns the header notes (the first is the one-line description).
pub(super) fn build(
    c: &mut Circuit,
    n: usize,
    w: usize,
    style: Style,
    rng: &mut Rng,
) -> Vec<String> {
    let k = clog2(n);
    let d = c.input("d", n * w);
    let s = c.input("s", k);
    let layout = if w == 1 {
        "channel i is d[i]".to_string()
    } else {
        format!("channel i is d[i*{w} +: {w}]")
    };
    let mut notes = vec![format!(
        "{n}:1 selector of {w}-bit channels: d[{}:0] in ({layout}), s[{}:0] selects, y[{}:0] = \
         channel s",
        n * w - 1,
        k - 1,
        w - 1
    )];
    if n < 1 << k {
        c.care = Some(Care {
            port: 1,
            limit: n as u64,
        });
        notes.push(format!(
            "select values {n}..{} are out of range: the spec reads x there, gate-level styles \
             give what their structure gives",
            (1usize << k) - 1
        ));
    }
    let chan = |i: usize, b: usize| d[i * w + b];
    let bs = |b: usize| {
        if w == 1 {
            String::new()
        } else {
            format!("_{b}")
        }
    };
    let y: Vec<Net> = match style {
        Style::Spec | Style::Decoder => {
            notes.push(if style == Style::Spec {
                "style spec: the one-line selection; in bench written as the decoder AND-OR \
                 (0 out of range)"
                    .to_string()
            } else {
                format!(
                    "style decoder: {n} decoder lines of {k}-input ANDs drive an AND-OR per bit \
                     (OR trees of fan-in 4)"
                )
            });
            let lines = flat_lines(c, &s, n, "dec", "sn");
            (0..w)
                .map(|b| {
                    let terms: Vec<Net> = (0..n)
                        .map(|i| {
                            c.gate(
                                Op::And,
                                vec![lines[i], chan(i, b)],
                                format!("a{i}{}", bs(b)),
                            )
                        })
                        .collect();
                    c.tree(Op::Or, &terms, 4, &format!("o{}", bs(b)), &format!("y_{b}"))
                })
                .collect()
        }
        Style::Tree => {
            notes.push(format!(
                "style tree: per bit a tree of 2:1 cells on s[0] first, {} cells in depth {k}",
                n - 1
            ));
            (0..w)
                .map(|b| {
                    let items: Vec<Net> = (0..n).map(|i| chan(i, b)).collect();
                    mux_tree(c, items, &s, 0, 0, &bs(b))
                })
                .collect()
        }
        Style::Onehot => {
            notes.push(
                "style onehot: a separate predecoded one-hot decoder (hot{i}), then per bit an \
                 AND-OR with 2-input OR trees"
                    .to_string(),
            );
            let hot = predecode(c, &s, n, "hot");
            (0..w)
                .map(|b| {
                    let terms: Vec<Net> = (0..n)
                        .map(|i| {
                            c.gate(Op::And, vec![hot[i], chan(i, b)], format!("t{i}{}", bs(b)))
                        })
                        .collect();
                    c.tree(Op::Or, &terms, 2, &format!("o{}", bs(b)), &format!("y_{b}"))
                })
                .collect()
        }
        Style::Mixed => mixed(c, &d, &s, n, w, rng, &mut notes),
        other => unreachable!("selector style {other:?} passed validation"),
    };
    c.output("y", &y);
    if style == Style::Spec {
        c.behaviour = vec![if w == 1 {
            "assign y = d[s];".to_string()
        } else {
            format!("assign y = d[s*{w} +: {w}];")
        }];
    }
    notes
}

/// A tree of 2:1 cells over `items` (first item at select value 0) on `sel`, s[0] first.
/// Cells are named `m{level}_{node}{suffix}` with level `level0 + j` and node `(base >> (j+1)) + m`
/// so that trees over different groups get different names.
fn mux_tree(
    c: &mut Circuit,
    items: Vec<Net>,
    sel: &[Net],
    level0: usize,
    base: usize,
    suffix: &str,
) -> Net {
    let mut layer = items;
    for (j, &sj) in sel.iter().enumerate() {
        if layer.len() == 1 {
            break;
        }
        let mut next = Vec::with_capacity(layer.len().div_ceil(2));
        for m in 0..layer.len().div_ceil(2) {
            if 2 * m + 1 < layer.len() {
                let name = format!("m{}_{}{suffix}", level0 + j, (base >> (j + 1)) + m);
                next.push(c.mux(sj, layer[2 * m + 1], layer[2 * m], name));
            } else {
                next.push(layer[2 * m]);
            }
        }
        layer = next;
    }
    layer[0]
}

/// Mixed style: split the select bits at a seed-chosen point; a 2:1 tree on one part and a
/// decoder AND-OR on the other, in a seed-chosen order.
fn mixed(
    c: &mut Circuit,
    d: &[Net],
    s: &[Net],
    n: usize,
    w: usize,
    rng: &mut Rng,
    notes: &mut Vec<String>,
) -> Vec<Net> {
    let k = s.len();
    let bs = |b: usize| {
        if w == 1 {
            String::new()
        } else {
            format!("_{b}")
        }
    };
    if k == 1 {
        notes
            .push("style mixed: with one select bit this is a single 2:1 cell per bit".to_string());
        return (0..w)
            .map(|b| mux_tree(c, vec![d[b], d[w + b]], s, 0, 0, &bs(b)))
            .collect();
    }
    let m = 1 + rng.below(k - 1);
    let g = 1usize << m;
    let groups = n.div_ceil(g);
    if rng.below(2) == 0 {
        notes.push(format!(
            "style mixed: 2:1 cell trees on s[{}:0] inside groups of {g} channels, then a \
             decoder AND-OR on s[{}:{m}] over the {groups} groups",
            m - 1,
            k - 1
        ));
        let lines = flat_lines(c, &s[m..], groups, "gdec", "sn");
        (0..w)
            .map(|b| {
                let terms: Vec<Net> = (0..groups)
                    .map(|gi| {
                        let items: Vec<Net> = (gi * g..n.min((gi + 1) * g))
                            .map(|i| d[i * w + b])
                            .collect();
                        let r = mux_tree(c, items, &s[..m], 0, gi * g, &bs(b));
                        c.gate(Op::And, vec![lines[gi], r], format!("a{gi}{}", bs(b)))
                    })
                    .collect();
                c.tree(Op::Or, &terms, 4, &format!("o{}", bs(b)), &format!("y_{b}"))
            })
            .collect()
    } else {
        notes.push(format!(
            "style mixed: a decoder AND-OR on s[{}:0] inside groups of {g} channels, then a tree \
             of 2:1 cells on s[{}:{m}] over the {groups} groups",
            m - 1,
            k - 1
        ));
        let lines = flat_lines(c, &s[..m], g.min(n), "ldec", "sn");
        (0..w)
            .map(|b| {
                let results: Vec<Net> = (0..groups)
                    .map(|gi| {
                        let terms: Vec<Net> = (gi * g..n.min((gi + 1) * g))
                            .map(|i| {
                                c.gate(
                                    Op::And,
                                    vec![lines[i - gi * g], d[i * w + b]],
                                    format!("a{i}{}", bs(b)),
                                )
                            })
                            .collect();
                        c.tree(
                            Op::Or,
                            &terms,
                            4,
                            &format!("o{gi}{}", bs(b)),
                            &format!("q{gi}{}", bs(b)),
                        )
                    })
                    .collect();
                mux_tree(c, results, &s[m..], m, 0, &bs(b))
            })
            .collect()
    }
}
