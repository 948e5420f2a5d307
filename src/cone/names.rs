//! Bit-name lists: parse items such as `d[0..11]`, `d[3:0]`, `sel`, `G1gat` or `*`, resolve
//! them against a design's input or output bits, and write sets of bits back compactly with
//! bus ranges (`sel[0..3], ch0[0..7], mode`).

use crate::design::{Design, InputBit, OutputBit};
use std::collections::BTreeMap;

/// The naming facts of one bit.
#[derive(Copy, Clone, Debug)]
pub struct BitName<'a> {
    /// Full bit name (`d[3]` or `mode`).
    pub name: &'a str,
    /// Port name without the index.
    pub port: &'a str,
    /// Bit index within a vector port.
    pub index: Option<i64>,
}

impl<'a> From<&'a InputBit> for BitName<'a> {
    fn from(b: &'a InputBit) -> Self {
        BitName {
            name: &b.name,
            port: &b.port,
            index: b.index,
        }
    }
}

impl<'a> From<&'a OutputBit> for BitName<'a> {
    fn from(b: &'a OutputBit) -> Self {
        BitName {
            name: &b.name,
            port: &b.port,
            index: b.index,
        }
    }
}

/// The input bits of a design, for name resolution.
pub fn input_names(d: &Design) -> Vec<BitName<'_>> {
    d.inputs.iter().map(BitName::from).collect()
}

/// The output bits of a design, for name resolution.
pub fn output_names(d: &Design) -> Vec<BitName<'_>> {
    d.outputs.iter().map(BitName::from).collect()
}

/// Why an item did not resolve: a message and advice.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct NameError {
    /// What is wrong.
    pub message: String,
    /// What to do.
    pub help: String,
}

/// Resolve one item to bit positions (in `bits` order). `what` names the kind of bit in
/// messages ("input", "output"); `*` means every bit when `allow_all` is set.
pub fn resolve(
    item: &str,
    bits: &[BitName<'_>],
    what: &str,
    allow_all: bool,
) -> Result<Vec<usize>, NameError> {
    let item = item.trim();
    if let Some(i) = bits.iter().position(|b| b.name == item) {
        return Ok(vec![i]);
    }
    if item == "*" {
        if allow_all {
            return Ok((0..bits.len()).collect());
        }
        return Err(NameError {
            message: format!("`*` is not allowed for {what}s here"),
            help: format!("name the {what}s one by one or as buses"),
        });
    }
    if let Some((port, lo, hi)) = parse_range(item)? {
        let mut found = Vec::new();
        let (a, b) = (lo.min(hi), lo.max(hi));
        for idx in a..=b {
            let pos = bits
                .iter()
                .position(|x| x.port == port && x.index == Some(idx))
                .or_else(|| {
                    let full = format!("{port}[{idx}]");
                    bits.iter().position(|x| x.name == full)
                });
            match pos {
                Some(p) => found.push(p),
                None => {
                    return Err(NameError {
                        message: format!("{what} `{port}[{idx}]` does not exist (in `{item}`)"),
                        help: help_for(port, bits, what),
                    })
                }
            }
        }
        return Ok(found);
    }
    let whole: Vec<usize> = (0..bits.len())
        .filter(|&i| bits[i].port == item && bits[i].index.is_some())
        .collect();
    if whole.is_empty() {
        return Err(NameError {
            message: format!("no {what} is named `{item}`"),
            help: help_for(item, bits, what),
        });
    }
    Ok(whole)
}

/// `port[a..b]`, `port[a:b]` or `port[a]` as (port, a, b); `None` when there is no bracket.
fn parse_range(item: &str) -> Result<Option<(&str, i64, i64)>, NameError> {
    let Some(open) = item.find('[') else {
        return Ok(None);
    };
    let bad = || NameError {
        message: format!("`{item}` is not a bit or a bit range"),
        help: "write `name[3]`, `name[0..7]` or `name[7:0]`".to_string(),
    };
    if !item.ends_with(']') || open == 0 {
        return Err(bad());
    }
    let port = &item[..open];
    let inner = &item[open + 1..item.len() - 1];
    let (a, b) = match inner.split_once("..").or_else(|| inner.split_once(':')) {
        Some((a, b)) => (a, b),
        None => (inner, inner),
    };
    let a: i64 = a.trim().parse().map_err(|_| bad())?;
    let b: i64 = b.trim().parse().map_err(|_| bad())?;
    if a.abs_diff(b) > 1 << 24 {
        return Err(bad());
    }
    Ok(Some((port, a, b)))
}

fn help_for(item: &str, bits: &[BitName<'_>], what: &str) -> String {
    let mut ports: Vec<String> = Vec::new();
    for b in bits {
        let shown = if b.index.is_some() { b.port } else { b.name };
        if !ports.iter().any(|p| p == shown) {
            ports.push(shown.to_string());
        }
    }
    let lower = item.to_ascii_lowercase();
    let close: Vec<&String> = ports
        .iter()
        .filter(|p| {
            let pl = p.to_ascii_lowercase();
            !lower.is_empty() && (pl.contains(&lower) || lower.contains(&pl))
        })
        .take(5)
        .collect();
    if !close.is_empty() {
        let list: Vec<&str> = close.iter().map(|s| s.as_str()).collect();
        return format!("did you mean {}?", list.join(", "));
    }
    let shown: Vec<&str> = ports.iter().take(8).map(|s| s.as_str()).collect();
    let more = if ports.len() > 8 {
        format!(" and {} more", ports.len() - 8)
    } else {
        String::new()
    };
    format!("the design's {what}s are {}{more}", shown.join(", "))
}

/// Write the bits at `positions` compactly: buses as ranges of consecutive indices, in the
/// order of each port's first bit.
pub fn compact(positions: &[usize], bits: &[BitName<'_>]) -> String {
    compact_list(positions, bits).join(", ")
}

/// The items of [`compact`], one string each.
pub fn compact_list(positions: &[usize], bits: &[BitName<'_>]) -> Vec<String> {
    let mut order: Vec<(&str, usize)> = Vec::new();
    let mut by_port: BTreeMap<&str, Vec<i64>> = BTreeMap::new();
    let mut scalars: Vec<(usize, &str)> = Vec::new();
    for &p in positions {
        let b = bits[p];
        match b.index {
            Some(i) => {
                let e = by_port.entry(b.port).or_default();
                if e.is_empty() {
                    order.push((b.port, p));
                }
                e.push(i);
            }
            None => scalars.push((p, b.name)),
        }
    }
    let mut items: Vec<(usize, String)> = scalars
        .into_iter()
        .map(|(p, n)| (p, n.to_string()))
        .collect();
    for (port, first) in order {
        let mut idx = by_port.remove(port).unwrap_or_default();
        idx.sort_unstable();
        idx.dedup();
        let mut runs = Vec::new();
        let mut i = 0;
        while i < idx.len() {
            let mut j = i;
            while j + 1 < idx.len() && idx[j + 1] == idx[j] + 1 {
                j += 1;
            }
            runs.push(if i == j {
                format!("{port}[{}]", idx[i])
            } else {
                format!("{port}[{}..{}]", idx[i], idx[j])
            });
            i = j + 1;
        }
        items.push((first, runs.join(", ")));
    }
    items.sort_by_key(|(p, _)| *p);
    items.into_iter().map(|(_, s)| s).collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn bits() -> Vec<(String, String, Option<i64>)> {
        let mut v = Vec::new();
        for i in 0..4 {
            v.push((format!("sel[{i}]"), "sel".to_string(), Some(i)));
        }
        v.push(("mode".to_string(), "mode".to_string(), None));
        for i in 0..8 {
            v.push((format!("ch0[{i}]"), "ch0".to_string(), Some(i)));
        }
        v
    }

    fn view(v: &[(String, String, Option<i64>)]) -> Vec<BitName<'_>> {
        v.iter()
            .map(|(n, p, i)| BitName {
                name: n,
                port: p,
                index: *i,
            })
            .collect()
    }

    #[test]
    fn resolves_bits_ranges_buses_and_star() {
        let owned = bits();
        let b = view(&owned);
        assert_eq!(resolve("sel[2]", &b, "input", false).unwrap(), vec![2]);
        assert_eq!(
            resolve("sel[3:1]", &b, "input", false).unwrap(),
            vec![1, 2, 3]
        );
        assert_eq!(
            resolve("ch0[0..1]", &b, "input", false).unwrap(),
            vec![5, 6]
        );
        assert_eq!(
            resolve("sel", &b, "input", false).unwrap(),
            vec![0, 1, 2, 3]
        );
        assert_eq!(resolve("*", &b, "input", true).unwrap().len(), 13);
        let e = resolve("sel[4]", &b, "input", false).unwrap_err();
        assert_eq!(e.message, "input `sel[4]` does not exist (in `sel[4]`)");
        let e = resolve("chan", &b, "input", false).unwrap_err();
        assert_eq!(e.help, "the design's inputs are sel, mode, ch0");
        assert!(resolve("sel[x]", &b, "input", false).is_err());
    }

    #[test]
    fn compacts_runs() {
        let owned = bits();
        let b = view(&owned);
        assert_eq!(
            compact(&[0, 1, 2, 4, 5, 6, 7, 9], &b),
            "sel[0..2], mode, ch0[0..2], ch0[4]"
        );
        assert_eq!(compact(&[], &b), "");
    }
}
