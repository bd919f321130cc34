//! Computing what is asked: a state evaluated for Z and density only ([`Need::Volumetric`])
//! has the same root, phase, Z, density and pressure, bit for bit, as the full evaluation,
//! says what it computed, and leaves the rest unset (NaN, `None`, empty) rather than stale.
//! The full values themselves are checked against published data in the other test files;
//! here IF97's Z at one state of IAPWS R7-97(2012) Table 5 anchors the volumetric path.

use eos::cubic::{Cubic, CubicKind};
use eos::helmholtz::reference_for;
use eos::need::Need;
use eos::properties::Properties;
use eos::state::{RootChoice, State};
use eos::tp_explicit::{self, If97Model, LeeKeslerModel};
use eos::{Component, Model};

fn water() -> Component {
    // Constants from memory of Poling et al. (2001) App. A.
    Component::new(
        "water",
        eos::tp_explicit::if97::M_WATER,
        647.096,
        220.64e5,
        0.344,
    )
}

fn methane() -> Component {
    // Poling et al. (2001) App. A, from memory.
    Component::new("methane", 0.016_042_46, 190.56, 45.99e5, 0.011)
}

fn same_volumetric(full: &Properties, vol: &Properties, what: &str) {
    assert_eq!(full.computed, Need::All, "{what}");
    assert_eq!(vol.computed, Need::Volumetric, "{what}");
    for (a, b, name) in [
        (full.t, vol.t, "t"),
        (full.p, vol.p, "p"),
        (full.rho, vol.rho, "rho"),
        (full.z, vol.z, "z"),
        (full.molar_mass, vol.molar_mass, "molar mass"),
    ] {
        assert_eq!(a.to_bits(), b.to_bits(), "{what}: {name} {a} vs {b}");
    }
    assert!(
        vol.h.is_nan() && vol.s.is_nan() && vol.cv.is_nan(),
        "{what}"
    );
    assert!(
        vol.cp.is_none() && vol.w.is_none() && vol.jt.is_none(),
        "{what}"
    );
    assert!(vol.ln_phi.is_empty(), "{what}");
    assert!(full.h.is_finite() && full.cv.is_finite(), "{what}");
}

#[test]
fn models_with_a_helmholtz_energy_give_the_same_root_and_z() {
    let pr = Cubic::new(CubicKind::Pr76, &[methane()], None).unwrap();
    let water95 = reference_for("water").unwrap();
    type States<'a> = &'a [(f64, f64)];
    let models: [(&dyn Model, States); 2] = [
        (&pr, &[(150.0, 1e5), (150.0, 50e5), (300.0, 100e5)]),
        (
            &water95,
            &[(300.0, 1e5), (400.0, 1e5), (600.0, 10e6), (700.0, 30e6)],
        ),
    ];
    for (m, states) in models {
        for &(t, p) in states {
            let what = format!("{} at {t} K, {p} Pa", m.id());
            let full = State::at_tp(m, t, p, &[1.0], RootChoice::LowestGibbs).unwrap();
            let vol = State::at_tp_need(m, t, p, &[1.0], RootChoice::LowestGibbs, Need::Volumetric)
                .unwrap();
            assert_eq!(full.phase, vol.phase, "{what}");
            assert_eq!(full.roots, vol.roots, "{what}");
            same_volumetric(&full.props, &vol.props, &what);
            assert_eq!(
                full.props.dp_drho.to_bits(),
                vol.props.dp_drho.to_bits(),
                "{what}"
            );
        }
    }
}

#[test]
fn models_explicit_in_t_and_p_take_one_evaluation_for_z() {
    let if97 = If97Model::new(water());
    let lk = LeeKeslerModel::new(&[methane()], None).unwrap();
    let cases: [(&dyn tp_explicit::TpModel, f64, f64); 4] = [
        (&if97, 300.0, 3e6),
        (&if97, 700.0, 30e6),
        (&lk, 200.0, 50e5),
        (&lk, 300.0, 100e5),
    ];
    for (m, t, p) in cases {
        let what = format!("{} at {t} K, {p} Pa", m.id());
        let full = tp_explicit::evaluate(m, t, p, &[1.0], RootChoice::LowestGibbs).unwrap();
        let vol =
            tp_explicit::evaluate_need(m, t, p, &[1.0], RootChoice::LowestGibbs, Need::Volumetric)
                .unwrap();
        assert_eq!(full.phase, vol.phase, "{what}");
        assert_eq!(full.warnings, vol.warnings, "{what}");
        same_volumetric(&full.props, &vol.props, &what);
    }
    // IAPWS R7-97(2012) Table 5: v = 0.100215168e-2 m3/kg at 300 K, 3 MPa.
    let vol = tp_explicit::evaluate_need(
        &if97,
        300.0,
        3e6,
        &[1.0],
        RootChoice::LowestGibbs,
        Need::Volumetric,
    )
    .unwrap();
    let v = 1.0 / (vol.props.rho * vol.props.molar_mass);
    assert!((v / 0.100215168e-2 - 1.0).abs() < 1e-8, "{v}");
}
