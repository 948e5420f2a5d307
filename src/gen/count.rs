//! Counting and comparing: population count (a tree of ripple adders, or carry-save column
//! compression), majority (a Batcher odd-even merge sorting network, or a population count and a
//! comparison with the threshold), recursive majority-of-three, and magnitude comparators.

use super::fold::{constant, trim, Fold, Sig};
use super::{clog2, Circuit, Net, Op, Style};
use std::collections::VecDeque;

/// Population count: input `x[n-1:0]`, output `y[K-1:0]` = number of ones, K = ceil(log2(n+1)).
pub(super) fn build_popcount(c: &mut Circuit, n: usize, style: Style) -> Vec<String> {
    let x = c.input("x", n);
    let k = clog2(n + 1);
    let mut notes = vec![format!(
        "{n}-input population count: x[{}:0] in; y[{}:0] = number of ones in x",
        n - 1,
        k - 1
    )];
    let mut f = Fold::new(c, "w");
    let sigs: Vec<Sig> = x.iter().map(|&n| Sig::Net(n)).collect();
    let y = if style == Style::Csa {
        notes.push(
            "style csa: carry-save compression of the weight columns with full and half adders"
                .to_string(),
        );
        csa_count(&mut f, &sigs)
    } else {
        notes.push("style adder-tree: a balanced tree of ripple-carry adders".to_string());
        tree_count(&mut f, &sigs)
    };
    let y: Vec<Net> = (0..k)
        .map(|i| {
            let s = y.get(i).copied().unwrap_or(Sig::Zero);
            f.net(s)
        })
        .collect();
    c.output("y", &y);
    notes
}

/// The count of ones of `bits` by a balanced tree of ripple-carry adders.
fn tree_count(f: &mut Fold, bits: &[Sig]) -> Vec<Sig> {
    let mut layer: Vec<Vec<Sig>> = bits.iter().map(|&b| vec![b]).collect();
    while layer.len() > 1 {
        let mut next = Vec::with_capacity(layer.len().div_ceil(2));
        let mut it = layer.chunks(2);
        for pair in &mut it {
            match pair {
                [a, b] => next.push(trim(f.add(a, b, Sig::Zero))),
                [a] => next.push(a.clone()),
                _ => unreachable!("chunks of two"),
            }
        }
        layer = next;
    }
    layer.pop().unwrap_or_else(|| vec![Sig::Zero])
}

/// The count of ones of `bits` by carry-save compression of the weight columns.
fn csa_count(f: &mut Fold, bits: &[Sig]) -> Vec<Sig> {
    let mut cols: Vec<VecDeque<Sig>> = vec![bits.iter().copied().collect()];
    let mut w = 0;
    let mut out = Vec::new();
    while w < cols.len() {
        while cols[w].len() > 1 {
            let a = cols[w].pop_front().expect("two or more");
            let b = cols[w].pop_front().expect("two or more");
            let cin = if cols[w].is_empty() {
                Sig::Zero
            } else {
                cols[w].pop_front().expect("one or more")
            };
            let (s, co) = f.full_add(a, b, cin);
            cols[w].push_back(s);
            if cols.len() == w + 1 {
                cols.push(VecDeque::new());
            }
            cols[w + 1].push_back(co);
        }
        out.push(cols[w].front().copied().unwrap_or(Sig::Zero));
        w += 1;
    }
    out
}

/// Majority: input `x[n-1:0]`, output `y` = 1 when more than half of the inputs are 1.
pub(super) fn build_majority(c: &mut Circuit, n: usize, style: Style) -> Vec<String> {
    let x = c.input("x", n);
    let t = n / 2 + 1;
    let mut notes = vec![format!(
        "{n}-input majority: x[{}:0] in; y = 1 when at least {t} inputs are 1",
        n - 1
    )];
    let mut f = Fold::new(c, "w");
    let sigs: Vec<Sig> = x.iter().map(|&n| Sig::Net(n)).collect();
    let y = if style == Style::Sorting {
        let m = n.next_power_of_two();
        notes.push(format!(
            "style sorting: Batcher odd-even merge sort of {m} lines (zeros padded), \
             comparators (OR, AND) put ones first; y = sorted line {}",
            t - 1
        ));
        let mut lines = sigs.clone();
        lines.resize(m, Sig::Zero);
        sort_ones_first(&mut f, &mut lines);
        lines[t - 1]
    } else {
        notes.push(format!(
            "style adder-tree: a tree of ripple-carry adders counts the ones, then count >= {t} \
             by a subtraction"
        ));
        let count = tree_count(&mut f, &sigs);
        let (_, borrow) = f.sub(&count, &constant(t as u64, count.len()));
        if t >= 1 << count.len() {
            Sig::Zero
        } else {
            f.not(borrow)
        }
    };
    let y = f.net(y);
    c.output_scalar("y", y);
    notes
}

/// Batcher's odd-even merge sort (common practice) on a power-of-two number of lines; each
/// comparator puts the OR on the lower line, so ones come first.
fn sort_ones_first(f: &mut Fold, v: &mut [Sig]) {
    let n = v.len();
    let mut p = 1;
    while p < n {
        let mut k = p;
        while k >= 1 {
            let mut j = k % p;
            while j + k < n {
                for i in 0..k.min(n - j - k) {
                    if (i + j) / (2 * p) == (i + j + k) / (2 * p) {
                        let (a, b) = (v[i + j], v[i + j + k]);
                        v[i + j] = f.or(a, b);
                        v[i + j + k] = f.and(a, b);
                    }
                }
                j += 2 * k;
            }
            k /= 2;
        }
        p *= 2;
    }
}

/// Recursive majority of three: input `x[n-1:0]` with n a power of 3; each level takes the
/// majority of consecutive triples.
pub(super) fn build_recursive_majority(c: &mut Circuit, n: usize, style: Style) -> Vec<String> {
    let x = c.input("x", n);
    let mut notes = vec![format!(
        "{n}-input recursive majority of three: x[{}:0] in; each level takes maj(x[3i], x[3i+1], \
         x[3i+2]) of the level below; y is the last level's bit",
        n - 1
    )];
    notes.push(if style == Style::Select {
        "style select: maj(a, b, c) = (a ^ b) ? c : a".to_string()
    } else {
        "style sop: maj(a, b, c) = a&b | a&c | b&c".to_string()
    });
    let mut layer = x;
    let mut level = 0;
    while layer.len() > 1 {
        layer = layer
            .chunks(3)
            .enumerate()
            .map(|(i, t)| {
                let (a, b, d) = (t[0], t[1], t[2]);
                let nm = format!("m{level}_{i}");
                if style == Style::Select {
                    let x = c.gate(Op::Xor, vec![a, b], format!("{nm}_x"));
                    c.mux(x, d, a, nm)
                } else {
                    let ab = c.gate(Op::And, vec![a, b], format!("{nm}_ab"));
                    let ad = c.gate(Op::And, vec![a, d], format!("{nm}_ac"));
                    let bd = c.gate(Op::And, vec![b, d], format!("{nm}_bc"));
                    c.gate(Op::Or, vec![ab, ad, bd], nm)
                }
            })
            .collect();
        level += 1;
    }
    c.output_scalar("y", layer[0]);
    notes
}

/// Comparator: inputs `a[n-1:0]`, `b[n-1:0]`, outputs `lt`, `eq`, `gt` (unsigned).
pub(super) fn build_comparator(c: &mut Circuit, n: usize, style: Style) -> Vec<String> {
    let a = c.input("a", n);
    let b = c.input("b", n);
    let mut notes = vec![format!(
        "{n}-bit unsigned comparator: a[{}:0], b[{}:0] in; lt = a < b, eq = a == b, gt = a > b",
        n - 1,
        n - 1
    )];
    let mut f = Fold::new(c, "w");
    // Per bit: (gt, lt) of that bit alone.
    let mut bits: Vec<(Sig, Sig)> = (0..n)
        .map(|i| {
            let (x, y) = (Sig::Net(a[i]), Sig::Net(b[i]));
            let nx = f.not(x);
            let ny = f.not(y);
            (f.and(x, ny), f.and(nx, y))
        })
        .collect();
    // (gt, lt) of hi over lo: hi decides unless it is equal.
    let merge = |f: &mut Fold, hi: (Sig, Sig), lo: (Sig, Sig)| {
        let either = f.or(hi.0, hi.1);
        let same = f.not(either);
        let g = f.and(same, lo.0);
        let l = f.and(same, lo.1);
        (f.or(hi.0, g), f.or(hi.1, l))
    };
    let (gt, lt) = if style == Style::Tree {
        notes.push("style tree: (gt, lt) pairs of halves merged in a balanced tree".to_string());
        while bits.len() > 1 {
            let mut next = Vec::with_capacity(bits.len().div_ceil(2));
            for pair in bits.chunks(2) {
                next.push(match *pair {
                    [lo, hi] => merge(&mut f, hi, lo),
                    [x] => x,
                    _ => unreachable!("chunks of two"),
                });
            }
            bits = next;
        }
        bits[0]
    } else {
        notes.push(if style == Style::Spec {
            "style spec: `lt = a < b` ...; in bench written as the ripple comparator".to_string()
        } else {
            "style ripple: from bit 0 up, bit i decides unless a[i] == b[i]".to_string()
        });
        let mut acc = bits[0];
        for &bit in &bits[1..] {
            acc = merge(&mut f, bit, acc);
        }
        acc
    };
    let either = f.or(gt, lt);
    let eq = f.not(either);
    let (lt, eq, gt) = (f.net(lt), f.net(eq), f.net(gt));
    c.output_scalar("lt", lt);
    c.output_scalar("eq", eq);
    c.output_scalar("gt", gt);
    if style == Style::Spec {
        c.behaviour = vec![
            "assign lt = a < b;".to_string(),
            "assign eq = a == b;".to_string(),
            "assign gt = a > b;".to_string(),
        ];
    }
    notes
}
