//! The built-in demo: the Tidewater 7 buoy's 12-channel sensor selector (an invented scenario).
//! Proves the hand-optimized revision r2 against the one-line spec under `sel < 12`, catches
//! the crossed channels of revision r3 with a counterexample and route tables, audits r2's
//! cones (the masked test-mode pin shows as a redundant input) and prints its cost, delay and
//! bounds. Every figure printed is computed here and now by the tool.

use crate::check::{self, CheckOutcome, CheckRequest, DiagnosisRequest};
use crate::cone::{self, AuditOptions};
use crate::cost::{self, CostModel};
use crate::design::{Design, Format};
use crate::front;
use crate::report;
use crate::sat::Limits;
use std::sync::Arc;

/// The embedded files: (name, text).
pub const FILES: [(&str, &str); 3] = [
    (
        "t7_sensor_sel_spec.v",
        include_str!("files/t7_sensor_sel_spec.v"),
    ),
    (
        "t7_sensor_sel_r2.v",
        include_str!("files/t7_sensor_sel_r2.v"),
    ),
    (
        "t7_sensor_sel_r3.v",
        include_str!("files/t7_sensor_sel_r3.v"),
    ),
];

/// The assumption of the scenario: the sequencer never drives select values 12..15.
pub const ASSUME: &str = "sel < 12";

fn load(k: usize) -> Design {
    let (name, text) = FILES[k];
    front::load_texts(
        Format::Verilog,
        &[(Arc::from(name), text.to_string())],
        None,
    )
    .unwrap_or_else(|e| panic!("embedded demo file {name} must read: {e}"))
}

fn prove(r: &Design, c: &Design) -> Result<CheckOutcome, String> {
    let req = CheckRequest {
        assumptions: vec![ASSUME.to_string()],
        diagnosis: DiagnosisRequest::Select("sel".to_string()),
        explain: Some(Default::default()),
        ..CheckRequest::new(r, c)
    };
    check::check(&req).map_err(|e| e.to_string())
}

/// Run the demo; returns the text to print, or an internal error.
pub fn run() -> Result<String, String> {
    let spec = load(0);
    let r2 = load(1);
    let r3 = load(2);
    let mut s = String::new();
    s += "Tidewater 7 buoy, telemetry chip: 12-channel sensor selector (8-bit channels, 4-bit sel)\n";
    s += "The reference is the one-line spec `assign y = ch[8*sel +: 8];` (selects 12..15 read x).\n";
    s += &format!(
        "The sequencer never drives sel above 11, so every check below assumes `{ASSUME}`.\n"
    );
    s += "\n== 1. Revision r2 (2:1 tree + decoder AND-OR) against the spec\n";
    s += &report::check_text(&prove(&spec, &r2)?);
    s += "\n== 2. Revision r3 against the spec\n";
    s += &report::check_text(&prove(&spec, &r3)?);
    s += "\n== 3. Cone audit of r2: what really reaches each output\n";
    let limits = Limits::none();
    let audit = cone::audit(
        &r2,
        &AuditOptions {
            outputs: Vec::new(),
            expect: None,
            support: Default::default(),
            text_evidence: false,
        },
        &limits,
    );
    s += &audit.to_string();
    s += "\n== 4. Cost, delay and bounds of r2 (unit cost and delay per gate)\n";
    s += &cost::stats(&r2, &CostModel::unit(), &limits).to_string();
    s += "\nThe embedded files: equicone demo --write DIR writes them out, to rerun each step by hand.\n";
    Ok(s)
}
