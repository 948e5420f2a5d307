//! The text form of the exact cone across registers ([`super::exact::ExactCones`]): one line
//! per output with each input's first latency, `never` or the bound, then the dead registers.

use super::exact::{ExactCones, ExactInput, Influence};
use crate::bitrun::{extends, input_list, join_runs, run_label, run_name};

impl std::fmt::Display for ExactCones {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        writeln!(
            f,
            "across clock cycles (exact, from reset, {} cycles unrolled): per output, each input with the first latency at which it changes the output",
            self.cycles
        )?;
        if !self.held.is_empty() {
            let hs: Vec<String> = self
                .held
                .iter()
                .map(|h| format!("{}={} ({})", h.name, u8::from(h.value), h.role))
                .collect();
            writeln!(f, "  held, not analysed: {}", hs.join(", "))?;
        }
        if !self.register_groups.is_empty() {
            writeln!(
                f,
                "  register pairs proved in every reachable state: {}",
                group_lines(&self.register_groups).join("; ")
            )?;
        }
        let lines: Vec<(String, String)> = self
            .outputs
            .iter()
            .map(|c| {
                let ins = c.inputs.iter().map(|i| (i.input.clone(), self.tail(i)));
                (c.output.clone(), format!(": {}", input_list(ins.collect())))
            })
            .collect();
        for line in join_runs(&lines, run_label) {
            writeln!(f, "  {line}")?;
        }
        if self.dead_registers.is_empty() {
            writeln!(f, "dead registers (exact, every cycle): none")?;
        } else {
            // In the design's register order, runs of one bus with the same reason joined.
            let ds: Vec<(String, String)> = self
                .dead_registers
                .iter()
                .map(|d| (d.register.clone(), format!(" ({})", d.why)))
                .collect();
            writeln!(
                f,
                "dead registers (exact, every cycle; {}): {}",
                ds.len(),
                join_runs(&ds, run_name).join(", ")
            )?;
        }
        if self.undecided > 0 {
            writeln!(
                f,
                "  {} of {} claims undecided (a limit stopped them)",
                self.undecided, self.claims
            )?;
        }
        Ok(())
    }
}

impl ExactCones {
    /// What follows an input's name: `@2`, ` never`, ...
    fn tail(&self, i: &ExactInput) -> String {
        match i.influence {
            Influence::Depends => format!(
                "@{}{}",
                i.first_latency.unwrap_or(0),
                if i.proved_first {
                    String::new()
                } else {
                    format!(
                        " (the least in the first {} cycles; {} not ruled out later)",
                        self.cycles,
                        bound_words(i.lower_bound)
                    )
                }
            ),
            Influence::Never => " never".to_string(),
            Influence::NotWithinBound => {
                format!(
                    " not in the first {} cycles (not proved after)",
                    self.cycles
                )
            }
            Influence::Undecided => " undecided".to_string(),
        }
    }
}

/// The register groups, consecutive groups whose members are runs of bits joined
/// (`q[0..7] = ~p[0..7]` for eight groups `q[i] = ~p[i]`), and a group that is one run of
/// one bus written `r[0..7] (all equal)`.
fn group_lines(groups: &[Vec<String>]) -> Vec<String> {
    // A member as (`~` or ``, name); constants stay as they are.
    let split = |m: &str| -> (bool, String) {
        match m.strip_prefix('~') {
            Some(n) => (true, n.to_string()),
            None => (false, m.to_string()),
        }
    };
    let mut out = Vec::new();
    let mut i = 0;
    while i < groups.len() {
        let first: Vec<(bool, String)> = groups[i].iter().map(|m| split(m)).collect();
        // Per member position, the run of names so far.
        let mut cols: Vec<Vec<String>> = first.iter().map(|(_, n)| vec![n.clone()]).collect();
        let mut j = i + 1;
        while j < groups.len() && groups[j].len() == first.len() {
            let next: Vec<(bool, String)> = groups[j].iter().map(|m| split(m)).collect();
            let fits = next.iter().zip(&first).zip(&cols).all(|((m, f), col)| {
                let run: Vec<&str> = col.iter().map(String::as_str).collect();
                m.0 == f.0 && (is_const(&m.1) && m.1 == f.1 || extends(&run, &m.1))
            });
            if !fits {
                break;
            }
            for (col, m) in cols.iter_mut().zip(next) {
                if !is_const(&m.1) {
                    col.push(m.1);
                }
            }
            j += 1;
        }
        let members: Vec<String> = first
            .iter()
            .zip(&cols)
            .map(|((inv, _), col)| {
                let run: Vec<&str> = col.iter().map(String::as_str).collect();
                format!("{}{}", if *inv { "~" } else { "" }, run_name(&run))
            })
            .collect();
        // Within the group, a run of one bus (all equal, none inverted).
        let inner: Vec<(String, String)> = if j == i + 1 {
            first
                .iter()
                .map(|(inv, n)| (n.clone(), if *inv { "~" } else { "" }.to_string()))
                .collect()
        } else {
            Vec::new()
        };
        let joined = join_runs(&inner, run_name);
        if inner.len() > 1 && joined.len() == 1 && inner.iter().all(|(_, t)| t.is_empty()) {
            out.push(format!("{} (all equal)", joined[0]));
        } else {
            out.push(members.join(" = "));
        }
        i = j;
    }
    out
}

fn is_const(m: &str) -> bool {
    m == "0" || m == "1"
}

fn bound_words(b: Option<usize>) -> String {
    match b {
        Some(l) => format!("@{l}"),
        None => "none".to_string(),
    }
}
