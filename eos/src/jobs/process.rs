//! Changes of state of a unit mass along a named path, with heat, work and the changes of
//! u, h and s.
//!
//! Sign convention: q is heat into the fluid, w is work done by the fluid, so the first law of
//! a closed system reads du = q - w. The paths are reversible except the throttle:
//!
//! | path | end given by | q | w (closed system) |
//! |---|---|---|---|
//! | isochoric | T or P | du | 0 |
//! | isobaric | T | dh | P dv |
//! | isothermal | P | T ds | q - du |
//! | isentropic | P | 0 | -du |
//! | isenthalpic (throttle, steady flow) | P | 0 | 0 (no shaft work) |
//!
//! The steady-flow (shaft) work done by the fluid on a reversible path is
//! w_flow = -integral v dP = q - dh; for the throttle it is 0 and h2 = h1, and T2 - T1 is the
//! Joule-Thomson temperature change. Every relation is the first law with the definitions
//! h = u + P v and, for reversible heat, dq = T ds (any thermodynamics text, e.g. Y. A. Cengel
//! and M. A. Boles, *Thermodynamics: An Engineering Approach*, chapters 4, 5 and 7).

use crate::error::{positive, Error, Result};
use crate::jobs::equilibrium_state::{at_ph, at_ps, at_tp, at_trho, EqState};
use crate::model::Model;

/// A named path.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Path {
    /// Constant volume.
    Isochoric,
    /// Constant pressure.
    Isobaric,
    /// Constant temperature.
    Isothermal,
    /// Constant entropy.
    Isentropic,
    /// Constant enthalpy (a throttling valve).
    Isenthalpic,
}

impl Path {
    /// Name used in reports.
    pub fn as_str(self) -> &'static str {
        match self {
            Path::Isochoric => "isochoric",
            Path::Isobaric => "isobaric",
            Path::Isothermal => "isothermal",
            Path::Isentropic => "isentropic",
            Path::Isenthalpic => "isenthalpic",
        }
    }
}

/// The end condition.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum End {
    /// End temperature, K.
    Temperature(f64),
    /// End pressure, Pa.
    Pressure(f64),
}

/// A process result; per-mass quantities in J/kg and J/(kg K).
#[derive(Debug, Clone, PartialEq)]
pub struct Process {
    /// The path.
    pub path: Path,
    /// Start state.
    pub start: EqState,
    /// End state.
    pub end: EqState,
    /// Heat into the fluid, J/kg.
    pub heat: f64,
    /// Work done by the fluid (closed system), J/kg.
    pub work: f64,
    /// Steady-flow work done by the fluid, q - dh, J/kg.
    pub flow_work: f64,
    /// u2 - u1, J/kg.
    pub du: f64,
    /// h2 - h1, J/kg.
    pub dh: f64,
    /// s2 - s1, J/(kg K).
    pub ds: f64,
    /// T2 - T1, K.
    pub dt: f64,
}

fn wrong_end(path: Path, needs: &str) -> Error {
    Error::InvalidInput {
        what: "end condition",
        value: path.as_str().to_string(),
        accepted: format!("an {} path ends at a stated {needs}", path.as_str()),
    }
}

/// The isochoric state at overall density `rho` and pressure `p`: temperature by bracketing
/// and Brent's method on ln P(T) (P rises with T at fixed volume).
fn isochoric_at_p(model: &dyn Model, rho: f64, p: f64, t0: f64, x: &[f64]) -> Result<EqState> {
    let mut err = None;
    let mut g = |t: f64| match at_trho(model, t, rho, x) {
        Ok(s) => (s.p / p).ln(),
        Err(e) => {
            err.get_or_insert(e);
            f64::NAN
        }
    };
    let (mut lo, mut hi) = (t0, t0);
    let mut k = 0;
    while g(hi) < 0.0 {
        hi *= 1.5;
        k += 1;
        if k > 60 {
            break;
        }
    }
    k = 0;
    loop {
        let v = g(lo);
        if v.is_nan() || v <= 0.0 || k > 60 || lo < 1.0 {
            break;
        }
        lo /= 1.5;
        k += 1;
    }
    let t = crate::equilibrium::brent::solve(
        "temperature of an isochoric end state",
        lo,
        hi,
        1e-14,
        1e-15,
        &mut g,
    );
    if let Some(e) = err {
        return Err(e);
    }
    at_trho(model, t?, rho, x)
}

/// The change of state of feed `x` from (t1, p1) along `path` to `end`.
pub fn run(
    model: &dyn Model,
    t1: f64,
    p1: f64,
    x: &[f64],
    path: Path,
    end: End,
) -> Result<Process> {
    let a = at_tp(model, t1, p1, x)?;
    let b = match (path, end) {
        (Path::Isochoric, End::Temperature(t2)) => at_trho(model, t2, a.rho, x)?,
        (Path::Isochoric, End::Pressure(p2)) => {
            positive("end pressure (Pa)", p2)?;
            isochoric_at_p(model, a.rho, p2, t1, x)?
        }
        (Path::Isobaric, End::Temperature(t2)) => at_tp(model, t2, p1, x)?,
        (Path::Isothermal, End::Pressure(p2)) => at_tp(model, t1, p2, x)?,
        (Path::Isentropic, End::Pressure(p2)) => at_ps(model, p2, a.s, x)?,
        (Path::Isenthalpic, End::Pressure(p2)) => at_ph(model, p2, a.h, x)?,
        (Path::Isobaric, End::Pressure(_)) => return Err(wrong_end(path, "temperature")),
        (_, End::Temperature(_)) => return Err(wrong_end(path, "pressure")),
    };
    let m = a.molar_mass;
    let du = (b.u - a.u) / m;
    let dh = (b.h - a.h) / m;
    let ds = (b.s - a.s) / m;
    let dv = (1.0 / b.rho - 1.0 / a.rho) / m;
    let (heat, work) = match path {
        Path::Isochoric => (du, 0.0),
        Path::Isobaric => (dh, p1 * dv),
        Path::Isothermal => {
            let q = t1 * ds;
            (q, q - du)
        }
        Path::Isentropic => (0.0, -du),
        Path::Isenthalpic => (0.0, 0.0),
    };
    Ok(Process {
        path,
        flow_work: heat - dh,
        du,
        dh,
        ds,
        dt: b.t - a.t,
        heat,
        work,
        start: a,
        end: b,
    })
}
