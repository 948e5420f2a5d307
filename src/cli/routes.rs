//! `equicone routes`: for each value of a select bus, which data input each output follows.

use super::common::{print, report_input_error, DesignArgs};
use super::Exit;
use crate::report;
use crate::routes::{self, Route, RouteTable};
use crate::sat::Limits;
use clap::Args;
use serde::Serialize;

/// Options of `routes`.
#[derive(Args, Debug)]
pub struct RoutesArgs {
    #[command(flatten)]
    design: DesignArgs,
    /// The select bus (an input port name).
    #[arg(long, value_name = "BUS")]
    select: String,
    /// Only these output bits or buses (repeatable; default: all outputs).
    #[arg(long = "output", value_name = "NAME")]
    outputs: Vec<String>,
    /// Only select values (and inputs) where this Verilog expression holds, e.g. `sel < 12`
    /// (repeatable: all must hold).
    #[arg(long, value_name = "EXPR")]
    assume: Vec<String>,
    /// Print the result as JSON.
    #[arg(long)]
    json: bool,
}

#[derive(Serialize)]
struct RoutesReport {
    design: String,
    select: String,
    select_bits: usize,
    assumptions: Vec<String>,
    tables: Vec<TableJson>,
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
    let d = match a.design.load() {
        Ok(d) => d,
        Err(e) => return e,
    };
    let (d, constraint) = match crate::assume::on_design(&d, &a.assume) {
        Ok(x) => x,
        Err(e) => return report_input_error(&e),
    };
    let sel = match routes::select_bits(&d, &a.select) {
        Ok(s) => s,
        Err(e) => return report_input_error(&e),
    };
    let outs = match pick_outputs(&d, &a.outputs) {
        Ok(o) => o,
        Err(e) => return report_input_error(&e),
    };
    let limits = Limits::none();
    let tables: Vec<RouteTable> = outs
        .iter()
        .map(|&k| routes::route_table(&d, k, &a.select, &sel, constraint, &limits))
        .collect();
    let undecided = tables.iter().any(|t| {
        t.routes
            .iter()
            .any(|r| matches!(r, Route::Undecided { .. }))
    });
    if a.json {
        let rep = RoutesReport {
            design: d.name.clone(),
            select: a.select.clone(),
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
        };
        print(&report::to_json(&rep));
    } else {
        let mut s = format!(
            "design   {}\nselect   {} ({} bit{}, {} values)\nroutes (each proved by SAT for its select value; ~ marks an inverted route)\n",
            d.name,
            a.select,
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
        print(&s);
    }
    if undecided {
        Exit::Undecided
    } else {
        Exit::Ok
    }
}
