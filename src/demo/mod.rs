//! The built-in demo: the Tidewater 7 buoy's 12-channel sensor selector (an invented scenario).
//! Proves the hand-optimized revision r2 against the one-line spec under `sel < 12`, catches
//! the crossed channels of revision r3 with a counterexample and route tables, audits r2's
//! cones (the masked test-mode pin shows as a redundant input) and prints its cost, delay and
//! bounds. Step 5 is the selector registered on the chip: a revision that renamed its registers
//! and stores one channel bit inverted, paired by behaviour and proved, and a revision whose bug
//! first shows on the third cycle after reset, with its trace and difference cubes. Every
//! figure printed is computed here and now by the tool.

use crate::check::{self, CheckOutcome, CheckRequest, DiagnosisRequest};
use crate::cone::{self, AuditOptions};
use crate::cost::{self, CostModel};
use crate::design::{Design, Format};
use crate::front;
use crate::report;
use crate::sat::Limits;
use std::sync::Arc;

/// The embedded files: (name, text); the last three are step 5's clocked designs.
pub const FILES: [(&str, &str); 6] = [
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
    (
        "t7_sensor_reg_spec.v",
        include_str!("files/t7_sensor_reg_spec.v"),
    ),
    (
        "t7_sensor_reg_r4.v",
        include_str!("files/t7_sensor_reg_r4.v"),
    ),
    (
        "t7_sensor_reg_r5.v",
        include_str!("files/t7_sensor_reg_r5.v"),
    ),
];

/// The assumption of the scenario: the sequencer never drives select values 12..15.
pub const ASSUME: &str = "sel < 12";

/// Read embedded file `k`.
pub fn load(k: usize) -> Design {
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
            shard: None,
            structure: None,
            ..AuditOptions::default()
        },
        &limits,
    );
    s += &audit.to_string();
    s += "\n== 4. Cost, delay and bounds of r2 (unit cost and delay per gate)\n";
    s += &cost::stats(&r2, &CostModel::unit(), &limits).to_string();
    s += "\n== 5. The selector registered on the chip (clocked designs, from reset)\n";
    s += "Revision r4 renamed its registers and stores bit 5 of the output register inverted:\n";
    let (spec5, r4, r5) = (load(3), load(4), load(5));
    s += &clocked(&spec5, &r4)?.to_string();
    s += "\nRevision r5 against the same reference:\n";
    let rep = clocked(&spec5, &r5)?;
    s += &rep.to_string();
    if let Some(t) = &rep.trace {
        let cubes = crate::explain::trace_cubes::trace_cubes(
            &spec5,
            &r5,
            t,
            &Default::default(),
            &Limits::none(),
        )?;
        s += &crate::explain::trace_cubes::trace_cubes_text(&cubes);
    }
    s += "\nThe embedded files: equicone demo --write DIR writes them out, to rerun each step by hand.\n";
    s += "It also writes r5's trace as a waveform (t7_sensor_reg_r5.vcd) and a testbench (t7_sensor_reg_r5_tb.v).\n";
    Ok(s)
}

/// A clocked check of `c` against `r` with the default settings.
pub fn clocked(r: &Design, c: &Design) -> Result<crate::seq::SeqReport, String> {
    check::check_clocked(&CheckRequest::new(r, c), &check::ClockedSettings::default())
        .map_err(|e| e.to_string())
}

/// Step 5's trace files for `demo --write`: (file name, text) of the VCD of r5's trace and of
/// the testbench replaying it (which compiles with the reference's file, `spec_path`).
pub fn trace_files(spec_path: &str, r5_path: &str) -> Result<Vec<(String, String)>, String> {
    let (spec5, r5) = (load(3), load(5));
    let rep = clocked(&spec5, &r5)?;
    let t = rep.trace.ok_or("revision r5 shows no trace")?;
    let vcd = crate::explain::trace_vcd::trace_vcd(&spec5, &r5, &t)?;
    let side = |d, path: &str, k: usize| crate::explain::testbench::TbDesign {
        design: d,
        files: vec![(path.to_string(), FILES[k].1.to_string())],
    };
    let tb = crate::explain::trace_bench::trace_testbench(
        &side(&spec5, spec_path, 3),
        &side(&r5, r5_path, 5),
        &t,
    )?;
    Ok(vec![
        ("t7_sensor_reg_r5.vcd".to_string(), vcd),
        ("t7_sensor_reg_r5_tb.v".to_string(), tb.text),
    ])
}
