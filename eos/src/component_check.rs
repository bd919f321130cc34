//! The checks every model makes of its components before it is built: how many there are,
//! and critical constants and acentric factor that the equations can use.

use crate::component::Component;
use crate::error::{positive, Error, Result};

/// What a model accepts as an acentric factor: a test and the words that say it.
pub(crate) struct OmegaRule {
    pub ok: fn(f64) -> bool,
    pub accepted: &'static str,
}

/// Any finite acentric factor.
pub(crate) const FINITE_OMEGA: OmegaRule = OmegaRule {
    ok: f64::is_finite,
    accepted: "a finite number",
};

/// 1 to `max` components, each with a positive critical temperature and pressure and an
/// acentric factor that `omega` accepts.
pub(crate) fn check(comps: &[Component], max: usize, omega: &OmegaRule) -> Result<()> {
    let n = comps.len();
    if n == 0 || n > max {
        return Err(Error::invalid(
            "number of components",
            n as f64,
            format!("1 to {max}"),
        ));
    }
    for c in comps {
        positive("critical temperature", c.tc)?;
        positive("critical pressure", c.pc)?;
        if !(omega.ok)(c.omega) {
            return Err(Error::invalid("acentric factor", c.omega, omega.accepted));
        }
    }
    Ok(())
}
