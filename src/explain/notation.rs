//! The text notation of difference cubes. A cube lists the inputs that matter, every other
//! input being free: a bus whose bits are all fixed is shown by value (`sel=9`, bit j of the
//! number being the bus bit with the j-th smallest index), other bits one by one (`ch[72]=1`).
//! Two cubes that are equal except for two inputs that both take opposite values are shown as
//! one line with a relation: `ch[72]!=ch[80]` (one is 1 and the other 0) or `a==b`.
//! A cube with no fixed input reads `always` (the pair differs on every vector).

use super::cubes::Cube;
use crate::design::split_bit;

/// One line of the text form: fixed inputs and at most one relation between two inputs.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Term {
    /// (shared input, value), ascending by input.
    pub fixed: Vec<(usize, bool)>,
    /// (input x, input y, equal): `x==y` when equal, else `x!=y`.
    pub relation: Option<(usize, usize, bool)>,
}

/// Merge cubes that differ only in two inputs with both values flipped into relation terms;
/// other cubes stay as they are. Among several partners a cube prefers the one that leaves
/// the most buses fully fixed (shown by value), then two inputs of different buses. `names[k]`
/// is shared input k's bit name. Order: by the first cube of each term.
pub fn merge_pairs(cubes: &[Cube], names: &[String]) -> Vec<Term> {
    let mut used = vec![false; cubes.len()];
    let mut out = Vec::new();
    for i in 0..cubes.len() {
        if used[i] {
            continue;
        }
        used[i] = true;
        let a = &cubes[i];
        let mut best: Option<(usize, usize, Term)> = None;
        for j in i + 1..cubes.len() {
            let b = &cubes[j];
            if used[j] || b.lits.len() != a.lits.len() {
                continue;
            }
            if a.lits.iter().zip(&b.lits).any(|(x, y)| x.0 != y.0) {
                continue;
            }
            let flipped: Vec<usize> = (0..a.lits.len())
                .filter(|&t| a.lits[t].1 != b.lits[t].1)
                .collect();
            if let [p, q] = flipped[..] {
                let (x, y) = (a.lits[p], a.lits[q]);
                let fixed: Vec<(usize, bool)> = a
                    .lits
                    .iter()
                    .enumerate()
                    .filter(|&(t, _)| t != p && t != q)
                    .map(|(_, &l)| l)
                    .collect();
                let whole = whole_buses(&fixed, names);
                let apart = split_bit(&names[x.0]).0 != split_bit(&names[y.0]).0;
                let score = whole * 2 + apart as usize;
                if best.as_ref().is_none_or(|b| score > b.0) {
                    let term = Term {
                        fixed,
                        relation: Some((x.0, y.0, x.1 == y.1)),
                    };
                    best = Some((score, j, term));
                }
            }
        }
        match best {
            Some((_, j, term)) => {
                used[j] = true;
                out.push(term);
            }
            None => out.push(Term {
                fixed: a.lits.clone(),
                relation: None,
            }),
        }
    }
    out
}

/// How many buses (of more than one bit) have every bit in `fixed`.
fn whole_buses(fixed: &[(usize, bool)], names: &[String]) -> usize {
    let mut ports: Vec<&str> = fixed
        .iter()
        .filter_map(|&(k, _)| {
            let (p, i) = split_bit(&names[k]);
            i.map(|_| p)
        })
        .collect();
    ports.sort_unstable();
    ports.dedup();
    ports
        .into_iter()
        .filter(|p| {
            let width = names
                .iter()
                .filter(|n| {
                    let (q, i) = split_bit(n);
                    q == *p && i.is_some()
                })
                .count();
            let have = fixed
                .iter()
                .filter(|&&(k, _)| split_bit(&names[k]).0 == *p)
                .count();
            width > 1 && have == width
        })
        .count()
}

/// The text of one term; `names[k]` is shared input k's bit name.
pub fn term_text(t: &Term, names: &[String]) -> String {
    let mut parts: Vec<String> = Vec::new();
    // Buses by first appearance; a bus is shown by value when all its bits are fixed.
    let mut done = vec![false; t.fixed.len()];
    for i in 0..t.fixed.len() {
        if done[i] {
            continue;
        }
        let (port, idx) = split_bit(&names[t.fixed[i].0]);
        if idx.is_some() {
            let width = names
                .iter()
                .filter(|n| {
                    let (p, ix) = split_bit(n);
                    p == port && ix.is_some()
                })
                .count();
            let mine: Vec<usize> = (i..t.fixed.len())
                .filter(|&j| {
                    let (p, ix) = split_bit(&names[t.fixed[j].0]);
                    p == port && ix.is_some()
                })
                .collect();
            if mine.len() == width && width > 1 && width <= 64 {
                let mut bits: Vec<(i64, bool)> = mine
                    .iter()
                    .map(|&j| (split_bit(&names[t.fixed[j].0]).1.unwrap_or(0), t.fixed[j].1))
                    .collect();
                bits.sort();
                let v: u64 = bits
                    .iter()
                    .enumerate()
                    .map(|(j, &(_, b))| (b as u64) << j)
                    .sum();
                parts.push(format!("{port}={v}"));
                for j in mine {
                    done[j] = true;
                }
                continue;
            }
        }
        done[i] = true;
        parts.push(format!("{}={}", names[t.fixed[i].0], t.fixed[i].1 as u8));
    }
    if let Some((x, y, eq)) = t.relation {
        let op = if eq { "==" } else { "!=" };
        parts.push(format!("{}{op}{}", names[x], names[y]));
    }
    if parts.is_empty() {
        "always".to_string()
    } else {
        parts.join(", ")
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn swapped_pair_reads_as_a_relation_and_buses_by_value() {
        let names: Vec<String> = ["s[0]", "s[1]", "a", "b", "c"]
            .iter()
            .map(|s| s.to_string())
            .collect();
        let cubes = vec![
            Cube {
                lits: vec![(0, true), (1, false), (2, true), (3, false)],
            },
            Cube {
                lits: vec![(0, true), (1, false), (2, false), (3, true)],
            },
            Cube {
                lits: vec![(1, true), (4, true)],
            },
        ];
        let terms = merge_pairs(&cubes, &names);
        assert_eq!(terms.len(), 2);
        assert_eq!(term_text(&terms[0], &names), "s=1, a!=b");
        assert_eq!(term_text(&terms[1], &names), "s[1]=1, c=1");
        let all = Term {
            fixed: vec![],
            relation: None,
        };
        assert_eq!(term_text(&all, &names), "always");
    }
}
