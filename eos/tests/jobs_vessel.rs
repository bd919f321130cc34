//! Vessel jobs against exact ideal-gas relations, mass conservation, an independent
//! integration of the isentropic path, and IAPWS-95 steam through its own saturation solver.

mod common;

use approx::assert_relative_eq;
use common::comp;
use eos::constants::R;
use eos::cubic::{Cubic, CubicKind};
use eos::ideal::IdealGas;
use eos::jobs::vessel::{self, Target};
use eos::phase::Phase;
use eos::state::{RootChoice, State};
use eos::Model;

fn methane_pr() -> Cubic {
    Cubic::new(CubicKind::Pr76, &[comp("methane")], None).unwrap()
}

#[test]
fn ideal_gas_inventory_is_pv_over_rt() {
    // Ideal-gas law n = P V / (R T) (definition of the ideal gas; CODATA 2018 R).
    let m = IdealGas::new(&[comp("nitrogen")]);
    let inv = vessel::inventory(&m, 0.05, 293.15, 200e5, &[1.0]).unwrap();
    let n = 200e5 * 0.05 / (R * 293.15);
    assert_relative_eq!(inv.moles, n, max_relative = 1e-13);
    assert_relative_eq!(inv.mass, n * m.molar_mass(&[1.0]), max_relative = 1e-13);
}

#[test]
fn ideal_gas_heating_at_fixed_volume_gives_p1_t2_over_t1() {
    // Ideal gas at fixed n and V: P2 = P1 T2 / T1 (Gay-Lussac's law, exact for P v = R T).
    let m = IdealGas::new(&[comp("methane")]);
    let r = vessel::retemper(&m, 1.0, 288.15, 200e5, 338.15, &[1.0]).unwrap();
    assert_relative_eq!(r.end.state.p, 200e5 * 338.15 / 288.15, max_relative = 1e-12);
    assert!(r.mass_balance.abs() < 1e-14);
}

#[test]
fn real_gas_heating_conserves_mass_and_matches_p_of_t_rho() {
    // Mass conservation, and the end pressure equals the model's P(T2, rho1) directly.
    let m = methane_pr();
    let r = vessel::retemper(&m, 0.08, 288.15, 200e5, 328.15, &[1.0]).unwrap();
    assert!(r.mass_balance.abs() < 1e-12, "{}", r.mass_balance);
    let direct = State::at_trho(&m, 328.15, r.initial.state.rho, &[1.0]).unwrap();
    assert_relative_eq!(r.end.state.p, direct.props.p, max_relative = 1e-12);
    // A real gas at 200 bar rises by more than the ideal-gas ratio (Z grows with T here).
    assert!(r.end.state.p > 200e5 * 328.15 / 288.15);
}

#[test]
fn cooled_propane_condenses_and_the_split_obeys_the_lever_rule() {
    // Propane at 60 bar, 400 K (supercritical for PR) cooled to 300 K at fixed volume must
    // end two-phase or liquid; if two-phase the volume is the lever-rule sum of the
    // saturated volumes of the model's own saturation solver.
    let m = Cubic::new(CubicKind::Pr76, &[comp("propane")], None).unwrap();
    let v = 1.0;
    let r = vessel::retemper(&m, v, 400.0, 30e5, 300.0, &[1.0]).unwrap();
    assert_eq!(r.end.state.phase, Phase::TwoPhase);
    let split = r.end.state.split.as_ref().unwrap();
    let sat = eos::equilibrium::saturation::pressure(&m, 300.0).unwrap();
    assert_relative_eq!(r.end.state.p, sat.p, max_relative = 1e-12);
    let q = split.vapor_fraction;
    let vol = (1.0 - q) / sat.rho_l() + q / sat.rho_v();
    assert_relative_eq!(1.0 / r.end.state.rho, vol, max_relative = 1e-12);
    assert!(r.mass_balance.abs() < 1e-12);
}

#[test]
fn cooled_mixture_splits_by_the_flash_and_keeps_its_mass() {
    // A methane-propane-butane gas cooled at fixed volume into the two-phase region: the
    // end state is a flash result whose overall volume equals the vessel's (mass
    // conservation) and whose phases have equal fugacities (checked by the flash itself).
    let names = ["methane", "propane", "n-butane"];
    let comps: Vec<_> = names.iter().map(|n| comp(n)).collect();
    let m = Cubic::new(CubicKind::Pr76, &comps, None).unwrap();
    let x = [0.6, 0.25, 0.15];
    let r = vessel::retemper(&m, 1.0, 350.0, 40e5, 260.0, &x).unwrap();
    assert_eq!(r.end.state.phase, Phase::TwoPhase, "{:?}", r.end.state);
    assert!(r.mass_balance.abs() < 1e-8, "{}", r.mass_balance);
    let s = r.end.state.split.as_ref().unwrap();
    // Material balance of the split: z_i = (1 - beta) x_i + beta y_i.
    for (i, xi) in x.iter().enumerate() {
        let zi = (1.0 - s.vapor_fraction) * s.x[i] + s.vapor_fraction * s.y[i];
        assert_relative_eq!(zi, *xi, max_relative = 1e-10);
    }
}

#[test]
fn fill_pressure_settles_to_the_rated_pressure() {
    // Round trip: the fill state and the rated state have one density (same mass in the same
    // volume); the ideal gas gives P_fill = P_rated T_fill / T_ref exactly.
    let m = methane_pr();
    let f = vessel::fill_pressure(&m, 313.15, 200e5, 288.15, &[1.0]).unwrap();
    assert_relative_eq!(f.fill.rho, f.rated.rho, max_relative = 1e-12);
    let back = State::at_trho(&m, 288.15, f.fill.rho, &[1.0]).unwrap();
    assert_relative_eq!(back.props.p, 200e5, max_relative = 1e-10);
    let ig = IdealGas::new(&[comp("methane")]);
    let fi = vessel::fill_pressure(&ig, 313.15, 200e5, 288.15, &[1.0]).unwrap();
    assert_relative_eq!(fi.fill.p, 200e5 * 313.15 / 288.15, max_relative = 1e-12);
}

#[test]
fn mass_to_target_balances_and_refuses_what_cannot_be_reached() {
    let m = methane_pr();
    let up = vessel::to_target(
        &m,
        0.5,
        300.0,
        50e5,
        Target::Pressure(150e5),
        101_325.0,
        &[1.0],
    )
    .unwrap();
    // Mass conservation: start + added = end.
    assert_relative_eq!(
        up.initial.mass + up.delta_mass,
        up.end.mass,
        max_relative = 1e-14
    );
    assert!(up.delta_mass > 0.0);
    // Reaching a mass reproduces the pressure it came from.
    let back = vessel::to_target(
        &m,
        0.5,
        300.0,
        150e5,
        Target::Mass(up.initial.mass),
        101_325.0,
        &[1.0],
    )
    .unwrap();
    assert_relative_eq!(back.end.state.p, 50e5, max_relative = 1e-9);
    // Venting below the back pressure, and a mass above the co-volume limit, are refused.
    assert!(vessel::to_target(
        &m,
        0.5,
        300.0,
        50e5,
        Target::Pressure(5e4),
        101_325.0,
        &[1.0]
    )
    .is_err());
    assert!(vessel::to_target(&m, 0.5, 300.0, 50e5, Target::Mass(1e6), 101_325.0, &[1.0]).is_err());
}

#[test]
fn usable_gas_is_the_difference_of_two_inventories() {
    let m = methane_pr();
    let u = vessel::usable(&m, 2.0, (300.0, 200e5), (290.0, 10e5), &[1.0]).unwrap();
    assert_relative_eq!(u.mass, u.initial.mass - u.end.mass, max_relative = 1e-14);
    assert!(vessel::usable(&m, 2.0, (300.0, 10e5), (300.0, 200e5), &[1.0]).is_err());
}

#[test]
fn ideal_gas_venting_follows_t_p_to_the_k_minus_1_over_k() {
    // Constant-cp ideal gas (cp = 3.5 R, k = 1.4): isentropic T2 = T1 (P2/P1)^((k-1)/k)
    // (exact for the constant-cp ideal gas, any thermodynamics text).
    let m = IdealGas::new(&[comp("nitrogen")]);
    let v = vessel::vent_isentropic(&m, 1.0, 300.0, 100e5, 1e5, 20, Some(233.15), &[1.0]).unwrap();
    let t2 = 300.0 * (1e5_f64 / 100e5).powf(0.4 / 1.4);
    assert_relative_eq!(v.path.last().unwrap().t, t2, max_relative = 1e-10);
    assert_eq!(v.below_mdmt, Some(true));
    // Entropy held to 1e-9 J/(mol K) at every point; mass conserved.
    assert!(v.entropy_drift < 1e-9, "{}", v.entropy_drift);
    assert_relative_eq!(
        v.mass_left + v.mass_vented,
        v.initial.mass,
        max_relative = 1e-14
    );
}

#[test]
fn real_gas_venting_matches_an_independent_integration_of_dt_dp_at_constant_s() {
    // (dT/dP)_s = T (dv/dT)_P / cp = T (dP/dT)_rho / (rho^2 (dP/drho)_T cp) (a Maxwell
    // relation), integrated here by fourth-order Runge-Kutta in ln P from the model's
    // properties; the library instead solves s(T, P) = s1 at each point.
    let m = methane_pr();
    let (t1, p1, p2) = (350.0, 200e5, 20e5);
    let v = vessel::vent_isentropic(&m, 1.0, t1, p1, p2, 10, None, &[1.0]).unwrap();
    assert!(v.entropy_drift < 1e-9, "{}", v.entropy_drift);
    assert!(v.path.iter().all(|pt| pt.state.split.is_none()));
    let rate = |lnp: f64, t: f64| {
        let p = lnp.exp();
        let s = State::at_tp(&m, t, p, &[1.0], RootChoice::Vapor)
            .unwrap()
            .props;
        p * t * s.dp_dt / (s.rho * s.rho * s.dp_drho * s.cp.unwrap())
    };
    let n = 2000;
    let dl = (p2 / p1).ln() / n as f64;
    let (mut l, mut t) = (p1.ln(), t1);
    for _ in 0..n {
        let k1 = rate(l, t);
        let k2 = rate(l + dl / 2.0, t + dl / 2.0 * k1);
        let k3 = rate(l + dl / 2.0, t + dl / 2.0 * k2);
        let k4 = rate(l + dl, t + dl * k3);
        t += dl / 6.0 * (k1 + 2.0 * k2 + 2.0 * k3 + k4);
        l += dl;
    }
    assert_relative_eq!(v.path.last().unwrap().t, t, max_relative = 1e-8);
}

#[test]
fn steam_cooled_in_a_closed_vessel_matches_iapws95_saturation() {
    // IAPWS-95 (W. Wagner and A. Pruss, J. Phys. Chem. Ref. Data 31 (2002) 387): steam at
    // 1 MPa, 250 degC cooled at fixed volume to 120 degC condenses; the end state is
    // computed here independently from the formulation's own saturation routine
    // (HelmholtzFluid::saturation_t) and the lever rule on volume.
    let w = eos::helmholtz::reference_for("water").unwrap();
    let r = vessel::retemper(&w, 1.0, 523.15, 1e6, 393.15, &[1.0]).unwrap();
    assert_eq!(r.end.state.phase, Phase::TwoPhase);
    let sat = w.saturation_t(393.15).unwrap();
    assert_relative_eq!(r.end.state.p, sat.p, max_relative = 1e-8);
    let v = 1.0 / r.initial.state.rho;
    let q = (v - 1.0 / sat.rho_liq) / (1.0 / sat.rho_vap - 1.0 / sat.rho_liq);
    assert_relative_eq!(
        r.end.state.split.as_ref().unwrap().vapor_fraction,
        q,
        max_relative = 1e-7
    );
}

#[test]
fn methane_vented_to_5_bar_from_300_k_ends_on_the_saturation_line() {
    // The same expansion carried to 5 bar from 300 K reaches the two-phase region of the
    // model: the end temperature is the model's own saturation temperature at 5 bar, and
    // the remaining contents are partly liquid.
    let m = methane_pr();
    let v = vessel::vent_isentropic(&m, 1.0, 300.0, 200e5, 5e5, 10, None, &[1.0]).unwrap();
    let end = &v.path.last().unwrap().state;
    assert_eq!(end.phase, Phase::TwoPhase);
    let sat = eos::equilibrium::saturation::temperature(&m, 5e5).unwrap();
    assert_relative_eq!(end.t, sat.t, max_relative = 1e-10);
    assert!(v.entropy_drift < 1e-9, "{}", v.entropy_drift);
}
