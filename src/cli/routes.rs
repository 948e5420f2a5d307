//! `equicone routes`: for each value of a select bus, which data input each output follows.

use super::common::{print, report_input_error, BudgetArgs, DesignArgs};
use super::Exit;
use crate::report;
use crate::routes::{self, Route, RouteTable};
use clap::Args;
use serde::Serialize;

/// Options of `routes`.
#[derive(Args, Debug)]
pub struct RoutesArgs {
    #[command(flatten)]
    design: DesignArgs,
    /// The select bus (an input port name; default: `sel`, `s`, `select` or `addr`, the first the
    /// design has).
    #[arg(long, value_name = "BUS")]
    select: Option<String>,
    /// Only these output bits or buses (repeatable; default: all outputs).
    #[arg(long = "output", value_name = "NAME")]
    outputs: Vec<String>,
    /// Only select values (and inputs) where this Verilog expression holds, e.g. `sel < 12`
    /// (repeatable: all must hold).
    #[arg(long, value_name = "EXPR")]
    assume: Vec<String>,
    /// `--timeout` and `--conflict-limit`.
    #[command(flatten)]
    budget: BudgetArgs,
    /// Print the result as JSON.
    #[arg(long)]
    json: bool,
}

/// Version of the `routes` JSON report; fields are only ever added within a version.
const ROUTES_SCHEMA: u32 = 1;

#[derive(Serialize)]
struct RoutesReport {
    schema: u32,
    design: String,
    select: String,
    select_bits: usize,
    assumptions: Vec<String>,
    tables: Vec<TableJson>,
    /// Select values left undecided by a limit, over all tables.
    undecided_routes: usize,
}

#[derive(Serialize)]
struct TableJson {
    output: String,
    rows: Vec<routes::Row>,
    routes: Vec<Route>,
}

/// Output indices named by `names` (bits or whole buses); all outputs when empty.
pub fn pick_outputs(d: &crate::Design, names: &[String]) -> Result<Vec<usize>, crate::InputError> {
    if names.is_empty() {
        return Ok((0..d.outputs.len()).collect());
    }
    let mut out = Vec::new();
    for n in names {
        let hits: Vec<usize> = (0..d.outputs.len())
            .filter(|&k| d.outputs[k].name == *n || d.outputs[k].port == *n)
            .collect();
        if hits.is_empty() {
            let ports: Vec<&str> = d.outputs.iter().map(|o| o.name.as_str()).take(16).collect();
            return Err(crate::InputError::plain(
                format!("{} has no output `{n}`", d.name),
                format!("outputs include: {}", ports.join(", ")),
            ));
        }
        out.extend(hits);
    }
    out.dedup();
    Ok(out)
}

/// Text lines of one table: `name  row; row; ...` wrapped per row when long.
pub fn table_text(t: &RouteTable) -> String {
    let rows = routes::render(&t.select, &routes::compress(&t.routes));
    let one = rows.join("; ");
    if one.len() <= 90 {
        format!("  {:10} {one}\n", t.output)
    } else {
        let mut s = format!("  {}\n", t.output);
        for r in rows {
            s += &format!("    {r}\n");
        }
        s
    }
}

/// Run `routes`.
pub fn run(a: &RoutesArgs) -> Exit {
    // The clock starts before reading: --timeout covers the whole run.
    let limits = match a.budget.limits() {
        Ok(l) => l,
        Err(e) => return e,
    };
    let d = match a.design.load_within(&limits) {
        Ok(d) => d,
        Err(e) => return e,
    };
    let (d, constraint) = match crate::assume::on_design(&d, &a.assume) {
        Ok(x) => x,
        Err(e) => return report_input_error(&e),
    };
    let select = match a.select.clone() {
        Some(s) => s,
        None => match crate::diagnose::pick_select(&d, &d, None) {
            Some(s) => s,
            None => {
                return report_input_error(&crate::diag::InputError::plain(
                    "no select bus: the design has none of the usual names `sel`, `s`, `select`, `addr`",
                    "name the select bus with `--select BUS`",
                ))
            }
        },
    };
    let sel = match routes::select_bits(&d, &select) {
        Ok(s) => s,
        Err(e) => return report_input_error(&e),
    };
    let outs = match pick_outputs(&d, &a.outputs) {
        Ok(o) => o,
        Err(e) => return report_input_error(&e),
    };
    let tables: Vec<RouteTable> = outs
        .iter()
        .map(|&k| routes::route_table(&d, k, &select, &sel, constraint, &limits))
        .collect();
    let undecided = tables
        .iter()
        .flat_map(|t| &t.routes)
        .filter(|r| matches!(r, Route::Undecided { .. }))
        .count();
    if a.json {
        let rep = RoutesReport {
            schema: ROUTES_SCHEMA,
            design: d.name.clone(),
            select: select.clone(),
            select_bits: sel.len(),
            assumptions: a.assume.clone(),
            tables: tables
                .iter()
                .map(|t| TableJson {
                    output: t.output.clone(),
                    rows: routes::compress(&t.routes),
                    routes: t.routes.clone(),
                })
                .collect(),
            undecided_routes: undecided,
        };
        print(&report::to_json(&rep));
    } else {
        let mut s = format!(
            "design   {}\nselect   {} ({} bit{}, {} values)\nroutes (each proved for its select value, by constant folding or SAT; ~ marks an inverted route)\n",
            d.name,
            select,
            sel.len(),
            if sel.len() == 1 { "" } else { "s" },
            1usize << sel.len()
        );
        for x in &a.assume {
            s += &format!("assuming {x}\n");
        }
        for t in &tables {
            s += &table_text(t);
        }
        if undecided > 0 {
            s += &format!(
                "undecided: {undecided} route{} (select value and output) stopped by a limit; no claim for them\n",
                if undecided == 1 { "" } else { "s" }
            );
        }
        print(&s);
    }
    if undecided > 0 {
        Exit::Undecided
    } else {
        Exit::Ok
    }
}
