//! Compact printing of route tables: runs of select values whose targets step through one
//! number become one row, e.g. `s 0..7 -> d[0..7]` or `s 0..11 -> d[3..91 step 8]`.

use super::Route;
use serde::Serialize;

/// One printed row: select values `from..=to` and what they route to.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct Row {
    /// First select value.
    pub from: usize,
    /// Last select value.
    pub to: usize,
    /// The targets as text (`d[0..7]`, `0`, `mixed`, ...).
    pub target: String,
}

/// Split a name into text and number pieces: `ch12[3]` -> [`ch`, 12, `[`, 3, `]`].
fn pieces(s: &str) -> Vec<Result<u64, String>> {
    let mut out: Vec<Result<u64, String>> = Vec::new();
    let mut cur = String::new();
    let mut digits = false;
    for c in s.chars() {
        let d = c.is_ascii_digit();
        if !cur.is_empty() && d != digits {
            out.push(if digits {
                cur.parse().map_err(|_| cur.clone())
            } else {
                Err(cur.clone())
            });
            cur.clear();
        }
        digits = d;
        cur.push(c);
    }
    if !cur.is_empty() {
        out.push(if digits {
            cur.parse().map_err(|_| cur.clone())
        } else {
            Err(cur.clone())
        });
    }
    out
}

/// The single number piece in which `a` and `b` differ, with both values.
fn one_difference(a: &str, b: &str) -> Option<(usize, u64, u64)> {
    let (pa, pb) = (pieces(a), pieces(b));
    if pa.len() != pb.len() {
        return None;
    }
    let mut diff = None;
    for (i, (x, y)) in pa.iter().zip(&pb).enumerate() {
        if x != y {
            match (x, y) {
                (Ok(u), Ok(v)) if diff.is_none() => diff = Some((i, *u, *v)),
                _ => return None,
            }
        }
    }
    diff
}

/// Compress a table into rows.
pub fn compress(routes: &[Route]) -> Vec<Row> {
    let mut rows = Vec::new();
    let mut v = 0;
    while v < routes.len() {
        let mut end = v;
        let text = routes[v].text();
        // Runs of the same text (constants, mixed, excluded).
        while end + 1 < routes.len()
            && routes[end + 1].text() == text
            && !matches!(routes[v], Route::Input { .. })
        {
            end += 1;
        }
        let mut target = text.clone();
        if let Route::Input { .. } = routes[v] {
            // Runs whose target changes in one number with a fixed step.
            if let Some(next) = routes.get(v + 1).map(|r| r.text()) {
                if let Some((piece, a, b)) = one_difference(&text, &next).filter(|&(_, a, b)| b > a)
                {
                    let step = b as i64 - a as i64;
                    let mut last = b;
                    end = v + 1;
                    while let Some(r) = routes.get(end + 1) {
                        match one_difference(&text, &r.text()) {
                            Some((p, _, c)) if p == piece && c as i64 - last as i64 == step => {
                                last = c;
                                end += 1;
                            }
                            _ => break,
                        }
                    }
                    if step != 1 && end - v < 2 {
                        // Two rows with a wider step read as a range they are not: keep them apart.
                        rows.push(Row {
                            from: v,
                            to: v,
                            target: text,
                        });
                        v += 1;
                        continue;
                    }
                    let mut ps = pieces(&text);
                    let range = if step == 1 {
                        format!("{a}..{last}")
                    } else {
                        format!("{a}..{last} step {step}")
                    };
                    ps[piece] = Err(range);
                    target = ps
                        .into_iter()
                        .map(|p| match p {
                            Ok(n) => n.to_string(),
                            Err(s) => s,
                        })
                        .collect();
                }
            }
        }
        rows.push(Row {
            from: v,
            to: end,
            target,
        });
        v = end + 1;
    }
    rows
}

/// Render rows as `s 0..7 -> d[0..7]; s 8 -> d[9]`.
pub fn render(select: &str, rows: &[Row]) -> Vec<String> {
    rows.iter()
        .map(|r| {
            if r.from == r.to {
                format!("{select} {} -> {}", r.from, r.target)
            } else {
                format!("{select} {}..{} -> {}", r.from, r.to, r.target)
            }
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn inp(n: &str) -> Route {
        Route::Input {
            name: n.into(),
            inverted: false,
        }
    }

    #[test]
    fn runs_compress() {
        let mut r: Vec<Route> = (0..8).map(|i| inp(&format!("d[{i}]"))).collect();
        r.push(inp("d[9]"));
        r.push(Route::Constant { value: false });
        r.push(Route::Constant { value: false });
        let rows = compress(&r);
        assert_eq!(
            render("s", &rows),
            vec!["s 0..7 -> d[0..7]", "s 8 -> d[9]", "s 9..10 -> 0"]
        );
        let r: Vec<Route> = (0..12).map(|i| inp(&format!("d[{}]", 3 + 8 * i))).collect();
        assert_eq!(
            render("sel", &compress(&r)),
            vec!["sel 0..11 -> d[3..91 step 8]"]
        );
        // A swapped pair stays visible as two rows.
        let r: Vec<Route> = [0, 1, 3, 2]
            .iter()
            .map(|i| inp(&format!("d[{i}]")))
            .collect();
        assert_eq!(
            render("s", &compress(&r)),
            vec!["s 0..1 -> d[0..1]", "s 2 -> d[3]", "s 3 -> d[2]"]
        );
    }
}
