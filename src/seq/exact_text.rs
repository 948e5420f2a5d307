//! The text form of the exact cone across registers ([`super::exact::ExactCones`]): one line
//! per output with each input's first latency, `never` or the bound, then the dead registers.

use super::exact::{ExactCones, Influence};

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
            let gs: Vec<String> = self.register_groups.iter().map(|g| g.join(" = ")).collect();
            writeln!(
                f,
                "  register pairs proved in every reachable state: {}",
                gs.join("; ")
            )?;
        }
        for c in &self.outputs {
            let ins: Vec<String> = c
                .inputs
                .iter()
                .map(|i| match i.influence {
                    Influence::Depends => format!(
                        "{}@{}{}",
                        i.input,
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
                    Influence::Never => format!("{} never", i.input),
                    Influence::NotWithinBound => format!(
                        "{} not in the first {} cycles (not proved after)",
                        i.input, self.cycles
                    ),
                    Influence::Undecided => format!("{} undecided", i.input),
                })
                .collect();
            writeln!(
                f,
                "  {}: {}",
                c.output,
                if ins.is_empty() {
                    "no inputs".to_string()
                } else {
                    ins.join(", ")
                }
            )?;
        }
        if self.dead_registers.is_empty() {
            writeln!(f, "dead registers (exact, every cycle): none")?;
        } else {
            let ds: Vec<String> = self
                .dead_registers
                .iter()
                .map(|d| format!("{} ({})", d.register, d.why))
                .collect();
            writeln!(
                f,
                "dead registers (exact, every cycle; {}): {}",
                ds.len(),
                ds.join(", ")
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

fn bound_words(b: Option<usize>) -> String {
    match b {
        Some(l) => format!("@{l}"),
        None => "none".to_string(),
    }
}
