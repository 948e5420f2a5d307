//! Evidence and output stability: every "depends" claim re-simulates, the JSON form follows
//! its schema, and two runs print byte-identical reports.

use crate::common::{check_evidence, iscas, iscas_dir};
use equicone::cone::{audit, AuditOptions};
use equicone::cost::{stats, CostModel};
use equicone::sat::Limits;

#[test]
fn reports_are_byte_identical_and_evidence_re_simulates() {
    let Some(dir) = iscas_dir() else { return };
    for name in ["c17", "c432", "c880"] {
        let d = iscas(&dir, name);
        let opts = AuditOptions {
            text_evidence: true,
            ..AuditOptions::default()
        };
        let a = audit(&d, &opts, &Limits::none());
        let b = audit(&d, &opts, &Limits::none());
        assert_eq!(a.to_json(), b.to_json(), "{name}");
        assert_eq!(a.to_string(), b.to_string(), "{name}");
        let checked = check_evidence(&d, &a);
        let supports: usize = a.outputs.iter().map(|o| o.support.len()).sum();
        assert_eq!(checked, supports, "{name}");
        let s1 = stats(&d, &CostModel::unit(), &Limits::none());
        let s2 = stats(&d, &CostModel::unit(), &Limits::none());
        assert_eq!(s1.to_json(), s2.to_json());
        assert_eq!(s1.to_string(), s2.to_string());
    }
}

#[test]
fn json_has_the_documented_shape() {
    let Some(dir) = iscas_dir() else { return };
    let d = iscas(&dir, "c17");
    let r = audit(&d, &AuditOptions::default(), &Limits::none());
    let v: serde_json::Value = serde_json::from_str(&r.to_json()).unwrap();
    assert_eq!(v["schema"], "equicone.cone/1");
    assert_eq!(v["graph"], "netlist");
    let o = &v["outputs"][0];
    assert_eq!(o["name"], "G22gat");
    assert_eq!(o["support"].as_array().unwrap().len(), 4);
    let c = &o["claims"][0];
    assert_eq!(c["verdict"], "depends");
    assert!(c["by"] == "random_simulation" || c["by"] == "sat");
    assert_eq!(c["vector"].as_str().unwrap().len(), 4);
    assert!(v["stats"]["depends_by_random_simulation"]
        .as_u64()
        .is_some());
    assert!(v["flags"].as_array().unwrap().is_empty());
    let s: serde_json::Value =
        serde_json::from_str(&stats(&d, &CostModel::unit(), &Limits::none()).to_json()).unwrap();
    assert_eq!(s["schema"], "equicone.stats/1");
    assert_eq!(s["written"]["by_type"]["nand"]["by_fanin"]["2"], 6);
    assert_eq!(s["per_output"][0]["gate_bound"], 3);
}
