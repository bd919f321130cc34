//! The truncated virial equation as a [`Model`].
//!
//! Form used: Z = 1 + B rho (volume-explicit), so that the residual Helmholtz energy is the
//! closed form alpha_r(T, rho, x) = B(T, x) rho that the [`Model`] trait requires, with
//! ln phi_i = 2 rho sum_j x_j B_ij - ln Z. The pressure-explicit form Z = 1 + B P/(RT), the
//! usual choice at low pressure (it is the residual Gibbs energy G_r/(RT) = B P/(RT), exact to
//! the same order), is given by [`Virial::z_pressure_explicit`] and
//! [`Virial::ln_phi_pressure_explicit`]; the two differ by O((B P/RT)^2): with
//! x = B P/(RT), Z_volume = (1 + sqrt(1 + 4x))/2 against Z_pressure = 1 + x. At 1 atm the
//! pressure-explicit form meets ISO 6976 to 1e-4 for CH4, C2H6, N2, O2 and CO2; the
//! volume-explicit one is off by up to 1.1e-4 (ethane, 20 C).
//!
//! Mixture: B = sum_i sum_j x_i x_j B_ij with B_ij from the correlation at the cross constants
//! (Prausnitz, Lichtenthaler, de Azevedo, *Molecular Thermodynamics of Fluid-Phase Equilibria*,
//! 3rd ed., 1999, Sec. 5.7): Tc_ij = sqrt(Tc_i Tc_j)(1 - k_ij),
//! Vc_ij = ((Vc_i^(1/3) + Vc_j^(1/3))/2)^3, Zc_ij = (Zc_i + Zc_j)/2,
//! Pc_ij = Zc_ij R Tc_ij / Vc_ij, omega_ij = (omega_i + omega_j)/2. Where a component has no
//! Vc, Zc_i = 0.2905 - 0.085 omega_i (Lee & Kesler 1975) fixes Vc_i = Zc_i R Tc_i/Pc_i; the
//! pure B_ii uses Tc_i and Pc_i either way.
//!
//! Validity: a two-term virial series holds at low density; common practice limits it to
//! reduced volumes V/Vc >= 2 (rho <= rho_c/2), which at moderate reduced temperatures is about
//! Pr <= Tr/2. Here rho_c of a mixture is 1/Vc_m with Vc_m = sum_i sum_j x_i x_j Vc_ij; denser
//! states are refused with [`Error::OutOfRange`] by [`Virial::state_tp`], left out of
//! [`Model::densities`], and [`Model::max_density`] returns that limit.

use super::correlation::Correlation;
use crate::component::Component;
use crate::component_check::{self, FINITE_OMEGA};
use crate::composition;
use crate::constants::R;
use crate::error::{positive, Error, Result};
use crate::model::{DensityRoots, Model};
use crate::residual::Residual;
use crate::state::{RootChoice, State};

/// Most components the model accepts.
pub const MAX_COMPONENTS: usize = 64;
/// Model id.
pub const ID: &str = "virial";
/// Highest reduced density rho/rho_c accepted (V/Vc >= 2).
pub const MAX_REDUCED_DENSITY: f64 = 0.5;

/// The truncated virial equation with a generalized B correlation.
#[derive(Debug, Clone)]
pub struct Virial {
    comps: Vec<Component>,
    correlation: Correlation,
    n: usize,
    /// Cross constants, row-major n x n: Tc_ij, R Tc_ij / Pc_ij, omega_ij, Vc_ij.
    tc: Vec<f64>,
    rtc_pc: Vec<f64>,
    omega: Vec<f64>,
    vc: Vec<f64>,
}

/// B of a mixture with its scaled temperature derivatives, m3/mol.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SecondVirial {
    /// B, m3/mol.
    pub b: f64,
    /// T dB/dT, m3/mol.
    pub b_t: f64,
    /// T^2 d2B/dT2, m3/mol.
    pub b_tt: f64,
}

impl Virial {
    /// The model for `comps` with the given correlation and k_ij (n x n row-major, symmetric,
    /// zero diagonal; zero when `None`).
    pub fn new(comps: &[Component], correlation: Correlation, kij: Option<&[f64]>) -> Result<Self> {
        component_check::check(comps, MAX_COMPONENTS, &FINITE_OMEGA)?;
        for c in comps {
            if let Some(v) = c.vc {
                positive("critical volume", v)?;
            }
        }
        let n = comps.len();
        if let Some(k) = kij {
            crate::pair_matrix::check(
                k,
                n,
                &crate::pair_matrix::PairRule {
                    name: "k_ij",
                    diagonal: 0.0,
                    positive: false,
                    below: 1.0,
                    accepted: "finite, below 1, symmetric, zero on the diagonal",
                },
            )?;
        }
        let vc_i: Vec<f64> = comps
            .iter()
            .map(|c| c.vc.unwrap_or((0.2905 - 0.085 * c.omega) * R * c.tc / c.pc))
            .collect();
        let zc_i: Vec<f64> = comps
            .iter()
            .zip(&vc_i)
            .map(|(c, v)| c.pc * v / (R * c.tc))
            .collect();
        let mut m = Virial {
            comps: comps.to_vec(),
            correlation,
            n,
            tc: vec![0.0; n * n],
            rtc_pc: vec![0.0; n * n],
            omega: vec![0.0; n * n],
            vc: vec![0.0; n * n],
        };
        for i in 0..n {
            for j in 0..n {
                let k = i * n + j;
                let (ci, cj) = (&comps[i], &comps[j]);
                let kij = kij.map_or(0.0, |m| m[k]);
                let tc = (ci.tc * cj.tc).sqrt() * (1.0 - kij);
                let vc = (0.5 * (vc_i[i].cbrt() + vc_i[j].cbrt())).powi(3);
                let rtc_pc = if i == j {
                    R * ci.tc / ci.pc
                } else {
                    // R Tc_ij / Pc_ij = Vc_ij / Zc_ij
                    vc / (0.5 * (zc_i[i] + zc_i[j]))
                };
                m.tc[k] = tc;
                m.rtc_pc[k] = rtc_pc;
                m.omega[k] = 0.5 * (ci.omega + cj.omega);
                m.vc[k] = vc;
            }
        }
        Ok(m)
    }

    /// The correlation in use.
    pub fn correlation(&self) -> Correlation {
        self.correlation
    }

    fn b_ij(&self, t: f64, k: usize) -> SecondVirial {
        let f = self.correlation.reduced_b(t / self.tc[k], self.omega[k]);
        let s = self.rtc_pc[k];
        SecondVirial {
            b: s * f.f,
            b_t: s * f.f_t,
            b_tt: s * f.f_tt,
        }
    }

    /// B of composition x at T, with T dB/dT and T^2 d2B/dT2; fills `row` with
    /// sum_j x_j B_ij when given.
    pub fn second_virial(&self, t: f64, x: &[f64], mut row: Option<&mut [f64]>) -> SecondVirial {
        let n = self.n;
        let mut out = SecondVirial {
            b: 0.0,
            b_t: 0.0,
            b_tt: 0.0,
        };
        for i in 0..n {
            let mut ri = 0.0;
            for j in 0..n {
                let bij = self.b_ij(t, i * n + j);
                let w = x[i] * x[j];
                out.b += w * bij.b;
                out.b_t += w * bij.b_t;
                out.b_tt += w * bij.b_tt;
                ri += x[j] * bij.b;
            }
            if let Some(r) = row.as_deref_mut() {
                r[i] = ri;
            }
        }
        out
    }

    /// Critical molar volume of composition x, sum_ij x_i x_j Vc_ij, m3/mol.
    pub fn critical_volume(&self, x: &[f64]) -> f64 {
        let n = self.n;
        let mut v = 0.0;
        for i in 0..n {
            for j in 0..n {
                v += x[i] * x[j] * self.vc[i * n + j];
            }
        }
        v
    }

    /// Checks rho <= rho_c/2 for composition x.
    pub fn check_validity(&self, t: f64, rho: f64, x: &[f64]) -> Result<()> {
        let limit = self.max_density(x);
        if rho.is_finite() && rho > 0.0 && rho <= limit {
            Ok(())
        } else {
            Err(Error::OutOfRange {
                model: ID.into(),
                what: "density",
                detail: format!(
                    "rho = {rho:.6e} mol/m3 at T = {t} K is above half the critical density \
                     ({limit:.6e} mol/m3, V/Vc = 2): a two-term virial series does not hold there"
                ),
            })
        }
    }

    /// The gas state at (T, P) of the volume-explicit form, refused with
    /// [`Error::OutOfRange`] beyond the validity limit.
    pub fn state_tp(&self, t: f64, p: f64, x: &[f64]) -> Result<State> {
        positive("temperature (K)", t)?;
        positive("pressure (Pa)", p)?;
        composition::check(x, self.n)?;
        let rho = self.gas_density(t, p, x).ok_or_else(|| Error::OutOfRange {
            model: ID.into(),
            what: "pressure",
            detail: format!(
                "Z = 1 + B rho has no density at T = {t} K, p = {p} Pa (1 + 4 B p/(RT) < 0): far \
                 beyond the validity of a two-term virial series"
            ),
        })?;
        self.check_validity(t, rho, x)?;
        State::at_tp(self, t, p, x, RootChoice::Vapor)
    }

    /// Z = 1 + B P/(RT), the pressure-explicit form, with the same density limit.
    pub fn z_pressure_explicit(&self, t: f64, p: f64, x: &[f64]) -> Result<f64> {
        positive("temperature (K)", t)?;
        positive("pressure (Pa)", p)?;
        composition::check(x, self.n)?;
        let b = self.b_mix(t, x);
        let z = 1.0 + b * p / (R * t);
        // One validity test for both forms: the density of the volume-explicit form, which is
        // the higher of the two estimates when B < 0.
        let rho = gas_density_of(b, t, p)
            .filter(|_| z > 0.0)
            .ok_or_else(|| Error::OutOfRange {
                model: ID.into(),
                what: "pressure",
                detail: format!(
                    "T = {t} K, p = {p} Pa is far beyond the validity of a two-term virial \
                     series (1 + 4 B p/(RT) < 0 or Z <= 0)"
                ),
            })?;
        self.check_validity(t, rho, x)?;
        Ok(z)
    }

    /// ln phi_i of the pressure-explicit form, (2 sum_j x_j B_ij - B) P/(RT), into `out`.
    pub fn ln_phi_pressure_explicit(
        &self,
        t: f64,
        p: f64,
        x: &[f64],
        out: &mut [f64],
    ) -> Result<()> {
        self.z_pressure_explicit(t, p, x)?;
        if out.len() != self.n {
            return Err(Error::invalid(
                "length of the ln phi output",
                out.len() as f64,
                format!("one per component ({})", self.n),
            ));
        }
        let b = self.second_virial(t, x, Some(out)).b;
        for o in out.iter_mut() {
            *o = (2.0 * *o - b) * p / (R * t);
        }
        Ok(())
    }

    /// The root of B rho^2 + rho - p/(RT) = 0 that tends to the ideal gas as B -> 0.
    fn gas_density(&self, t: f64, p: f64, x: &[f64]) -> Option<f64> {
        gas_density_of(self.b_mix(t, x), t, p)
    }

    /// B of composition x at T alone: the symmetric sum over i <= j, one correlation
    /// evaluation per pair (the Z-only path).
    fn b_mix(&self, t: f64, x: &[f64]) -> f64 {
        let n = self.n;
        let mut b = 0.0;
        for i in 0..n {
            let k = i * n + i;
            b += x[i] * x[i] * self.b_ij(t, k).b;
            for j in i + 1..n {
                b += 2.0 * x[i] * x[j] * self.b_ij(t, i * n + j).b;
            }
        }
        b
    }
}

/// The root of B rho^2 + rho - p/(RT) = 0 that tends to the ideal gas as B -> 0, written
/// 2q/(1 + sqrt(1 + 4 B q)) with q = p/(RT) (no cancellation as B -> 0).
fn gas_density_of(b: f64, t: f64, p: f64) -> Option<f64> {
    let q = p / (R * t);
    let disc = 1.0 + 4.0 * b * q;
    (disc >= 0.0).then(|| 2.0 * q / (1.0 + disc.sqrt()))
}

impl Model for Virial {
    fn id(&self) -> &str {
        ID
    }

    fn components(&self) -> &[Component] {
        &self.comps
    }

    fn residual(&self, t: f64, rho: f64, x: &[f64]) -> Residual {
        let b = self.second_virial(t, x, None);
        Residual {
            a: b.b * rho,
            a_d: b.b * rho,
            a_dd: 0.0,
            a_t: b.b_t * rho,
            a_tt: b.b_tt * rho,
            a_dt: b.b_t * rho,
        }
    }

    fn ln_phi(&self, t: f64, rho: f64, x: &[f64], out: &mut [f64]) {
        let b = self.second_virial(t, x, Some(out)).b;
        let ln_z = (1.0 + b * rho).ln();
        for o in out.iter_mut() {
            *o = 2.0 * rho * *o - ln_z;
        }
    }

    fn densities(&self, t: f64, p: f64, x: &[f64]) -> DensityRoots {
        match self.gas_density(t, p, x) {
            Some(rho) if rho <= self.max_density(x) => DensityRoots::from_slice(&[rho]),
            _ => DensityRoots::default(),
        }
    }

    fn max_density(&self, x: &[f64]) -> f64 {
        MAX_REDUCED_DENSITY / self.critical_volume(x)
    }
}
