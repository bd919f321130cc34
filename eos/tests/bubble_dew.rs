//! Bubble and dew points, checked by the equilibrium conditions, by the flash, and by the
//! pure-fluid limit.

mod common;

use common::{demo_gas, pr_model};
use eos::equilibrium::{bubble, dew, flash, saturation, SaturationPoint, Side};
use eos::{Error, Model};

/// Equal fugacity at the point with the model's own ln phi (Michelsen 1980 conditions).
fn check_point(m: &dyn Model, r: &SaturationPoint) {
    let n = r.x.len();
    let (mut ll, mut lv) = (vec![0.0; n], vec![0.0; n]);
    common::ln_phi_at(m, r.t, r.p, r.rho_l, &r.x, &mut ll);
    common::ln_phi_at(m, r.t, r.p, r.rho_v, &r.y, &mut lv);
    for i in 0..n {
        if r.x[i] > 0.0 && r.y[i] > 0.0 {
            let d = r.x[i].ln() + ll[i] - r.y[i].ln() - lv[i];
            assert!(d.abs() < 1e-10, "component {i}: {d:e}");
        }
    }
    assert!((r.x.iter().sum::<f64>() - 1.0).abs() < 1e-10);
    assert!((r.y.iter().sum::<f64>() - 1.0).abs() < 1e-10);
    assert!(r.rho_l > r.rho_v);
}

#[test]
fn demo_gas_dew_and_bubble_points() {
    let (names, z) = demo_gas();
    let m = pr_model(&names);
    let d = dew::pressure(&m, 250.0, &z).unwrap();
    assert_eq!(d.side, Side::Dew);
    check_point(&m, &d);
    let dt = dew::temperature(&m, d.p, &z).unwrap();
    assert!((dt.t / 250.0 - 1.0).abs() < 1e-8, "{}", dt.t);
    let b = bubble::pressure(&m, 150.0, &z).unwrap();
    check_point(&m, &b);
    let bt = bubble::temperature(&m, b.p, &z).unwrap();
    assert!((bt.t / 150.0 - 1.0).abs() < 1e-8, "{}", bt.t);
}

/// The dew point separates one phase from two: flashes just beside it (the flash and the
/// dew-point solver share no code path beyond the model) give a vapour fraction near 1 on
/// one side and one phase on the other.
#[test]
fn flash_agrees_with_the_dew_point() {
    let (names, z) = demo_gas();
    let m = pr_model(&names);
    let d = dew::pressure(&m, 250.0, &z).unwrap();
    let a = flash::tp(&m, 250.0, d.p * (1.0 - 1e-3), &z).unwrap();
    let b = flash::tp(&m, 250.0, d.p * (1.0 + 1e-3), &z).unwrap();
    let (two, one) = match (&a, &b) {
        (flash::FlashResult::TwoPhase(t), flash::FlashResult::SinglePhase(_)) => (t, &b),
        (flash::FlashResult::SinglePhase(_), flash::FlashResult::TwoPhase(t)) => (t, &a),
        _ => panic!("{a:?}\n{b:?}"),
    };
    assert!(!one.is_two_phase());
    assert!(two.vapor_fraction > 0.99, "{}", two.vapor_fraction);
}

/// As one component vanishes, bubble and dew pressures of the binary collapse onto the
/// vapour pressure of the other (pure-fluid limit of the equilibrium conditions); the gap
/// closes in proportion to the trace amount.
#[test]
fn dilute_binary_collapses_onto_the_pure_vapour_pressure() {
    let m = pr_model(&["methane", "ethane"]);
    let pure = pr_model(&["methane"]);
    let t = 0.8 * 190.56;
    let ps = saturation::pressure(&pure, t).unwrap().p;
    let mut last = f64::INFINITY;
    for eps in [1e-3, 1e-4, 1e-5, 1e-6, 1e-7] {
        let z = [1.0 - eps, eps];
        let b = bubble::pressure(&m, t, &z).unwrap();
        let d = dew::pressure(&m, t, &z).unwrap();
        check_point(&m, &b);
        check_point(&m, &d);
        assert!(b.p > d.p, "bubble {} below dew {}", b.p, d.p);
        let gap = (b.p - d.p) / ps;
        // For a trace of the heavier component the gap is first order in its amount: each
        // decade of eps must shrink it by well over a factor of 0.7.
        assert!(gap < 0.7 * last, "eps {eps}: gap {gap} vs {last}");
        last = gap;
        let off = (b.p / ps - 1.0).abs().max((d.p / ps - 1.0).abs());
        if eps <= 1e-7 {
            assert!(off < 1e-4, "eps {eps}: {off}");
        }
    }
}

#[test]
fn no_dew_point_above_the_cricondenbar() {
    let (names, z) = demo_gas();
    let m = pr_model(&names);
    assert!(matches!(
        dew::temperature(&m, 400e5, &z),
        Err(Error::NoSolution(_))
    ));
    assert!(matches!(
        dew::pressure(&m, 500.0, &z),
        Err(Error::NoSolution(_))
    ));
    // One component present only: a typed refusal.
    assert!(matches!(
        bubble::pressure(
            &m,
            150.0,
            &[0.0, 0.0, 1.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0]
        ),
        Err(Error::InvalidInput { .. })
    ));
}

/// Where the dew curve is retrograde (between the critical temperature and the
/// cricondentherm) one isotherm crosses it twice (common practice: retrograde condensation):
/// both dew pressures are found, each meets the equilibrium conditions, and flashes just
/// beside each (no code shared with the dew-point solver beyond the model) change between one
/// phase and two there: two phases between the two points, one phase outside. Below the
/// critical temperature there is one dew pressure. No published values for this binary with
/// this model are at hand; the checks are the conditions themselves.
#[test]
fn both_dew_pressures_of_a_retrograde_isotherm() {
    let m = pr_model(&["methane", "propane"]);
    let z = [0.9, 0.1];
    let both = dew::pressures(&m, 250.0, &z).unwrap();
    assert_eq!(both.len(), 2, "{both:?}");
    let (lower, upper) = (&both[0], &both[1]);
    assert!(upper.p > 1.5 * lower.p, "{} {}", lower.p, upper.p);
    let two_phase = |p: f64| flash::tp(&m, 250.0, p, &z).unwrap().is_two_phase();
    for d in [lower, upper] {
        check_point(&m, d);
        assert!((d.t - 250.0).abs() < 1e-9);
    }
    assert!(!two_phase(lower.p * 0.999) && two_phase(lower.p * 1.001));
    assert!(two_phase(upper.p * 0.999) && !two_phase(upper.p * 1.001));
    // The single-point solver finds one of the two.
    let one = dew::pressure(&m, 250.0, &z).unwrap();
    assert!(both.iter().any(|d| (d.p / one.p - 1.0).abs() < 1e-8));
    // Below the critical temperature, one dew pressure.
    assert_eq!(dew::pressures(&m, 200.0, &z).unwrap().len(), 1);
    // Between the critical pressure and the cricondenbar, two dew temperatures.
    let temps = dew::temperatures(&m, 80e5, &z).unwrap();
    assert_eq!(temps.len(), 2, "{temps:?}");
    for d in &temps {
        check_point(&m, d);
    }
    assert!(temps[0].t < temps[1].t);
    // Beyond the cricondentherm, none.
    assert!(dew::pressures(&m, 260.0, &z).is_err());
}
