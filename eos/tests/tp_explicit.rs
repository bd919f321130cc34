//! (T, P)-explicit models through the common property layer: the numerical derivatives and
//! departure integrals of `eos::tp_explicit` checked against published values and identities.
//!
//! - IAPWS-IF97 verification values (IAPWS R7-97(2012) Tables 5 and 15, as recorded in
//!   shared/reference/water/if97_check_values.csv): cp and w from the adapter's central
//!   differences, and enthalpy and entropy differences between states.
//! - Identities: ln phi of a pure fluid = h_dep/RT - s_dep/R; cp = (dh/dT)_P; Z -> 1 as P -> 0;
//!   (T, rho) and (P, rho) invert (T, P).

use approx::assert_relative_eq;
use eos::gas_gravity::ZCorrelation;
use eos::state::RootChoice;
use eos::tp_explicit::{self, GravityModel, If97Model, LeeKeslerModel, TpModel};
use eos::Component;

const M: f64 = eos::tp_explicit::if97::M_WATER;

fn water() -> Component {
    // Constants from memory of Poling et al. (2001) App. A; IF97 gives the values.
    Component::new("water", M, 647.096, 220.64e5, 0.344)
}

fn methane() -> Component {
    Component::new("methane", 0.016_042_46, 190.56, 45.99e5, 0.011)
        .with_cp(eos::IdealGasCp::constant(4.3))
}

#[test]
fn if97_cp_and_sound_speed_from_numerical_derivatives() {
    // (T K, p MPa, cp kJ/(kg K), w m/s): Table 5 region 1 and Table 15 region 2.
    let cases = [
        (300.0, 3.0, 0.417301218e1, 0.150773921e4),
        (500.0, 3.0, 0.465580682e1, 0.124071337e4),
        (300.0, 0.0035, 0.191300162e1, 0.427920172e3),
        (700.0, 0.0035, 0.208141274e1, 0.644289068e3),
        (700.0, 30.0, 0.103505092e2, 0.480386523e3),
    ];
    let m = If97Model::new(water());
    for (t, p, cp, w) in cases {
        let s = tp_explicit::state_tp(&m, t, p * 1e6, &[1.0], RootChoice::LowestGibbs).unwrap();
        assert_relative_eq!(s.props.cp.unwrap() / M / 1e3, cp, max_relative = 1e-6);
        assert_relative_eq!(s.props.w.unwrap(), w, max_relative = 1e-6);
    }
}

#[test]
fn if97_enthalpy_and_entropy_differences() {
    // h and s differences between Table 5 and Table 15 states, kJ/kg and kJ/(kg K).
    let m = If97Model::new(water());
    let at = |t: f64, p: f64| {
        tp_explicit::state_tp(&m, t, p * 1e6, &[1.0], RootChoice::LowestGibbs)
            .unwrap()
            .props
    };
    let (a, b) = (at(300.0, 3.0), at(700.0, 0.0035));
    let dh = (b.h - a.h) / M / 1e3;
    let ds = (b.s - a.s) / M / 1e3;
    assert_relative_eq!(dh, 0.333568375e4 - 0.115331273e3, max_relative = 1e-8);
    // Entropy carries the 2e-5 ln(P/P_REF) J/(mol K) gas-constant difference (module docs).
    assert!((ds - (0.101749996e2 - 0.392294792)).abs() < 2e-5, "{ds}");
}

#[test]
fn pure_fluid_identities_for_every_tp_model() {
    let models: Vec<Box<dyn TpModel>> = vec![
        Box::new(LeeKeslerModel::new(&[methane()], None).unwrap()),
        Box::new(GravityModel::new(&[methane()], ZCorrelation::Dak)),
        Box::new(GravityModel::new(
            &[methane()],
            ZCorrelation::HallYarborough,
        )),
    ];
    for m in &models {
        let (t, p) = (300.0, 60e5);
        let s = tp_explicit::state_tp(m.as_ref(), t, p, &[1.0], RootChoice::LowestGibbs).unwrap();
        let pr = &s.props;
        let r = eos::constants::R;
        // ln phi = g_dep/RT = h_dep/RT - s_dep/R.
        assert_relative_eq!(
            pr.ln_phi[0],
            pr.h_res / (r * t) - pr.s_res / r,
            epsilon = 1e-9
        );
        // cp = (dh/dT)_P by a wider central difference than the adapter uses.
        let h = |t: f64| {
            tp_explicit::state_tp(m.as_ref(), t, p, &[1.0], RootChoice::LowestGibbs)
                .unwrap()
                .props
                .h
        };
        let cp = (h(t + 0.05) - h(t - 0.05)) / 0.1;
        assert_relative_eq!(pr.cp.unwrap(), cp, max_relative = 1e-4);
        assert!(pr.cp.unwrap() > pr.cv && pr.cv > 0.0 && pr.w.unwrap() > 0.0);
        // Round trips through the density pairs.
        let a = tp_explicit::state_trho(m.as_ref(), t, pr.rho, &[1.0], RootChoice::LowestGibbs)
            .unwrap();
        assert_relative_eq!(a.props.p, p, max_relative = 1e-9);
        let b = tp_explicit::state_prho(m.as_ref(), p, pr.rho, &[1.0], RootChoice::LowestGibbs)
            .unwrap();
        assert_relative_eq!(b.props.t, t, max_relative = 1e-9);
    }
}

#[test]
fn departures_from_the_z_integral_agree_with_lee_keslers_own() {
    // The same Lee-Kesler Z integrated along the isotherm (the path the Z-only correlations
    // take) reproduces Lee-Kesler's analytic departure functions.
    struct ZOnly(LeeKeslerModel);
    impl TpModel for ZOnly {
        fn id(&self) -> &str {
            "lk-z-only"
        }
        fn components(&self) -> &[Component] {
            self.0.components()
        }
        fn point(
            &self,
            t: f64,
            p: f64,
            x: &[f64],
            root: RootChoice,
        ) -> eos::Result<eos::tp_explicit::TpPoint> {
            let mut pt = self.0.point(t, p, x, root)?;
            pt.h_dep = None;
            pt.s_dep = None;
            Ok(pt)
        }
        fn has_departures(&self) -> bool {
            false
        }
    }
    let lk = LeeKeslerModel::new(&[methane()], None).unwrap();
    let a = tp_explicit::state_tp(&lk, 320.0, 80e5, &[1.0], RootChoice::Vapor).unwrap();
    let z = ZOnly(LeeKeslerModel::new(&[methane()], None).unwrap());
    let b = tp_explicit::state_tp(&z, 320.0, 80e5, &[1.0], RootChoice::Vapor).unwrap();
    assert_relative_eq!(a.props.h_res, b.props.h_res, max_relative = 1e-4);
    assert_relative_eq!(a.props.s_res, b.props.s_res, max_relative = 1e-4);
}

#[test]
fn the_gravity_correlations_tend_to_the_ideal_gas() {
    let m = GravityModel::new(&[methane()], ZCorrelation::Dak);
    let s = tp_explicit::state_tp(&m, 300.0, 1e3, &[1.0], RootChoice::LowestGibbs).unwrap();
    assert!((s.props.z - 1.0).abs() < 1e-4);
}

#[test]
fn t_rho_inverts_t_p_where_the_ideal_gas_start_lies_beyond_the_models_range() {
    // Lee-Kesler methane at 250 K and 149.4 bar: the ideal-gas pressure of its density
    // (about 230 bar) is the start of the search, and doubling it leaves Lee-Kesler's range
    // (Pr <= 10); the bracket must keep its last good end. Found by the Python property test.
    let lk = LeeKeslerModel::new(&[methane()], None).unwrap();
    let (t, p) = (250.0, 14_935_545.0);
    let s = tp_explicit::state_tp(&lk, t, p, &[1.0], RootChoice::LowestGibbs).unwrap();
    let back =
        tp_explicit::state_trho(&lk, t, s.props.rho, &[1.0], RootChoice::LowestGibbs).unwrap();
    assert_relative_eq!(back.props.p, p, max_relative = 1e-9);
}
