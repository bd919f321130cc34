//! Where a pure fluid is a solid: below its triple-point temperature above the sublimation
//! pressure, and above its melting pressure. No model of the crate describes a solid, so a
//! (T, P) state there is flagged whatever model computed it (a cubic happily reports solid CO2
//! as a liquid).
//!
//! Curves, each from the reference paper of the fluid's formulation:
//! - water: IAPWS R14-08 (2011), sublimation of ice Ih and melting of ice Ih, III, V, VI, VII
//!   ([`crate::pure::ice`]);
//! - carbon dioxide: R. Span, W. Wagner, J. Phys. Chem. Ref. Data 25 (1996) 1509, eq. 3.10
//!   (melting, to 327 K in the paper) and eq. 3.12 (sublimation); coefficients from memory,
//!   checked: the sublimation pressure at 194.686 K is one atmosphere (the normal sublimation
//!   point, common practice);
//! - nitrogen: R. Span et al., J. Phys. Chem. Ref. Data 29 (2000) 1361, melting and
//!   sublimation equations; coefficients from memory, checked only for continuity at the
//!   triple point;
//! - methane: the triple point of U. Setzmann, W. Wagner, J. Phys. Chem. Ref. Data 20 (1991)
//!   1061 (90.6941 K, 11.696 kPa); its melting equation is not used: the coefficients as
//!   recalled gave a melting pressure that turns negative above 450 K, so they are wrong.
//!
//! A fluid without a sublimation curve is solid below its triple-point temperature at any
//! pressure above its triple-point pressure (the sublimation pressure is lower there), and
//! may be solid below that; a fluid known only by its triple-point temperature may be solid
//! anywhere below it.

use crate::pure::ice;

/// Where a (T, P) state of a pure fluid stands against its solid phase.
#[derive(Debug, Clone, PartialEq)]
pub enum SolidCheck {
    /// Fluid (or nothing is known that says otherwise).
    Fluid,
    /// The stable phase is a solid; the text says why.
    Solid(String),
    /// A solid may be the stable phase; the text says why.
    MaybeSolid(String),
}

/// A fluid's triple point and the curves known for it.
#[derive(Debug, Clone, Copy)]
pub struct SolidLines {
    /// Triple-point temperature, K.
    pub t_triple: f64,
    /// Triple-point pressure, Pa, where known.
    pub p_triple: Option<f64>,
    /// Melting pressure (Pa) at T above the triple point, where known.
    pub melting: Option<fn(f64) -> Option<f64>>,
    /// Sublimation pressure (Pa) at T below the triple point, where known.
    pub sublimation: Option<fn(f64) -> Option<f64>>,
    /// Where the curves come from.
    pub source: &'static str,
}

fn co2_melting(t: f64) -> Option<f64> {
    let x = t / 216.592 - 1.0;
    (t >= 216.592).then_some(0.517_95e6 * (1.0 + 1_955.539 * x + 2_055.459_3 * x * x))
}

fn co2_sublimation(t: f64) -> Option<f64> {
    let x = 1.0 - t / 216.592;
    (t <= 216.592 && t > 0.0).then(|| {
        let s = -14.740_846 * x + 2.432_701_5 * x.powf(1.9) - 5.306_177_8 * x.powf(2.9);
        0.517_95e6 * (216.592 / t * s).exp()
    })
}

fn n2_melting(t: f64) -> Option<f64> {
    (t >= 63.151).then(|| 12_523.0 * (1.0 + 12_798.61 * (t / 63.151 - 1.0).powf(1.789_63)))
}

fn n2_sublimation(t: f64) -> Option<f64> {
    (t <= 63.151 && t > 0.0)
        .then(|| 12_523.0 * (63.151 / t * (-13.088_692 * (1.0 - t / 63.151))).exp())
}

fn water_melting(t: f64) -> Option<f64> {
    ice::melting_pressure_high(t)
}

fn water_sublimation(t: f64) -> Option<f64> {
    ice::sublimation_pressure(t).ok()
}

/// The curves of a fluid by its component id (`water`, `co2`, `nitrogen`, `methane`), or its
/// triple point alone: `t_triple` and `p_triple` from the component's data, where known.
pub fn lines(id: &str, t_triple: Option<f64>, p_triple: Option<f64>) -> Option<SolidLines> {
    let known = |t: f64, p: f64, m, s, source| SolidLines {
        t_triple: t,
        p_triple: Some(p),
        melting: Some(m),
        sublimation: s,
        source,
    };
    match id {
        "water" => Some(known(
            ice::T_TRIPLE,
            ice::P_TRIPLE,
            water_melting,
            Some(water_sublimation),
            "IAPWS R14-08 (2011)",
        )),
        "co2" => Some(known(
            216.592,
            0.517_95e6,
            co2_melting,
            Some(co2_sublimation),
            "Span & Wagner (1996), from memory",
        )),
        "nitrogen" => Some(known(
            63.151,
            12_523.0,
            n2_melting,
            Some(n2_sublimation),
            "Span et al. (2000), from memory",
        )),
        "methane" => Some(SolidLines {
            t_triple: 90.694_1,
            p_triple: Some(11_696.0),
            melting: None,
            sublimation: None,
            source: "Setzmann & Wagner (1991)",
        }),
        _ => t_triple.map(|t| SolidLines {
            t_triple: t,
            p_triple,
            melting: None,
            sublimation: None,
            source: "the component's triple point",
        }),
    }
}

/// Where (T, P) stands for a fluid with curves `l`, named `name` in the messages.
pub fn check(l: &SolidLines, name: &str, t: f64, p: f64) -> SolidCheck {
    let mpa = |p: f64| {
        if p >= 1e3 {
            format!("{:.6} MPa", p / 1e6)
        } else {
            format!("{p:.4e} Pa")
        }
    };
    if t < l.t_triple {
        // Water is anomalous: below its triple point the liquid persists above the ice Ih
        // melting pressure (to 251.165 K), so ice Ih lies between the two curves.
        if let (Some(sub), true) = (l.sublimation.and_then(|f| f(t)), name == "water") {
            let melt = ice::melting_pressure_ih(t).ok();
            let high = ice::melting_pressure_high(t);
            return match (melt, high) {
                (Some(m), Some(h)) if p > m && p > h => SolidCheck::Solid(format!(
                    "above the melting pressure of the high-pressure ices ({} at {t} K; {}), \
                     the stable phase is ice",
                    mpa(h),
                    l.source
                )),
                (Some(m), _) if p > m => SolidCheck::Fluid,
                _ if p > sub => SolidCheck::Solid(format!(
                    "below water's triple point (273.16 K) and above the sublimation pressure \
                     of ice ({} at {t} K; {}), the stable phase is ice",
                    mpa(sub),
                    l.source
                )),
                _ => SolidCheck::Fluid,
            };
        }
        return match (l.sublimation.and_then(|f| f(t)), l.p_triple) {
            (Some(sub), _) if p > sub => SolidCheck::Solid(format!(
                "below the triple point of {name} ({} K) and above its sublimation pressure \
                 ({} at {t} K; {}), the stable phase is solid",
                l.t_triple,
                mpa(sub),
                l.source
            )),
            (Some(_), _) => SolidCheck::Fluid,
            (None, Some(pt)) if p > pt => SolidCheck::Solid(format!(
                "below the triple point of {name} ({} K, {}) and above the triple-point \
                 pressure, the stable phase is solid",
                l.t_triple,
                mpa(pt)
            )),
            _ => SolidCheck::MaybeSolid(format!(
                "below the triple-point temperature of {name} ({} K) a solid may form (its \
                 sublimation pressure is not known here; below it the state is vapour)",
                l.t_triple
            )),
        };
    }
    match l.melting.and_then(|f| f(t)) {
        Some(m) if p > m => SolidCheck::Solid(format!(
            "above the melting pressure of {name} ({} at {t} K; {}), the stable phase is \
             solid",
            mpa(m),
            l.source
        )),
        _ => SolidCheck::Fluid,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn of(id: &str) -> SolidLines {
        lines(id, None, None).unwrap()
    }

    #[test]
    fn carbon_dioxide_sublimes_at_one_atmosphere_at_194_7_k() {
        // Normal sublimation point of CO2, 194.686 K (common practice; 194.69 K in the usual
        // handbooks).
        let p = co2_sublimation(194.686).unwrap();
        assert!((p / 101_325.0 - 1.0).abs() < 5e-4, "{p}");
    }

    #[test]
    fn melting_pressures_rise_with_temperature_above_the_triple_point() {
        // A block of states is cleared of the solid by its lowest temperature and highest
        // pressure alone (zfactor's range check) only because of this: the Simon-type curves
        // of CO2 and nitrogen and water's curves of ices III, V, VI and VII all rise with T
        // (common practice; the phase diagrams in the sources named in `lines`).
        for id in ["water", "co2", "nitrogen", "methane"] {
            let l = of(id);
            let Some(melting) = l.melting else { continue };
            let mut last = 0.0;
            for k in 0..20_000 {
                let t = l.t_triple + 0.05 * k as f64;
                if let Some(m) = melting(t) {
                    assert!(
                        m >= last,
                        "{id}: melting pressure falls at {t} K: {m} < {last}"
                    );
                    last = m;
                }
            }
        }
    }

    #[test]
    fn the_curves_meet_at_the_triple_point() {
        for id in ["co2", "nitrogen"] {
            let l = of(id);
            let pt = l.p_triple.unwrap();
            let m = (l.melting.unwrap())(l.t_triple).unwrap();
            assert!((m / pt - 1.0).abs() < 1e-12, "{id} melting {m}");
            if let Some(s) = l.sublimation.and_then(|f| f(l.t_triple)) {
                assert!((s / pt - 1.0).abs() < 1e-12, "{id} sublimation {s}");
            }
        }
    }

    #[test]
    fn solids_where_the_phase_diagram_puts_them() {
        let solid =
            |id: &str, t: f64, p: f64| matches!(check(&of(id), id, t, p), SolidCheck::Solid(_));
        // Common practice: dry ice at 200 K and 100 bar; CO2 gas at 200 K and 1 kPa; CO2
        // liquid at 250 K and 100 bar (melting is near 180 MPa there); ice at 250 K and 1 bar;
        // liquid water at 260 K above the ice Ih melting pressure (about 100 MPa) and below
        // ice V's (about 400 MPa); ice V at 260 K and 500 MPa; ice VI at 300 K and 1 GPa
        // (melting about 1.0 GPa there).
        assert!(solid("co2", 200.0, 100e5));
        assert!(!solid("co2", 200.0, 1e3));
        assert!(!solid("co2", 250.0, 100e5));
        assert!(solid("co2", 250.0, 300e6));
        assert!(solid("water", 250.0, 1e5));
        assert!(!solid("water", 250.0, 10.0));
        assert!(!solid("water", 260.0, 150e6));
        assert!(solid("water", 260.0, 500e6));
        assert!(solid("water", 300.0, 1.2e9));
        assert!(!solid("water", 300.0, 1e8));
        assert!(solid("nitrogen", 50.0, 1e5));
        assert!(solid("methane", 80.0, 1e5));
        // Methane at 500 K and 10 bar is a gas (its melting pressure there is in the GPa
        // range, common practice): no curve here may say otherwise.
        assert!(!solid("methane", 500.0, 1e6));
        assert!(!solid("nitrogen", 500.0, 1e6));
        assert!(!solid("co2", 500.0, 1e6));
        let hydrogen = lines("hydrogen", Some(13.957), None).unwrap();
        assert!(matches!(
            check(&hydrogen, "hydrogen", 10.0, 1e6),
            SolidCheck::MaybeSolid(_)
        ));
    }
}
