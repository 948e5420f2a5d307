//! N:1 selectors (N = 2^k): the support is exactly the N data and k select inputs
//! (common practice), and a tree of 2:1 selector cells has N-1 cells and depth k
//! (common practice). Generators are in `common`.

use crate::common::{check_evidence, selector_decoder, selector_tree};
use equicone::cone::{audit, AuditOptions};
use equicone::cost::{stats, CostModel};
use equicone::sat::Limits;

fn check_selector(d: &equicone::Design, n: usize, k: usize) {
    // The generator really is a selector: y = d[s] on a sweep of vectors.
    for probe in 0..64usize {
        let sel = (probe * 37 + 11) % n;
        let mut v = vec![false; n + k];
        for j in 0..k {
            v[n + j] = sel >> j & 1 == 1;
        }
        for (i, slot) in v.iter_mut().enumerate().take(n) {
            *slot = (i * 7 + probe) % 3 == 0;
        }
        assert_eq!(d.eval(&v)[0], v[sel], "N={n} select {sel}");
    }
    let r = audit(d, &AuditOptions::default(), &Limits::none());
    let o = &r.outputs[0];
    assert_eq!(o.support.len(), n + k, "N={n}: support is N + k");
    assert_eq!(o.cone.len(), n + k);
    assert!(o.redundant.is_empty() && o.undecided.is_empty());
    assert!(!r.flagged(), "N={n}: {r}");
    let want = if n == 1 {
        "d[0]".to_string()
    } else {
        format!("d[0..{}]", n - 1)
    };
    let sel = if k == 1 {
        "s[0]".to_string()
    } else {
        format!("s[0..{}]", k - 1)
    };
    assert_eq!(o.support_text, format!("{want}, {sel}"));
    assert_eq!(check_evidence(d, &r), n + k);
}

#[test]
fn tree_selectors_read_all_data_and_selects() {
    for k in 1..=10 {
        let n = 1 << k;
        let d = selector_tree(k);
        check_selector(&d, n, k);
        let s = stats(&d, &CostModel::unit(), &Limits::none());
        let w = s.written.as_ref().unwrap();
        assert_eq!(w.gates, n - 1, "N={n}: N-1 cells");
        assert_eq!(w.by_type["mux2"].total, n - 1);
        assert_eq!(w.depth, k as u32, "N={n}: depth k");
        // Support N + k with fan-in 3: at least ceil((N+k-1)/2) gates, depth ceil(log3(N+k)).
        let o = &s.per_output[0];
        assert_eq!(o.support, (n + k) as u64);
        assert_eq!(o.gate_bound, (n + k - 1).div_ceil(2) as u64);
        assert_eq!(s.bound_fanin, 3);
    }
}

#[test]
fn decoder_selectors_read_all_data_and_selects() {
    for k in 1..=10 {
        let n = 1 << k;
        let d = selector_decoder(k);
        check_selector(&d, n, k);
        let s = stats(&d, &CostModel::unit(), &Limits::none());
        let w = s.written.as_ref().unwrap();
        // k inverters, N decoder ANDs, N data ANDs, one OR.
        assert_eq!(w.gates, k + 2 * n + 1);
        assert_eq!(w.depth, 4, "NOT, decoder AND, data AND, OR");
    }
}

#[test]
fn most_claims_come_from_simulation() {
    let d = selector_decoder(10);
    let r = audit(&d, &AuditOptions::default(), &Limits::none());
    let s = r.stats;
    assert_eq!(s.claims, 1034);
    assert!(s.by_simulation() > 1000, "{s:?}");
    assert_eq!(s.by_simulation() + s.by_sat(), 1034);
}
