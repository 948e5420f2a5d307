//! A small independent DRAT checker (forward, RUP only): every added clause must follow from
//! the clauses present by unit propagation, and the empty clause must be derived. Written for
//! these tests from the DRAT definition (Wetzler, Heule and Hunt, SAT 2014); no solver code.

use std::collections::HashMap;

/// Parse DIMACS clauses (comment and header lines skipped).
pub fn parse_cnf(text: &str) -> Vec<Vec<i64>> {
    text.lines()
        .filter(|l| !l.starts_with('c') && !l.starts_with('p') && !l.trim().is_empty())
        .map(|l| {
            l.split_whitespace()
                .map(|t| t.parse::<i64>().unwrap())
                .take_while(|&x| x != 0)
                .collect()
        })
        .collect()
}

fn key(c: &[i64]) -> Vec<i64> {
    let mut k = c.to_vec();
    k.sort_unstable();
    k.dedup();
    k
}

/// Whether `lemma` follows from the live clauses by unit propagation.
fn rup(
    db: &[Vec<i64>],
    alive: &[bool],
    occ: &HashMap<i64, Vec<usize>>,
    lemma: &[i64],
    nvars: usize,
) -> bool {
    // value[v]: 0 unassigned, 1 true, -1 false.
    let mut value = vec![0i8; nvars + 1];
    let mut queue: Vec<i64> = Vec::new();
    let assign = |value: &mut Vec<i8>, queue: &mut Vec<i64>, l: i64| -> bool {
        let v = l.unsigned_abs() as usize;
        let want = if l > 0 { 1 } else { -1 };
        if value[v] == 0 {
            value[v] = want;
            queue.push(l);
            true
        } else {
            value[v] == want
        }
    };
    for &l in lemma {
        if !assign(&mut value, &mut queue, -l) {
            return true;
        }
    }
    for (i, c) in db.iter().enumerate() {
        if alive[i] && c.len() == 1 && !assign(&mut value, &mut queue, c[0]) {
            return true;
        }
        if alive[i] && c.is_empty() {
            return true;
        }
    }
    let mut head = 0;
    while head < queue.len() {
        let l = queue[head];
        head += 1;
        // Clauses containing the literal made false.
        if let Some(list) = occ.get(&-l) {
            for &ci in list {
                if !alive[ci] {
                    continue;
                }
                let mut unassigned = None;
                let mut count = 0;
                let mut sat = false;
                for &x in &db[ci] {
                    let v = value[x.unsigned_abs() as usize];
                    let val = if x > 0 { v } else { -v };
                    if val == 1 {
                        sat = true;
                        break;
                    }
                    if val == 0 {
                        count += 1;
                        unassigned = Some(x);
                    }
                }
                if sat {
                    continue;
                }
                match (count, unassigned) {
                    (0, _) => return true,
                    (1, Some(u)) if !assign(&mut value, &mut queue, u) => return true,
                    _ => {}
                }
            }
        }
    }
    false
}

/// Check a text DRAT proof of `cnf`; returns the number of lemmas checked, or why it failed.
pub fn check(cnf: &str, proof: &str) -> Result<usize, String> {
    let mut db = parse_cnf(cnf);
    let mut nvars = db
        .iter()
        .flatten()
        .map(|x| x.unsigned_abs() as usize)
        .max()
        .unwrap_or(0);
    let mut alive = vec![true; db.len()];
    let mut occ: HashMap<i64, Vec<usize>> = HashMap::new();
    let mut by_key: HashMap<Vec<i64>, Vec<usize>> = HashMap::new();
    for (i, c) in db.iter().enumerate() {
        for &x in c {
            occ.entry(x).or_default().push(i);
        }
        by_key.entry(key(c)).or_default().push(i);
    }
    let mut lemmas = 0;
    for (n, line) in proof.lines().enumerate() {
        let line = line.trim();
        if line.is_empty() {
            continue;
        }
        let (del, body) = match line.strip_prefix('d') {
            Some(rest) => (true, rest),
            None => (false, line),
        };
        let c: Vec<i64> = body
            .split_whitespace()
            .map(|t| t.parse::<i64>().map_err(|e| format!("line {}: {e}", n + 1)))
            .take_while(|x| x != &Ok(0))
            .collect::<Result<_, _>>()?;
        if del {
            if let Some(ids) = by_key.get_mut(&key(&c)) {
                if let Some(i) = ids.pop() {
                    alive[i] = false;
                }
            }
            continue;
        }
        nvars = nvars.max(
            c.iter()
                .map(|x| x.unsigned_abs() as usize)
                .max()
                .unwrap_or(0),
        );
        if !rup(&db, &alive, &occ, &c, nvars) {
            return Err(format!(
                "proof line {}: clause {c:?} is not implied by unit propagation",
                n + 1
            ));
        }
        lemmas += 1;
        if c.is_empty() {
            return Ok(lemmas);
        }
        let i = db.len();
        for &x in &c {
            occ.entry(x).or_default().push(i);
        }
        by_key.entry(key(&c)).or_default().push(i);
        db.push(c);
        alive.push(true);
    }
    // A proof may end when the clauses present already conflict under unit propagation.
    if rup(&db, &alive, &occ, &[], nvars) {
        Ok(lemmas)
    } else {
        Err("the proof ends without deriving the empty clause".into())
    }
}
