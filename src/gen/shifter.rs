//! Barrel shifters (logical left shift, zeros shifted in): the spec `a << s`, a log shifter of
//! 2:1 cells, and a decoder-driven AND-OR.

use super::decoder::flat_lines;
use super::emit::{Circuit, Net, Op};
use super::{clog2, Style};

/// Shifter: inputs `a[n-1:0]`, `s[K-1:0]` (K = ceil(log2 n)), output `y[n-1:0]` = `a << s`.
pub(super) fn build(c: &mut Circuit, n: usize, style: Style) -> Vec<String> {
    let k = clog2(n);
    let a = c.input("a", n);
    let s = c.input("s", k);
    let mut notes = vec![format!(
        "{n}-bit barrel shifter: a[{}:0], s[{}:0] in; y[{}:0] = a << s, zeros shifted in{}",
        n - 1,
        k - 1,
        n - 1,
        if n < 1 << k {
            " (y = 0 for s >= n)"
        } else {
            ""
        }
    )];
    let y = match style {
        Style::Spec | Style::Log => {
            notes.push(if style == Style::Spec {
                "style spec: `y = a << s`; in bench written as the log shifter".to_string()
            } else {
                format!(
                    "style log: {k} levels of 2:1 cells, level j shifts by 2^j when s[j] is set"
                )
            });
            let mut x = a.clone();
            for (j, &sj) in s.iter().enumerate() {
                let d = 1usize << j;
                let inv = c.gate(Op::Not, vec![sj], format!("sn{j}"));
                x = (0..n)
                    .map(|i| {
                        if i >= d {
                            c.mux(sj, x[i - d], x[i], format!("l{j}_{i}"))
                        } else {
                            c.gate(Op::And, vec![inv, x[i]], format!("z{j}_{i}"))
                        }
                    })
                    .collect();
            }
            x
        }
        Style::Decoder => {
            notes.push(format!(
                "style decoder: {n} decoder lines of s, y[i] = OR over j <= i of (line j AND a[i-j])"
            ));
            let lines = flat_lines(c, &s, n, "dec", "sn");
            (0..n)
                .map(|i| {
                    let terms: Vec<Net> = (0..=i)
                        .map(|j| c.gate(Op::And, vec![lines[j], a[i - j]], format!("t{i}_{j}")))
                        .collect();
                    c.tree(Op::Or, &terms, 4, &format!("o{i}"), &format!("y_{i}"))
                })
                .collect()
        }
        other => unreachable!("shifter style {other:?} passed validation"),
    };
    c.output("y", &y);
    if style == Style::Spec {
        c.behaviour = vec!["assign y = a << s;".to_string()];
    }
    notes
}
