//! An independent Value Change Dump reader, written from IEEE 1364-2005 clause 18 (the
//! four-state VCD format) without any of equicone's code: it reads the declarations (scopes,
//! `$var` with size, identifier code, reference and optional range) and the value changes
//! (scalar `0!`, vector `b0101 !`, `#time`), and gives each variable's value at each time.

use std::collections::BTreeMap;

/// One declared variable.
#[derive(Clone, Debug)]
pub struct Var {
    /// Scope path joined with `.`.
    pub scope: String,
    /// The reference name (without its range).
    pub name: String,
    /// The range text after the name, e.g. `[3:0]`, or empty.
    pub range: String,
    /// Size in bits.
    pub size: usize,
    /// Identifier code.
    pub code: String,
}

/// A whole dump: variables and the value of every variable after each time stamp.
#[derive(Debug)]
pub struct Dump {
    pub vars: Vec<Var>,
    /// time -> code -> value (characters, most significant first, padded to the size).
    pub at: BTreeMap<u64, BTreeMap<String, String>>,
}

impl Dump {
    /// The value of `scope.name` at time `t` (most significant first).
    pub fn value(&self, scope: &str, name: &str, t: u64) -> Option<String> {
        let v = self
            .vars
            .iter()
            .find(|v| v.scope == scope && v.name == name)?;
        self.at.get(&t)?.get(&v.code).cloned()
    }

    /// The scopes declared, in order.
    pub fn scopes(&self) -> Vec<String> {
        let mut s: Vec<String> = Vec::new();
        for v in &self.vars {
            if !s.contains(&v.scope) {
                s.push(v.scope.clone());
            }
        }
        s
    }
}

/// Parse a dump; panics with a message on anything malformed.
pub fn parse(text: &str) -> Dump {
    let toks: Vec<&str> = text.split_whitespace().collect();
    let mut i = 0;
    let mut scope: Vec<String> = Vec::new();
    let mut vars = Vec::new();
    // Header.
    loop {
        assert!(i < toks.len(), "vcd: no $enddefinitions");
        match toks[i] {
            "$scope" => {
                scope.push(toks[i + 2].to_string());
                assert_eq!(toks[i + 3], "$end", "vcd: $scope not closed");
                i += 4;
            }
            "$upscope" => {
                scope.pop().expect("vcd: $upscope without $scope");
                i += 2;
            }
            "$var" => {
                let mut j = i + 1;
                let mut parts = Vec::new();
                while toks[j] != "$end" {
                    parts.push(toks[j]);
                    j += 1;
                }
                assert!(parts.len() >= 4, "vcd: short $var: {parts:?}");
                vars.push(Var {
                    scope: scope.join("."),
                    name: parts[3].to_string(),
                    range: parts[4..].join(""),
                    size: parts[1].parse().expect("vcd: $var size"),
                    code: parts[2].to_string(),
                });
                i = j + 1;
            }
            "$enddefinitions" => {
                i += 2;
                break;
            }
            t if t.starts_with('$') => {
                // $comment, $version, $timescale, $date: skip to $end.
                while toks[i] != "$end" {
                    i += 1;
                }
                i += 1;
            }
            t => panic!("vcd: unexpected `{t}` in the header"),
        }
    }
    assert!(scope.is_empty(), "vcd: unclosed scopes");
    let size: BTreeMap<&str, usize> = vars.iter().map(|v| (v.code.as_str(), v.size)).collect();
    let mut cur: BTreeMap<String, String> = BTreeMap::new();
    let mut at = BTreeMap::new();
    let mut time: Option<u64> = None;
    while i < toks.len() {
        let t = toks[i];
        i += 1;
        if let Some(n) = t.strip_prefix('#') {
            if let Some(old) = time {
                at.insert(old, cur.clone());
            }
            let n: u64 = n.parse().expect("vcd: time");
            assert!(time.is_none_or(|o| n > o), "vcd: time goes back");
            time = Some(n);
        } else if matches!(
            t,
            "$dumpvars" | "$end" | "$dumpall" | "$dumpon" | "$dumpoff"
        ) {
        } else if let Some(bits) = t.strip_prefix(['b', 'B']) {
            let code = toks[i];
            i += 1;
            let w = *size
                .get(code)
                .unwrap_or_else(|| panic!("vcd: unknown code {code}"));
            assert!(bits.len() <= w, "vcd: value wider than {code}");
            // Left extension: 0 and 1 extend with 0, x with x (clause 18.2.1).
            let pad = if bits.starts_with(['x', 'X']) {
                'x'
            } else {
                '0'
            };
            let full: String = std::iter::repeat_n(pad, w - bits.len())
                .chain(bits.chars())
                .collect();
            cur.insert(code.to_string(), full.to_ascii_lowercase());
        } else {
            let (v, code) = t.split_at(1);
            assert!(
                matches!(v, "0" | "1" | "x" | "X" | "z" | "Z"),
                "vcd: bad scalar change `{t}`"
            );
            assert!(size.contains_key(code), "vcd: unknown code {code}");
            cur.insert(code.to_string(), v.to_ascii_lowercase());
        }
    }
    if let Some(old) = time {
        at.insert(old, cur);
    }
    Dump { vars, at }
}
