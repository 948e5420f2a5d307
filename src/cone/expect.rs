//! `--expect` files: which inputs each output must depend on, as text lines
//! (`d[0..7]: sel[0..3], ch0`) or as a JSON object (`{"d[0..7]": ["sel[0..3]", "ch0"]}`),
//! resolved against a design. Every error carries file:line:column; all are collected.

use super::names::{input_names, output_names, resolve, NameError};
use crate::design::Design;
use crate::diag::{Diagnostic, InputError, SourcePos};
use std::collections::BTreeMap;
use std::sync::Arc;

/// What the user expects of each named output: exactly these inputs in its support.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Expectation {
    /// Expected support per output index (design input indices, ascending).
    pub entries: BTreeMap<usize, ExpectEntry>,
}

/// The expectation for one output bit.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct ExpectEntry {
    /// Design input indices the output must depend on, ascending; no others.
    pub inputs: Vec<usize>,
    /// Where the expectation is written.
    pub pos: SourcePos,
}

/// Parse an expectation (text or JSON, told apart by a leading `{`) against `design`.
pub fn parse_expect(
    file: &Arc<str>,
    text: &str,
    design: &Design,
) -> Result<Expectation, InputError> {
    let (lines, mut errors) = if text.trim_start().starts_with('{') {
        json_lines(file, text)?
    } else {
        text_lines(file, text)
    };
    let ins = input_names(design);
    let outs = output_names(design);
    let mut entries: BTreeMap<usize, ExpectEntry> = BTreeMap::new();
    for line in lines {
        let mut inputs = Vec::new();
        for (item, pos) in &line.inputs {
            match resolve(item, &ins, "input", true) {
                Ok(v) => inputs.extend(v.into_iter().filter(|&k| !design.inputs[k].is_unknown())),
                Err(e) => errors.push(diag(pos, e)),
            }
        }
        inputs.sort_unstable();
        inputs.dedup();
        for (item, pos) in &line.outputs {
            let found = match resolve(item, &outs, "output", true) {
                Ok(v) => v,
                Err(e) => {
                    errors.push(diag(pos, e));
                    continue;
                }
            };
            for o in found {
                if let Some(first) = entries.get(&o) {
                    errors.push(
                        Diagnostic::error(
                            Some(pos.clone()),
                            format!(
                                "output `{}` already has an expectation (at {})",
                                design.outputs[o].name, first.pos
                            ),
                        )
                        .with_help("give each output bit one line; list all its inputs there"),
                    );
                    continue;
                }
                entries.insert(
                    o,
                    ExpectEntry {
                        inputs: inputs.clone(),
                        pos: pos.clone(),
                    },
                );
            }
        }
    }
    if errors.is_empty() {
        Ok(Expectation { entries })
    } else {
        errors.sort_by(|a, b| a.pos.cmp(&b.pos));
        Err(InputError {
            diagnostics: errors,
        })
    }
}

fn diag(pos: &SourcePos, e: NameError) -> Diagnostic {
    Diagnostic::error(Some(pos.clone()), e.message).with_help(e.help)
}

type Items = Vec<(String, SourcePos)>;

/// One expectation as written: output items and input items, each with its position.
struct Line {
    outputs: Items,
    inputs: Items,
}

/// The lines of the text form and the syntax errors found.
fn text_lines(file: &Arc<str>, text: &str) -> (Vec<Line>, Vec<Diagnostic>) {
    let mut out = Vec::new();
    let mut errors = Vec::new();
    for (ln, raw) in text.lines().enumerate() {
        let line_no = ln as u32 + 1;
        let body = raw.split('#').next().unwrap_or("");
        if body.trim().is_empty() {
            continue;
        }
        let chars: Vec<char> = body.chars().collect();
        let mut depth = 0i32;
        let mut colon = None;
        for (i, &c) in chars.iter().enumerate() {
            match c {
                '[' => depth += 1,
                ']' => depth -= 1,
                ':' if depth == 0 => {
                    colon = Some(i);
                    break;
                }
                _ => {}
            }
        }
        let Some(colon) = colon else {
            errors.push(
                Diagnostic::error(
                    Some(SourcePos::new(file, line_no, 1)),
                    "expected `OUTPUTS: INPUTS` (no `:` on this line)",
                )
                .with_help("for example `d[0..7]: sel[0..3], ch0[0..7]`; an empty right side means a constant output"),
            );
            continue;
        };
        let outputs = items(file, line_no, &chars[..colon], 0);
        let mut inputs = items(file, line_no, &chars[colon + 1..], colon + 1);
        if inputs.len() == 1 && inputs[0].0 == "-" {
            inputs.clear();
        }
        if outputs.is_empty() {
            errors.push(
                Diagnostic::error(
                    Some(SourcePos::new(file, line_no, colon as u32 + 1)),
                    "no output named before `:`",
                )
                .with_help("write the output bits or buses first, e.g. `d[0..7]: sel`"),
            );
            continue;
        }
        out.push(Line { outputs, inputs });
    }
    (out, errors)
}

/// Split `chars` (starting at character `offset` of its line) into items separated by
/// commas or white space outside brackets.
fn items(file: &Arc<str>, line: u32, chars: &[char], offset: usize) -> Items {
    let mut out = Vec::new();
    let mut cur = String::new();
    let mut start = 0;
    let mut depth = 0i32;
    for (i, &c) in chars.iter().enumerate() {
        let sep = depth == 0 && (c == ',' || c.is_whitespace());
        if sep {
            if !cur.is_empty() {
                out.push((
                    std::mem::take(&mut cur),
                    SourcePos::new(file, line, (offset + start) as u32 + 1),
                ));
            }
            continue;
        }
        if c.is_whitespace() {
            continue;
        }
        if cur.is_empty() {
            start = i;
        }
        match c {
            '[' => depth += 1,
            ']' => depth -= 1,
            _ => {}
        }
        cur.push(c);
    }
    if !cur.is_empty() {
        out.push((cur, SourcePos::new(file, line, (offset + start) as u32 + 1)));
    }
    out
}

/// The entries of the JSON form and the errors found; invalid JSON is an error at once.
#[allow(clippy::type_complexity)]
fn json_lines(file: &Arc<str>, text: &str) -> Result<(Vec<Line>, Vec<Diagnostic>), InputError> {
    let value: serde_json::Value = serde_json::from_str(text).map_err(|e| {
        let msg = e.to_string();
        let msg = msg.rfind(" at line ").map_or(msg.as_str(), |i| &msg[..i]);
        InputError::one(
            Diagnostic::error(
                Some(SourcePos::new(file, e.line() as u32, e.column() as u32)),
                format!("not valid JSON: {msg}"),
            )
            .with_help(
                "an expectation in JSON is an object such as {\"d[0..7]\": [\"sel\", \"ch0\"]}",
            ),
        )
    })?;
    let serde_json::Value::Object(map) = value else {
        return Err(InputError::one(
            Diagnostic::error(
                Some(SourcePos::new(file, 1, 1)),
                "the JSON expectation must be an object",
            )
            .with_help("map each output (or bus) to a list of inputs: {\"y\": [\"a\", \"b\"]}"),
        ));
    };
    let mut out = Vec::new();
    let mut errors = Vec::new();
    for (key, val) in &map {
        let kpos = locate(file, text, key, 0);
        let koff = offset_of(text, key, 0);
        let strings: Vec<String> = match val {
            serde_json::Value::Array(a) => {
                let mut v = Vec::new();
                for x in a {
                    match x {
                        serde_json::Value::String(s) => v.push(s.clone()),
                        other => errors.push(
                            Diagnostic::error(
                                Some(kpos.clone()),
                                format!("the inputs of `{key}` must be strings, found {other}"),
                            )
                            .with_help(
                                "write input names as strings, e.g. [\"sel[0..3]\", \"ch0\"]",
                            ),
                        ),
                    }
                }
                v
            }
            serde_json::Value::String(s) => vec![s.clone()],
            other => {
                errors.push(
                    Diagnostic::error(
                        Some(kpos.clone()),
                        format!("the inputs of `{key}` must be a list of strings, found {other}"),
                    )
                    .with_help("write [\"a\", \"b\"], or [] for a constant output"),
                );
                continue;
            }
        };
        let mut inputs = Vec::new();
        for s in strings {
            let pos = locate(file, text, &s, koff);
            let chars: Vec<char> = s.chars().collect();
            for (item, _) in items(file, pos.line, &chars, 0) {
                inputs.push((item, pos.clone()));
            }
        }
        let kchars: Vec<char> = key.chars().collect();
        let outputs = items(file, kpos.line, &kchars, 0)
            .into_iter()
            .map(|(i, _)| (i, kpos.clone()))
            .collect();
        out.push(Line { outputs, inputs });
    }
    Ok((out, errors))
}

/// Byte offset of the first quoted occurrence of `s` at or after `from` (0 if absent).
fn offset_of(text: &str, s: &str, from: usize) -> usize {
    let quoted = format!("\"{s}\"");
    text.get(from..)
        .and_then(|t| t.find(&quoted))
        .map_or(from, |i| from + i + 1)
}

/// The line and column of the first quoted occurrence of `s` at or after byte `from`.
fn locate(file: &Arc<str>, text: &str, s: &str, from: usize) -> SourcePos {
    let off = offset_of(text, s, from);
    let before = &text[..off];
    let line = before.matches('\n').count() as u32 + 1;
    let start = before.rfind('\n').map_or(0, |i| i + 1);
    let col = before[start..].chars().count() as u32 + 1;
    SourcePos::new(file, line, col)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::front::bench::read_bench;

    fn design() -> Design {
        read_bench(
            &Arc::from("t.bench"),
            "INPUT(a)\nINPUT(b)\nINPUT(c)\nOUTPUT(y)\nOUTPUT(z)\ny = AND(a, b)\nz = OR(b, c)\n",
        )
        .unwrap()
    }

    #[test]
    fn text_form_with_comments_and_constant() {
        let d = design();
        let e = parse_expect(&Arc::from("e.txt"), "# x\ny: a, b  # and\nz: -\n", &d).unwrap();
        assert_eq!(e.entries[&0].inputs, vec![0, 1]);
        assert!(e.entries[&1].inputs.is_empty());
        assert_eq!(e.entries[&0].pos.to_string(), "e.txt:2:1");
    }

    #[test]
    fn text_errors_are_collected_with_positions() {
        let d = design();
        let e = parse_expect(&Arc::from("e.txt"), "y: a, q\nz c\ny: b\n", &d).unwrap_err();
        let s = e.to_string();
        assert_eq!(e.diagnostics.len(), 3, "{s}");
        assert!(s.contains("e.txt:1:7: error: no input is named `q`"), "{s}");
        assert!(
            s.contains("e.txt:2:1: error: expected `OUTPUTS: INPUTS`"),
            "{s}"
        );
        assert!(
            s.contains("e.txt:3:1: error: output `y` already has an expectation (at e.txt:1:1)"),
            "{s}"
        );
    }

    #[test]
    fn json_form_and_its_errors() {
        let d = design();
        let e = parse_expect(
            &Arc::from("e.json"),
            "{\"y\": [\"a\", \"b\"], \"z\": \"b c\"}",
            &d,
        )
        .unwrap();
        assert_eq!(e.entries[&1].inputs, vec![1, 2]);
        let err = parse_expect(
            &Arc::from("e.json"),
            "{\n  \"y\": [\"a\",\n    \"nope\"]\n}",
            &d,
        )
        .unwrap_err()
        .to_string();
        assert!(
            err.contains("e.json:3:6: error: no input is named `nope`"),
            "{err}"
        );
        let err = parse_expect(&Arc::from("e.json"), "{\"y\": [1", &d)
            .unwrap_err()
            .to_string();
        assert!(
            err.starts_with("e.json:1:8: error: not valid JSON: EOF while parsing a list\n"),
            "{err}"
        );
    }
}
