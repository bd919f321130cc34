//! The two fixed workloads of the Python/NumPy yardstick in `shared/bench/yardstick_pr.py`,
//! rebuilt here so that zfactor's batch kernel can reproduce its checksums.
//!
//! Constants below are the yardstick's own invented-but-realistic test constants (its
//! docstring says they are recalled from memory and should be treated as invented); they are
//! used only to compare answers and speed with the yardstick.

#![allow(dead_code)]

use eos::cubic::{Cubic, CubicKind};
use eos::Component;

/// name, Tc (K), Pc (bar), omega.
pub const COMPONENTS: [(&str, f64, f64, f64); 10] = [
    ("nitrogen-like", 126.20, 33.98, 0.037),
    ("carbon-dioxide-like", 304.13, 73.77, 0.224),
    ("methane-like", 190.56, 45.99, 0.011),
    ("ethane-like", 305.32, 48.72, 0.099),
    ("propane-like", 369.83, 42.48, 0.152),
    ("isobutane-like", 407.80, 36.40, 0.186),
    ("n-butane-like", 425.12, 37.96, 0.200),
    ("isopentane-like", 460.40, 33.80, 0.229),
    ("n-pentane-like", 469.70, 33.70, 0.252),
    ("n-hexane-like", 507.60, 30.25, 0.301),
];

/// Mole fractions of the 10-component gas.
pub const X_GAS: [f64; 10] = [
    0.0150, 0.0100, 0.8550, 0.0700, 0.0300, 0.0050, 0.0070, 0.0020, 0.0020, 0.0040,
];

/// Non-zero k_ij (i < j).
pub const KIJ: [(usize, usize, f64); 22] = [
    (0, 1, -0.017),
    (0, 2, 0.031),
    (0, 3, 0.052),
    (0, 4, 0.085),
    (0, 5, 0.103),
    (0, 6, 0.080),
    (0, 7, 0.092),
    (0, 8, 0.100),
    (0, 9, 0.080),
    (1, 2, 0.092),
    (1, 3, 0.132),
    (1, 4, 0.124),
    (1, 5, 0.120),
    (1, 6, 0.133),
    (1, 7, 0.140),
    (1, 8, 0.140),
    (1, 9, 0.145),
    (2, 5, 0.026),
    (2, 6, 0.013),
    (2, 7, 0.018),
    (2, 8, 0.023),
    (2, 9, 0.042),
];

/// Checksums sum(Z) printed in the yardstick's README.
pub const SUM_PURE: f64 = 823188.2635450142;
pub const SUM_MIX_LARGEST: f64 = 766284.6574533038;
pub const SUM_MIX_GIBBS: f64 = 766188.5637833859;
pub const SUM_MIXLOOP_LARGEST: f64 = 7673.9360644165;
pub const SUM_MIXLOOP_GIBBS: f64 = 7672.7258305638;

/// The yardstick's rounded Omega_a and Omega_b (README of shared/bench).
pub const OMEGA_A: f64 = 0.45723553;
pub const OMEGA_B: f64 = 0.07779607;

fn comp(k: usize) -> Component {
    let (name, tc, pc, w) = COMPONENTS[k];
    Component::new(name, 0.016, tc, pc * 1e5, w)
}

/// Peng-Robinson (1976) for the methane-like pure fluid.
pub fn pure() -> (Cubic, Vec<f64>) {
    (
        Cubic::new(CubicKind::Pr76, &[comp(2)], None)
            .and_then(|m| m.with_omegas(OMEGA_A, OMEGA_B))
            .unwrap(),
        vec![1.0],
    )
}

/// Peng-Robinson (1976) for the 10-component gas.
pub fn mix() -> (Cubic, Vec<f64>) {
    let comps: Vec<Component> = (0..10).map(comp).collect();
    let mut k = vec![0.0; 100];
    for (i, j, v) in KIJ {
        k[i * 10 + j] = v;
        k[j * 10 + i] = v;
    }
    let s: f64 = X_GAS.iter().sum();
    let x = X_GAS.iter().map(|v| v / s).collect();
    let m = Cubic::new(CubicKind::Pr76, &comps, Some(&k))
        .and_then(|m| m.with_omegas(OMEGA_A, OMEGA_B))
        .unwrap();
    (m, x)
}

/// The yardstick's grid: T = linspace(200, 400, nt) K outer, P = linspace(1, 300, np) bar inner.
pub fn grid(nt: usize, np: usize) -> (Vec<f64>, Vec<f64>) {
    let lin = |lo: f64, hi: f64, n: usize, k: usize| lo + (hi - lo) * k as f64 / (n - 1) as f64;
    let mut t = Vec::with_capacity(nt * np);
    let mut p = Vec::with_capacity(nt * np);
    for i in 0..nt {
        for j in 0..np {
            t.push(lin(200.0, 400.0, nt, i));
            p.push(lin(1.0, 300.0, np, j) * 1e5);
        }
    }
    (t, p)
}

/// Order-independent exactly rounded sum (Neumaier compensated summation; matches Python's
/// math.fsum to well below the 1e-9 tolerance used).
pub fn fsum(v: &[f64]) -> f64 {
    let (mut s, mut c) = (0.0_f64, 0.0_f64);
    for &x in v {
        let t = s + x;
        if s.abs() >= x.abs() {
            c += (s - t) + x;
        } else {
            c += (x - t) + s;
        }
        s = t;
    }
    s + c
}
