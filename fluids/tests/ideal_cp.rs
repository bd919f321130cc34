//! Ideal-gas heat capacities: bounds, continuity, and agreement with independent reference
//! values (NIST-JANAF, Poling's tabulated Cp at 298 K, group additivity) and with the source
//! forms the derived fits were made from.

use fluids::{all, find};

/// Molar gas constant, J/(mol K) (CODATA 2018, exact).
const R: f64 = 8.314_462_618;

fn cp(id: &str, t: f64) -> f64 {
    find(id).unwrap().ideal_cp().cp_r(t) * R
}

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs()
}

#[test]
fn cp_at_least_translational_over_the_whole_range() {
    // cp0 >= 5/2 R for every ideal gas (translation alone gives 5/2 R).
    for c in all() {
        for s in &c.cp_segments {
            for k in 0..=200 {
                let t = s.t_lo_k + (s.t_hi_k - s.t_lo_k) * f64::from(k) / 200.0;
                let v = c.ideal_cp().cp_r(t);
                assert!(v >= 2.5 - 1e-6, "{} at {t} K: cp/R = {v}", c.id);
            }
        }
    }
}

#[test]
fn segments_join_continuously() {
    // The GRI-Mech 3.0 pairs are continuous at 1000 K to <= 7e-4 J/(mol K) (propane's 1985
    // fit is the worst), i.e. 8.4e-5 in cp/R; 1e-4 allows that and nothing more.
    let mut joins = 0;
    for c in all() {
        for w in c.cp_segments.windows(2) {
            let t = w[0].t_hi_k;
            assert!((t - w[1].t_lo_k).abs() < 1e-9, "{}: gap", c.id);
            let f = |a: &[f64; 5]| a[0] + t * (a[1] + t * (a[2] + t * (a[3] + t * a[4])));
            let d = (f(&w[0].a) - f(&w[1].a)).abs();
            assert!(d < 1e-4, "{}: jump {d} in cp/R at {t} K", c.id);
            joins += 1;
        }
    }
    // 17 components carry two-range NASA polynomials.
    assert!(joins >= 17);
}

#[test]
fn every_component_has_a_range_covering_room_temperature() {
    for c in all() {
        let (lo, hi) = c.cp_range_k;
        assert!(lo <= 300.0 && hi >= 600.0, "{}: range {lo}-{hi} K", c.id);
    }
}

/// NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998), ideal-gas Cp in J/(mol K), from
/// memory (as in the project's shared reference set): (id, T, Cp).
const JANAF: &[(&str, f64, f64)] = &[
    ("nitrogen", 298.15, 29.124),
    ("nitrogen", 500.0, 29.580),
    ("nitrogen", 1000.0, 32.697),
    ("oxygen", 298.15, 29.376),
    ("oxygen", 500.0, 31.091),
    ("oxygen", 1000.0, 34.870),
    ("argon", 298.15, 20.786),
    ("argon", 500.0, 20.786),
    ("argon", 1000.0, 20.786),
    ("helium", 298.15, 20.786),
    ("helium", 500.0, 20.786),
    ("helium", 1000.0, 20.786),
    ("hydrogen", 298.15, 28.836),
    ("hydrogen", 500.0, 29.260),
    ("hydrogen", 1000.0, 30.205),
    ("co", 298.15, 29.142),
    ("co", 500.0, 29.794),
    ("co", 1000.0, 33.183),
    ("co2", 298.15, 37.129),
    ("co2", 500.0, 44.627),
    ("co2", 1000.0, 54.308),
    ("water", 298.15, 33.590),
    ("water", 500.0, 35.226),
    ("water", 1000.0, 41.268),
    ("methane", 298.15, 35.639),
    ("methane", 500.0, 46.342),
    ("methane", 1000.0, 71.795),
    ("ammonia", 298.15, 35.652),
    ("ammonia", 500.0, 42.048),
    ("ammonia", 1000.0, 56.491),
    ("ethylene", 298.15, 42.886),
    ("ethylene", 500.0, 62.477),
    ("ethylene", 1000.0, 93.899),
    ("acetylene", 298.15, 44.036),
];

#[test]
fn matches_janaf_at_every_listed_temperature() {
    // Tolerance 0.4 %: the GRI-Mech fits agree with JANAF to <= 0.32 % for all these species
    // but methane, whose fit is based on other (anharmonic) data and is 2.5 % high at 1000 K,
    // while JANAF methane equals the rigid-rotor/harmonic value; so methane at 1000 K gets 3 %.
    for &(id, t, janaf) in JANAF {
        let tol = if id == "methane" && t > 900.0 {
            0.03
        } else {
            0.004
        };
        let v = cp(id, t);
        assert!(
            rel(v, janaf) < tol,
            "{id} at {t} K: {v:.3} vs JANAF {janaf}"
        );
    }
}

#[test]
fn air_matches_janaf_composition_average() {
    // Ideal-gas mixture identity: cp(air) = sum x_i cp_i, with JANAF N2, O2, Ar (above) and the
    // Lemmon et al. (2000) composition 0.7812 / 0.2096 / 0.0092.
    for (t, n2, o2) in [(500.0, 29.580, 31.091), (1000.0, 32.697, 34.870)] {
        let janaf = 0.7812 * n2 + 0.2096 * o2 + 0.0092 * 20.786;
        assert!(rel(cp("air", t), janaf) < 0.004, "air at {t} K");
    }
}

#[test]
fn added_species_match_janaf_at_298() {
    // NIST-JANAF 4th ed. Cp(298.15 K), from memory (not in the shared set): NO 29.845,
    // Cl2 33.949, HCl 29.136, SO2 39.842 J/(mol K). Same 0.4 % as above.
    for (id, janaf) in [
        ("no", 29.845),
        ("chlorine", 33.949),
        ("hcl", 29.136),
        ("so2", 39.842),
    ] {
        let v = cp(id, 298.15);
        assert!(rel(v, janaf) < 0.004, "{id}: {v:.3} vs JANAF {janaf}");
    }
}

#[test]
fn poling_polynomials_reproduce_poling_tabulated_cp_at_298() {
    // Poling et al. (2001) App. A tabulates CpIG(298.15 K) beside each polynomial (values from
    // memory, J/(mol K)). The printed polynomials reproduce their own column to about 0.5 %
    // (rounding of the printed coefficients), which is the tolerance here; a mis-recalled
    // coefficient shows up as several per cent.
    let table = [
        ("n-butane", 98.49),
        ("n-pentane", 120.04),
        ("n-hexane", 142.59),
        ("n-heptane", 165.98),
        ("n-octane", 188.69),
        ("n-nonane", 211.71),
        ("isobutane", 96.65),
        ("propylene", 64.32),
        ("1-butene", 85.65),
        ("benzene", 82.44),
        ("toluene", 103.72),
        ("cyclohexane", 105.8),
        ("ethanol", 65.65),
        ("dimethyl-ether", 65.57),
        ("h2s", 34.24),
        ("chlorine", 33.95),
        ("hcl", 29.13),
    ];
    for (id, tab) in table {
        let v = cp(id, 298.15);
        assert!(rel(v, tab) < 0.005, "{id}: {v:.2} vs Poling {tab}");
    }
}

/// Benson group heat capacities in cal/(mol K) at 300, 500, 1000 K (from memory of Benson,
/// Thermochemical Kinetics, 2nd ed., 1976): C-(C)(H)3 and C-(C)2(H)2.
const CH3: [f64; 3] = [6.19, 9.40, 14.77];
const CH2: [f64; 3] = [5.50, 8.25, 12.34];

#[test]
fn group_additivity_derivations_agree_with_benson_sums() {
    // n-decane = 2 CH3 + 8 CH2. Group additivity is good to about 2 % for alkane Cp
    // (Benson 1976), so 2 % is the tolerance. The same sums for n-butane (2 CH3 + 2 CH2)
    // against Poling's polynomial show the method's accuracy on independent data.
    for (k, t) in [300.0, 500.0, 1000.0].into_iter().enumerate() {
        let decane = (2.0 * CH3[k] + 8.0 * CH2[k]) * 4.184;
        assert!(rel(cp("n-decane", t), decane) < 0.02, "n-decane at {t} K");
        let c4 = (2.0 * CH3[k] + 2.0 * CH2[k]) * 4.184;
        assert!(rel(cp("n-butane", t), c4) < 0.02, "n-butane at {t} K");
    }
}

#[test]
fn branched_pentanes_match_tabulated_cp_at_298() {
    // Ideal-gas Cp(298.15 K) of isopentane 118.8 and neopentane 121.6 J/(mol K), from memory
    // of the API/TRC hydrocarbon tables (medium confidence); both correlations here are
    // derived (group additivity), so 1 %.
    assert!(rel(cp("isopentane", 298.15), 118.8) < 0.01);
    assert!(rel(cp("neopentane", 298.15), 121.6) < 0.01);
}

/// Einstein function x^2 e^x / (e^x - 1)^2.
fn einstein(x: f64) -> f64 {
    if x > 700.0 {
        return 0.0;
    }
    let e = x.exp();
    x * x * e / ((e - 1.0) * (e - 1.0))
}

/// Second radiation constant hc/k in cm K (CODATA 2018).
const C2: f64 = 1.438_776_877;

fn rrho(t: f64, modes: &[(f64, f64)]) -> f64 {
    4.0 + modes
        .iter()
        .map(|&(nu, g)| g * einstein(C2 * nu / t))
        .sum::<f64>()
}

#[test]
fn derived_fits_follow_their_source_forms() {
    // Each fit is checked against the formula it was fitted to, over its stated range, at the
    // fit deviation stated in its notes (rounded up to 0.4 %).
    let so2 = [(1151.4, 1.0), (517.7, 1.0), (1361.8, 1.0)];
    let sf6 = [
        (775.0, 1.0),
        (643.0, 2.0),
        (948.0, 3.0),
        (615.0, 3.0),
        (524.0, 3.0),
        (347.0, 3.0),
    ];
    // Tillner-Roth & Baehr (1994) ideal part of R-134a, from memory.
    let r134a = |t: f64| {
        let tau: f64 = 374.18 / t;
        1.0 - 1.629_789 + 0.75 * 9.723_916 * tau.powf(-0.5) + 1.3125 * 3.927_170 * tau.powf(-0.75)
    };
    // Tillner-Roth & Yokozeki (1997) ideal part of R-32, from memory.
    let r32 = |t: f64| {
        let tau = 351.255 / t;
        let a = [1.160761, 2.645151, 5.794987, 1.129475];
        let n = [2.2718538, 11.914421, 5.1415638, 32.768217];
        4.004486
            + a.iter()
                .zip(n)
                .map(|(a, n)| a * einstein(n * tau))
                .sum::<f64>()
    };
    // Richter, McLinden & Lemmon (2011) ideal part of R-1234yf, from memory.
    let r1234yf = |t: f64| {
        let v = [7.549, 1.537, 2.030, 7.455];
        let u = [718.0, 877.0, 4465.0, 1755.0];
        5.944
            + v.iter()
                .zip(u)
                .map(|(v, u)| v * einstein(u / t))
                .sum::<f64>()
    };
    let checks: [(&str, &dyn Fn(f64) -> f64); 5] = [
        ("so2", &|t| rrho(t, &so2)),
        ("sf6", &|t| rrho(t, &sf6)),
        ("r134a", &r134a),
        ("r32", &r32),
        ("r1234yf", &r1234yf),
    ];
    for (id, f) in checks {
        let c = find(id).unwrap();
        let (lo, hi) = c.cp_range_k;
        for k in 0..=50 {
            let t = lo + (hi - lo) * f64::from(k) / 50.0;
            let v = c.ideal_cp().cp_r(t);
            assert!(rel(v, f(t)) < 0.004, "{id} at {t} K: {v} vs {}", f(t));
        }
    }
}

#[test]
fn rrho_reproduces_janaf_so2_at_298() {
    // Independent check of the recalled SO2 fundamentals: harmonic cp0 at 298.15 K against
    // NIST-JANAF 39.842 J/(mol K) (from memory), 0.4 %.
    let v = rrho(298.15, &[(1151.4, 1.0), (517.7, 1.0), (1361.8, 1.0)]) * R;
    assert!(rel(v, 39.842) < 0.004, "{v}");
}

#[test]
fn air_polynomial_is_the_composition_average_of_its_parts() {
    // cp of an ideal-gas mixture is the mole-fraction average of the pure cp (exact).
    let (n2, o2, ar) = (
        find("N2").unwrap(),
        find("O2").unwrap(),
        find("Ar").unwrap(),
    );
    for t in [300.0, 450.0, 999.0, 1001.0, 2000.0, 3500.0] {
        let mix = 0.7812 * n2.ideal_cp().cp_r(t)
            + 0.2096 * o2.ideal_cp().cp_r(t)
            + 0.0092 * ar.ideal_cp().cp_r(t);
        assert!(
            rel(find("air").unwrap().ideal_cp().cp_r(t), mix) < 1e-9,
            "{t} K"
        );
    }
}

#[test]
fn the_common_gases_are_covered_down_to_200_k() {
    // A 15 degC base state and a cold flash must not extrapolate the ideal-gas cp of the
    // gases of the trade (natural-gas components, air and its parts).
    for id in [
        "methane",
        "ethane",
        "propane",
        "n-butane",
        "isobutane",
        "n-pentane",
        "isopentane",
        "n-hexane",
        "nitrogen",
        "co2",
        "h2s",
        "oxygen",
        "argon",
        "hydrogen",
        "helium",
        "water",
        "air",
    ] {
        let (lo, _) = find(id).unwrap().cp_range_k;
        assert!(lo <= 200.0, "{id}: fitted from {lo} K");
    }
    // NIST-JANAF 4th ed., N2 at 200 K: Cp = 29.107 J/(mol K), from memory; the rigid-rotor
    // harmonic-oscillator segment joins the GRI fit, which is 0.16 % low at 300 K: 0.2 %.
    assert!(rel(cp("nitrogen", 200.0), 29.107) < 0.002);
    // A non-linear molecule has at least translation and rotation, cp0 >= 4 R (common
    // practice); propane at 100 K, the bottom of its lowest segment.
    assert!(cp("propane", 100.0) / R >= 4.0);
    // Argon is an ideal monatomic gas: 5/2 R at every temperature (20.786 J/(mol K), JANAF).
    assert!(rel(cp("argon", 150.0), 20.786) < 1e-4);
}
