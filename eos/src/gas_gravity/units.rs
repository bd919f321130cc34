//! Field units the gas-gravity correlations were published in.

/// Kelvin per degree Rankine.
pub const K_PER_RANKINE: f64 = 5.0 / 9.0;
/// Pascal per psi (1 lbf/in2 = 4.4482216152605 N / 0.00064516 m2).
pub const PA_PER_PSI: f64 = 6_894.757_293_168_361;
