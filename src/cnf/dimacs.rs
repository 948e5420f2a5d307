//! DIMACS CNF text output, with comment lines that name variables.

use crate::sat::CLit;
use std::io::{self, Write};

/// Write `formula` in DIMACS CNF, preceded by `comments` (one `c` line each).
pub fn write_dimacs(
    out: &mut impl Write,
    formula: &varisat::CnfFormula,
    comments: &[String],
) -> io::Result<()> {
    for c in comments {
        writeln!(out, "c {c}")?;
    }
    writeln!(out, "p cnf {} {}", formula.var_count(), formula.len())?;
    for clause in formula.iter() {
        for l in clause {
            write!(out, "{} ", l.to_dimacs())?;
        }
        writeln!(out, "0")?;
    }
    Ok(())
}

/// The DIMACS number of a literal.
pub fn dimacs_number(l: CLit) -> isize {
    l.to_dimacs()
}

/// Comment lines recording the assumptions (`--assume`) that the unit clause on `holds`
/// asserts: `assume EXPR` for each, then which literal stands for their conjunction.
pub fn assumption_comments(exprs: &[String], holds: CLit) -> Vec<String> {
    let mut out: Vec<String> = exprs.iter().map(|e| format!("assume {e}")).collect();
    out.push(format!(
        "assumptions {} (asserted by a unit clause: the formula covers only the vectors where they hold)",
        dimacs_number(holds)
    ));
    out
}
