//! Lee-Kesler (1975) as a (T, P)-explicit model: Z, departure functions and fugacity
//! coefficients come from [`crate::lee_kesler::LeeKesler`].

use super::{TpModel, TpPoint};
use crate::component::Component;
use crate::error::Result;
use crate::lee_kesler::LeeKesler;
use crate::state::RootChoice;

/// The Lee-Kesler model with the Plocker-Knapp-Prausnitz mixing rules.
#[derive(Debug, Clone)]
pub struct LeeKeslerModel {
    inner: LeeKesler,
}

impl LeeKeslerModel {
    /// The model for `comps` with the mixing-rule parameters k*_jk (all ones when `None`).
    pub fn new(comps: &[Component], kstar: Option<&[f64]>) -> Result<Self> {
        Ok(LeeKeslerModel {
            inner: LeeKesler::new(comps, kstar)?,
        })
    }
}

impl TpModel for LeeKeslerModel {
    fn id(&self) -> &str {
        crate::lee_kesler::ID
    }

    fn components(&self) -> &[Component] {
        self.inner.components()
    }

    fn point(&self, t: f64, p: f64, x: &[f64], root: RootChoice) -> Result<TpPoint> {
        let s = self.inner.state_tp(t, p, x, root)?;
        Ok(TpPoint {
            z: s.z,
            h_dep: Some(s.h_dep),
            s_dep: Some(s.s_dep),
            ideal: None,
            warnings: Vec::new(),
            caloric: None,
        })
    }

    fn component_ln_phi(
        &self,
        t: f64,
        p: f64,
        x: &[f64],
        root: RootChoice,
    ) -> Result<Option<Vec<f64>>> {
        let mut out = vec![0.0; x.len()];
        self.inner.ln_phi(t, p, x, root, &mut out)?;
        Ok(Some(out))
    }

    fn has_departures(&self) -> bool {
        true
    }
}
