//! Vessels and gas cylinders: a fixed volume V holding an amount n of a feed.
//!
//! Every operation is a state at a fixed overall molar density rho = n / V, or a change of n:
//!
//! - inventory at (T, P): n = V rho(T, P), m = n M;
//! - usable gas between two states: m1 - m2 (each at its own T and P);
//! - heating or cooling at fixed V and m: the equilibrium state at (T2, rho1), which may
//!   condense ([`super::equilibrium_state::at_trho`]); the split is reported;
//! - fill pressure: the pressure at the filling temperature of the density that gives the
//!   rated pressure at the reference temperature, P(T_fill, rho(T_ref, P_rated));
//! - mass to add or vent to reach a target pressure or mass at the current temperature;
//! - isentropic (adiabatic, reversible) venting to a final pressure. Each mass element of the
//!   gas that stays in the vessel has expanded reversibly and adiabatically, pushing out the
//!   gas ahead of it, so its specific entropy is that of the start (e.g. Y. A. Cengel and
//!   M. A. Boles, *Thermodynamics: An Engineering Approach*, uniform-flow discharge of a
//!   rigid tank with no heat transfer):
//!
//!   ```text
//!   s(T(P), P) = s1 at every P on the path;  m(P) = V rho(T(P), P) M
//!   ```
//!
//!   The path is followed in equal steps of ln P; each point is solved on its own (no error
//!   accumulates), and the remaining contents are taken as homogeneous.

use crate::error::{positive, Error, Result};
use crate::jobs::equilibrium_state::{at_ps, at_tp, at_trho, EqState};
use crate::model::Model;

/// What a vessel holds at one state.
#[derive(Debug, Clone, PartialEq)]
pub struct Inventory {
    /// Vessel volume, m3.
    pub volume: f64,
    /// The state of the contents.
    pub state: EqState,
    /// Amount, mol.
    pub moles: f64,
    /// Mass, kg.
    pub mass: f64,
}

impl Inventory {
    fn of(volume: f64, state: EqState) -> Self {
        let moles = volume * state.rho;
        Inventory {
            volume,
            moles,
            mass: moles * state.molar_mass,
            state,
        }
    }
}

fn check_volume(v: f64) -> Result<f64> {
    positive("vessel volume (m3)", v)
}

/// The contents of a vessel of volume `volume` (m3) at (T, P).
pub fn inventory(model: &dyn Model, volume: f64, t: f64, p: f64, x: &[f64]) -> Result<Inventory> {
    check_volume(volume)?;
    Ok(Inventory::of(volume, at_tp(model, t, p, x)?))
}

/// Gas that can be drawn between two states of the same vessel.
#[derive(Debug, Clone, PartialEq)]
pub struct Usable {
    /// Contents at the start.
    pub initial: Inventory,
    /// Contents at the end.
    pub end: Inventory,
    /// Amount drawn, mol.
    pub moles: f64,
    /// Mass drawn, kg.
    pub mass: f64,
}

/// Gas drawn from state (t1, p1) down to state (t2, p2).
pub fn usable(
    model: &dyn Model,
    volume: f64,
    (t1, p1): (f64, f64),
    (t2, p2): (f64, f64),
    x: &[f64],
) -> Result<Usable> {
    let initial = inventory(model, volume, t1, p1, x)?;
    let end = inventory(model, volume, t2, p2, x)?;
    if end.moles > initial.moles {
        return Err(Error::InvalidInput {
            what: "end state",
            value: format!("{t2} K, {p2} Pa"),
            accepted: format!(
                "a state holding less than the start ({:.6e} kg at the end against {:.6e} kg \
                 at the start): no gas can be drawn",
                end.mass, initial.mass
            ),
        });
    }
    Ok(Usable {
        moles: initial.moles - end.moles,
        mass: initial.mass - end.mass,
        initial,
        end,
    })
}

/// A closed vessel brought to another temperature.
#[derive(Debug, Clone, PartialEq)]
pub struct Retemper {
    /// Contents at the start.
    pub initial: Inventory,
    /// Contents at the new temperature (same volume and mass).
    pub end: Inventory,
    /// (m_end - m_start) / m_start: zero to the solver's tolerance.
    pub mass_balance: f64,
}

/// The vessel at (t1, p1) heated or cooled to `t2` at fixed volume and mass.
pub fn retemper(
    model: &dyn Model,
    volume: f64,
    t1: f64,
    p1: f64,
    t2: f64,
    x: &[f64],
) -> Result<Retemper> {
    let initial = inventory(model, volume, t1, p1, x)?;
    let end = Inventory::of(volume, at_trho(model, t2, initial.state.rho, x)?);
    Ok(Retemper {
        mass_balance: (end.mass - initial.mass) / initial.mass,
        initial,
        end,
    })
}

/// The fill pressure that settles to a rated pressure at a reference temperature.
#[derive(Debug, Clone, PartialEq)]
pub struct FillPressure {
    /// The rated state (reference temperature, rated pressure).
    pub rated: EqState,
    /// The state at the filling temperature with the same density.
    pub fill: EqState,
}

/// Fill pressure at `t_fill` for a rated pressure `p_rated` at `t_ref`.
pub fn fill_pressure(
    model: &dyn Model,
    t_fill: f64,
    p_rated: f64,
    t_ref: f64,
    x: &[f64],
) -> Result<FillPressure> {
    let rated = at_tp(model, t_ref, p_rated, x)?;
    let fill = at_trho(model, t_fill, rated.rho, x)?;
    Ok(FillPressure { rated, fill })
}

/// A target for the contents at the current temperature.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Target {
    /// Absolute pressure, Pa.
    Pressure(f64),
    /// Mass, kg.
    Mass(f64),
}

/// Mass to add (positive) or vent (negative) to reach a target.
#[derive(Debug, Clone, PartialEq)]
pub struct ToTarget {
    /// Contents now.
    pub initial: Inventory,
    /// Contents at the target.
    pub end: Inventory,
    /// Mass to add (> 0) or vent (< 0), kg.
    pub delta_mass: f64,
    /// Amount to add or vent, mol.
    pub delta_moles: f64,
}

/// Mass to add or vent at temperature `t` to go from pressure `p` to `target`. Venting cannot
/// bring the vessel below `back_pressure` (Pa), the pressure it vents into.
pub fn to_target(
    model: &dyn Model,
    volume: f64,
    t: f64,
    p: f64,
    target: Target,
    back_pressure: f64,
    x: &[f64],
) -> Result<ToTarget> {
    let initial = inventory(model, volume, t, p, x)?;
    let end = match target {
        Target::Pressure(pt) => {
            positive("target pressure (Pa)", pt)?;
            if pt < p && pt < back_pressure {
                return Err(Error::InvalidInput {
                    what: "target pressure (Pa)",
                    value: format!("{pt}"),
                    accepted: format!(
                        "a pressure the vessel can reach: venting stops at the back pressure \
                         of {back_pressure} Pa"
                    ),
                });
            }
            inventory(model, volume, t, pt, x)?
        }
        Target::Mass(m) => {
            positive("target mass (kg)", m)?;
            let rho = m / (volume * model.molar_mass(x));
            let max = model.max_density(x);
            if rho >= max {
                return Err(Error::OutOfRange {
                    model: model.id().to_string(),
                    what: "target mass",
                    detail: format!(
                        "{m} kg in {volume} m3 is {rho:.6e} mol/m3, at or above the densest \
                         state the model represents ({max:.6e} mol/m3): the vessel cannot \
                         hold it"
                    ),
                });
            }
            let s = at_trho(model, t, rho, x)?;
            if s.p < back_pressure && m < initial.mass {
                return Err(Error::InvalidInput {
                    what: "target mass (kg)",
                    value: format!("{m}"),
                    accepted: format!(
                        "a mass the vessel can reach by venting: at {m} kg its pressure would \
                         be {:.6e} Pa, below the back pressure of {back_pressure} Pa",
                        s.p
                    ),
                });
            }
            Inventory::of(volume, s)
        }
    };
    Ok(ToTarget {
        delta_mass: end.mass - initial.mass,
        delta_moles: end.moles - initial.moles,
        initial,
        end,
    })
}

/// One point of an isentropic venting path.
#[derive(Debug, Clone, PartialEq)]
pub struct VentPoint {
    /// Pressure, Pa.
    pub p: f64,
    /// Temperature, K.
    pub t: f64,
    /// Mass left in the vessel, kg.
    pub mass: f64,
    /// The equilibrium state.
    pub state: EqState,
}

/// Isentropic venting of a vessel.
#[derive(Debug, Clone, PartialEq)]
pub struct Venting {
    /// Contents at the start.
    pub initial: Inventory,
    /// The path, start and end included, pressure falling.
    pub path: Vec<VentPoint>,
    /// Mass left at the end, kg.
    pub mass_left: f64,
    /// Mass vented, kg.
    pub mass_vented: f64,
    /// Lowest temperature on the path, K.
    pub t_min: f64,
    /// Largest |s - s1| on the path, J/(mol K).
    pub entropy_drift: f64,
    /// True when the lowest temperature is below the minimum design metal temperature.
    pub below_mdmt: Option<bool>,
}

/// Venting from (t1, p1) to `p2` in `steps` equal steps of ln P (at least 1, at most 10 000),
/// with the lowest temperature compared with `mdmt` (K) when given.
#[allow(clippy::too_many_arguments)]
pub fn vent_isentropic(
    model: &dyn Model,
    volume: f64,
    t1: f64,
    p1: f64,
    p2: f64,
    steps: usize,
    mdmt: Option<f64>,
    x: &[f64],
) -> Result<Venting> {
    positive("final pressure (Pa)", p2)?;
    if p2 >= p1 {
        return Err(Error::InvalidInput {
            what: "final venting pressure (Pa)",
            value: format!("{p2}"),
            accepted: format!("a pressure below the start of {p1} Pa"),
        });
    }
    if !(1..=10_000).contains(&steps) {
        return Err(Error::invalid("venting steps", steps as f64, "1 to 10000"));
    }
    if let Some(m) = mdmt {
        positive("minimum design metal temperature (K)", m)?;
    }
    let initial = inventory(model, volume, t1, p1, x)?;
    let s1 = initial.state.s;
    let mut path = Vec::with_capacity(steps + 1);
    path.push(VentPoint {
        p: p1,
        t: t1,
        mass: initial.mass,
        state: initial.state.clone(),
    });
    let ratio = (p2 / p1).ln() / steps as f64;
    let mut drift: f64 = 0.0;
    for k in 1..=steps {
        let p = if k == steps {
            p2
        } else {
            p1 * (ratio * k as f64).exp()
        };
        let st = at_ps(model, p, s1, x)?;
        drift = drift.max((st.s - s1).abs());
        path.push(VentPoint {
            p,
            t: st.t,
            mass: volume * st.rho * st.molar_mass,
            state: st,
        });
    }
    let t_min = path.iter().map(|v| v.t).fold(f64::INFINITY, f64::min);
    let mass_left = path.last().map_or(initial.mass, |v| v.mass);
    Ok(Venting {
        mass_vented: initial.mass - mass_left,
        mass_left,
        t_min,
        entropy_drift: drift,
        below_mdmt: mdmt.map(|m| t_min < m),
        path,
        initial,
    })
}
