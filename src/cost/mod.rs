//! Gate counts, cost, delay and bounds (placeholder while the module is written).
