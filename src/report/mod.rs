//! Reports for people and programs: the text form of each result and its JSON form, and the
//! shared helpers that print bit vectors compactly (buses as binary numbers).

mod prove_text;
pub mod values;

pub use prove_text::check_text;

use serde::Serialize;

/// The JSON form of any report, pretty-printed, with a final newline.
pub fn to_json<T: Serialize>(value: &T) -> String {
    let mut s = serde_json::to_string_pretty(value).expect("reports serialize");
    s.push('\n');
    s
}
