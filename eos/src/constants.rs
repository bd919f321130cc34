//! Physical constants (CODATA 2018; exact in the 2019 SI).

/// Molar gas constant R in J/(mol K), exact since the 2019 SI redefinition (N_A k).
pub const R: f64 = 8.314_462_618;

/// Reference temperature of the ideal-gas enthalpy and entropy, in K: h0 = 0 and s0 = 0 for
/// each pure ideal gas at this temperature and [`P_REF`].
pub const T_REF: f64 = 298.15;

/// Reference pressure of the ideal-gas entropy, in Pa (one standard atmosphere).
pub const P_REF: f64 = 101_325.0;
