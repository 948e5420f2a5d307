//! The pairing of two designs written compactly: consecutive paired bits of one bus on each
//! side become one run (`a[7:0] <-> b[0:7]`), for reports of a pairing that is not by name.

use crate::design::Design;
use crate::engine::pairing::{Shared, SharedInput};
use serde::Serialize;

/// A run of paired bits: the reference's bits and the candidate's, in pairing order.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct PairedRun {
    /// `input` or `output`.
    pub kind: &'static str,
    /// The reference's bits (`a[7:0]`: the first paired bit is written last).
    pub reference: String,
    /// The candidate's bits, written the same way, so position k pairs with position k.
    pub candidate: String,
}

/// An output pair's label: one name when both sides call it the same, else
/// `reference <-> candidate` (`<->` reads "paired with"; `~` only ever means inverted).
pub fn pair_label(reference: &str, candidate: &str) -> String {
    if reference == candidate {
        reference.to_string()
    } else {
        format!("{reference} <-> {candidate}")
    }
}

/// One bit: its port and index.
pub type Bit<'a> = (&'a str, Option<i64>);

/// The paired input and output bits of `shared` as runs, inputs first.
pub fn paired_runs(shared: &Shared, r: &Design, c: &Design) -> Vec<PairedRun> {
    let inputs: Vec<(Bit, Bit)> = shared
        .inputs
        .iter()
        .filter_map(|s| match *s {
            SharedInput::Both {
                reference,
                candidate,
            } => {
                let (a, b) = (&r.inputs[reference], &c.inputs[candidate]);
                Some(((a.port.as_str(), a.index), (b.port.as_str(), b.index)))
            }
            _ => None,
        })
        .collect();
    let outputs: Vec<(Bit, Bit)> = shared
        .pairs
        .iter()
        .map(|&(ri, ci)| {
            let (a, b) = (&r.outputs[ri], &c.outputs[ci]);
            ((a.port.as_str(), a.index), (b.port.as_str(), b.index))
        })
        .collect();
    let mut out = runs("input", &inputs);
    out.extend(runs("output", &outputs));
    out
}

/// Group consecutive pairs whose bits step through one bus on each side by a fixed direction.
pub fn runs(kind: &'static str, bits: &[(Bit, Bit)]) -> Vec<PairedRun> {
    let mut out = Vec::new();
    let mut i = 0;
    while i < bits.len() {
        let ((rp, ri), (cp, ci)) = bits[i];
        let mut j = i + 1;
        if let (Some(r0), Some(c0)) = (ri, ci) {
            let mut step: Option<(i64, i64)> = None;
            while j < bits.len() {
                let ((rp2, ri2), (cp2, ci2)) = bits[j];
                let (Some(r2), Some(c2)) = (ri2, ci2) else {
                    break;
                };
                if rp2 != rp || cp2 != cp {
                    break;
                }
                let k = (j - i) as i64;
                let s = step.unwrap_or((r2 - r0, c2 - c0));
                if s.0.abs() != 1 || s.1.abs() != 1 || r2 != r0 + s.0 * k || c2 != c0 + s.1 * k {
                    break;
                }
                step = Some(s);
                j += 1;
            }
        }
        let last = bits[j - 1];
        out.push(PairedRun {
            kind,
            reference: span(rp, ri, last.0 .1),
            candidate: span(cp, ci, last.1 .1),
        });
        i = j;
    }
    out
}

/// `port`, `port[i]` or `port[last:first]`.
fn span(port: &str, first: Option<i64>, last: Option<i64>) -> String {
    match (first, last) {
        (Some(f), Some(l)) if f != l => format!("{port}[{l}:{f}]"),
        (Some(f), _) => format!("{port}[{f}]"),
        _ => port.to_string(),
    }
}

/// The runs as text lines, `  inputs   a[7:0] <-> b[0:7], c <-> d` (wrapped at 100 columns).
pub fn runs_text(runs: &[PairedRun]) -> String {
    let mut s = String::new();
    for (kind, label) in [("input", "inputs "), ("output", "outputs")] {
        let items: Vec<String> = runs
            .iter()
            .filter(|r| r.kind == kind)
            .map(|r| format!("{} <-> {}", r.reference, r.candidate))
            .collect();
        if items.is_empty() {
            continue;
        }
        let mut line = format!("  {label}  ");
        let indent = " ".repeat(line.len());
        let mut first = true;
        for it in items {
            if !first && line.len() + it.len() + 2 > 100 {
                s += line.trim_end_matches(' ');
                s.push('\n');
                line = indent.clone();
            } else if !first {
                line += ", ";
            }
            line += &it;
            first = false;
        }
        s += &line;
        s.push('\n');
    }
    s
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn runs_follow_each_bus_in_its_direction() {
        let bits: Vec<(Bit, Bit)> = (0..4)
            .map(|k| (("a", Some(k)), ("b", Some(3 - k))))
            .chain([(("s", None), ("t", None))])
            .chain((0..2).map(|k| (("a", Some(4 + k)), ("c", Some(k)))))
            .collect();
        let r = runs("input", &bits);
        let pairs: Vec<(String, String)> = r
            .iter()
            .map(|x| (x.reference.clone(), x.candidate.clone()))
            .collect();
        assert_eq!(
            pairs,
            vec![
                ("a[3:0]".to_string(), "b[0:3]".to_string()),
                ("s".to_string(), "t".to_string()),
                ("a[5:4]".to_string(), "c[1:0]".to_string()),
            ]
        );
        assert_eq!(
            runs_text(&r),
            "  inputs   a[3:0] <-> b[0:3], s <-> t, a[5:4] <-> c[1:0]\n"
        );
    }
}
