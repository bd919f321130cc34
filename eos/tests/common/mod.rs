//! Shared test data: pure-component constants.
//!
//! Copied from the project's reference table of gases (components.csv), whose values are
//! from memory of B. E. Poling, J. M. Prausnitz, J. P. O'Connell, *The Properties of Gases
//! and Liquids*, 5th ed., McGraw-Hill 2001, Appendix A (Tc, Pc, omega, Tb); molar masses
//! computed from the formulas with the IUPAC 2007 atomic weights. The confidence mark of each
//! row is the table's own (high / medium).

#![allow(dead_code)]

use eos::Component;

/// One row: name, molar mass g/mol, Tc K, Pc bar, omega, normal boiling point K (NaN where
/// there is none), confidence.
pub struct Data {
    pub name: &'static str,
    pub m: f64,
    pub tc: f64,
    pub pc_bar: f64,
    pub omega: f64,
    pub tb: f64,
    pub confidence: &'static str,
}

const fn d(
    name: &'static str,
    m: f64,
    tc: f64,
    pc_bar: f64,
    omega: f64,
    tb: f64,
    confidence: &'static str,
) -> Data {
    Data {
        name,
        m,
        tc,
        pc_bar,
        omega,
        tb,
        confidence,
    }
}

/// Non-polar, non-quantum components (hydrocarbons, permanent gases, noble gases heavier
/// than neon, CO2).
pub const NON_POLAR: &[Data] = &[
    d("methane", 16.04246, 190.56, 45.99, 0.011, 111.66, "high"),
    d("ethane", 30.06904, 305.32, 48.72, 0.099, 184.55, "high"),
    d("propane", 44.09562, 369.83, 42.48, 0.152, 231.02, "high"),
    d("n-butane", 58.12220, 425.12, 37.96, 0.2, 272.66, "high"),
    d("isobutane", 58.12220, 407.85, 36.4, 0.186, 261.34, "medium"),
    d("n-pentane", 72.14878, 469.7, 33.7, 0.252, 309.22, "high"),
    d(
        "isopentane",
        72.14878,
        460.39,
        33.81,
        0.229,
        300.99,
        "medium",
    ),
    d(
        "neopentane",
        72.14878,
        433.75,
        31.96,
        0.196,
        282.65,
        "medium",
    ),
    d("n-hexane", 86.17536, 507.6, 30.25, 0.3, 341.88, "high"),
    d("n-heptane", 100.20194, 540.2, 27.4, 0.35, 371.58, "high"),
    d("n-octane", 114.22852, 568.7, 24.9, 0.399, 398.82, "medium"),
    d("n-nonane", 128.25510, 594.6, 22.9, 0.445, 423.97, "medium"),
    d("n-decane", 142.28168, 617.7, 21.1, 0.49, 447.3, "medium"),
    d("ethylene", 28.05316, 282.34, 50.41, 0.087, 169.42, "high"),
    d("propylene", 42.07974, 364.9, 46.0, 0.142, 225.46, "medium"),
    d(
        "acetylene",
        26.03728,
        308.3,
        61.14,
        0.189,
        f64::NAN,
        "medium",
    ),
    d("benzene", 78.11184, 562.05, 48.95, 0.21, 353.24, "high"),
    d("toluene", 92.13842, 591.75, 41.08, 0.264, 383.79, "high"),
    d("cyclohexane", 84.15948, 553.5, 40.73, 0.211, 353.93, "high"),
    d("nitrogen", 28.01340, 126.2, 33.98, 0.037, 77.35, "high"),
    d("oxygen", 31.99880, 154.58, 50.43, 0.022, 90.17, "high"),
    d("argon", 39.94800, 150.86, 48.98, -0.002, 87.27, "high"),
    d(
        "carbon monoxide",
        28.01010,
        132.85,
        34.94,
        0.048,
        81.66,
        "medium",
    ),
    d(
        "carbon dioxide",
        44.00950,
        304.12,
        73.74,
        0.225,
        f64::NAN,
        "high",
    ),
    d("krypton", 83.79800, 209.4, 55.02, 0.0, 119.8, "medium"),
    d("xenon", 131.29300, 289.74, 58.4, 0.0, 165.02, "medium"),
];

/// Looks a component up by name in [`NON_POLAR`].
pub fn data(name: &str) -> &'static Data {
    NON_POLAR
        .iter()
        .find(|c| c.name == name)
        .unwrap_or_else(|| panic!("no test data for {name}"))
}

/// The model-ready component (SI units) of a row.
pub fn component(c: &Data) -> Component {
    Component::new(c.name, c.m * 1e-3, c.tc, c.pc_bar * 1e5, c.omega)
}

/// The component of that name.
pub fn comp(name: &str) -> Component {
    component(data(name))
}

/// Peng-Robinson k_ij of the natural-gas pairs present in [`demo_gas`], from the project's
/// reference table kij_pr.csv (from memory of tables derived from Knapp et al. (1982),
/// DECHEMA Chem. Data Ser. VI; confidence medium; hydrocarbon pairs taken as zero). They
/// are inputs of the model, not reference results.
pub const KIJ_PR: &[(&str, &str, f64)] = &[
    ("methane", "carbon dioxide", 0.0919),
    ("methane", "nitrogen", 0.0311),
    ("nitrogen", "carbon dioxide", -0.0170),
    ("carbon dioxide", "ethane", 0.1322),
    ("carbon dioxide", "propane", 0.1241),
    ("carbon dioxide", "n-butane", 0.1333),
    ("nitrogen", "ethane", 0.0515),
    ("nitrogen", "propane", 0.0852),
    ("nitrogen", "n-butane", 0.0800),
];

/// Row-major k_ij matrix for the named components.
pub fn kij(names: &[&str]) -> Vec<f64> {
    let n = names.len();
    let mut k = vec![0.0; n * n];
    for i in 0..n {
        for j in 0..n {
            for &(a, b, v) in KIJ_PR {
                if (names[i] == a && names[j] == b) || (names[i] == b && names[j] == a) {
                    k[i * n + j] = v;
                }
            }
        }
    }
    k
}

/// A demo natural gas with heavy ends: a composition of our own for testing, not a
/// measured gas. Returns the names and mole fractions.
pub fn demo_gas() -> (Vec<&'static str>, Vec<f64>) {
    let rows = [
        ("nitrogen", 0.01),
        ("carbon dioxide", 0.02),
        ("methane", 0.80),
        ("ethane", 0.08),
        ("propane", 0.04),
        ("isobutane", 0.01),
        ("n-butane", 0.015),
        ("isopentane", 0.005),
        ("n-pentane", 0.005),
        ("n-hexane", 0.005),
        ("n-heptane", 0.005),
        ("n-octane", 0.005),
    ];
    (
        rows.iter().map(|r| r.0).collect(),
        rows.iter().map(|r| r.1).collect(),
    )
}

/// A Peng-Robinson (1976) model of the named components with the k_ij above.
pub fn pr_model(names: &[&str]) -> eos::cubic::Cubic {
    let comps: Vec<Component> = names.iter().map(|n| comp(n)).collect();
    eos::cubic::Cubic::new(eos::cubic::CubicKind::Pr76, &comps, Some(&kij(names))).unwrap()
}

/// ln phi of each component at (T, rho, x) from the model, with ln Z taken as ln(P/(rho R T))
/// at the state's pressure: ln phi_i = mu_res_i/RT - ln Z, and for a dense liquid at low
/// pressure the model's own Z is a small difference of large terms whose rounding (~1e-10
/// in ln Z) would otherwise swamp a 1e-10 check of equal fugacities.
pub fn ln_phi_at(m: &dyn eos::Model, t: f64, p: f64, rho: f64, x: &[f64], out: &mut [f64]) {
    m.ln_phi(t, rho, x, out);
    let z_model = m.residual(t, rho, x).z();
    let z = p / (rho * eos::constants::R * t);
    for o in out.iter_mut() {
        *o += (z_model / z).ln();
    }
}
