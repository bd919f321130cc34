//! The truncated virial equation against published second virial coefficients and ISO 6976
//! compression factors.

use approx::{assert_abs_diff_eq, assert_relative_eq};
use eos::constants::R;
use eos::model::Model;
use eos::state::{RootChoice, State};
use eos::virial::{Correlation, Virial};
use eos::{Component, Error};

/// Critical constants from memory of Poling, Prausnitz & O'Connell, *The Properties of Gases
/// and Liquids*, 5th ed. (2001), App. A (as listed in the shared components.csv).
fn comp(name: &str) -> Component {
    let (m, tc, pc_bar, omega, vc_cm3) = match name {
        "nitrogen" => (0.0280134, 126.2, 33.98, 0.037, 89.2),
        "methane" => (0.01604246, 190.56, 45.99, 0.011, 98.6),
        "carbon dioxide" => (0.0440095, 304.12, 73.74, 0.225, 94.07),
        "argon" => (0.039948, 150.86, 48.98, -0.002, 74.57),
        "ethane" => (0.03006904, 305.32, 48.72, 0.099, 145.5),
        "oxygen" => (0.0319988, 154.58, 50.43, 0.022, 73.37),
        _ => panic!("no data for {name}"),
    };
    Component::new(name, m, tc, pc_bar * 1e5, omega).with_vc(vc_cm3 * 1e-6)
}

fn pure(name: &str, corr: Correlation) -> Virial {
    Virial::new(&[comp(name)], corr, None).unwrap()
}

#[test]
fn b_at_300_k_within_the_uncertainty_of_the_compilations() {
    // second_virial_300K.csv: from memory of Dymond & Smith (1980) and Dymond et al. (2002),
    // cm3/mol; test bands +-1.5 (N2, CH4, Ar) and +-3 (CO2) as the shared reference advises.
    for (name, b_lit, band) in [
        ("nitrogen", -4.5, 1.5),
        ("methane", -42.8, 1.5),
        ("carbon dioxide", -122.0, 3.0),
        ("argon", -15.8, 1.5),
    ] {
        let b = pure(name, Correlation::Tsonopoulos)
            .second_virial(300.0, &[1.0], None)
            .b
            * 1e6;
        assert!((b - b_lit).abs() <= band, "{name}: B = {b:.2} vs {b_lit}");
    }
}

#[test]
fn tsonopoulos_b_matches_the_independent_computation() {
    // second_virial_300K.csv, column B_Tsonopoulos_1974_calc (computed there independently
    // from the same constants, printed to 0.1 cm3/mol).
    for (name, b_calc) in [
        ("nitrogen", -5.1),
        ("methane", -42.4),
        ("carbon dioxide", -122.1),
        ("argon", -14.9),
    ] {
        let b = pure(name, Correlation::Tsonopoulos)
            .second_virial(300.0, &[1.0], None)
            .b
            * 1e6;
        assert_abs_diff_eq!(b, b_calc, epsilon = 0.05);
    }
}

#[test]
fn pitzer_curl_b_for_methane_at_300_k() {
    // Pitzer & Curl (1957) at Tr = 1.574, omega = 0.011 against the compilation value
    // -42.8 +- 1.5 cm3/mol (second_virial_300K.csv).
    let b = pure("methane", Correlation::PitzerCurl)
        .second_virial(300.0, &[1.0], None)
        .b
        * 1e6;
    assert!((b + 42.8).abs() <= 1.5, "B = {b}");
}

/// ISO 6976:1995 compression factors at 101.325 kPa (from memory of Table 2 summation factors,
/// shared iso6976_compression_factors.csv; the rows marked high or medium confidence).
const ISO6976: [(&str, f64, f64); 14] = [
    ("methane", 273.15, 0.99760),
    ("methane", 288.15, 0.99800),
    ("methane", 293.15, 0.99810),
    ("ethane", 273.15, 0.99000),
    ("ethane", 288.15, 0.99150),
    ("ethane", 293.15, 0.99201),
    ("nitrogen", 273.15, 0.99950),
    ("nitrogen", 288.15, 0.99970),
    ("nitrogen", 293.15, 0.99971),
    ("oxygen", 273.15, 0.99900),
    ("oxygen", 288.15, 0.99920),
    ("carbon dioxide", 273.15, 0.99329),
    ("carbon dioxide", 288.15, 0.99440),
    ("carbon dioxide", 293.15, 0.99470),
];

#[test]
fn z_at_one_atmosphere_matches_iso_6976_pressure_explicit() {
    for (name, t, z_iso) in ISO6976 {
        let z = pure(name, Correlation::Tsonopoulos)
            .z_pressure_explicit(t, 101_325.0, &[1.0])
            .unwrap();
        assert_abs_diff_eq!(z, z_iso, epsilon = 1e-4);
    }
}

#[test]
fn volume_explicit_model_relates_to_the_pressure_explicit_form_exactly() {
    // With x = B P/(RT): Z = 1 + B rho and P = rho R T Z give Z = (1 + sqrt(1 + 4x))/2,
    // while the pressure-explicit form is 1 + x. At 1 atm the volume-explicit model is not
    // tested against ISO 6976 to 1e-4: it misses ethane at 20 C by 1.1e-4, the O(x^2) gap.
    for (name, t, _) in ISO6976 {
        let m = pure(name, Correlation::Tsonopoulos);
        let s = m.state_tp(t, 101_325.0, &[1.0]).unwrap();
        let x = m.z_pressure_explicit(t, 101_325.0, &[1.0]).unwrap() - 1.0;
        assert_relative_eq!(
            s.props.z,
            0.5 * (1.0 + (1.0 + 4.0 * x).sqrt()),
            max_relative = 1e-14
        );
    }
}

#[test]
fn mixture_fugacities_satisfy_the_euler_identity_and_identical_components_reduce() {
    let comps = [comp("methane"), comp("nitrogen"), comp("carbon dioxide")];
    let m = Virial::new(&comps, Correlation::Tsonopoulos, None).unwrap();
    let x = [0.85, 0.10, 0.05];
    let (t, p) = (280.0, 2e6);
    let s = m.state_tp(t, p, &x).unwrap();
    // ln phi of the mixture = g_res/RT = sum x_i ln phi_i (Euler)
    let sum: f64 = x.iter().zip(&s.props.ln_phi).map(|(x, l)| x * l).sum();
    assert_relative_eq!(sum, s.props.g_res / (R * t), max_relative = 1e-12);
    // ln phi_i equals the numerical derivative of n g_res/RT at fixed T, V
    let rho = s.props.rho;
    let n_a = |n: &[f64; 3]| {
        let nt: f64 = n.iter().sum();
        let xn = [n[0] / nt, n[1] / nt, n[2] / nt];
        nt * m.residual(t, rho * nt, &xn).a
    };
    let h = 1e-6;
    for i in 0..3 {
        let mut up = x;
        let mut dn = x;
        up[i] += h;
        dn[i] -= h;
        let mu = (n_a(&up) - n_a(&dn)) / (2.0 * h);
        assert_relative_eq!(mu - s.props.z.ln(), s.props.ln_phi[i], max_relative = 1e-6);
    }
    // the same gas listed twice behaves as the pure gas
    let twice = Virial::new(
        &[comp("methane"), comp("methane")],
        Correlation::Tsonopoulos,
        None,
    )
    .unwrap();
    let b1 = pure("methane", Correlation::Tsonopoulos).second_virial(250.0, &[1.0], None);
    let b2 = twice.second_virial(250.0, &[0.4, 0.6], None);
    assert_relative_eq!(b1.b, b2.b, max_relative = 1e-12);
}

#[test]
fn caloric_derivatives_match_numerical_differentiation() {
    // a_t = T dB/dT rho and a_tt = T^2 d2B/dT2 rho: check T dB/dT against a central difference.
    let m = pure("carbon dioxide", Correlation::Tsonopoulos);
    let t = 320.0;
    let b = m.second_virial(t, &[1.0], None);
    let dt = 1e-3;
    let bt = |t: f64| m.second_virial(t, &[1.0], None).b;
    assert_relative_eq!(
        b.b_t,
        t * (bt(t + dt) - bt(t - dt)) / (2.0 * dt),
        max_relative = 1e-7
    );
    assert_relative_eq!(
        b.b_tt,
        t * t * (bt(t + dt) - 2.0 * b.b + bt(t - dt)) / (dt * dt),
        max_relative = 1e-4
    );
}

#[test]
fn dense_states_are_refused_with_a_typed_error() {
    // CO2 at 300 K and 6 MPa is near-critical vapour, far above half the critical density.
    let m = pure("carbon dioxide", Correlation::Tsonopoulos);
    assert!(matches!(
        m.state_tp(300.0, 6e6, &[1.0]),
        Err(Error::OutOfRange { .. })
    ));
    assert!(matches!(
        m.z_pressure_explicit(300.0, 6e6, &[1.0]),
        Err(Error::OutOfRange { .. })
    ));
    // the Model interface offers no root there either
    assert!(m.densities(300.0, 6e6, &[1.0]).is_empty());
    assert!(State::at_tp(&m, 300.0, 6e6, &[1.0], RootChoice::Vapor).is_err());
    // and accepts the dilute gas
    assert!(m.state_tp(300.0, 1e6, &[1.0]).is_ok());
}

#[test]
fn z_only_path_agrees_with_the_full_mixture_sum() {
    // Identity: Z = 1 + B P/(RT) with B = sum_ij x_i x_j B_ij; the Z-only path sums the
    // symmetric matrix over i <= j, `second_virial` over every (i, j) with derivatives.
    let names = ["nitrogen", "methane", "carbon dioxide", "ethane", "argon"];
    let comps: Vec<Component> = names.iter().map(|n| comp(n)).collect();
    let mut kij = vec![0.0; 25];
    kij[1] = 0.03;
    kij[5] = 0.03;
    kij[2 * 5 + 3] = 0.12;
    kij[3 * 5 + 2] = 0.12;
    let m = Virial::new(&comps, Correlation::Tsonopoulos, Some(&kij)).unwrap();
    let x = [0.05, 0.80, 0.03, 0.10, 0.02];
    for (t, p) in [(250.0, 5e5), (300.0, 20e5), (400.0, 40e5)] {
        let b = m.second_virial(t, &x, None).b;
        let z = m.z_pressure_explicit(t, p, &x).unwrap();
        assert_relative_eq!(z, 1.0 + b * p / (R * t), max_relative = 1e-14);
    }
}
