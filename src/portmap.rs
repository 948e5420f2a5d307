//! Port map files: which names of the reference and of the candidate stand for the same
//! thing when the names differ (renamed ports; the same file form can name register pairs).
//!
//! The format (our own): one pair per line, `REFERENCE_NAME CANDIDATE_NAME`, each a whole bus
//! (`data`) or one bit (`data[3]`); `#` starts a comment; blank lines are skipped. A bus pairs
//! with a bus of the same width bit by bit by significance (least significant with least
//! significant, whatever the declared ranges); names not listed pair by name as usual.
//! [`PortMap::bit_pairs`] expands the entries against the bits each side has, so any kind of
//! named bit can be paired the same way: ports, and in clocked checks registers (a register
//! name of the candidate written `~q` pairs with the reference's register stored inverted).

use crate::design::{Design, Format, InputKind};
use crate::diag::{Diagnostic, InputError, SourcePos};
use std::collections::{BTreeMap, BTreeSet};
use std::sync::Arc;

/// A port map resolved against two designs: reference bit name -> candidate bit name, for
/// inputs and outputs alike, with the file it came from (for reports).
#[derive(Clone, Debug, PartialEq, Eq, Default)]
pub struct BitMap {
    /// The port map file, as given.
    pub file: String,
    /// Reference bit -> candidate bit.
    pub pairs: BTreeMap<String, String>,
    /// Candidate register bits paired with their reference register stored inverted (`~q`).
    pub inverted: BTreeSet<String>,
    /// The reference register bits the map pairs (the rest of `pairs` are ports).
    pub registers: BTreeSet<String>,
}

impl BitMap {
    /// The candidate bit a reference bit pairs with: its mapped partner, else the bit of the
    /// same name unless that name is mapped to another reference bit.
    pub fn partner<'a>(&'a self, reference: &'a str) -> Option<&'a str> {
        match self.pairs.get(reference) {
            Some(c) => Some(c),
            None if self.pairs.values().any(|c| c == reference) => None,
            None => Some(reference),
        }
    }
}

/// One line of a port map.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Entry {
    /// The reference's name (bus or bit).
    pub reference: String,
    /// The candidate's name (bus or bit).
    pub candidate: String,
    /// Where the line is.
    pub pos: SourcePos,
}

/// A parsed port map file.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct PortMap {
    /// The entries, in file order.
    pub entries: Vec<Entry>,
}

/// The bits a name stands for on one side, least significant first, with a kind word
/// (`input`, `output`, ...), or `None` when that side has no such name.
pub type BitsOf<'a> = &'a dyn Fn(&str) -> Option<(Vec<String>, &'static str)>;

/// Help shown with every error about the file's form.
const FORM: &str = "a port map has one pair per line, `REFERENCE_NAME CANDIDATE_NAME` (a bus or a bit each, e.g. `data din` or `en[0] enable`); `#` starts a comment";

impl PortMap {
    /// Parse the text of a port map file named `file`; every malformed line is reported.
    pub fn parse(file: &Arc<str>, text: &str) -> Result<PortMap, InputError> {
        let mut entries = Vec::new();
        let mut errors = Vec::new();
        let mut seen: BTreeMap<(u8, String), u32> = BTreeMap::new();
        for (k, raw) in text.lines().enumerate() {
            let line = k as u32 + 1;
            let body = raw.split('#').next().unwrap_or("");
            let words: Vec<(usize, &str)> = body
                .split_whitespace()
                .map(|w| (w.as_ptr() as usize - raw.as_ptr() as usize, w))
                .collect();
            let pos = |at: usize| SourcePos::new(file, line, at as u32 + 1);
            match words.as_slice() {
                [] => {}
                [(at, r), (cat, c)] => {
                    let mut dup = false;
                    for (side, name, at) in [(0u8, r, at), (1u8, c, cat)] {
                        if let Some(first) = seen.insert((side, name.to_string()), line) {
                            errors.push(
                                Diagnostic::error(
                                    Some(pos(*at)),
                                    format!(
                                        "`{name}` of the {} is mapped twice (first on line {first})",
                                        if side == 0 { "reference" } else { "candidate" }
                                    ),
                                )
                                .with_help("map each name once"),
                            );
                            dup = true;
                        }
                    }
                    if !dup {
                        entries.push(Entry {
                            reference: r.to_string(),
                            candidate: c.to_string(),
                            pos: pos(*at),
                        });
                    }
                }
                [(at, _)] => errors.push(
                    Diagnostic::error(Some(pos(*at)), "a line of a port map needs two names")
                        .with_help(FORM),
                ),
                [_, _, (at, w), ..] => errors.push(
                    Diagnostic::error(
                        Some(pos(*at)),
                        format!("unexpected `{w}` after the two names"),
                    )
                    .with_help(FORM),
                ),
            }
        }
        if errors.is_empty() {
            Ok(PortMap { entries })
        } else {
            Err(InputError {
                diagnostics: errors,
            })
        }
    }

    /// Expand the entries against the port bits of two designs (a bus name stands for its
    /// bits from the least significant; a bit name for itself).
    /// Register names (the [`crate::design::Register`] bits and their vectors) are found too,
    /// as kind `register`.
    pub fn resolve(&self, file: &str, r: &Design, c: &Design) -> Result<BitMap, InputError> {
        let pairs = self.bit_pairs(&|n| port_bits(r, n), &|n| port_bits(c, n))?;
        let mut map = BitMap {
            file: file.to_string(),
            ..Default::default()
        };
        for (rn, cn) in pairs {
            let cn = match cn.strip_prefix('~') {
                Some(bit) => {
                    map.inverted.insert(bit.to_string());
                    bit.to_string()
                }
                None => cn,
            };
            if r.registers.iter().any(|g| g.name == rn) {
                map.registers.insert(rn.clone());
            }
            map.pairs.insert(rn, cn);
        }
        Ok(map)
    }

    /// Expand the entries into bit pairs (reference bit name -> candidate bit name).
    /// `reference_bits(name)` and `candidate_bits(name)` give the bits a name stands for on
    /// each side, least significant first (one for a bit, `None` when the side has no such
    /// name) and a kind word (`input`, `output`, `register`) that must agree on both sides. A
    /// candidate name written `~name` (registers only) gives candidate bits written `~bit`.
    pub fn bit_pairs(
        &self,
        reference_bits: BitsOf<'_>,
        candidate_bits: BitsOf<'_>,
    ) -> Result<BTreeMap<String, String>, InputError> {
        let mut out = BTreeMap::new();
        let mut errors = Vec::new();
        for e in &self.entries {
            let err = |m: String, h: &str| {
                Diagnostic::error(Some(e.pos.clone()), m).with_help(h.to_string())
            };
            let (cand, inverted) = match e.candidate.strip_prefix('~') {
                Some(n) => (n, true),
                None => (e.candidate.as_str(), false),
            };
            let (r, c) = (reference_bits(&e.reference), candidate_bits(cand));
            match (r, c) {
                (None, _) => errors.push(err(
                    format!("the reference has no port or bit `{}`", e.reference),
                    "the first name of a line is the reference's: check its spelling and side",
                )),
                (_, None) => errors.push(err(
                    format!("the candidate has no port or bit `{cand}`"),
                    "the second name of a line is the candidate's: check its spelling and side",
                )),
                (Some((rb, rk)), Some((cb, ck))) => {
                    if inverted && ck != "register" {
                        errors.push(err(
                            format!("`~{cand}`: only a register can be paired inverted, and `{cand}` is {} {ck} of the candidate", a(ck)),
                            "write `~` only before a register's name (the candidate stores that register inverted)",
                        ));
                    } else if rk != ck {
                        errors.push(err(
                            format!(
                                "`{}` is {} {rk} of the reference but `{}` {} {ck} of the candidate",
                                e.reference, a(rk), e.candidate, a(ck)
                            ),
                            "pair inputs with inputs, outputs with outputs and registers with registers",
                        ));
                    } else if rb.len() != cb.len() {
                        errors.push(err(
                            format!(
                                "`{}` has {} bit{} in the reference but `{}` {} in the candidate",
                                e.reference,
                                rb.len(),
                                if rb.len() == 1 { "" } else { "s" },
                                e.candidate,
                                cb.len()
                            ),
                            "pair names of the same width, or map single bits (`a[3] b[3]`)",
                        ));
                    } else if inverted {
                        out.extend(rb.into_iter().zip(cb.into_iter().map(|b| format!("~{b}"))));
                    } else {
                        out.extend(rb.into_iter().zip(cb));
                    }
                }
            }
        }
        if errors.is_empty() {
            Ok(out)
        } else {
            Err(InputError {
                diagnostics: errors,
            })
        }
    }
}

/// The article before a kind word.
fn a(kind: &str) -> &'static str {
    if kind.starts_with(['a', 'e', 'i', 'o', 'u']) {
        "an"
    } else {
        "a"
    }
}

/// The port bits `name` stands for in `d` (least significant first) and whether they are
/// inputs or outputs; else the register bits it names (bit j of a register vector is the one
/// with the j-th smallest index).
fn port_bits(d: &Design, name: &str) -> Option<(Vec<String>, &'static str)> {
    let inputs = d
        .inputs
        .iter()
        .filter(|b| b.kind == InputKind::Port)
        .map(|b| (b.name.as_str(), b.port.as_str(), b.index));
    let outputs = d
        .outputs
        .iter()
        .map(|o| (o.name.as_str(), o.port.as_str(), o.index));
    let find = |bits: Vec<(&str, &str, Option<i64>)>| {
        if let Some(b) = bits.iter().find(|b| b.0 == name) {
            return Some(vec![b.0.to_string()]);
        }
        let mut bus: Vec<(&str, Option<i64>)> = bits
            .iter()
            .filter(|b| b.1 == name)
            .map(|b| (b.0, b.2))
            .collect();
        // The Verilog reader lists a bus from its least significant bit; a bench bus has no
        // declared range, and bit j is the one with the j-th smallest index.
        if d.format != Format::Verilog {
            bus.sort_by_key(|b| b.1);
        }
        (!bus.is_empty()).then(|| bus.into_iter().map(|b| b.0.to_string()).collect())
    };
    if let Some(b) = find(inputs.collect()) {
        return Some((b, "input"));
    }
    if let Some(b) = find(outputs.collect()) {
        return Some((b, "output"));
    }
    if let Some(g) = d.registers.iter().find(|g| g.name == name) {
        return Some((vec![g.name.clone()], "register"));
    }
    let mut bus: Vec<(Option<i64>, &str)> = d
        .registers
        .iter()
        .filter(|g| g.port == name)
        .map(|g| (g.index, g.name.as_str()))
        .collect();
    bus.sort();
    (!bus.is_empty()).then(|| {
        (
            bus.into_iter().map(|b| b.1.to_string()).collect(),
            "register",
        )
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn parse(text: &str) -> Result<PortMap, InputError> {
        PortMap::parse(&Arc::from("m.map"), text)
    }

    #[test]
    fn lines_comments_and_errors() {
        let m = parse("# renamed ports\ndata din  # the bus\n\nen[0] enable\n").unwrap();
        assert_eq!(m.entries.len(), 2);
        assert_eq!(m.entries[1].reference, "en[0]");
        assert_eq!(m.entries[1].pos.to_string(), "m.map:4:1");
        let e = parse("a\nb c d\ne f\ne g\n").unwrap_err().to_string();
        assert!(
            e.contains("m.map:1:1: error: a line of a port map needs two names"),
            "{e}"
        );
        assert!(
            e.contains("m.map:2:5: error: unexpected `d` after the two names"),
            "{e}"
        );
        assert!(
            e.contains("m.map:4:1: error: `e` of the reference is mapped twice (first on line 3)"),
            "{e}"
        );
    }

    #[test]
    fn buses_pair_by_significance_and_widths_must_agree() {
        let m = parse("a b\nx y\n").unwrap();
        let rb = |n: &str| match n {
            "a" => Some((vec!["a[0]".to_string(), "a[1]".to_string()], "input")),
            "x" => Some((vec!["x".to_string()], "output")),
            _ => None,
        };
        let cb = |n: &str| match n {
            "b" => Some((vec!["b[1]".to_string(), "b[0]".to_string()], "input")),
            "y" => Some((vec!["y".to_string()], "output")),
            _ => None,
        };
        let p = m.bit_pairs(&rb, &cb).unwrap();
        assert_eq!(p["a[0]"], "b[1]");
        assert_eq!(p["x"], "y");
        let m = parse("a y\n").unwrap();
        let e = m.bit_pairs(&rb, &cb).unwrap_err().to_string();
        assert!(
            e.contains("`a` is an input of the reference but `y` an output of the candidate"),
            "{e}"
        );
    }
}
