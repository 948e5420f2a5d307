//! Register names as synthesis tools rewrite them: `q_reg[3]`, `q[3]`, `q_3_` and `q_reg_3_`
//! all name bit 3 of `q`; `q_reg` names `q`. Pairing by name compares these normal forms.

/// The normal form of a register bit name.
pub fn normalize(name: &str) -> String {
    let (base, index) = split(name);
    let base = base.strip_suffix("_reg").unwrap_or(base);
    match index {
        Some(i) => format!("{base}[{i}]"),
        None => base.to_string(),
    }
}

/// `base[i]`, `base_i_` (and their `_reg` forms) into base and index.
fn split(name: &str) -> (&str, Option<u64>) {
    if let Some(open) = name.rfind('[') {
        if name.ends_with(']') && open > 0 {
            if let Ok(i) = name[open + 1..name.len() - 1].parse::<u64>() {
                return (&name[..open], Some(i));
            }
        }
    }
    if let Some(body) = name.strip_suffix('_') {
        if let Some(us) = body.rfind('_') {
            let digits = &body[us + 1..];
            if us > 0 && !digits.is_empty() && digits.bytes().all(|b| b.is_ascii_digit()) {
                if let Ok(i) = digits.parse::<u64>() {
                    return (&body[..us], Some(i));
                }
            }
        }
    }
    (name, None)
}

#[cfg(test)]
mod tests {
    use super::normalize;

    #[test]
    fn synthesis_renamings_meet() {
        for n in ["q[3]", "q_reg[3]", "q_3_", "q_reg_3_"] {
            assert_eq!(normalize(n), "q[3]", "{n}");
        }
        assert_eq!(normalize("q_reg"), "q");
        assert_eq!(normalize("state"), "state");
        assert_eq!(normalize("a_b"), "a_b");
        assert_eq!(normalize("_1_"), "_1_");
    }
}
