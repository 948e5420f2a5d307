//! Independent oracles for the tests: the one bench-text reader and evaluator of the tests (one
//! vector by name here, 64 patterns per word through [`sim::Evaluator`]) and a miter solved by a
//! second SAT solver (the `batsat` crate from crates.io, a MiniSat reimplementation), written directly
//! from the gate lines without any of equicone's code, plus the location of the shared
//! benchmark data and the tests' one random-circuit generator (`random.rs`).

#![allow(dead_code)]

pub mod random;

use std::collections::HashMap;
use std::path::PathBuf;

/// The folder `bench-data/SUB` of the shared data (beside the checkout, or where
/// `EQUICONE_SHARED_DIR` says), recognized by its file `probe`; `None` with a loud SKIPPED note
/// when it is absent. With `EQUICONE_REQUIRE_SHARED=1` absence is a failure, as CI requires.
/// The tests' one locator of the shared data.
pub fn shared_data(sub: &str, probe: &str) -> Option<PathBuf> {
    let shared = std::env::var_os("EQUICONE_SHARED_DIR")
        .map(PathBuf::from)
        .unwrap_or_else(|| PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("../shared"));
    let dir = shared.join("bench-data").join(sub);
    if dir.join(probe).is_file() {
        return Some(dir);
    }
    if std::env::var("EQUICONE_REQUIRE_SHARED").as_deref() == Ok("1") {
        panic!(
            "EQUICONE_REQUIRE_SHARED=1 but the shared data is missing at {}",
            dir.display()
        );
    }
    eprintln!("SKIPPED: shared data not found at {} (set EQUICONE_REQUIRE_SHARED=1 to make this a failure)", dir.display());
    None
}

/// The ISCAS-85 folder of the shared data ([`shared_data`]).
pub fn iscas_dir() -> Option<PathBuf> {
    shared_data("iscas85", "c17.bench")
}

/// A bench netlist as plain data: inputs, outputs, and gates by output name.
#[derive(Clone, Debug)]
pub struct Net {
    pub inputs: Vec<String>,
    pub outputs: Vec<String>,
    pub gates: Vec<(String, String, Vec<String>)>,
}

/// Parse bench text with plain string operations (no equicone code).
pub fn parse(text: &str) -> Net {
    let mut n = Net {
        inputs: vec![],
        outputs: vec![],
        gates: vec![],
    };
    for line in text.lines() {
        let line = line.split('#').next().unwrap().trim();
        if line.is_empty() {
            continue;
        }
        let inner = |l: &str| {
            l[l.find('(').unwrap() + 1..l.rfind(')').unwrap()]
                .trim()
                .to_string()
        };
        if line.to_ascii_uppercase().starts_with("INPUT") {
            n.inputs.push(inner(line));
        } else if line.to_ascii_uppercase().starts_with("OUTPUT") {
            n.outputs.push(inner(line));
        } else {
            let (lhs, rhs) = line.split_once('=').unwrap();
            let kind = rhs[..rhs.find('(').unwrap()].trim().to_ascii_uppercase();
            let args = inner(rhs)
                .split(',')
                .map(|s| s.trim().to_string())
                .collect();
            n.gates.push((lhs.trim().to_string(), kind, args));
        }
    }
    n
}

fn apply(kind: &str, v: &[bool]) -> bool {
    match kind {
        "AND" => v.iter().all(|&x| x),
        "NAND" => !v.iter().all(|&x| x),
        "OR" => v.iter().any(|&x| x),
        "NOR" => !v.iter().any(|&x| x),
        "XOR" => v.iter().filter(|&&x| x).count() % 2 == 1,
        "XNOR" => v.iter().filter(|&&x| x).count() % 2 == 0,
        "NOT" => !v[0],
        "BUF" | "BUFF" => v[0],
        k => panic!("oracle: unknown gate {k}"),
    }
}

impl Net {
    /// Gates in an order where every fan-in comes first (Kahn's algorithm).
    pub fn order(&self) -> Vec<usize> {
        let idx: HashMap<&str, usize> = self
            .gates
            .iter()
            .enumerate()
            .map(|(i, g)| (g.0.as_str(), i))
            .collect();
        let mut indeg = vec![0usize; self.gates.len()];
        let mut users: Vec<Vec<usize>> = vec![vec![]; self.gates.len()];
        for (i, g) in self.gates.iter().enumerate() {
            for a in &g.2 {
                if let Some(&j) = idx.get(a.as_str()) {
                    indeg[i] += 1;
                    users[j].push(i);
                }
            }
        }
        let mut ready: Vec<usize> = (0..self.gates.len()).filter(|&i| indeg[i] == 0).collect();
        let mut out = vec![];
        while let Some(i) = ready.pop() {
            out.push(i);
            for &u in &users[i] {
                indeg[u] -= 1;
                if indeg[u] == 0 {
                    ready.push(u);
                }
            }
        }
        assert_eq!(out.len(), self.gates.len(), "oracle: cycle");
        out
    }

    /// Output values for one input assignment (by name).
    pub fn eval(&self, inputs: &HashMap<String, bool>) -> Vec<bool> {
        let mut val: HashMap<&str, bool> = self
            .inputs
            .iter()
            .map(|i| (i.as_str(), inputs[i]))
            .collect();
        for i in self.order() {
            let (name, kind, args) = &self.gates[i];
            let v: Vec<bool> = args.iter().map(|a| val[a.as_str()]).collect();
            val.insert(name, apply(kind, &v));
        }
        self.outputs.iter().map(|o| val[o.as_str()]).collect()
    }
}

/// Decide with batsat whether two nets (outputs and inputs paired by position) differ; returns a
/// distinguishing assignment of the first net's input names, or `None` when they are equivalent.
pub fn batsat_differs(a: &Net, b: &Net) -> Option<HashMap<String, bool>> {
    use batsat::{lbool, SolverInterface};
    let mut m = BatsatMiter::new(a, b);
    let any = m.differs.clone();
    m.solver.add_clause_reuse(&mut any.clone());
    let r = m.solver.solve_limited(&[]);
    if r == lbool::FALSE {
        return None;
    }
    assert_eq!(r, lbool::TRUE, "batsat gave no answer");
    Some(m.model(a))
}

/// Per output pair (by position): `None` when batsat proves the pair equal (UNSAT), else a
/// distinguishing assignment of the first net's input names. One solver, one query per pair
/// under the assumption that this pair's XOR is true.
pub fn batsat_per_output(a: &Net, b: &Net) -> Vec<Option<HashMap<String, bool>>> {
    use batsat::{lbool, SolverInterface};
    let mut m = BatsatMiter::new(a, b);
    (0..m.differs.len())
        .map(|k| {
            let d = m.differs[k];
            let r = m.solver.solve_limited(&[d]);
            if r == lbool::FALSE {
                return None;
            }
            assert_eq!(r, lbool::TRUE, "batsat gave no answer");
            Some(m.model(a))
        })
        .collect()
}

/// Both nets encoded in one batsat solver (Tseitin, written from the gate lines), sharing
/// input variables, with one literal per output pair that is true exactly when the pair
/// differs.
struct BatsatMiter {
    solver: batsat::BasicSolver,
    inputs: Vec<batsat::Lit>,
    differs: Vec<batsat::Lit>,
}

impl BatsatMiter {
    fn new(a: &Net, b: &Net) -> BatsatMiter {
        use batsat::{BasicSolver, Lit, SolverInterface};
        let mut s = BasicSolver::default();
        let inputs: Vec<Lit> = a
            .inputs
            .iter()
            .map(|_| Lit::new(s.new_var_default(), true))
            .collect();
        let encode = |s: &mut BasicSolver, n: &Net| -> Vec<Lit> {
            let mut lit: HashMap<&str, Lit> = n
                .inputs
                .iter()
                .zip(&inputs)
                .map(|(i, &l)| (i.as_str(), l))
                .collect();
            for gi in n.order() {
                let (name, kind, args) = &n.gates[gi];
                let ins: Vec<Lit> = args.iter().map(|x| lit[x.as_str()]).collect();
                let z = Lit::new(s.new_var_default(), true);
                let (base, neg) = match kind.as_str() {
                    "NAND" => ("AND", true),
                    "NOR" => ("OR", true),
                    "XNOR" => ("XOR", true),
                    "NOT" => ("BUF", true),
                    "BUFF" => ("BUF", false),
                    k => (k, false),
                };
                let out = if neg { !z } else { z };
                match base {
                    "AND" => {
                        let mut big = vec![out];
                        for &x in &ins {
                            s.add_clause_reuse(&mut vec![!out, x]);
                            big.push(!x);
                        }
                        s.add_clause_reuse(&mut big);
                    }
                    "OR" => {
                        let mut big = vec![!out];
                        for &x in &ins {
                            s.add_clause_reuse(&mut vec![out, !x]);
                            big.push(x);
                        }
                        s.add_clause_reuse(&mut big);
                    }
                    "BUF" => {
                        s.add_clause_reuse(&mut vec![!out, ins[0]]);
                        s.add_clause_reuse(&mut vec![out, !ins[0]]);
                    }
                    "XOR" => {
                        // Chain of two-input XORs.
                        let mut acc = ins[0];
                        for &x in &ins[1..] {
                            let t = Lit::new(s.new_var_default(), true);
                            s.add_clause_reuse(&mut vec![!t, acc, x]);
                            s.add_clause_reuse(&mut vec![!t, !acc, !x]);
                            s.add_clause_reuse(&mut vec![t, !acc, x]);
                            s.add_clause_reuse(&mut vec![t, acc, !x]);
                            acc = t;
                        }
                        s.add_clause_reuse(&mut vec![!out, acc]);
                        s.add_clause_reuse(&mut vec![out, !acc]);
                    }
                    k => panic!("oracle: unknown gate {k}"),
                }
                lit.insert(name, z);
            }
            n.outputs.iter().map(|o| lit[o.as_str()]).collect()
        };
        let oa = encode(&mut s, a);
        let ob = encode(&mut s, b);
        let mut differs = vec![];
        for (&x, &y) in oa.iter().zip(&ob) {
            // d <-> (x xor y)
            let d = Lit::new(s.new_var_default(), true);
            s.add_clause_reuse(&mut vec![!d, x, y]);
            s.add_clause_reuse(&mut vec![!d, !x, !y]);
            s.add_clause_reuse(&mut vec![d, !x, y]);
            s.add_clause_reuse(&mut vec![d, x, !y]);
            differs.push(d);
        }
        BatsatMiter {
            solver: s,
            inputs,
            differs,
        }
    }

    /// The model's values of the first net's inputs, by name.
    fn model(&self, a: &Net) -> HashMap<String, bool> {
        use batsat::{lbool, SolverInterface};
        a.inputs
            .iter()
            .zip(&self.inputs)
            .map(|(n, &l)| (n.clone(), self.solver.value_lit(l) == lbool::TRUE))
            .collect()
    }
}

pub mod drat;
pub mod sim;
