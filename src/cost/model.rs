//! Cost models: cost and delay per gate type and fan-in, from a JSON file (see docs/cone.md),
//! or the default of unit cost and unit delay for every gate.

use crate::design::CellKind;
use crate::diag::{Diagnostic, InputError, SourcePos};
use serde::Serialize;
use serde_json::Value;
use std::collections::BTreeMap;
use std::sync::Arc;

/// Cost and delay of one gate.
#[derive(Copy, Clone, Debug, PartialEq, Serialize)]
pub struct GateCost {
    /// Area or price, in the model's unit.
    pub cost: f64,
    /// Input-to-output delay, in the model's unit.
    pub delay: f64,
}

impl GateCost {
    /// Unit cost and unit delay.
    pub const UNIT: GateCost = GateCost {
        cost: 1.0,
        delay: 1.0,
    };
}

/// The model of one gate type.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct GateSpec {
    /// Cost and delay at two inputs (or at the type's only fan-in).
    pub base: GateCost,
    /// Added for each input beyond two.
    pub per_extra_input: GateCost,
    /// Exact figures for given fan-ins, overriding the two above.
    pub fanin: BTreeMap<u32, GateCost>,
}

/// Cost and delay of every gate type.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct CostModel {
    /// How reports name the model.
    pub name: String,
    /// For gate types the model does not list.
    pub default: GateCost,
    /// Per gate type.
    pub gates: BTreeMap<CellKind, GateSpec>,
    /// The fan-in `k` of the lower bounds; `None`: the design's largest fan-in (at least 2).
    pub bound_fanin: Option<u32>,
}

impl Default for CostModel {
    fn default() -> Self {
        CostModel::unit()
    }
}

impl CostModel {
    /// Unit cost and unit delay for every gate.
    pub fn unit() -> CostModel {
        CostModel {
            name: "unit".to_string(),
            default: GateCost::UNIT,
            gates: BTreeMap::new(),
            bound_fanin: None,
        }
    }

    /// Cost and delay of a gate of type `kind` with `fanin` inputs.
    pub fn gate(&self, kind: CellKind, fanin: usize) -> GateCost {
        let Some(spec) = self.gates.get(&kind) else {
            return self.default;
        };
        if let Some(c) = spec.fanin.get(&(fanin as u32)) {
            return *c;
        }
        let extra = fanin.saturating_sub(2) as f64;
        GateCost {
            cost: spec.base.cost + extra * spec.per_extra_input.cost,
            delay: spec.base.delay + extra * spec.per_extra_input.delay,
        }
    }

    /// Parse a cost model from JSON text; `file` names it in messages. All errors are
    /// collected.
    pub fn parse(file: &Arc<str>, text: &str) -> Result<CostModel, InputError> {
        let value: Value = serde_json::from_str(text).map_err(|e| {
            let msg = e.to_string();
            let msg = msg.rfind(" at line ").map_or(msg.as_str(), |i| &msg[..i]);
            InputError::one(
                Diagnostic::error(
                    Some(SourcePos::new(file, e.line() as u32, e.column() as u32)),
                    format!("not valid JSON: {msg}"),
                )
                .with_help("a cost model is a JSON object such as {\"gates\": {\"nand\": {\"cost\": 1, \"delay\": 1}}}"),
            )
        })?;
        let mut p = Parser {
            file,
            text,
            errors: Vec::new(),
        };
        let model = p.model(&value);
        p.errors.sort_by(|a, b| a.pos.cmp(&b.pos));
        if p.errors.is_empty() {
            Ok(model)
        } else {
            Err(InputError {
                diagnostics: p.errors,
            })
        }
    }
}

struct Parser<'a> {
    file: &'a Arc<str>,
    text: &'a str,
    errors: Vec<Diagnostic>,
}

impl Parser<'_> {
    /// Byte offset just inside the first quoted `key` at or after `from`.
    fn offset(&self, key: &str, from: usize) -> usize {
        let quoted = format!("\"{key}\"");
        self.text
            .get(from..)
            .and_then(|t| t.find(&quoted))
            .map_or(from, |i| from + i + 1)
    }

    fn pos(&self, off: usize) -> SourcePos {
        let before = &self.text[..off.min(self.text.len())];
        let line = before.matches('\n').count() as u32 + 1;
        let start = before.rfind('\n').map_or(0, |i| i + 1);
        SourcePos::new(self.file, line, before[start..].chars().count() as u32 + 1)
    }

    fn err(&mut self, off: usize, msg: String, help: &str) {
        let pos = self.pos(off);
        self.errors
            .push(Diagnostic::error(Some(pos), msg).with_help(help));
    }

    fn model(&mut self, v: &Value) -> CostModel {
        let mut m = CostModel::unit();
        let Value::Object(top) = v else {
            self.err(
                0,
                "a cost model must be a JSON object".into(),
                "write {\"gates\": {...}}",
            );
            return m;
        };
        for (key, val) in top {
            let off = self.offset(key, 0);
            match key.as_str() {
                "name" => match val {
                    Value::String(s) => m.name = s.clone(),
                    _ => self.err(
                        off,
                        "`name` must be a string".into(),
                        "write \"name\": \"my cells\"",
                    ),
                },
                "default" => m.default = self.cost(val, off, "default", GateCost::UNIT),
                "bound_fanin" => match val.as_u64() {
                    Some(k) if (2..=1 << 20).contains(&k) => m.bound_fanin = Some(k as u32),
                    _ => self.err(
                        off,
                        format!("`bound_fanin` must be a whole number of at least 2, found {val}"),
                        "the bounds assume gates of at most this many inputs, e.g. 2",
                    ),
                },
                "gates" => self.gates(val, off, &mut m),
                other => self.err(
                    off,
                    format!("unknown key `{other}` in the cost model"),
                    "the keys are name, default, gates and bound_fanin",
                ),
            }
        }
        m
    }

    fn gates(&mut self, v: &Value, at: usize, m: &mut CostModel) {
        let Value::Object(gates) = v else {
            self.err(
                at,
                "`gates` must be an object".into(),
                "map gate types to figures: {\"nand\": {\"cost\": 1, \"delay\": 1}}",
            );
            return;
        };
        for (key, val) in gates {
            let off = self.offset(key, at);
            let Some(kind) = CellKind::ALL.iter().copied().find(|k| k.name() == key) else {
                let names: Vec<&str> = CellKind::ALL.iter().map(|k| k.name()).collect();
                self.err(
                    off,
                    format!("unknown gate type `{key}`"),
                    &format!("gate types are {}", names.join(", ")),
                );
                continue;
            };
            let spec = self.spec(val, off, key);
            m.gates.insert(kind, spec);
        }
    }

    fn spec(&mut self, v: &Value, at: usize, gate: &str) -> GateSpec {
        let base = self.cost(v, at, gate, GateCost::UNIT);
        let mut spec = GateSpec {
            base,
            per_extra_input: GateCost {
                cost: 0.0,
                delay: 0.0,
            },
            fanin: BTreeMap::new(),
        };
        let Value::Object(o) = v else { return spec };
        if let Some(x) = o.get("per_extra_input") {
            let off = self.offset("per_extra_input", at);
            spec.per_extra_input = self.cost(
                x,
                off,
                "per_extra_input",
                GateCost {
                    cost: 0.0,
                    delay: 0.0,
                },
            );
        }
        if let Some(x) = o.get("fanin") {
            let off = self.offset("fanin", at);
            match x {
                Value::Object(f) => {
                    for (n, c) in f {
                        let noff = self.offset(n, off);
                        match n.parse::<u32>() {
                            Ok(k) if k >= 1 => {
                                let c = self.cost(c, noff, n, spec.base);
                                spec.fanin.insert(k, c);
                            }
                            _ => self.err(
                                noff,
                                format!("fan-in `{n}` of `{gate}` is not a whole number of at least 1"),
                                "key the fan-in table by input count, e.g. \"fanin\": {\"3\": {\"cost\": 2, \"delay\": 1.5}}",
                            ),
                        }
                    }
                }
                _ => self.err(
                    off,
                    format!("`fanin` of `{gate}` must be an object"),
                    "e.g. \"fanin\": {\"3\": {\"cost\": 2, \"delay\": 1.5}}",
                ),
            }
        }
        spec
    }

    /// `{"cost": .., "delay": ..}`; a missing figure takes the one of `fallback`.
    fn cost(&mut self, v: &Value, at: usize, what: &str, fallback: GateCost) -> GateCost {
        let mut c = fallback;
        let Value::Object(o) = v else {
            self.err(
                at,
                format!("`{what}` must be an object with cost and delay, found {v}"),
                "write {\"cost\": 1, \"delay\": 1}",
            );
            return c;
        };
        for (key, val) in o {
            let off = self.offset(key, at);
            let slot = match key.as_str() {
                "cost" => &mut c.cost,
                "delay" => &mut c.delay,
                "per_extra_input" | "fanin" => continue,
                other => {
                    self.err(
                        off,
                        format!("unknown key `{other}` in `{what}`"),
                        "the keys are cost, delay, per_extra_input and fanin",
                    );
                    continue;
                }
            };
            match val.as_f64() {
                Some(x) if x.is_finite() && x >= 0.0 => *slot = x,
                _ => self.err(
                    off,
                    format!("`{key}` of `{what}` must be a number of at least 0, found {val}"),
                    "write a plain non-negative number such as 1 or 0.5",
                ),
            }
        }
        c
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn parse(t: &str) -> Result<CostModel, InputError> {
        CostModel::parse(&Arc::from("m.json"), t)
    }

    #[test]
    fn figures_by_type_extra_inputs_and_fanin_table() {
        let m = parse(
            r#"{"name": "cells", "default": {"cost": 2, "delay": 3},
                "gates": {"nand": {"cost": 1, "delay": 1, "per_extra_input": {"cost": 0.5, "delay": 0.25},
                                   "fanin": {"4": {"cost": 9, "delay": 9}}},
                          "mux2": {"cost": 2.5, "delay": 1.5}},
                "bound_fanin": 3}"#,
        )
        .unwrap();
        assert_eq!(
            m.gate(CellKind::Nand, 2),
            GateCost {
                cost: 1.0,
                delay: 1.0
            }
        );
        assert_eq!(
            m.gate(CellKind::Nand, 3),
            GateCost {
                cost: 1.5,
                delay: 1.25
            }
        );
        assert_eq!(
            m.gate(CellKind::Nand, 4),
            GateCost {
                cost: 9.0,
                delay: 9.0
            }
        );
        assert_eq!(
            m.gate(CellKind::Mux2, 3),
            GateCost {
                cost: 2.5,
                delay: 1.5
            }
        );
        assert_eq!(
            m.gate(CellKind::Xor, 2),
            GateCost {
                cost: 2.0,
                delay: 3.0
            }
        );
        assert_eq!(m.bound_fanin, Some(3));
        assert_eq!(CostModel::unit().gate(CellKind::Not, 1), GateCost::UNIT);
    }

    #[test]
    fn errors_are_collected_with_positions() {
        let e = parse("{\n  \"gates\": {\n    \"nandd\": {\"cost\": 1},\n    \"and\": {\"cost\": -1}\n  },\n  \"bound_fanin\": 1\n}")
            .unwrap_err();
        let s = e.to_string();
        assert_eq!(e.diagnostics.len(), 3, "{s}");
        assert!(
            s.contains("m.json:3:6: error: unknown gate type `nandd`"),
            "{s}"
        );
        assert!(
            s.contains(
                "m.json:4:14: error: `cost` of `and` must be a number of at least 0, found -1"
            ),
            "{s}"
        );
        assert!(
            s.contains("m.json:6:4: error: `bound_fanin` must be a whole number of at least 2"),
            "{s}"
        );
        let e = parse("{\"gates\": [").unwrap_err().to_string();
        assert!(e.starts_with("m.json:1:11: error: not valid JSON"), "{e}");
    }
}
