//! Printing named bit values compactly: bits `name[i]` of one bus become one binary number,
//! scalar bits become `name=value`, and lines wrap.

pub use crate::design::split_bit;

/// One item of a grouped vector: a bus (port, high index, low index, bits from high to low) or a scalar.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum Group {
    /// A run of bits of one bus with consecutive indices.
    Bus {
        /// The bus name.
        port: String,
        /// Index of the first bit printed (the most significant).
        hi: i64,
        /// Index of the last bit printed.
        lo: i64,
        /// Values from `hi` down to `lo`.
        bits: Vec<bool>,
    },
    /// A single bit.
    Scalar {
        /// Its name.
        name: String,
        /// Its value.
        value: bool,
    },
}

/// Group bits (in the given order) into buses where consecutive names are bits of one bus
/// with indices stepping by one in one direction.
pub fn group<'a>(bits: impl IntoIterator<Item = (&'a str, bool)>) -> Vec<Group> {
    group_declared(bits, &std::collections::BTreeSet::new())
}

/// As [`group`], with the buses of `ascending` (declared `[0:7]` in Verilog: the lowest index
/// is the most significant bit) printed in their declared order, `a[0:7]`, and numbered as
/// Verilog reads them.
pub fn group_declared<'a>(
    bits: impl IntoIterator<Item = (&'a str, bool)>,
    ascending: &std::collections::BTreeSet<String>,
) -> Vec<Group> {
    // Runs as (port, first index, step, values in the given order).
    let mut runs: Vec<(String, i64, i64, Vec<bool>)> = Vec::new();
    let mut scalars_at: Vec<Option<(String, bool)>> = Vec::new();
    for (name, value) in bits {
        let (port, idx) = split_bit(name);
        let Some(i) = idx else {
            runs.push((String::new(), 0, 0, Vec::new()));
            scalars_at.push(Some((name.to_string(), value)));
            continue;
        };
        if let (Some((p, first, step, vals)), Some(None)) = (runs.last_mut(), scalars_at.last()) {
            let last = *first + *step * (vals.len() as i64 - 1);
            let next_step = i - last;
            if p == port && next_step.abs() == 1 && (vals.len() == 1 || next_step == *step) {
                *step = next_step;
                vals.push(value);
                continue;
            }
        }
        runs.push((port.to_string(), i, 1, vec![value]));
        scalars_at.push(None);
    }
    runs.into_iter()
        .zip(scalars_at)
        .map(|((port, first, step, mut vals), scalar)| match scalar {
            Some((name, value)) => Group::Scalar { name, value },
            None => {
                let last = first + step * (vals.len() as i64 - 1);
                let (mut hi, mut lo) = if step > 0 {
                    (last, first)
                } else {
                    (first, last)
                };
                if step > 0 {
                    vals.reverse();
                }
                if ascending.contains(&port) {
                    std::mem::swap(&mut hi, &mut lo);
                    vals.reverse();
                }
                Group::Bus {
                    port,
                    hi,
                    lo,
                    bits: vals,
                }
            }
        })
        .collect()
}

impl Group {
    /// `d[7:0]=8'b0000_0101 (5)` or `a=1`.
    pub fn render(&self) -> String {
        match self {
            Group::Scalar { name, value } => format!("{name}={}", *value as u8),
            Group::Bus { port, hi, lo, bits } => {
                if bits.len() == 1 {
                    return format!("{port}[{hi}]={}", bits[0] as u8);
                }
                let mut s = format!("{port}[{hi}:{lo}]={}'b", bits.len());
                for (i, b) in bits.iter().enumerate() {
                    if i > 0 && (bits.len() - i) % 4 == 0 {
                        s.push('_');
                    }
                    s.push(if *b { '1' } else { '0' });
                }
                let hex = (bits.len() > 16).then(|| crate::design::hex_text(bits));
                if bits.len() <= 64 {
                    let v = bits.iter().fold(0u64, |acc, &b| (acc << 1) | b as u64);
                    match hex {
                        Some(h) => s += &format!(" ({h} = {v})"),
                        None => s += &format!(" ({v})"),
                    }
                } else if let Some(h) = hex {
                    s += &format!(" ({h})");
                }
                s
            }
        }
    }
}

/// Render groups as lines of at most `width` characters, each starting with `indent`.
pub fn wrap(groups: &[Group], indent: &str, width: usize) -> String {
    let mut out = String::new();
    let mut line = String::new();
    for g in groups {
        let item = g.render();
        if !line.is_empty() && line.len() + 2 + item.len() > width {
            out += indent;
            out += &line;
            out.push('\n');
            line.clear();
        }
        if !line.is_empty() {
            line += "  ";
        }
        line += &item;
    }
    if !line.is_empty() {
        out += indent;
        out += &line;
        out.push('\n');
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn wide_buses_show_hexadecimal_and_ascending_ones_their_declared_order() {
        let bits: Vec<(String, bool)> = (0..20).map(|i| (format!("w[{i}]"), i % 3 == 0)).collect();
        let g = group(bits.iter().map(|(n, v)| (n.as_str(), *v)));
        // Bits 0, 3, ..., 18 set: 0b1001_0010_0100_1001_0010_0100_1001 over 20 bits.
        let v: u64 = (0..20).filter(|i| i % 3 == 0).map(|i| 1u64 << i).sum();
        assert_eq!(
            g[0].render(),
            format!(
                "w[19:0]=20'b0100_1001_0010_0100_1001 (20'h{:x}_{:04x} = {v})",
                v >> 16,
                v & 0xffff
            )
        );
        // `input [0:3] a` lists a[3] (least significant) first; a = 4'b0001 is a[3]=1.
        let asc: std::collections::BTreeSet<String> = ["a".to_string()].into();
        let bits = [
            ("a[3]", true),
            ("a[2]", false),
            ("a[1]", false),
            ("a[0]", false),
        ];
        let g = group_declared(bits.iter().map(|(n, v)| (*n, *v)), &asc);
        assert_eq!(g[0].render(), "a[0:3]=4'b0001 (1)");
        let g = group(bits.iter().map(|(n, v)| (*n, *v)));
        assert_eq!(g[0].render(), "a[3:0]=4'b1000 (8)");
    }

    #[test]
    fn groups_buses_and_scalars() {
        let bits = [
            ("s[0]", true),
            ("s[1]", false),
            ("s[2]", true),
            ("en", true),
            ("d[3]", false),
        ];
        let g = group(bits.iter().map(|(n, v)| (*n, *v)));
        let r: Vec<String> = g.iter().map(|x| x.render()).collect();
        assert_eq!(r, vec!["s[2:0]=3'b101 (5)", "en=1", "d[3]=0"]);
    }

    #[test]
    fn descending_order_also_groups() {
        let bits = [
            ("y[3]", true),
            ("y[2]", false),
            ("y[1]", false),
            ("y[0]", false),
            ("y[4]", true),
        ];
        let g = group(bits.iter().map(|(n, v)| (*n, *v)));
        let r: Vec<String> = g.iter().map(|x| x.render()).collect();
        assert_eq!(r, vec!["y[3:0]=4'b1000 (8)", "y[4]=1"]);
    }
}
