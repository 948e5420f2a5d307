//! Reports for people and programs: the text form of each result and its JSON form, and the
//! shared helpers that print bit vectors compactly (buses as binary numbers).

mod prove_text;
pub mod values;

pub use prove_text::{check_text, prove_text};

use serde::Serialize;

/// An output pair's label: one name when both sides call it the same, else
/// `reference <-> candidate` (`<->` reads "paired with"; `~` only ever means inverted).
pub fn pair_label(reference: &str, candidate: &str) -> String {
    if reference == candidate {
        reference.to_string()
    } else {
        format!("{reference} <-> {candidate}")
    }
}

/// The JSON form of any report, pretty-printed, with a final newline.
pub fn to_json<T: Serialize>(value: &T) -> String {
    let mut s = serde_json::to_string_pretty(value).expect("reports serialize");
    s.push('\n');
    s
}
