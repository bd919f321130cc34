//! A pure-fluid state fixed by two properties: the request ([`Spec`]) and the answer
//! ([`PureState`]).

use super::error::{PureError, PureResult};
use super::fluid::SatState;
use crate::phase::Phase;
use crate::properties::Properties;

/// Two properties that fix a pure-fluid state, SI molar units: T in K, p in Pa, v in m3/mol,
/// h in J/mol, s in J/(mol K), x the vapour quality (mass = mole fraction of vapour).
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Spec {
    /// Temperature and pressure.
    Tp { t: f64, p: f64 },
    /// Temperature and molar volume.
    Tv { t: f64, v: f64 },
    /// Pressure and molar volume.
    Pv { p: f64, v: f64 },
    /// Pressure and molar enthalpy.
    Ph { p: f64, h: f64 },
    /// Pressure and molar entropy.
    Ps { p: f64, s: f64 },
    /// Temperature and quality.
    Tx { t: f64, x: f64 },
    /// Pressure and quality.
    Px { p: f64, x: f64 },
}

/// One property of a request.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Quantity {
    /// Temperature, K.
    T,
    /// Pressure, Pa.
    P,
    /// Molar volume, m3/mol.
    V,
    /// Molar enthalpy, J/mol.
    H,
    /// Molar entropy, J/(mol K).
    S,
    /// Vapour quality, 0..1.
    X,
}

impl Quantity {
    fn symbol(self) -> &'static str {
        match self {
            Quantity::T => "T",
            Quantity::P => "P",
            Quantity::V => "v",
            Quantity::H => "h",
            Quantity::S => "s",
            Quantity::X => "x",
        }
    }
}

impl Spec {
    /// The request made of two properties in either order; pairs that do not fix a state
    /// here (a property twice, (h, s), (T, h), ...) give [`PureError::UnsupportedPair`].
    pub fn from_pair(a: (Quantity, f64), b: (Quantity, f64)) -> PureResult<Spec> {
        use Quantity::*;
        let ((qa, va), (qb, vb)) = if order(a.0) <= order(b.0) {
            (a, b)
        } else {
            (b, a)
        };
        Ok(match (qa, qb) {
            (T, P) => Spec::Tp { t: va, p: vb },
            (T, V) => Spec::Tv { t: va, v: vb },
            (T, X) => Spec::Tx { t: va, x: vb },
            (P, V) => Spec::Pv { p: va, v: vb },
            (P, H) => Spec::Ph { p: va, h: vb },
            (P, S) => Spec::Ps { p: va, s: vb },
            (P, X) => Spec::Px { p: va, x: vb },
            _ => {
                return Err(PureError::UnsupportedPair {
                    given: format!("({}, {})", qa.symbol(), qb.symbol()),
                })
            }
        })
    }
}

fn order(q: Quantity) -> u8 {
    match q {
        Quantity::T => 0,
        Quantity::P => 1,
        Quantity::V => 2,
        Quantity::H => 3,
        Quantity::S => 4,
        Quantity::X => 5,
    }
}

/// A pure-fluid state: single-phase, saturated or two-phase.
#[derive(Debug, Clone, PartialEq)]
pub struct PureState {
    /// Temperature, K.
    pub t: f64,
    /// Pressure, Pa.
    pub p: f64,
    /// Overall molar density, mol/m3.
    pub rho: f64,
    /// Overall molar volume, m3/mol.
    pub v: f64,
    /// Internal energy, J/mol.
    pub u: f64,
    /// Enthalpy, J/mol.
    pub h: f64,
    /// Entropy, J/(mol K).
    pub s: f64,
    /// The phase: compressed liquid ([`Phase::Liquid`]), saturated liquid, two-phase,
    /// saturated vapour, superheated vapour ([`Phase::Vapor`]), gas above the critical
    /// temperature below the critical pressure ([`Phase::Gas`]) or supercritical fluid.
    pub phase: Phase,
    /// Vapour quality for saturated and two-phase states, `None` for single-phase states.
    pub quality: Option<f64>,
    /// Every property of a single-phase state.
    pub single: Option<Properties>,
    /// Both saturated phases of a saturated or two-phase state.
    pub saturation: Option<SatState>,
}

impl PureState {
    /// A single-phase state.
    pub fn single(props: Properties, phase: Phase) -> Self {
        PureState {
            t: props.t,
            p: props.p,
            rho: props.rho,
            v: 1.0 / props.rho,
            u: props.u,
            h: props.h,
            s: props.s,
            phase,
            quality: None,
            single: Some(props),
            saturation: None,
        }
    }

    /// The state of quality `x` (0..1) at a saturation state, by the lever rule
    /// m = (1 - x) m' + x m'' on v, u, h and s (additivity of extensive properties over two
    /// coexisting phases).
    pub fn two_phase(sat: SatState, x: f64) -> PureResult<Self> {
        if !(0.0..=1.0).contains(&x) {
            return Err(PureError::QualityOutOfRange { x });
        }
        let (l, g) = (&sat.liquid, &sat.vapor);
        let lever = |a: f64, b: f64| (1.0 - x) * a + x * b;
        let v = lever(l.molar_volume(), g.molar_volume());
        let phase = if x <= 0.0 {
            Phase::SaturatedLiquid
        } else if x >= 1.0 {
            Phase::SaturatedVapor
        } else {
            Phase::TwoPhase
        };
        Ok(PureState {
            t: sat.t,
            p: sat.p,
            rho: 1.0 / v,
            v,
            u: lever(l.u, g.u),
            h: lever(l.h, g.h),
            s: lever(l.s, g.s),
            phase,
            quality: Some(x),
            single: None,
            saturation: Some(sat),
        })
    }
}
