//! Route tables: for each value of a select bus, which single data input an output follows
//! (proved by SAT under the select value, not only simulated), or that it is constant, or that
//! it follows no single input.
//!
//! First the cone is folded with the select bits fixed ([`fold`]): an output that folds to a
//! constant or one input literal has its route proved without a solver. Otherwise candidates
//! come from simulation (64 random patterns per select value, select bits fixed); each candidate route `out == in` (or `out == !in`, or `out == const`) is then proved by an
//! UNSAT answer on `out XOR in` under the select value as solver assumptions.

mod fold;
mod table;

pub use table::{compress, render, Row};

use crate::aig::{random_words, simulate, Lit};
use crate::cnf::Tseitin;
use crate::design::Design;
use crate::diag::InputError;
use crate::sat::{ClauseSink, Limits, Sat, SatResult, StopReason};
use serde::Serialize;

/// The largest select bus handled (2^16 values).
pub const MAX_SELECT_BITS: usize = 16;

/// What an output does for one select value.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum Route {
    /// Follows input `name` (inverted when `inverted`).
    Input {
        /// The data input's bit name.
        name: String,
        /// Whether the output is the complement of the input.
        inverted: bool,
    },
    /// Is this constant for every other input.
    Constant {
        /// The constant.
        value: bool,
    },
    /// Depends on the other inputs but equals no single one of them.
    Mixed,
    /// The select value is excluded by the assumptions.
    Excluded,
    /// A limit stopped the proof.
    Undecided {
        /// Which limit.
        reason: StopReason,
    },
}

impl Route {
    /// Short text: `d[3]`, `~d[3]`, `0`, `1`, `mixed`, `excluded`, `undecided`.
    pub fn text(&self) -> String {
        match self {
            Route::Input { name, inverted } => {
                format!("{}{name}", if *inverted { "~" } else { "" })
            }
            Route::Constant { value } => (*value as u8).to_string(),
            Route::Mixed => "mixed".into(),
            Route::Excluded => "excluded".into(),
            Route::Undecided { .. } => "undecided".into(),
        }
    }
}

/// The route table of one output.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct RouteTable {
    /// The output bit.
    pub output: String,
    /// The select bus.
    pub select: String,
    /// `routes[v]` for select value `v`.
    pub routes: Vec<Route>,
}

/// The select bits of `bus` (input indices, least significant first).
pub fn select_bits(d: &Design, bus: &str) -> Result<Vec<usize>, InputError> {
    let mut bits: Vec<(i64, usize)> = d
        .inputs
        .iter()
        .enumerate()
        .filter(|(_, b)| b.port == bus && !b.is_unknown())
        .map(|(k, b)| (b.index.unwrap_or(0), k))
        .collect();
    if bits.is_empty() {
        let mut ports: Vec<&str> = d
            .inputs
            .iter()
            .filter(|b| !b.is_unknown())
            .map(|b| b.port.as_str())
            .collect();
        ports.dedup();
        return Err(InputError::plain(
            format!("{} has no input bus `{bus}`", d.name),
            format!(
                "name the select bus with `--select`; inputs are: {}",
                ports.into_iter().take(16).collect::<Vec<_>>().join(", ")
            ),
        ));
    }
    if bits.len() > MAX_SELECT_BITS {
        return Err(InputError::plain(
            format!("the select bus `{bus}` has {} bits; route tables go up to {MAX_SELECT_BITS} bits (65536 values)", bits.len()),
            "pick a narrower select bus",
        ));
    }
    bits.sort();
    Ok(bits.into_iter().map(|(_, k)| k).collect())
}

/// Build the route table of output `out` of `d` over the select bits `sel` (from
/// [`select_bits`]). `constraint` (a literal of `d.aig`, `Lit::TRUE` for none) excludes select
/// values for which it cannot hold... per value, it is added as a solver assumption.
pub fn route_table(
    d: &Design,
    out: usize,
    bus: &str,
    sel: &[usize],
    constraint: Lit,
    limits: &Limits,
) -> RouteTable {
    table(d, out, bus, sel, constraint, limits, true, &|_| {})
}

/// [`route_table`] for each output in `outs`, with a progress bar of the select values
/// decided over all of them where the host draws progress (`crate::host`) when `progress`.
pub fn route_tables(
    d: &Design,
    outs: &[usize],
    bus: &str,
    sel: &[usize],
    constraint: Lit,
    limits: &Limits,
    progress: bool,
) -> Vec<RouteTable> {
    let values = 1u64 << sel.len();
    let bar = crate::host::counted_bar(
        progress,
        "route tables",
        "select values",
        values * outs.len() as u64,
    );
    let tables = outs
        .iter()
        .map(|&k| {
            table(d, k, bus, sel, constraint, limits, true, &|n| {
                bar.inc(n as u64)
            })
        })
        .collect();
    bar.finish_and_clear();
    tables
}

/// [`route_table`], with or without the structural shortcut (`fold`; without it every route
/// is asked of the solver, as the tests compare); `done(n)` after each chunk of `n` values.
#[allow(clippy::too_many_arguments)]
fn table(
    d: &Design,
    out: usize,
    bus: &str,
    sel: &[usize],
    constraint: Lit,
    limits: &Limits,
    fold: bool,
    done: &dyn Fn(usize),
) -> RouteTable {
    let values = 1usize << sel.len();
    let o = d.outputs[out].lit;
    let data: Vec<usize> = (0..d.inputs.len()).filter(|k| !sel.contains(k)).collect();
    let mut sat = Sat::new(limits);
    let mut ts = Tseitin::new();
    let co = ts.lit(&d.aig, &mut sat, o);
    let cc = ts.lit(&d.aig, &mut sat, constraint);
    let sel_lits: Vec<_> = sel
        .iter()
        .map(|&k| ts.lit(&d.aig, &mut sat, d.aig.input_lit(k)))
        .collect();
    let mut routes = Vec::with_capacity(values);
    let mut folder = fold::Folder::new(&d.aig, &[o, constraint], sel);
    // Simulate in chunks of select values, one word (64 patterns) per value.
    const CHUNK: usize = 256;
    let mut v0 = 0;
    while v0 < values {
        let n = CHUNK.min(values - v0);
        if limits.expired() {
            // The time is up: the rest is undecided, without simulating or solving.
            routes.resize(
                values,
                Route::Undecided {
                    reason: StopReason::Timeout,
                },
            );
            break;
        }
        // Routes that folding decides need no simulation or solver; the chunk is simulated
        // only when some value is left for the solver.
        let quick: Vec<Option<Route>> = (v0..v0 + n)
            .map(|v| {
                fold.then(|| folded(&mut folder, d, v, o, constraint))
                    .flatten()
            })
            .collect();
        if quick.iter().all(Option::is_some) {
            routes.extend(quick.into_iter().flatten());
            v0 += n;
            done(n);
            continue;
        }
        let mut ins = random_words(d.inputs.len(), n, 0x5e1ec7 ^ v0 as u64);
        for (j, &k) in sel.iter().enumerate() {
            for (w, word) in ins[k].iter_mut().enumerate() {
                *word = if ((v0 + w) >> j) & 1 == 1 {
                    u64::MAX
                } else {
                    0
                };
            }
        }
        let t = simulate(&d.aig, &ins, n);
        for (w, quick) in quick.into_iter().enumerate() {
            let v = v0 + w;
            if let Some(r) = quick {
                routes.push(r);
                continue;
            }
            if limits.expired() {
                routes.push(Route::Undecided {
                    reason: StopReason::Timeout,
                });
                continue;
            }
            let assume: Vec<_> = sel_lits
                .iter()
                .enumerate()
                .map(|(j, &l)| if (v >> j) & 1 == 1 { l } else { !l })
                .collect();
            let ok = t.lit_word(constraint, w);
            let ow = t.lit_word(o, w);
            routes.push(decide(
                &mut sat, &mut ts, d, &data, &assume, cc, co, ok, ow, &ins, w,
            ));
        }
        v0 += n;
        done(n);
    }
    RouteTable {
        output: d.outputs[out].name.clone(),
        select: bus.to_string(),
        routes,
    }
}

/// The route of select value `v` when folding the cone with the select bits fixed decides it
/// (see [`fold`]): the assumption's constraint folds to a constant and, where it is true, the
/// output to a constant or one input literal. The same answer the solver would give, since
/// the other inputs are then free.
fn folded(f: &mut fold::Folder, d: &Design, v: usize, o: Lit, constraint: Lit) -> Option<Route> {
    f.fold(&d.aig, v);
    match f.value(constraint)? {
        Lit::FALSE => return Some(Route::Excluded),
        Lit::TRUE => {}
        _ => return None,
    }
    let l = f.value(o)?;
    if l.is_const() {
        return Some(Route::Constant {
            value: l == Lit::TRUE,
        });
    }
    match d.aig.node(l.node()) {
        crate::aig::Node::Input(k) => Some(Route::Input {
            name: d.inputs[k as usize].name.clone(),
            inverted: l.is_complemented(),
        }),
        _ => None,
    }
}

#[allow(clippy::too_many_arguments)]
fn decide(
    sat: &mut Sat,
    ts: &mut Tseitin,
    d: &Design,
    data: &[usize],
    assume: &[crate::sat::CLit],
    cc: crate::sat::CLit,
    co: crate::sat::CLit,
    ok: u64,
    ow: u64,
    ins: &[Vec<u64>],
    w: usize,
) -> Route {
    let mut with = assume.to_vec();
    with.push(cc);
    // Is the select value allowed at all?
    match sat.solve(&with) {
        SatResult::Unsat => return Route::Excluded,
        SatResult::Stopped(r) => return Route::Undecided { reason: r },
        SatResult::Sat => {}
    }
    // Candidates agreeing with the output on every simulated pattern that meets the constraint.
    let mut candidates: Vec<(Option<usize>, bool)> = Vec::new();
    if ow & ok == 0 {
        candidates.push((None, false));
    }
    if !ow & ok == 0 {
        candidates.push((None, true));
    }
    for &k in data {
        let iw = ins[k][w];
        if (iw ^ ow) & ok == 0 {
            candidates.push((Some(k), false));
        } else if (!iw ^ ow) & ok == 0 {
            candidates.push((Some(k), true));
        }
    }
    for (k, inv) in candidates {
        // Prove out == target under the select value: UNSAT of out XOR target.
        let target = match k {
            None => {
                let f = ts.lit(&d.aig, sat, Lit::FALSE);
                if inv {
                    !f
                } else {
                    f
                }
            }
            Some(k) => {
                let l = ts.lit(&d.aig, sat, d.aig.input_lit(k));
                if inv {
                    !l
                } else {
                    l
                }
            }
        };
        let act = sat.fresh();
        crate::cnf::xor_if(sat, act, co, target);
        let mut q = with.clone();
        q.push(act);
        let r = sat.solve(&q);
        sat.clause(&[!act]);
        match r {
            SatResult::Unsat => {
                return match k {
                    None => Route::Constant { value: inv },
                    Some(k) => Route::Input {
                        name: d.inputs[k].name.clone(),
                        inverted: inv,
                    },
                }
            }
            SatResult::Sat => continue,
            SatResult::Stopped(r) => return Route::Undecided { reason: r },
        }
    }
    Route::Mixed
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::front::bench::read_bench;
    use std::sync::Arc;

    #[test]
    fn mux4_routes_each_value_to_its_channel() {
        let text = "INPUT(s[0])\nINPUT(s[1])\nINPUT(d[0])\nINPUT(d[1])\nINPUT(d[2])\nINPUT(d[3])\nOUTPUT(y)\n\
                    n0 = NOT(s[0])\nn1 = NOT(s[1])\nt0 = AND(d[0], n1, n0)\nt1 = AND(d[1], n1, s[0])\n\
                    t2 = AND(d[3], s[1], n0)\nt3 = NOR(s[1], s[0])\ny = OR(t0, t1, t2)\n";
        let d = read_bench(&Arc::from("m.bench"), text).unwrap();
        let sel = select_bits(&d, "s").unwrap();
        let t = route_table(&d, 0, "s", &sel, Lit::TRUE, &Limits::none());
        let texts: Vec<String> = t.routes.iter().map(|r| r.text()).collect();
        assert_eq!(texts, vec!["d[0]", "d[1]", "d[3]", "0"]);
        // Issue 13 B2: a spent deadline leaves every value undecided instead of running on.
        let spent = Limits::new(Some(std::time::Duration::from_nanos(1)), None);
        std::thread::sleep(std::time::Duration::from_millis(2));
        let t = route_table(&d, 0, "s", &sel, Lit::TRUE, &spent);
        assert!(t.routes.iter().all(|r| matches!(
            r,
            Route::Undecided {
                reason: StopReason::Timeout
            }
        )));
    }

    /// Folding the cone under each select value gives the tables the solver gives, on the
    /// demo's selectors (a one-line spec, a tree with a decoder stage, a crossed revision) and
    /// on a mixed output, with the assumption `sel < 12` excluding values.
    #[test]
    fn folding_agrees_with_the_solver() {
        let files = [
            ("spec.v", include_str!("../demo/files/t7_sensor_sel_spec.v")),
            ("r2.v", include_str!("../demo/files/t7_sensor_sel_r2.v")),
            ("r3.v", include_str!("../demo/files/t7_sensor_sel_r3.v")),
        ];
        let mut folded_any = 0;
        for (name, text) in files {
            let d =
                crate::front::verilog::read_verilog(&[(Arc::from(name), text.to_string())], None)
                    .unwrap();
            let sel = select_bits(&d, "sel").unwrap();
            // sel < 12: not (sel[3] and sel[2]), built in the design's own graph.
            let (s2, s3) = (d.aig.input_lit(sel[2]), d.aig.input_lit(sel[3]));
            let mut d = d;
            let lt12 = !d.aig.and(s2, s3);
            for constraint in [Lit::TRUE, lt12] {
                for out in 0..d.outputs.len() {
                    let limits = Limits::none();
                    let a = table(&d, out, "sel", &sel, constraint, &limits, true, &|_| {});
                    let b = table(&d, out, "sel", &sel, constraint, &limits, false, &|_| {});
                    assert_eq!(a, b, "{name} output {out}");
                    let mut f = fold::Folder::new(&d.aig, &[d.outputs[out].lit, constraint], &sel);
                    folded_any += (0..16)
                        .filter(|&v| {
                            folded(&mut f, &d, v, d.outputs[out].lit, constraint).is_some()
                        })
                        .count();
                }
            }
        }
        assert!(folded_any > 0, "the shortcut never applied");
        // An output that follows no single input stays with the solver: `mixed`.
        let text = "INPUT(s)\nINPUT(a)\nINPUT(b)\nOUTPUT(y)\nt = AND(a, b)\ny = AND(t, s)\n";
        let d = read_bench(&Arc::from("m.bench"), text).unwrap();
        let sel = select_bits(&d, "s").unwrap();
        let t = route_table(&d, 0, "s", &sel, Lit::TRUE, &Limits::none());
        let texts: Vec<String> = t.routes.iter().map(|r| r.text()).collect();
        assert_eq!(texts, vec!["0", "mixed"]);
    }
}
