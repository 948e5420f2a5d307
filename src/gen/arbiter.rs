//! Round-robin arbiters: requests `r[n-1:0]` and a priority pointer `p[n-1:0]` (one-hot in use;
//! any value is defined) give grants `g[n-1:0]` and `v` = any request.
//!
//! Definition: a token enters at every position k with `p[k]` set and travels upwards (cyclically,
//! n-1 wraps to 0) past positions without a request; `g[i]` = `r[i]` and a token reaches i.
//! On the ring unrolled twice, t[j] = p[j mod n] | t[j-1] & !r[(j-1) mod n], and
//! `g[i]` = `r[i]` & t[i+n]: a carry chain with generate p and propagate !r, so the parallel
//! prefix networks of adders apply (common practice).

use super::emit::{Circuit, Net, Op};
use super::Style;

/// Arbiter of `n` requesters.
pub(super) fn build(c: &mut Circuit, n: usize, style: Style) -> Vec<String> {
    let r = c.input("r", n);
    let p = c.input("p", n);
    let mut notes = vec![format!(
        "{n}-requester round-robin arbiter: r[{}:0] requests, p[{}:0] priority pointer; \
         g[i] = r[i] and a token from a set p[k] reaches i past idle requesters; v = any request",
        n - 1,
        n - 1
    )];
    let nr: Vec<Net> = (0..n)
        .map(|i| c.gate(Op::Not, vec![r[i]], format!("nr{i}")))
        .collect();
    let m = 2 * n;
    // (generate, propagate) per position of the doubled ring; position j's propagate lets the
    // token of j-1 through.
    let mut nodes: Vec<(Net, Option<Net>)> = (0..m)
        .map(|j| (p[j % n], (j > 0).then(|| nr[(j - 1) % n])))
        .collect();
    if style == Style::KoggeStone {
        notes.push(
            "style kogge-stone: the token chain of the doubled ring as a Kogge-Stone prefix network"
                .to_string(),
        );
        let mut d = 1;
        let mut level = 0;
        while d < m {
            let prev = nodes.clone();
            for j in d..m {
                let (g_hi, p_hi) = prev[j];
                let (g_lo, p_lo) = prev[j - d];
                let Some(p_hi) = p_hi else { continue };
                let u = c.gate(Op::And, vec![p_hi, g_lo], format!("u{level}_{j}"));
                let g = c.gate(Op::Or, vec![g_hi, u], format!("t{level}_{j}"));
                let pp =
                    p_lo.map(|p_lo| c.gate(Op::And, vec![p_hi, p_lo], format!("a{level}_{j}")));
                nodes[j] = (g, pp);
            }
            d *= 2;
            level += 1;
        }
    } else {
        notes.push(
            "style chain: the token passes position by position around the ring twice".to_string(),
        );
        for j in 1..m {
            let (g, pr) = nodes[j];
            let pr = pr.expect("positions after 0 propagate");
            let u = c.gate(Op::And, vec![nodes[j - 1].0, pr], format!("u{j}"));
            nodes[j] = (c.gate(Op::Or, vec![g, u], format!("t{j}")), None);
        }
    }
    let g: Vec<Net> = (0..n)
        .map(|i| c.gate(Op::And, vec![r[i], nodes[i + n].0], format!("g_{i}")))
        .collect();
    c.output("g", &g);
    let v = c.tree(Op::Or, &r, 4, "v", "v_any");
    c.output_scalar("v", v);
    notes
}
