//! Difference cubes against exhaustive simulation (written here from the bench gate lines,
//! without equicone's code) on random pairs of 3 to 20 inputs: every vector of every cube
//! differs (and meets the assumption), cubes are disjoint, and a cover said to be complete
//! holds every differing vector, with the exact count reported.

use super::common::{design, prove, random_bench};
use super::oracle;
use equicone::engine::Verdict;
use equicone::explain::cubes::{cover_pair, CoverEnd, CubeLimits};
use equicone::sat::Limits;
use std::collections::HashMap;

/// Output values of `net` for every vector over `inputs` (bit i of the vector number is
/// `inputs[i]`), one `Vec<bool>` per output; every gate evaluated from its kind.
fn truth_tables(net: &oracle::Net, inputs: &[String]) -> Vec<Vec<bool>> {
    let n = inputs.len();
    let mut slot: HashMap<&str, usize> = HashMap::new();
    for (i, x) in inputs.iter().enumerate() {
        slot.insert(x.as_str(), i);
    }
    let order = net.order();
    for &g in &order {
        let len = slot.len();
        slot.insert(net.gates[g].0.as_str(), len);
    }
    let plan: Vec<(usize, &str, Vec<usize>)> = order
        .iter()
        .map(|&g| {
            let (o, k, a) = &net.gates[g];
            (
                slot[o.as_str()],
                k.as_str(),
                a.iter().map(|x| slot[x.as_str()]).collect(),
            )
        })
        .collect();
    let outs: Vec<usize> = net.outputs.iter().map(|o| slot[o.as_str()]).collect();
    let mut tables = vec![Vec::with_capacity(1 << n); outs.len()];
    let mut val = vec![false; slot.len()];
    for v in 0..1usize << n {
        for (i, x) in val.iter_mut().enumerate().take(n) {
            *x = (v >> i) & 1 == 1;
        }
        for (o, k, a) in &plan {
            let ones = a.iter().filter(|&&i| val[i]).count();
            val[*o] = match *k {
                "AND" => ones == a.len(),
                "NAND" => ones != a.len(),
                "OR" => ones > 0,
                "NOR" => ones == 0,
                "XOR" => ones % 2 == 1,
                "XNOR" => ones % 2 == 0,
                "NOT" => ones == 0,
                "BUF" | "BUFF" => ones == 1,
                k => panic!("unknown gate {k}"),
            };
        }
        for (t, &o) in tables.iter_mut().zip(&outs) {
            t.push(val[o]);
        }
    }
    tables
}

#[test]
fn cube_covers_match_exhaustive_simulation() {
    let (mut complete, mut covers) = (0, 0);
    for seed in 0..40u64 {
        // 3..=20 inputs; the largest ones on a few seeds only (2^20 vectors each).
        let n = if seed % 8 == 7 {
            18 + (seed as usize / 8) % 3
        } else {
            3 + (seed as usize % 12)
        };
        let bus = seed % 3 == 0;
        let (a, b) = random_bench(seed ^ 0x5eed, n, 10 + 2 * n, 2, bus, true);
        let r = design("ref.bench", &a);
        let c = design("cand.bench", &b);
        // Odd seeds assume that the first two inputs are not both 1.
        let (x0, x1) = if bus { ("d[0]", "d[1]") } else { ("i0", "i1") };
        let assume_text = format!("!({x0} & {x1})");
        let assume: Vec<&str> = if seed % 2 == 1 {
            vec![assume_text.as_str()]
        } else {
            vec![]
        };
        let (rep, shared) = prove(&r, &c, &assume);
        if rep.verdict != Verdict::Different {
            continue;
        }
        let (na, nb) = (oracle::parse(&a), oracle::parse(&b));
        let names = na.inputs.clone();
        let (ta, tb) = (truth_tables(&na, &names), truth_tables(&nb, &names));
        let pos = |s: &str| names.iter().position(|x| x == s).expect("input");
        let (p0, p1) = (pos(x0), pos(x1));
        let holds = |v: usize| assume.is_empty() || (v >> p0) & 1 == 0 || (v >> p1) & 1 == 0;
        // Shared input k -> position in the oracle's input list.
        let at: Vec<usize> = (0..shared.aig.num_inputs())
            .map(|k| pos(shared.input_name(k, &r, &c).0))
            .collect();
        for (p, pr) in rep.pairs.iter().enumerate() {
            if pr.status() != Verdict::Different {
                continue;
            }
            let o = na
                .outputs
                .iter()
                .position(|x| *x == pr.reference)
                .expect("output");
            let cov = cover_pair(&shared, p, None, &CubeLimits::default(), &Limits::none());
            covers += 1;
            let mut inside = vec![0u8; 1 << n];
            for cube in &cov.cubes {
                for v in 0..1usize << n {
                    if cube
                        .lits
                        .iter()
                        .all(|&(k, bit)| ((v >> at[k]) & 1 == 1) == bit)
                    {
                        assert!(
                            holds(v) && ta[o][v] != tb[o][v],
                            "seed {seed}: vector {v} in a cube does not differ"
                        );
                        inside[v] += 1;
                    }
                }
            }
            assert!(inside.iter().all(|&k| k <= 1), "seed {seed}: cubes overlap");
            if cov.end == CoverEnd::Complete {
                complete += 1;
                let differing: u128 = (0..1usize << n)
                    .filter(|&v| holds(v) && ta[o][v] != tb[o][v])
                    .count() as u128;
                for v in 0..1usize << n {
                    if holds(v) && ta[o][v] != tb[o][v] {
                        assert_eq!(
                            inside[v], 1,
                            "seed {seed}: differing vector {v} outside the cover"
                        );
                    }
                }
                // The count is over the cone's inputs; the others multiply it.
                let free = n - cov.inputs.len();
                assert_eq!(
                    cov.differing.map(|d| d << free),
                    Some(differing),
                    "seed {seed}"
                );
            }
        }
    }
    assert!(covers >= 12, "only {covers} covers checked");
    assert!(
        complete * 2 >= covers,
        "only {complete} of {covers} covers complete"
    );
}

#[test]
fn demo_bug_shows_the_swapped_channels_at_select_9_and_10() {
    let f = equicone::demo::FILES;
    let spec = design(f[0].0, f[0].1);
    let r3 = design(f[2].0, f[2].1);
    let (rep, shared) = prove(&spec, &r3, &["sel < 12"]);
    let e = equicone::explain::explain(
        &shared,
        &spec,
        &r3,
        &rep,
        &CubeLimits::default(),
        32,
        &Limits::none(),
    );
    assert_eq!(e.pairs.len(), 8);
    for (i, p) in e.pairs.iter().enumerate() {
        // The r3 file's comment (the planted bug): channels 9 and 10 swapped, so output bit i
        // differs exactly when sel is 9 or 10 and ch[72+i] differs from ch[80+i].
        let mut terms = p.terms.clone();
        terms.sort();
        assert_eq!(
            terms,
            vec![
                format!("sel=10, ch[{}]!=ch[{}]", 72 + i, 80 + i),
                format!("sel=9, ch[{}]!=ch[{}]", 72 + i, 80 + i),
            ]
        );
        assert_eq!(p.end, CoverEnd::Complete);
    }
    let demo = equicone::demo::run().expect("demo runs");
    assert!(
        demo.contains("sel=9, ch[72]!=ch[80]") && demo.contains("sel=10, ch[72]!=ch[80]"),
        "{demo}"
    );
    // The printed cube count agrees with the lines shown: each `x!=y` line is two cubes
    // (0 or 1 for the two inputs), and the header says so.
    assert!(
        demo.contains("`x!=y` or `x==y` on a line stands for two cubes"),
        "{demo}"
    );
    let text = equicone::explain::explanation_text(&e);
    for p in &e.pairs {
        let two = p
            .terms
            .iter()
            .filter(|t| t.contains("!=") || t.contains("=="))
            .count();
        assert_eq!(p.cubes.len(), p.terms.len() + two);
        let head = format!(
            "  {}: {} cubes in {} lines, complete",
            p.reference,
            p.cubes.len(),
            p.terms.len()
        );
        assert!(text.contains(&head), "{head}\n{text}");
    }
}
