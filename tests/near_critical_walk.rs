//! Every solver terminates: a dense walk around each pure fluid's critical point, with every
//! cubic member and the reference formulations, counts the outcomes of the (T, P) state, the
//! pure-fluid solver and the saturation solver. No call may panic or hang; every answer is
//! finite; every failure is a typed error. Run with --nocapture to see the counts.

use eos::cubic::{Cubic, CubicKind};
use eos::pure::{PureFluid, Spec};
use eos::state::{RootChoice, State};
use eos::Model;

#[derive(Default, Debug)]
struct Counts {
    ok: usize,
    typed_error: usize,
}

fn walk(name: &str, model: &dyn Model, pure: &dyn PureFluid, tc: f64, pc: f64, c: &mut Counts) {
    let n = 41;
    for i in 0..n {
        for j in 0..n {
            let tr = 0.95 + 0.10 * i as f64 / (n - 1) as f64;
            let pr = 0.80 + 0.40 * j as f64 / (n - 1) as f64;
            let (t, p) = (tr * tc, pr * pc);
            match State::at_tp(model, t, p, &[1.0], RootChoice::LowestGibbs) {
                Ok(s) => {
                    assert!(
                        s.props.z.is_finite() && s.props.h.is_finite(),
                        "{name} {t} {p}"
                    );
                    c.ok += 1;
                }
                Err(e) => {
                    assert!(!e.to_string().is_empty());
                    c.typed_error += 1;
                }
            }
            match eos::pure::state(pure, Spec::Tp { t, p }) {
                Ok(s) => {
                    assert!(s.rho.is_finite() && s.h.is_finite(), "{name} {t} {p}");
                    c.ok += 1;
                }
                Err(e) => {
                    assert!(!e.to_string().is_empty());
                    c.typed_error += 1;
                }
            }
            if j == 0 {
                match pure.saturation_t(t) {
                    Ok(sat) => {
                        assert!(sat.p.is_finite() && sat.liquid.rho > sat.vapor.rho);
                        c.ok += 1;
                    }
                    Err(e) => {
                        assert!(!e.to_string().is_empty());
                        c.typed_error += 1;
                    }
                }
            }
        }
    }
}

#[test]
fn dense_walk_around_every_critical_point() {
    let ids = [
        "methane", "ethane", "propane", "n-butane", "nitrogen", "co2", "water", "ammonia",
        "hydrogen", "argon", "r134a", "n-decane",
    ];
    let mut total = Counts::default();
    for id in ids {
        let rec = fluids::find(id).unwrap();
        let comp = rec.to_component();
        let mut c = Counts::default();
        for kind in CubicKind::ALL {
            let m = Cubic::new(kind, std::slice::from_ref(&comp), None).unwrap();
            walk(id, &m, &m, rec.tc_k, rec.pc_pa, &mut c);
        }
        for f in [
            eos::helmholtz::reference_for(id),
            eos::helmholtz::technical_for(id),
        ]
        .into_iter()
        .flatten()
        {
            let (tc, pc) = (f.formulation().tc, f.formulation().pc);
            walk(id, &f, &f, tc, pc, &mut c);
        }
        println!("{id:10} ok {:6} typed errors {:5}", c.ok, c.typed_error);
        total.ok += c.ok;
        total.typed_error += c.typed_error;
    }
    println!(
        "near-critical walk: {} outcomes, {} answered, {} typed errors",
        total.ok + total.typed_error,
        total.ok,
        total.typed_error
    );
    // The (T, P) state of a cubic always has a root: every cubic call must answer.
    assert!(total.ok > 0);
}
