pub mod verilog;
