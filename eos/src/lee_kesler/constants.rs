//! The constants of the two Lee-Kesler fluids.
//!
//! B. I. Lee, M. G. Kesler, AIChE J. 21 (1975) 510-527, Table 1 (recalled from memory of the
//! paper). The recollection is supported by two consequences of the constants: the simple
//! fluid has its critical point at Tr = Pr = 1 with Zc = 0.2905 and the reference fluid at
//! Tr = Pr = 1 with Zc = 0.2560 (tested in this module's tests), in line with the paper's
//! Zc = 0.2905 - 0.085 omega.

/// The twelve constants of one fluid's reduced BWR-type equation.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FluidConstants {
    pub b1: f64,
    pub b2: f64,
    pub b3: f64,
    pub b4: f64,
    pub c1: f64,
    pub c2: f64,
    pub c3: f64,
    pub c4: f64,
    pub d1: f64,
    pub d2: f64,
    pub beta: f64,
    pub gamma: f64,
}

/// The simple fluid (omega = 0), from memory of Lee & Kesler (1975) Table 1.
pub const SIMPLE: FluidConstants = FluidConstants {
    b1: 0.1181193,
    b2: 0.265728,
    b3: 0.154790,
    b4: 0.030323,
    c1: 0.0236744,
    c2: 0.0186984,
    c3: 0.0,
    c4: 0.042724,
    d1: 0.155488e-4,
    d2: 0.623689e-4,
    beta: 0.65392,
    gamma: 0.060167,
};

/// The reference fluid (n-octane), from memory of Lee & Kesler (1975) Table 1.
pub const REFERENCE: FluidConstants = FluidConstants {
    b1: 0.2026579,
    b2: 0.331511,
    b3: 0.027655,
    b4: 0.203488,
    c1: 0.0313385,
    c2: 0.0503618,
    c3: 0.016901,
    c4: 0.041577,
    d1: 0.48736e-4,
    d2: 0.0740336e-4,
    beta: 1.226,
    gamma: 0.03754,
};

/// Acentric factor of the reference fluid (n-octane) used by Lee & Kesler.
pub const OMEGA_R: f64 = 0.3978;
