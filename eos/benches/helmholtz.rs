//! Timing of the Helmholtz formulations: IAPWS-95 properties at (T, rho), at (T, p) including
//! the density solve, saturation at T, and the 12-term nitrogen equation.

use divan::black_box;
use eos::helmholtz::{reference_for, technical_for, HelmholtzFluid};
use std::sync::LazyLock;

static WATER: LazyLock<HelmholtzFluid> = LazyLock::new(|| reference_for("water").unwrap());
static N2: LazyLock<HelmholtzFluid> = LazyLock::new(|| reference_for("nitrogen").unwrap());
static N2_SW: LazyLock<HelmholtzFluid> = LazyLock::new(|| technical_for("nitrogen").unwrap());

fn main() {
    divan::main();
}

#[divan::bench]
fn iapws95_properties_t_rho_liquid() -> f64 {
    // 500 K, 838.025 kg/m3 (IAPWS-95 Table 6 state).
    let p = WATER
        .properties(black_box(500.0), black_box(838.025 / 0.018015268))
        .unwrap();
    p.cp.unwrap_or(0.0) + p.w.unwrap_or(0.0) + p.s
}

#[divan::bench]
fn iapws95_properties_t_p_liquid() -> f64 {
    let p = WATER
        .properties_tp(black_box(300.0), black_box(1e6))
        .unwrap();
    p.rho + p.h
}

#[divan::bench]
fn iapws95_properties_t_p_vapour() -> f64 {
    let p = WATER
        .properties_tp(black_box(500.0), black_box(1e6))
        .unwrap();
    p.rho + p.h
}

#[divan::bench]
fn iapws95_saturation_t() -> f64 {
    WATER.saturation_t(black_box(450.0)).unwrap().p
}

#[divan::bench]
fn nitrogen_reference_t_p() -> f64 {
    N2.properties_tp(black_box(300.0), black_box(10e6))
        .unwrap()
        .z
}

#[divan::bench]
fn nitrogen_sw12_t_p() -> f64 {
    N2_SW
        .properties_tp(black_box(300.0), black_box(10e6))
        .unwrap()
        .z
}
