//! Peneloux volume translation of a cubic equation of state (model ids `srk-pen`, `pr-pen`,
//! `pr78-pen`).
//!
//! A. Peneloux, E. Rauzy, R. Freze, *A consistent correction for Redlich-Kwong-Soave volumes*,
//! Fluid Phase Equilib. 8 (1982) 7-23. The translated volume is v = v_cubic - c with
//! c = sum_i x_i c_i, a constant per component. Phase equilibria are unchanged, because every
//! ln phi_i shifts by the same -c_i P/(RT) in each phase; liquid densities change.
//!
//! Shifts used (R Tc/Pc times a function of the Rackett compressibility Z_RA):
//! - SRK: c_i = 0.40768 (0.29441 - Z_RA,i) R Tc_i / Pc_i (Peneloux et al. 1982);
//! - PR: c_i = 0.50033 (0.25969 - Z_RA,i) R Tc_i / Pc_i, the Peneloux-type correlation for
//!   Peng-Robinson in common use (the 1982 paper treats SRK only; the source of these two
//!   constants was not verified here);
//! - Z_RA,i = 0.29056 - 0.08775 omega_i when no tabulated value is given (the Rackett
//!   compressibility correlation of Spencer & Danner, J. Chem. Eng. Data 17 (1972) 236).
//!
//! In Helmholtz form, with rho the translated and rho_c = rho/(1 + c rho) the cubic's density:
//! alpha_r(T, rho, x) = alpha_r,cubic(T, rho_c, x) - ln(1 + c rho).
//! With s = c rho and k = 1/(1 + s): a_d = k a_d,c - s k,
//! rho d(a_d)/d(rho) = k^2 (a_d,c + a_dd,c) - s k^2 a_d,c - s k^2, a_dd = that - a_d,
//! a_t = a_t,c, a_tt = a_tt,c, a_dt = k a_dt,c; ln phi_i = ln phi_i,c - c_i P/(RT).

use crate::component::Component;
use crate::constants::R;
use crate::cubic::{Cubic, CubicKind};
use crate::error::{Error, Result};
use crate::ideal_cp::IdealGasValues;
use crate::model::{DensityRoots, Model};
use crate::residual::Residual;

/// A cubic equation of state with a constant volume shift per component.
#[derive(Debug, Clone)]
pub struct Translated {
    cubic: Cubic,
    c: Vec<f64>,
    id: &'static str,
}

/// Rackett compressibility from the acentric factor, Z_RA = 0.29056 - 0.08775 omega.
pub fn rackett_z(omega: f64) -> f64 {
    0.29056 - 0.08775 * omega
}

/// The Peneloux shift c (m3/mol) of one component for a cubic member.
pub fn peneloux_shift(kind: CubicKind, tc: f64, pc: f64, z_ra: f64) -> Result<f64> {
    let rtc_pc = R * tc / pc;
    match kind {
        CubicKind::Srk => Ok(0.40768 * (0.29441 - z_ra) * rtc_pc),
        CubicKind::Pr76 | CubicKind::Pr78 => Ok(0.50033 * (0.25969 - z_ra) * rtc_pc),
        other => Err(Error::invalid(
            "cubic member for Peneloux translation",
            f64::NAN,
            format!(
                "SRK or Peng-Robinson ({} has no Peneloux correlation)",
                other.spec().id
            ),
        )),
    }
}

impl Translated {
    /// The Peneloux-translated member `kind` (SRK, PR 1976 or PR 1978) for `comps`. `z_ra` gives
    /// tabulated Rackett compressibilities (one per component) when known; otherwise
    /// Z_RA = 0.29056 - 0.08775 omega.
    pub fn peneloux(
        kind: CubicKind,
        comps: &[Component],
        kij: Option<&[f64]>,
        z_ra: Option<&[f64]>,
    ) -> Result<Self> {
        let id = match kind {
            CubicKind::Srk => "srk-pen",
            CubicKind::Pr76 => "pr-pen",
            CubicKind::Pr78 => "pr78-pen",
            _ => "",
        };
        let cubic = Cubic::new(kind, comps, kij)?;
        if let Some(z) = z_ra {
            if z.len() != comps.len() {
                return Err(Error::invalid(
                    "number of Rackett compressibilities",
                    z.len() as f64,
                    format!("one per component ({})", comps.len()),
                ));
            }
        }
        let c = comps
            .iter()
            .enumerate()
            .map(|(i, comp)| {
                let z = z_ra.map_or_else(|| rackett_z(comp.omega), |z| z[i]);
                if !(z.is_finite() && z > 0.0) {
                    return Err(Error::invalid(
                        "Rackett Z_RA",
                        z,
                        "a finite number above zero",
                    ));
                }
                peneloux_shift(kind, comp.tc, comp.pc, z)
            })
            .collect::<Result<Vec<_>>>()?;
        Self::with_shifts(cubic, c, id)
    }

    /// Any cubic with given shifts c_i (m3/mol); each must leave b_i - c_i > 0.
    pub fn with_shifts(cubic: Cubic, c: Vec<f64>, id: &'static str) -> Result<Self> {
        if c.len() != cubic.components().len() {
            return Err(Error::invalid(
                "number of volume shifts",
                c.len() as f64,
                format!("one per component ({})", cubic.components().len()),
            ));
        }
        for (&ci, &bi) in c.iter().zip(cubic.covolumes()) {
            if !ci.is_finite() || bi - ci <= 0.0 {
                return Err(Error::invalid(
                    "volume shift c (m3/mol)",
                    ci,
                    format!("a finite shift below the co-volume b = {bi:.6e} m3/mol"),
                ));
            }
        }
        Ok(Translated { cubic, c, id })
    }

    /// The untranslated cubic.
    pub fn cubic(&self) -> &Cubic {
        &self.cubic
    }

    /// The shift of each component, m3/mol.
    pub fn shifts(&self) -> &[f64] {
        &self.c
    }

    fn shift(&self, x: &[f64]) -> f64 {
        x.iter().zip(&self.c).map(|(x, c)| x * c).sum()
    }
}

impl Model for Translated {
    fn id(&self) -> &str {
        self.id
    }

    fn components(&self) -> &[Component] {
        self.cubic.components()
    }

    fn residual(&self, t: f64, rho: f64, x: &[f64]) -> Residual {
        let s = self.shift(x) * rho;
        let k = 1.0 / (1.0 + s);
        let rc = self.cubic.residual(t, rho * k, x);
        let a_d = k * rc.a_d - s * k;
        let d_a_d = k * k * (rc.a_d + rc.a_dd) - s * k * k * rc.a_d - s * k * k;
        Residual {
            a: rc.a - (1.0 + s).ln(),
            a_d,
            a_dd: d_a_d - a_d,
            a_t: rc.a_t,
            a_tt: rc.a_tt,
            a_dt: k * rc.a_dt,
        }
    }

    fn ln_phi(&self, t: f64, rho: f64, x: &[f64], out: &mut [f64]) {
        let c = self.shift(x);
        let rho_c = rho / (1.0 + c * rho);
        self.cubic.ln_phi(t, rho_c, x, out);
        let z_c = self.cubic.residual(t, rho_c, x).z();
        // P/(RT) = rho_c Z_c
        let p_rt = rho_c * z_c;
        for (o, ci) in out.iter_mut().zip(&self.c) {
            *o -= ci * p_rt;
        }
    }

    fn densities(&self, t: f64, p: f64, x: &[f64]) -> DensityRoots {
        let c = self.shift(x);
        let mut rho = [0.0; 3];
        let mut k = 0;
        for &rc in self.cubic.densities(t, p, x).as_slice() {
            let v = 1.0 / rc - c;
            if v > 0.0 {
                rho[k] = 1.0 / v;
                k += 1;
            }
        }
        DensityRoots::from_slice(&rho[..k])
    }

    fn max_density(&self, x: &[f64]) -> f64 {
        let b: f64 = x
            .iter()
            .zip(self.cubic.covolumes())
            .map(|(x, b)| x * b)
            .sum();
        1.0 / (b - self.shift(x))
    }

    fn ideal_gas(&self, t: f64, x: &[f64]) -> IdealGasValues {
        self.cubic.ideal_gas(t, x)
    }

    fn critical_z(&self) -> f64 {
        self.cubic.critical_z()
    }
}
