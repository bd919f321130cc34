//! The trait every equation of state implements.
//!
//! A model states its residual Helmholtz energy; [`crate::properties`] derives every property
//! from it, once, for all models. Composition is an argument (not part of the model) so that
//! phase-equilibrium solvers can evaluate trial phases of any composition with one model.

use crate::component::Component;
use crate::ideal_cp::IdealGasValues;
use crate::residual::Residual;
use crate::root_choice::{select_root, PhaseAt, RootSel};

/// Up to three densities (mol/m3) that satisfy P(T, rho) = P for one (T, P, x), lowest first.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct DensityRoots {
    len: usize,
    rho: [f64; 3],
}

impl DensityRoots {
    /// Builds the set from candidates; keeps finite positive ones, sorted ascending.
    pub fn from_slice(values: &[f64]) -> Self {
        let mut out = DensityRoots::default();
        for &v in values {
            if v.is_finite() && v > 0.0 && out.len < 3 {
                out.rho[out.len] = v;
                out.len += 1;
            }
        }
        out.rho[..out.len].sort_by(f64::total_cmp);
        out
    }

    /// The roots, lowest density (most vapour-like) first.
    pub fn as_slice(&self) -> &[f64] {
        &self.rho[..self.len]
    }

    /// True when no physical density exists.
    pub fn is_empty(&self) -> bool {
        self.len == 0
    }
}

/// An equation of state for a pure fluid or a mixture of the components it was built with.
pub trait Model: Send + Sync {
    /// Short identifier used in the command line and in JSON (`pr`, `srk`, ...).
    fn id(&self) -> &str;

    /// The components, in the order of every composition vector.
    fn components(&self) -> &[Component];

    /// Reduced residual Helmholtz energy and its derivatives at T (K), molar density rho
    /// (mol/m3) and mole fractions x.
    fn residual(&self, t: f64, rho: f64, x: &[f64]) -> Residual;

    /// The reduced residual Helmholtz energy alpha and the compressibility factor Z = 1 +
    /// a_d at (T, rho, x): all that choosing a density root by its Gibbs energy needs.
    /// Default: from [`Model::residual`]; a model may compute them more cheaply (the values
    /// must be the same).
    fn alpha_z(&self, t: f64, rho: f64, x: &[f64]) -> (f64, f64) {
        let r = self.residual(t, rho, x);
        (r.a, r.z())
    }

    /// Natural logarithm of each component's fugacity coefficient at (T, rho, x), into `out`.
    fn ln_phi(&self, t: f64, rho: f64, x: &[f64], out: &mut [f64]);

    /// ln phi of a phase of mole fractions `x` at (T, P) on the density root chosen by `sel`,
    /// into `out`, with the root's density, Z and Gibbs energy (`None` where the model has
    /// no usable root): the evaluation at the heart of every equilibrium solver. Default:
    /// [`ln_phi_at_tp_generic`] from [`Model::densities`],
    /// [`Model::alpha_z`] and [`Model::ln_phi`]; a model may share work between those steps
    /// (the values must be the same).
    fn ln_phi_at_tp(
        &self,
        t: f64,
        p: f64,
        x: &[f64],
        sel: RootSel,
        out: &mut [f64],
    ) -> Option<PhaseAt> {
        ln_phi_at_tp_generic(self, t, p, x, sel, out)
    }

    /// d ln phi_i / d n_j at fixed T and P for one mole of composition `x` at (T, rho), rho
    /// being a root of the pressure equation there, row-major into `jac[i * n + j]`. Returns
    /// false when the model has no analytic form (the default): the equilibrium solvers then
    /// take finite differences.
    fn dlnphi_dn_tp(&self, t: f64, rho: f64, x: &[f64], jac: &mut [f64]) -> bool {
        let _ = (t, rho, x, jac);
        false
    }

    /// Every density at which the model gives pressure `p` at (T, x), in mol/m3.
    fn densities(&self, t: f64, p: f64, x: &[f64]) -> DensityRoots;

    /// The density (mol/m3) of the stable phase at (T, P, x) when the model can tell in
    /// advance which branch of the isotherm it lies on, found on that branch alone; `None`
    /// where it cannot, and the caller compares the Gibbs energies of every root of
    /// [`Model::densities`]. Where it answers, the answer is the stable phase's root, also
    /// where a root on a spurious loop of the equation has a lower Gibbs energy.
    fn stable_density(&self, t: f64, p: f64, x: &[f64]) -> Option<f64> {
        let _ = (t, p, x);
        None
    }

    /// The highest molar density the model can represent at composition x (the co-volume
    /// limit 1/b for a cubic), mol/m3.
    fn max_density(&self, x: &[f64]) -> f64;

    /// Ideal-gas part: cp0/R, h0/R and s0/R at P_REF for the mixture at T (no mixing
    /// entropy; that is added by the property layer). Default: mole-fraction average of the
    /// components' heat capacities.
    fn ideal_gas(&self, t: f64, x: &[f64]) -> IdealGasValues {
        crate::ideal_cp::mixture_values(self.components().iter().map(|c| &c.cp), x, t)
    }

    /// A pseudo-critical point (T, P) of composition x used to name phases of single-phase
    /// states: by default Kay's rule (mole-fraction averages of Tc and Pc).
    fn pseudo_critical(&self, x: &[f64]) -> (f64, f64) {
        self.components()
            .iter()
            .zip(x)
            .fold((0.0, 0.0), |(t, p), (c, &xi)| {
                (t + xi * c.tc, p + xi * c.pc)
            })
    }

    /// Critical compressibility factor used with [`Model::pseudo_critical`] to estimate a
    /// critical density when naming phases; default 0.29, a typical value for light gases.
    fn critical_z(&self) -> f64 {
        0.29
    }

    /// Molar mass of composition x, kg/mol.
    fn molar_mass(&self, x: &[f64]) -> f64 {
        self.components()
            .iter()
            .zip(x)
            .map(|(c, &xi)| xi * c.molar_mass)
            .sum()
    }
}

/// ln phi at (T, P) and mole fractions `x` through the model's density roots, alpha and Z
/// ([`Model::alpha_z`]) and ln phi at (T, rho): the default of [`Model::ln_phi_at_tp`].
pub fn ln_phi_at_tp_generic<M: Model + ?Sized>(
    model: &M,
    t: f64,
    p: f64,
    x: &[f64],
    sel: RootSel,
    out: &mut [f64],
) -> Option<PhaseAt> {
    let roots = model.densities(t, p, x);
    select_root(
        t,
        p,
        roots.as_slice(),
        sel,
        |rho| {
            let (alpha, z_model) = model.alpha_z(t, rho, x);
            (alpha, z_model, ())
        },
        |rho, _, z_model, ln_z, out| {
            model.ln_phi(t, rho, x, out);
            // ln phi_i = mu_res_i/RT - ln Z: replace the model's ln Z by ln(P/(rho R T)).
            let corr = z_model.ln() - ln_z;
            for o in out.iter_mut() {
                *o += corr;
            }
        },
        out,
    )
}
