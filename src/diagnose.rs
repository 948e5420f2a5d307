//! Diagnosis of a difference: for selector-like output pairs that differ, both designs' route
//! tables over the select bus side by side, with the select values whose routes differ.

use crate::aig::Lit;
use crate::design::Design;
use crate::engine::{ProveReport, Verdict};
use crate::routes::{self, Route};
use crate::sat::Limits;
use serde::Serialize;

/// Route tables of one differing output pair.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct RouteDiff {
    /// Reference output bit.
    pub reference: String,
    /// Candidate output bit.
    pub candidate: String,
    /// Reference route per select value.
    pub reference_routes: Vec<Route>,
    /// Candidate route per select value.
    pub candidate_routes: Vec<Route>,
    /// Select values whose routes differ.
    pub differing_values: Vec<usize>,
}

/// What the diagnosis found.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Diagnosis {
    /// The select bus used for route tables.
    pub select: String,
    /// One entry per differing output pair (at most [`MAX_TABLES`]).
    pub routes: Vec<RouteDiff>,
}

/// Route tables are built for at most this many differing output pairs.
pub const MAX_TABLES: usize = 16;

/// Bus names tried when no select bus is named.
const USUAL_SELECTS: [&str; 4] = ["sel", "s", "select", "addr"];

/// The select bus to use: `named`, or a usual name present in both designs.
pub fn pick_select(r: &Design, c: &Design, named: Option<&str>) -> Option<String> {
    let ok = |bus: &str| routes::select_bits(r, bus).is_ok() && routes::select_bits(c, bus).is_ok();
    match named {
        Some(b) => ok(b).then(|| b.to_string()),
        None => USUAL_SELECTS.iter().find(|b| ok(b)).map(|b| b.to_string()),
    }
}

/// Build the route-table comparison for the differing pairs of `rep`. `constraints` are the
/// assumption literals of each design's own AIG (`Lit::TRUE` when none).
pub fn diagnose(
    r: &Design,
    c: &Design,
    rep: &ProveReport,
    select: &str,
    constraints: (Lit, Lit),
    limits: &Limits,
) -> Option<Diagnosis> {
    if rep.verdict != Verdict::Different {
        return None;
    }
    let rs = routes::select_bits(r, select).ok()?;
    let cs = routes::select_bits(c, select).ok()?;
    if rs.len() != cs.len() {
        return None;
    }
    let mut out = Vec::new();
    for p in rep
        .pairs
        .iter()
        .filter(|p| p.status == Verdict::Different)
        .take(MAX_TABLES)
    {
        let ri = r.output_index(&p.reference)?;
        let ci = c.output_index(&p.candidate)?;
        let rt = routes::route_table(r, ri, select, &rs, constraints.0, limits);
        let ct = routes::route_table(c, ci, select, &cs, constraints.1, limits);
        let differing_values = (0..rt.routes.len())
            .filter(|&v| {
                !matches!(rt.routes[v], Route::Excluded)
                    && !matches!(ct.routes[v], Route::Excluded)
                    && rt.routes[v] != ct.routes[v]
            })
            .collect();
        out.push(RouteDiff {
            reference: p.reference.clone(),
            candidate: p.candidate.clone(),
            reference_routes: rt.routes,
            candidate_routes: ct.routes,
            differing_values,
        });
    }
    Some(Diagnosis {
        select: select.to_string(),
        routes: out,
    })
}

/// Text form: both tables compressed, then every differing select value marked with `!`.
pub fn diagnosis_text(d: &Diagnosis) -> String {
    let mut s = format!(
        "\nroute tables over `{}` for the differing outputs (each route proved by SAT)\n",
        d.select
    );
    for t in &d.routes {
        let label = if t.reference == t.candidate {
            t.reference.clone()
        } else {
            format!("{} ~ {}", t.reference, t.candidate)
        };
        s += &format!("  {label}\n");
        let rr = routes::render(&d.select, &routes::compress(&t.reference_routes));
        let cr = routes::render(&d.select, &routes::compress(&t.candidate_routes));
        s += &format!("    reference  {}\n", rr.join("; "));
        s += &format!("    candidate  {}\n", cr.join("; "));
        for &v in &t.differing_values {
            s += &format!(
                "    {} {v}: reference {}, candidate {}  !\n",
                d.select,
                t.reference_routes[v].text(),
                t.candidate_routes[v].text()
            );
        }
    }
    s
}
