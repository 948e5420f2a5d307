//! Runs of consecutive bits of one bus, written once: `y[0]`, `y[1]`, `y[2]` as `y[0..2]`.
//! Shared by the text reports that group bits: the cone audit's flags and its sections across
//! clock cycles (structural and exact).

use crate::design::split_bit;
use std::cmp::Ordering;

/// Whether `b` is the next bit of the run `run` of one bus (same port, index one past the last
/// one, in the run's direction).
pub fn extends(run: &[&str], b: &str) -> bool {
    let (p, i) = split_bit(b);
    let Some(i) = i else { return false };
    let Some(last) = run.last() else { return false };
    let (lp, Some(li)) = split_bit(last) else {
        return false;
    };
    if lp != p || (i - li).abs() != 1 {
        return false;
    }
    match run.len() {
        1 => true,
        _ => {
            let (_, Some(pi)) = split_bit(run[run.len() - 2]) else {
                return false;
            };
            i - li == li - pi
        }
    }
}

/// `y[0..7]` for a run of bits of one bus, the name for one bit.
pub fn run_name(run: &[&str]) -> String {
    let (p, first) = split_bit(run[0]);
    let (_, last) = split_bit(run[run.len() - 1]);
    match (first, last) {
        (Some(a), Some(b)) if run.len() > 1 => format!("{p}[{a}..{b}]"),
        _ => run[0].to_string(),
    }
}

/// `y[0..7] (8 bits)` for a run of several bits, the name for one.
pub fn run_label(run: &[&str]) -> String {
    if run.len() > 1 {
        format!("{} ({} bits)", run_name(run), run.len())
    } else {
        run_name(run)
    }
}

/// Bit names in bus order: by bus name, then index (`a[2]` before `a[10]`; a scalar `a`
/// before the bits of a bus `a`).
pub fn bit_order(a: &str, b: &str) -> Ordering {
    split_bit(a).cmp(&split_bit(b)).then_with(|| a.cmp(b))
}

/// Items `(name, tail)` in order, written with runs of consecutive bits of one bus that have
/// the same tail joined: `label(run) + tail` per run (`a[0..7]@2` for eight `a[i]` with the
/// tail `@2`).
pub fn join_runs(items: &[(String, String)], label: impl Fn(&[&str]) -> String) -> Vec<String> {
    let mut out = Vec::new();
    let mut i = 0;
    while i < items.len() {
        let mut run: Vec<&str> = vec![&items[i].0];
        let mut j = i + 1;
        while j < items.len() && items[j].1 == items[i].1 && extends(&run, &items[j].0) {
            run.push(&items[j].0);
            j += 1;
        }
        out.push(format!("{}{}", label(&run), items[i].1));
        i = j;
    }
    out
}

/// An output's inputs, each with its tail (`@2`, ` never`), as one list: in bus order, runs of
/// one bus with the same tail joined (`a[0..7]@2, b@0`), or `no inputs`.
pub fn input_list(mut ins: Vec<(String, String)>) -> String {
    ins.sort_by(|a, b| bit_order(&a.0, &b.0));
    let ins = join_runs(&ins, run_name);
    if ins.is_empty() {
        "no inputs".to_string()
    } else {
        ins.join(", ")
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn items(v: &[(&str, &str)]) -> Vec<(String, String)> {
        v.iter()
            .map(|(a, b)| (a.to_string(), b.to_string()))
            .collect()
    }

    #[test]
    fn joins_runs_with_equal_tails() {
        let v = items(&[
            ("a[0]", "@2"),
            ("a[1]", "@2"),
            ("a[2]", "@2"),
            ("a[3]", "@1"),
            ("b", "@0"),
            ("c[5]", "@0"),
            ("c[4]", "@0"),
            ("c[2]", "@0"),
        ]);
        assert_eq!(
            join_runs(&v, run_name),
            ["a[0..2]@2", "a[3]@1", "b@0", "c[5..4]@0", "c[2]@0"]
        );
        assert_eq!(
            join_runs(&items(&[("y[0]", ": x"), ("y[1]", ": x")]), run_label),
            ["y[0..1] (2 bits): x"]
        );
    }

    #[test]
    fn orders_bits_by_index() {
        let mut v = vec!["a[10]", "b", "a[2]", "a", "a[0]"];
        v.sort_by(|x, y| bit_order(x, y));
        assert_eq!(v, ["a", "a[0]", "a[2]", "a[10]", "b"]);
    }
}
