//! Shared helpers of the trust tests: a scratch folder, file writing, standard streams.

pub use crate::runner::{code, equicone};
use std::path::PathBuf;
use std::process::Output;

/// A fresh scratch folder for one test.
pub fn scratch(name: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("equicone-trust-{}-{name}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).unwrap();
    d
}

/// Write `text` to `dir/name` and return the path as text.
pub fn write(dir: &std::path::Path, name: &str, text: &str) -> String {
    let p = dir.join(name);
    std::fs::write(&p, text).unwrap();
    p.to_str().unwrap().to_string()
}

pub fn stdout(o: &Output) -> String {
    String::from_utf8_lossy(&o.stdout).into_owned()
}

pub fn stderr(o: &Output) -> String {
    String::from_utf8_lossy(&o.stderr).into_owned()
}

/// Solve a DIMACS text with batsat (a second SAT solver, from crates.io): true when satisfiable.
pub fn batsat_satisfiable(text: &str) -> bool {
    use batsat::{lbool, BasicSolver, Lit, SolverInterface};
    let mut s = BasicSolver::default();
    let mut vars = Vec::new();
    for line in text
        .lines()
        .filter(|l| !l.starts_with('c') && !l.starts_with('p'))
    {
        let mut clause: Vec<Lit> = Vec::new();
        for t in line
            .split_whitespace()
            .map(|t| t.parse::<i64>().unwrap())
            .take_while(|&t| t != 0)
        {
            while vars.len() < t.unsigned_abs() as usize {
                vars.push(s.new_var_default());
            }
            clause.push(Lit::new(vars[t.unsigned_abs() as usize - 1], t > 0));
        }
        s.add_clause_reuse(&mut clause);
    }
    s.solve_limited(&[]) == lbool::TRUE
}
