//! Writing a Value Change Dump (IEEE 1364-2005 clause 18, the four-state form): a header with
//! one `$scope module` per design, `$var wire` declarations (buses as vectors with their
//! declared range), then one time step per vector: `#0` with `$dumpvars` holding every value,
//! later steps only the values that change, and a last time stamp closing the final step.
//! The output is the same bytes for the same input (no date line).

use std::fmt::Write;

/// One variable: a scalar (one bit, possibly a bit of a bus: `d [3]`), or a vector whose
/// bits are listed most significant first. One-bit variables change as scalars (`1!`).
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct VcdVar {
    /// The reference name (no white space).
    pub name: String,
    /// For a vector: the declared range `[msb:lsb]` printed after the name.
    pub range: Option<(i64, i64)>,
    /// Number of bits.
    pub width: usize,
}

/// One scope, its variables and the scopes nested in it.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct VcdScope {
    /// Scope name (no white space).
    pub name: String,
    /// Its variables.
    pub vars: Vec<VcdVar>,
    /// Scopes inside it; their variables come after this scope's own in value order.
    pub children: Vec<VcdScope>,
}

impl VcdScope {
    /// A scope without nested scopes.
    pub fn flat(name: impl Into<String>, vars: Vec<VcdVar>) -> VcdScope {
        VcdScope {
            name: name.into(),
            vars,
            children: Vec::new(),
        }
    }
}

/// A value: known bits, or `None` for x; most significant bit first.
pub type Bits = Vec<Option<bool>>;

/// The identifier code of variable `i`: printable ASCII from `!` to `~`, base 94.
fn code(mut i: usize) -> String {
    let mut s = String::new();
    loop {
        s.push((b'!' + (i % 94) as u8) as char);
        i /= 94;
        if i == 0 {
            break;
        }
        i -= 1;
    }
    s
}

fn bit_char(b: Option<bool>) -> char {
    match b {
        Some(true) => '1',
        Some(false) => '0',
        None => 'x',
    }
}

fn value_change(s: &mut String, var: &VcdVar, id: &str, v: &[Option<bool>]) {
    if var.width == 1 {
        let _ = writeln!(s, "{}{id}", bit_char(v[0]));
    } else {
        let bits: String = v.iter().map(|&b| bit_char(b)).collect();
        let _ = writeln!(s, "b{bits} {id}");
    }
}

/// The dump text. `steps[t]` holds one value per variable, scopes in order, each of the
/// variable's width; `comment` goes into the `$comment` section (no `$end` inside). Step t is
/// at time t.
pub fn write_vcd(comment: &str, scopes: &[VcdScope], steps: &[Vec<Bits>]) -> String {
    let timed: Vec<(u64, &[Bits])> = steps
        .iter()
        .enumerate()
        .map(|(t, s)| (t as u64, &s[..]))
        .collect();
    write_vcd_at(comment, scopes, &timed, steps.len() as u64)
}

/// Declare `sc` and its nested scopes, collecting the variables in value order.
fn declare<'a>(s: &mut String, sc: &'a VcdScope, vars: &mut Vec<&'a VcdVar>) {
    let _ = writeln!(s, "$scope module {} $end", sc.name);
    for v in &sc.vars {
        let id = code(vars.len());
        let range = match v.range {
            Some((m, l)) if m == l && v.width == 1 => format!(" [{m}]"),
            Some((m, l)) => format!(" [{m}:{l}]"),
            None => String::new(),
        };
        let _ = writeln!(s, "$var wire {} {id} {}{range} $end", v.width, v.name);
        vars.push(v);
    }
    for ch in &sc.children {
        declare(s, ch, vars);
    }
    s.push_str("$upscope $end\n");
}

/// [`write_vcd`] with a time per step (ascending) and the time `end` that closes the last one.
pub fn write_vcd_at(
    comment: &str,
    scopes: &[VcdScope],
    steps: &[(u64, &[Bits])],
    end: u64,
) -> String {
    let mut s = String::new();
    let _ = writeln!(s, "$comment\n  {}\n$end", comment.replace("$end", "$ end"));
    let _ = writeln!(
        s,
        "$version\n  equicone {}\n$end",
        env!("CARGO_PKG_VERSION")
    );
    s.push_str("$timescale\n  1ns\n$end\n");
    let mut vars: Vec<&VcdVar> = Vec::new();
    for sc in scopes {
        declare(&mut s, sc, &mut vars);
    }
    s.push_str("$enddefinitions $end\n");
    let mut last: Vec<Option<&Bits>> = vec![None; vars.len()];
    for (n, &(t, step)) in steps.iter().enumerate() {
        assert_eq!(step.len(), vars.len(), "one value per variable");
        let _ = writeln!(s, "#{t}");
        if n == 0 {
            s.push_str("$dumpvars\n");
        }
        for (i, v) in step.iter().enumerate() {
            assert_eq!(v.len(), vars[i].width, "value width of {}", vars[i].name);
            if last[i] != Some(v) {
                value_change(&mut s, vars[i], &code(i), v);
                last[i] = Some(v);
            }
        }
        if n == 0 {
            s.push_str("$end\n");
        }
    }
    let _ = writeln!(s, "#{end}");
    s
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn codes_are_distinct_printable_and_short() {
        let all: std::collections::BTreeSet<String> = (0..20_000).map(code).collect();
        assert_eq!(all.len(), 20_000);
        assert!(all
            .iter()
            .all(|c| c.bytes().all(|b| (33..=126).contains(&b))));
        assert_eq!(code(0), "!");
        assert_eq!(code(93), "~");
        assert_eq!(code(94).len(), 2);
    }

    #[test]
    fn only_changes_after_the_first_step() {
        let scopes = vec![VcdScope::flat(
            "top",
            vec![
                VcdVar {
                    name: "s".into(),
                    range: Some((1, 0)),
                    width: 2,
                },
                VcdVar {
                    name: "y".into(),
                    range: None,
                    width: 1,
                },
            ],
        )];
        let steps = vec![
            vec![vec![Some(true), Some(false)], vec![Some(false)]],
            vec![vec![Some(true), Some(false)], vec![None]],
        ];
        let v = write_vcd("test", &scopes, &steps);
        assert!(v.contains("$var wire 2 ! s [1:0] $end\n$var wire 1 \" y $end\n"));
        assert!(
            v.ends_with("#0\n$dumpvars\nb10 !\n0\"\n$end\n#1\nx\"\n#2\n"),
            "{v}"
        );
    }
}
