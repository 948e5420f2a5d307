//! Runs split across machines: which output pairs shard `K/N` of `prove` decides (pair i belongs to shard
//! `i mod N + 1`), the stamp a partial report carries (a fingerprint of the input files and one
//! of the options that can change a verdict), and the merge of N partial reports into the whole
//! report with the same verdict rules as one run (any pair different: `different`; else any
//! undecided: `undecided`; else `equivalent`).
//!
//! Merging works on the JSON form of the reports, so partial reports written on other
//! machines merge without rerunning anything. **Invariant:** a merge refuses parts whose
//! fingerprints, shard counts or pair totals differ, a shard given twice or missing, and any
//! output pair that is not covered exactly once.

pub mod cone;

use crate::diag::InputError;
use serde::Serialize;
use serde_json::{Map, Value};

/// Shard `index` of `count` (1-based).
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub struct Shard {
    /// Which shard, 1..=count.
    pub index: usize,
    /// How many shards.
    pub count: usize,
}

impl Shard {
    /// Parse `K/N` with 1 <= K <= N.
    pub fn parse(text: &str) -> Result<Shard, InputError> {
        let bad = || {
            InputError::plain(
                format!("--shard `{text}` is not of the form K/N with 1 <= K <= N"),
                "for example `--shard 2/8` runs the second of eight shards",
            )
        };
        let (k, n) = text.split_once('/').ok_or_else(bad)?;
        let k: usize = k.trim().parse().map_err(|_| bad())?;
        let n: usize = n.trim().parse().map_err(|_| bad())?;
        if k == 0 || n == 0 || k > n || n > 1_000_000 {
            return Err(bad());
        }
        Ok(Shard { index: k, count: n })
    }

    /// Whether this shard decides output pair `pair` (0-based, in pairing order).
    pub fn owns(&self, pair: usize) -> bool {
        pair % self.count == self.index - 1
    }
}

/// The stamp of a partial report (its `shard` field).
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct ShardStamp {
    /// Which shard, 1..=count.
    pub index: usize,
    /// How many shards.
    pub count: usize,
    /// Output pairs of the whole run.
    pub total_pairs: usize,
    /// The whole run's indices of this shard's pairs, in the order of its `pairs` list.
    pub pairs: Vec<usize>,
    /// Fingerprint of the input files' contents.
    pub inputs: String,
    /// Fingerprint of the options that can change a verdict.
    pub options: String,
}

/// A stable 64-bit fingerprint (FNV-1a, common practice) of byte strings, in hexadecimal; each
/// part is preceded by its length so that boundaries count.
pub fn fingerprint<'a>(parts: impl IntoIterator<Item = &'a [u8]>) -> String {
    let mut h: u64 = 0xcbf2_9ce4_8422_2325;
    let mut eat = |b: u8| {
        h ^= u64::from(b);
        h = h.wrapping_mul(0x0100_0000_01b3);
    };
    for p in parts {
        for b in (p.len() as u64).to_le_bytes() {
            eat(b);
        }
        for &b in p {
            eat(b);
        }
    }
    format!("{h:016x}")
}

/// Keep only the output pairs of `shard` in `shared`; the stamp lists them (fingerprints empty).
pub(crate) fn restrict(shared: &mut crate::engine::Shared, shard: Shard) -> ShardStamp {
    let total = shared.pairs.len();
    let keep: Vec<usize> = (0..total).filter(|&i| shard.owns(i)).collect();
    shared.pairs = keep.iter().map(|&i| shared.pairs[i]).collect();
    shared.ref_lits = keep.iter().map(|&i| shared.ref_lits[i]).collect();
    shared.cand_lits = keep.iter().map(|&i| shared.cand_lits[i]).collect();
    shared.dont_care = keep.iter().map(|&i| shared.dont_care[i]).collect();
    ShardStamp {
        index: shard.index,
        count: shard.count,
        total_pairs: total,
        pairs: keep,
        inputs: String::new(),
        options: String::new(),
    }
}

fn err(file: &str, what: impl Into<String>, help: &str) -> InputError {
    InputError::plain(format!("{file}: {}", what.into()), help)
}

/// The list `key` (`pairs`, `outputs`) of partial report `v` from file `f`, which must hold as
/// many entries as its stamp names items.
pub(crate) fn part_items(
    f: &str,
    v: &Value,
    key: &str,
    stamp: &PartStamp,
) -> Result<Vec<Value>, InputError> {
    let list = v
        .get(key)
        .and_then(Value::as_array)
        .cloned()
        .unwrap_or_default();
    if list.len() != stamp.items.len() {
        return Err(err(
            f,
            format!(
                "lists {} {key} but its stamp names {}",
                list.len(),
                stamp.items.len()
            ),
            "give the files as written",
        ));
    }
    Ok(list)
}

/// A partial report's stamp as read back: which shard of how many, the whole run's item count
/// (output pairs for `prove`, output bits for `cone`) and the whole run's indices of its items.
pub(crate) struct PartStamp {
    pub(crate) index: usize,
    pub(crate) count: usize,
    pub(crate) total: usize,
    pub(crate) items: Vec<usize>,
    inputs: String,
    options: String,
}

/// The field names and the command of one kind of partial report.
pub(crate) struct PartKind {
    /// The command that writes the parts (`prove` or `cone`).
    pub(crate) command: &'static str,
    /// The stamp field holding the whole run's item count.
    pub(crate) total_key: &'static str,
    /// The stamp field listing the part's items.
    pub(crate) items_key: &'static str,
    /// What an item is, for messages (`pairs`, `outputs`).
    pub(crate) items: &'static str,
}

const PROVE: PartKind = PartKind {
    command: "prove",
    total_key: "total_pairs",
    items_key: "pairs",
    items: "pairs",
};

fn stamp_of(file: &str, v: &Value, kind: &PartKind) -> Result<PartStamp, InputError> {
    let help = format!(
        "give the partial reports that `{} --shard K/N --report FILE` wrote",
        kind.command
    );
    let help = help.as_str();
    let s = v
        .get("shard")
        .and_then(Value::as_object)
        .ok_or_else(|| err(file, "is not a partial report (no `shard` field)", help))?;
    let num = |k: &str| {
        s.get(k)
            .and_then(Value::as_u64)
            .map(|x| x as usize)
            .ok_or_else(|| {
                err(
                    file,
                    format!("shard field `{k}` is missing or not a number"),
                    help,
                )
            })
    };
    let text = |k: &str| {
        s.get(k)
            .and_then(Value::as_str)
            .map(str::to_string)
            .ok_or_else(|| err(file, format!("shard field `{k}` is missing"), help))
    };
    let key = kind.items_key;
    let items = s
        .get(key)
        .and_then(Value::as_array)
        .ok_or_else(|| err(file, format!("shard field `{key}` is missing"), help))?
        .iter()
        .map(|x| x.as_u64().map(|x| x as usize))
        .collect::<Option<Vec<usize>>>()
        .ok_or_else(|| {
            err(
                file,
                format!("shard field `{key}` holds a non-number"),
                help,
            )
        })?;
    Ok(PartStamp {
        index: num("index")?,
        count: num("count")?,
        total: num(kind.total_key)?,
        items,
        inputs: text("inputs")?,
        options: text("options")?,
    })
}

/// Read the stamps of `parts` and check that they make one run: same input files, options,
/// split and schema, every shard once. Returns the stamps and the parts' order by shard.
pub(crate) fn check_parts(
    parts: &[(String, Value)],
    kind: &PartKind,
) -> Result<(Vec<PartStamp>, Vec<usize>), InputError> {
    let first = parts.first().ok_or_else(|| {
        InputError::plain("no partial report given", "name the N partial report files")
    })?;
    let mut stamps = Vec::with_capacity(parts.len());
    for (f, v) in parts {
        stamps.push(stamp_of(f, v, kind)?);
    }
    let s0 = &stamps[0];
    let same = "all parts must come from the same designs and options: rerun the odd shard";
    for ((f, v), s) in parts.iter().zip(&stamps) {
        if s.inputs != s0.inputs {
            return Err(err(
                f,
                format!("was run on other input files than {}", first.0),
                same,
            ));
        }
        if s.options != s0.options {
            return Err(err(
                f,
                format!("was run with other options than {}", first.0),
                same,
            ));
        }
        if s.count != s0.count || s.total != s0.total {
            return Err(err(
                f,
                format!(
                    "belongs to a split into {} shards of {} {}, {} into {} of {}",
                    s.count, s.total, kind.items, first.0, s0.count, s0.total
                ),
                same,
            ));
        }
        if v.get("schema") != first.1.get("schema") {
            return Err(err(f, "has another report schema", same));
        }
    }
    let mut seen = vec![None::<&str>; s0.count + 1];
    for ((f, _), s) in parts.iter().zip(&stamps) {
        if s.index == 0 || s.index > s0.count {
            return Err(err(
                f,
                format!("claims shard {}/{}", s.index, s.count),
                "give the files as written",
            ));
        }
        if let Some(other) = seen[s.index] {
            return Err(err(
                f,
                format!("is shard {}/{} again (also {other})", s.index, s.count),
                "give each shard once",
            ));
        }
        seen[s.index] = Some(f.as_str());
    }
    let missing: Vec<String> = (1..=s0.count)
        .filter(|&k| seen[k].is_none())
        .map(|k| format!("{k}/{}", s0.count))
        .collect();
    if !missing.is_empty() {
        return Err(InputError::plain(
            format!("shards missing: {}", missing.join(", ")),
            format!(
                "run them with `{} --shard K/N` and give every part",
                kind.command
            ),
        ));
    }
    let mut order: Vec<usize> = (0..parts.len()).collect();
    order.sort_by_key(|&i| stamps[i].index);
    Ok((stamps, order))
}

/// Stats fields that add up over shards (the others are the first part's: they describe the
/// designs, which every part shares).
const SUMMED: &[&str] = &["seconds", "sim_patterns"];

/// Merge partial prove reports `(file name, JSON)` into the whole report.
pub fn merge_prove(parts: &[(String, Value)]) -> Result<Value, InputError> {
    let (stamps, order) = check_parts(parts, &PROVE)?;
    let (first, s0) = (&parts[0], &stamps[0]);
    let mut pairs: Vec<Option<Value>> = vec![None; s0.total];
    let mut cexs: Vec<Value> = Vec::new();
    let mut warnings: Vec<Value> = Vec::new();
    let mut portfolio: Vec<Value> = Vec::new();
    let mut supports: Vec<Value> = Vec::new();
    let mut routes: Vec<Value> = Vec::new();
    let mut select = Value::Null;
    let mut stats: Map<String, Value> = first
        .1
        .get("stats")
        .and_then(Value::as_object)
        .cloned()
        .unwrap_or_default();
    for k in SUMMED {
        stats.insert((*k).to_string(), Value::from(0.0));
    }
    let mut sat = Map::new();
    for &i in &order {
        let (f, v) = &parts[i];
        let s = &stamps[i];
        let list = part_items(f, v, "pairs", s)?;
        let offset = cexs.len();
        for (mut p, &g) in list.into_iter().zip(&s.items) {
            if g >= s0.total || pairs[g].is_some() {
                return Err(err(
                    f,
                    format!("pair {g} is out of range or covered twice"),
                    "give each shard's file once",
                ));
            }
            if let Some(c) = p.get("counterexample").and_then(Value::as_u64) {
                p["counterexample"] = Value::from(c as usize + offset);
            }
            pairs[g] = Some(p);
        }
        cexs.extend(
            v.get("counterexamples")
                .and_then(Value::as_array)
                .cloned()
                .unwrap_or_default(),
        );
        for w in v
            .get("warnings")
            .and_then(Value::as_array)
            .into_iter()
            .flatten()
        {
            if !warnings.contains(w) {
                warnings.push(w.clone());
            }
        }
        if let Some(st) = v.get("stats") {
            for k in SUMMED {
                let add = st.get(*k).and_then(Value::as_f64).unwrap_or(0.0);
                let cur = stats.get(*k).and_then(Value::as_f64).unwrap_or(0.0);
                stats.insert((*k).to_string(), Value::from(cur + add));
            }
            for (k, x) in st
                .get("sat")
                .and_then(Value::as_object)
                .into_iter()
                .flatten()
            {
                let cur = sat.get(k).and_then(Value::as_u64).unwrap_or(0);
                sat.insert(k.clone(), Value::from(cur + x.as_u64().unwrap_or(0)));
            }
            for g in st
                .get("portfolio")
                .and_then(Value::as_array)
                .into_iter()
                .flatten()
            {
                let mut g = g.clone();
                if let Some(ps) = g.get("pairs").and_then(Value::as_array) {
                    let mapped: Vec<Value> = ps
                        .iter()
                        .filter_map(Value::as_u64)
                        .filter_map(|j| s.items.get(j as usize).map(|&x| Value::from(x)))
                        .collect();
                    g["pairs"] = Value::from(mapped);
                }
                portfolio.push(g);
            }
        }
        if let Some(d) = v.get("diagnosis").filter(|d| d.is_object()) {
            supports.extend(
                d.get("supports")
                    .and_then(Value::as_array)
                    .cloned()
                    .unwrap_or_default(),
            );
            routes.extend(
                d.get("routes")
                    .and_then(Value::as_array)
                    .cloned()
                    .unwrap_or_default(),
            );
            if select.is_null() {
                select = d.get("select").cloned().unwrap_or(Value::Null);
            }
        }
    }
    let pairs: Vec<Value> = pairs
        .into_iter()
        .enumerate()
        .map(|(g, p)| {
            p.ok_or_else(|| {
                InputError::plain(
                    format!("output pair {g} is in no part"),
                    "the parts do not cover the run; rerun the shards",
                )
            })
        })
        .collect::<Result<_, _>>()?;
    let status = |w: &str| {
        pairs
            .iter()
            .any(|p| p.get("status").and_then(Value::as_str) == Some(w))
    };
    let verdict = if status("different") {
        "different"
    } else if status("undecided") {
        "undecided"
    } else {
        "equivalent"
    };
    if !sat.is_empty() {
        stats.insert("sat".to_string(), Value::Object(sat));
    }
    if stats.contains_key("portfolio") {
        stats.insert("portfolio".to_string(), Value::from(portfolio));
    }
    let mut out = first.1.as_object().cloned().unwrap_or_default();
    out.remove("shard");
    out.insert("verdict".to_string(), Value::from(verdict));
    out.insert("pairs".to_string(), Value::from(pairs));
    out.insert("counterexamples".to_string(), Value::from(cexs));
    out.insert("warnings".to_string(), Value::from(warnings));
    out.insert("stats".to_string(), Value::Object(stats));
    out.insert("merged_shards".to_string(), Value::from(s0.count));
    if verdict == "different" {
        let mut d = Map::new();
        d.insert("supports".to_string(), Value::from(supports));
        d.insert("select".to_string(), select);
        d.insert("routes".to_string(), Value::from(routes));
        out.insert("diagnosis".to_string(), Value::Object(d));
    } else {
        out.remove("diagnosis");
    }
    Ok(Value::Object(out))
}

#[cfg(test)]
mod tests {
    use super::*;
    use serde_json::json;

    fn part(k: usize, n: usize, pairs: Vec<usize>, statuses: &[&str]) -> (String, Value) {
        let ps: Vec<Value> = statuses
            .iter()
            .map(|s| {
                if *s == "different" {
                    json!({"status": s, "counterexample": 0})
                } else {
                    json!({"status": s})
                }
            })
            .collect();
        let cex: Vec<Value> = statuses
            .iter()
            .filter(|s| **s == "different")
            .take(1)
            .map(|_| json!({"found_by": "sat"}))
            .collect();
        (
            format!("p{k}.json"),
            json!({"schema": 1, "verdict": "x", "pairs": ps, "counterexamples": cex,
                   "warnings": [], "stats": {"seconds": 1.0, "sim_patterns": 64},
                   "shard": {"index": k, "count": n, "total_pairs": 4, "pairs": pairs,
                             "inputs": "a", "options": "b"}}),
        )
    }

    #[test]
    fn shards_partition_the_pairs() {
        let s = Shard::parse("2/3").unwrap();
        let owned: Vec<usize> = (0..7).filter(|&i| s.owns(i)).collect();
        assert_eq!(owned, vec![1, 4]);
        for bad in ["0/3", "4/3", "3", "a/b", "1/0"] {
            assert!(Shard::parse(bad).is_err(), "{bad}");
        }
    }

    #[test]
    fn merge_follows_the_verdict_rules_and_checks_coverage() {
        let a = part(1, 2, vec![0, 2], &["equivalent", "undecided"]);
        let b = part(2, 2, vec![1, 3], &["equivalent", "different"]);
        let m = merge_prove(&[b.clone(), a.clone()]).unwrap();
        assert_eq!(m["verdict"], "different");
        assert_eq!(m["pairs"][3]["counterexample"], 0);
        assert_eq!(m["pairs"][2]["status"], "undecided");
        assert_eq!(m["stats"]["seconds"], 2.0);
        assert!(m.get("shard").is_none());
        let e = merge_prove(std::slice::from_ref(&a)).unwrap_err();
        assert!(e.to_string().contains("shards missing: 2/2"), "{e}");
        let e = merge_prove(&[a.clone(), a.clone()]).unwrap_err();
        assert!(e.to_string().contains("again"), "{e}");
        let mut c = b.clone();
        c.1["shard"]["options"] = json!("other");
        let e = merge_prove(&[a.clone(), c]).unwrap_err();
        assert!(e.to_string().contains("other options"), "{e}");
        let a2 = part(1, 2, vec![0, 2], &["equivalent", "equivalent"]);
        let b2 = part(2, 2, vec![1, 3], &["equivalent", "equivalent"]);
        assert_eq!(merge_prove(&[a2, b2]).unwrap()["verdict"], "equivalent");
    }

    #[test]
    fn fingerprints_see_boundaries() {
        assert_ne!(
            fingerprint([&b"ab"[..], b"c"]),
            fingerprint([&b"a"[..], b"bc"])
        );
        assert_eq!(fingerprint([&b"x"[..]]), fingerprint([&b"x"[..]]));
    }
}
