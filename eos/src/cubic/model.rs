//! A cubic equation of state bound to a set of components and their k_ij.

use super::alpha::SqrtAlpha;
use super::roots::solve_cubic;
use super::spec::{CriticalConstants, CubicSpec};
use super::CubicKind;
use crate::component::Component;
use crate::component_check::{self, FINITE_OMEGA};
use crate::constants::R;
use crate::error::Result;
use crate::model::{DensityRoots, Model};
use crate::residual::Residual;
use crate::root_choice::{select_root, PhaseAt, RootSel};

/// Most components a model accepts; per-state work uses stack arrays of this size.
pub const MAX_COMPONENTS: usize = 64;

/// A member of the cubic family for given components. Composition-independent constants are
/// computed once here; composition and temperature come with each call.
#[derive(Debug, Clone)]
pub struct Cubic {
    kind: CubicKind,
    spec: &'static CubicSpec,
    crit: CriticalConstants,
    comps: Vec<Component>,
    /// sqrt(a_c,i), Pa^(1/2) m3/mol.
    sqrt_ac: Vec<f64>,
    /// b_i, m3/mol.
    b: Vec<f64>,
    /// Alpha parameter of each component.
    m: Vec<f64>,
    /// 1 - k_ij, row-major n x n.
    one_minus_k: Vec<f64>,
    /// 1 / Tc,i and 1 / sqrt(Tc,i), so that Tr and sqrt(Tr) of every component come from
    /// one square root per temperature.
    inv_tc: Vec<f64>,
    inv_sqrt_tc: Vec<f64>,
}

/// The mixture parameters at one (T, x): a, T da/dT, T^2 d2a/dT2 and b.
#[derive(Debug, Clone, Copy)]
pub(crate) struct MixParams {
    pub a: f64,
    pub a_t: f64,
    pub a_tt: f64,
    pub b: f64,
}

impl Cubic {
    /// Builds a member of the family for `comps`. `kij` is the n x n matrix of binary
    /// interaction parameters, row-major (zero when `None`); it must be symmetric with a zero
    /// diagonal.
    pub fn new(kind: CubicKind, comps: &[Component], kij: Option<&[f64]>) -> Result<Self> {
        component_check::check(comps, MAX_COMPONENTS, &FINITE_OMEGA)?;
        for c in comps {
            crate::error::positive("molar mass", c.molar_mass)?;
        }
        let n = comps.len();
        let one_minus_k = match kij {
            None => vec![1.0; n * n],
            Some(k) => {
                crate::pair_matrix::check(
                    k,
                    n,
                    &crate::pair_matrix::PairRule {
                        name: "k_ij",
                        diagonal: 0.0,
                        positive: false,
                        below: f64::INFINITY,
                        accepted: "finite, symmetric, zero on the diagonal",
                    },
                )?;
                k.iter().map(|k| 1.0 - k).collect()
            }
        };
        let spec = kind.spec();
        let crit = CriticalConstants::from_deltas(spec.d1, spec.d2);
        Ok(Cubic {
            kind,
            spec,
            crit,
            sqrt_ac: comps
                .iter()
                .map(|c| (crit.omega_a * (R * c.tc).powi(2) / c.pc).sqrt())
                .collect(),
            b: comps
                .iter()
                .map(|c| crit.omega_b * R * c.tc / c.pc)
                .collect(),
            m: comps
                .iter()
                .map(|c| spec.alpha.parameter(c.omega))
                .collect(),
            one_minus_k,
            inv_tc: comps.iter().map(|c| 1.0 / c.tc).collect(),
            inv_sqrt_tc: comps.iter().map(|c| 1.0 / c.tc.sqrt()).collect(),
            comps: comps.to_vec(),
        })
    }

    /// Replaces the exact Omega_a and Omega_b with rounded values, as printed in a paper or
    /// used by another implementation whose answers are to be matched digit for digit
    /// (Zc stays that of the exact constants).
    pub fn with_omegas(mut self, omega_a: f64, omega_b: f64) -> Result<Self> {
        crate::error::positive("Omega_a", omega_a)?;
        crate::error::positive("Omega_b", omega_b)?;
        self.sqrt_ac = self
            .comps
            .iter()
            .map(|c| (omega_a * (R * c.tc).powi(2) / c.pc).sqrt())
            .collect();
        self.b = self
            .comps
            .iter()
            .map(|c| omega_b * R * c.tc / c.pc)
            .collect();
        self.crit.omega_a = omega_a;
        self.crit.omega_b = omega_b;
        Ok(self)
    }

    /// Which member this is.
    pub fn kind(&self) -> CubicKind {
        self.kind
    }

    /// The member's constants.
    pub fn spec(&self) -> &'static CubicSpec {
        self.spec
    }

    /// Omega_a, Omega_b and Zc of this member.
    pub fn critical_constants(&self) -> CriticalConstants {
        self.crit
    }

    /// Co-volume b_i of each component, m3/mol.
    pub fn covolumes(&self) -> &[f64] {
        &self.b
    }

    /// 1 - k_ij, row-major.
    pub fn one_minus_kij(&self) -> &[f64] {
        &self.one_minus_k
    }

    /// sqrt(a_c,i) of each component.
    pub fn sqrt_ac(&self) -> &[f64] {
        &self.sqrt_ac
    }

    /// Alpha-function parameter of each component (m or kappa; zero where unused).
    pub fn alpha_parameters(&self) -> &[f64] {
        &self.m
    }

    /// sqrt(a_i(T)) of every component with its scaled T derivatives.
    fn sqrt_alphas(&self, t: f64, out: &mut [SqrtAlpha]) {
        let sqrt_t = t.sqrt();
        for (i, o) in out.iter_mut().enumerate() {
            let sa = self.spec.alpha.sqrt_alpha(
                t * self.inv_tc[i],
                sqrt_t * self.inv_sqrt_tc[i],
                self.m[i],
            );
            let k = self.sqrt_ac[i];
            *o = SqrtAlpha {
                s: k * sa.s,
                s_t: k * sa.s_t,
                s_tt: k * sa.s_tt,
            };
        }
    }

    /// a, T da/dT, T^2 d2a/dT2 and b of composition x at T; fills `sum_a` with
    /// sum_j x_j a_ij when given (needed for fugacity coefficients).
    pub(crate) fn mix(&self, t: f64, x: &[f64], mut sum_a: Option<&mut [f64]>) -> MixParams {
        let n = self.comps.len();
        let mut sa = [SqrtAlpha {
            s: 0.0,
            s_t: 0.0,
            s_tt: 0.0,
        }; MAX_COMPONENTS];
        self.sqrt_alphas(t, &mut sa[..n]);
        let (mut a, mut a_t, mut a_tt, mut b) = (0.0, 0.0, 0.0, 0.0);
        for i in 0..n {
            let row = &self.one_minus_k[i * n..(i + 1) * n];
            let (mut ra, mut ra_t, mut ra_tt) = (0.0, 0.0, 0.0);
            for j in 0..n {
                let w = x[j] * row[j];
                ra += w * sa[j].s;
                ra_t += w * sa[j].s_t;
                ra_tt += w * sa[j].s_tt;
            }
            // sum_j x_j a_ij = s_i sum_j x_j (1-k_ij) s_j and its T derivatives.
            let si = sa[i];
            let ai = si.s * ra;
            if let Some(out) = sum_a.as_deref_mut() {
                out[i] = ai;
            }
            a += x[i] * ai;
            a_t += x[i] * (si.s_t * ra + si.s * ra_t);
            a_tt += x[i] * (si.s_tt * ra + 2.0 * si.s_t * ra_t + si.s * ra_tt);
            b += x[i] * self.b[i];
        }
        MixParams { a, a_t, a_tt, b }
    }

    /// The density integral D(rho) = int_0^rho dr / ((1 + d1 b r)(1 + d2 b r)) with
    /// rho D' and rho^2 D''.
    /// a and b of the mixture at T without their temperature derivatives (for the density
    /// roots and ln phi, which need none): the values of [`Cubic::mix`] to round-off, at a
    /// third of the inner-loop work.
    fn mix_ab(&self, t: f64, x: &[f64], sum_a: Option<&mut [f64]>) -> (f64, f64) {
        let n = self.comps.len();
        let mut s = [0.0; MAX_COMPONENTS];
        self.sqrt_a(t, &mut s[..n]);
        self.mix_ab_from(&s[..n], x, sum_a)
    }

    /// sqrt(a_i(T)) of every component (the `s` of [`Cubic::sqrt_alphas`]).
    fn sqrt_a(&self, t: f64, s: &mut [f64]) {
        let sqrt_t = t.sqrt();
        for (i, si) in s.iter_mut().enumerate() {
            *si = self.sqrt_ac[i]
                * self
                    .spec
                    .alpha
                    .sqrt_alpha(t * self.inv_tc[i], sqrt_t * self.inv_sqrt_tc[i], self.m[i])
                    .s;
        }
    }

    /// [`Cubic::mix_ab`] with sqrt(a_i(T)) given in `s`.
    fn mix_ab_from(&self, s: &[f64], x: &[f64], sum_a: Option<&mut [f64]>) -> (f64, f64) {
        let n = self.comps.len();
        let b = x.iter().zip(&self.b).map(|(x, b)| x * b).sum();
        let Some(out) = sum_a else {
            let mut a = 0.0;
            for i in 0..n {
                let row = &self.one_minus_k[i * n..(i + 1) * n];
                let mut ra = 0.0;
                for j in 0..n {
                    ra += x[j] * row[j] * s[j];
                }
                a += x[i] * s[i] * ra;
            }
            return (a, b);
        };
        // sum_j x_j a_ij = s_i sum_j (1-k_ij) x_j s_j, accumulated column by column into `out`
        // (the matrix is symmetric), so that the inner loop runs over independent rows.
        let out = &mut out[..n];
        out.fill(0.0);
        for j in 0..n {
            let col = &self.one_minus_k[j * n..(j + 1) * n];
            let c = x[j] * s[j];
            for (r, k) in out.iter_mut().zip(col) {
                *r += k * c;
            }
        }
        let mut a = 0.0;
        for i in 0..n {
            out[i] *= s[i];
            a += x[i] * out[i];
        }
        (a, b)
    }

    /// The density roots at (T, P) for mixture parameters a and b (see [`Cubic::mix_ab`]).
    fn roots_from(&self, a: f64, b: f64, t: f64, p: f64) -> DensityRoots {
        let rt = R * t;
        let aa = a * p / (rt * rt);
        let bb = b * p / rt;
        let (u, w) = (self.spec.d1 + self.spec.d2, self.spec.d1 * self.spec.d2);
        let c2 = (u - 1.0) * bb - 1.0;
        let c1 = aa + (w - u) * bb * bb - u * bb;
        let c0 = -(aa * bb + w * bb * bb + w * bb * bb * bb);
        let roots = solve_cubic(c2, c1, c0);
        let mut rho = [0.0; 3];
        let mut k = 0;
        for &z in roots.as_slice() {
            if z > bb {
                rho[k] = p / (z * rt);
                k += 1;
            }
        }
        DensityRoots::from_slice(&rho[..k])
    }

    /// alpha and Z = 1 + a_d at (T, rho) for mixture parameters a and b: the `a` and `a_d`
    /// of [`Model::residual`], without the temperature derivatives.
    fn alpha_z_from(&self, a: f64, b: f64, t: f64, rho: f64) -> (f64, f64) {
        let rt = R * t;
        let eta = b * rho;
        let (d, rd1, _) = self.d_integral(b, rho);
        let f = a / rt;
        let one_eta = 1.0 - eta;
        (-one_eta.ln() - f * d, 1.0 + (eta / one_eta - f * rd1))
    }

    /// ln phi at (T, rho) for mixture parameters a, b and sum_j x_j a_ij (`sum_a`).
    fn ln_phi_from(&self, a: f64, b: f64, sum_a: &[f64], t: f64, rho: f64, out: &mut [f64]) {
        let eta = b * rho;
        let (d, rd1, _) = self.d_integral(b, rho);
        let f = a / (R * t);
        let z = 1.0 + eta / (1.0 - eta) - f * rd1;
        self.ln_phi_terms(a, b, sum_a, f * d, z, (1.0 - eta).ln() + z.ln(), out);
    }

    /// ln phi_i = (b_i/b)(Z - 1) - ln(1 - b rho) - ln Z - (a/RT) D (2 sum_j x_j a_ij / a -
    /// b_i/b), from (a/RT) D (`fd`), Z and `ln_rest` = ln(1 - b rho) + ln Z (with the model's
    /// ln Z, or that of the given pressure at a density root).
    #[allow(clippy::too_many_arguments)]
    #[inline]
    fn ln_phi_terms(
        &self,
        a: f64,
        b: f64,
        sum_a: &[f64],
        fd: f64,
        z: f64,
        ln_rest: f64,
        out: &mut [f64],
    ) {
        let (inv_b, two_over_a) = (1.0 / b, 2.0 / a);
        let base = -ln_rest;
        for (i, o) in out.iter_mut().enumerate().take(self.comps.len()) {
            let bi_b = self.b[i] * inv_b;
            *o = bi_b * (z - 1.0) + base - fd * (two_over_a * sum_a[i] - bi_b);
        }
    }

    /// d ln phi_i / d n_j at fixed T and P for one mole at (T, rho, x), from the residual
    /// Helmholtz energy in total quantities (M. L. Michelsen, J. M. Mollerup, *Thermodynamic
    /// Models: Fundamentals and Computational Aspects*, 2nd ed., Tie-Line 2007, chapter 3):
    ///
    /// ```text
    /// F(T, V, n) = -n g(V, B) - D(T)/(RT) f(V, B),  g = ln(1 - B/V),
    /// f = ln((V + d1 B)/(V + d2 B)) / (B (d1 - d2)),  B = sum n_i b_i,  D = sum n_i n_j a_ij
    /// d ln phi_i/d n_j |T,P = F_ij + 1/n + P_i P_j / (RT dP/dV)
    /// ```
    ///
    /// with F_ij the second derivative at fixed (T, V), P_i = RT/V - RT F_Vi the partial
    /// derivative of P with n_i at fixed (T, V) and dP/dV = -RT F_VV - nRT/V^2.
    fn dlnphi_dn_from(&self, t: f64, rho: f64, x: &[f64], jac: &mut [f64]) -> bool {
        let n = self.comps.len();
        let mut sum_a = [0.0; MAX_COMPONENTS];
        let mut s = [0.0; MAX_COMPONENTS];
        self.sqrt_a(t, &mut s[..n]);
        let (d, b) = self.mix_ab_from(&s[..n], x, Some(&mut sum_a[..n]));
        let rt = R * t;
        let v = 1.0 / rho;
        let (d1, d2) = (self.spec.d1, self.spec.d2);
        let (e1, e2) = (v + d1 * b, v + d2 * b);
        let vb = v - b;
        if !(vb > 0.0 && e1 > 0.0 && e2 > 0.0 && b > 0.0) {
            return false;
        }
        // g = ln(1 - B/V) and f, with their derivatives (n = 1 mol, V = v).
        let g_v = 1.0 / vb - 1.0 / v;
        let g_b = -1.0 / vb;
        let g_bb = -1.0 / (vb * vb);
        let g_bv = 1.0 / (vb * vb);
        let g_vv = -1.0 / (vb * vb) + 1.0 / (v * v);
        let f = if (d1 - d2).abs() < 1e-12 {
            1.0 / e1
        } else {
            (e1 / e2).ln() / (b * (d1 - d2))
        };
        let f_v = -1.0 / (e1 * e2);
        let f_b = -(f + v * f_v) / b;
        let f_vv = -f_v * (1.0 / e1 + 1.0 / e2);
        let f_vb = -f_v * (d1 / e1 + d2 / e2);
        let f_bb = -(2.0 * f_b + v * f_vb) / b;
        let dr = d / rt;
        let f_nb = -g_b;
        let f_bb_tot = -g_bb - dr * f_bb;
        let f_bd = -f_b / rt;
        let f_dd1 = -f / rt;
        let f_nv = -g_v;
        let f_bv = -g_bv - dr * f_vb;
        let f_dv = -f_v / rt;
        let f_vv_tot = -g_vv - dr * f_vv;
        // dP/dV / (RT) and P_i / (RT) at fixed (T, V).
        let p_v = -f_vv_tot - 1.0 / (v * v);
        if !(p_v.is_finite() && p_v.abs() > f64::MIN_POSITIVE) {
            return false;
        }
        let mut p_i = [0.0; MAX_COMPONENTS];
        let mut d_i = [0.0; MAX_COMPONENTS];
        for i in 0..n {
            d_i[i] = 2.0 * sum_a[i];
            p_i[i] = 1.0 / v - (f_nv + f_bv * self.b[i] + f_dv * d_i[i]);
        }
        for i in 0..n {
            let bi = self.b[i];
            let row = &self.one_minus_k[i * n..(i + 1) * n];
            for j in 0..n {
                let bj = self.b[j];
                let d_ij = 2.0 * s[i] * s[j] * row[j];
                let f_ij = f_nb * (bi + bj)
                    + f_bb_tot * bi * bj
                    + f_bd * (bi * d_i[j] + bj * d_i[i])
                    + f_dd1 * d_ij;
                jac[i * n + j] = f_ij + 1.0 + p_i[i] * p_i[j] / p_v;
            }
        }
        true
    }

    #[inline]
    fn d_integral(&self, b: f64, rho: f64) -> (f64, f64, f64) {
        let (d1, d2) = (self.spec.d1, self.spec.d2);
        let eta = b * rho;
        let (e1, e2) = (1.0 + d1 * eta, 1.0 + d2 * eta);
        let d = if (d1 - d2).abs() < 1e-12 {
            rho / e1
        } else {
            (e1 / e2).ln() / (b * (d1 - d2))
        };
        let rd1 = rho / (e1 * e2);
        let rd2 = -rd1 * (d1 * eta / e1 + d2 * eta / e2);
        (d, rd1, rd2)
    }
}

impl Model for Cubic {
    fn id(&self) -> &str {
        self.spec.id
    }

    fn components(&self) -> &[Component] {
        &self.comps
    }

    fn residual(&self, t: f64, rho: f64, x: &[f64]) -> Residual {
        let mp = self.mix(t, x, None);
        let rt = R * t;
        let eta = mp.b * rho;
        let (d, rd1, rd2) = self.d_integral(mp.b, rho);
        let f = mp.a / rt;
        let f_t = (mp.a_t - mp.a) / rt;
        let f_tt = (mp.a_tt - 2.0 * mp.a_t + 2.0 * mp.a) / rt;
        let one_eta = 1.0 - eta;
        Residual {
            a: -one_eta.ln() - f * d,
            a_d: eta / one_eta - f * rd1,
            a_dd: (eta / one_eta).powi(2) - f * rd2,
            a_t: -f_t * d,
            a_tt: -f_tt * d,
            a_dt: -f_t * rd1,
        }
    }

    fn alpha_z(&self, t: f64, rho: f64, x: &[f64]) -> (f64, f64) {
        let (a, b) = self.mix_ab(t, x, None);
        self.alpha_z_from(a, b, t, rho)
    }

    fn ln_phi_at_tp(
        &self,
        t: f64,
        p: f64,
        x: &[f64],
        sel: RootSel,
        out: &mut [f64],
    ) -> Option<PhaseAt> {
        // One mixing sum for the roots, the root choice and ln phi (the values are those of
        // densities, alpha_z and ln_phi called one by one).
        let n = self.comps.len();
        let mut sum_a = [0.0; MAX_COMPONENTS];
        let (a, b) = self.mix_ab(t, x, Some(&mut sum_a[..n]));
        let roots = self.roots_from(a, b, t, p);
        let f = a / (R * t);
        select_root(
            t,
            p,
            roots.as_slice(),
            sel,
            |rho| {
                let eta = b * rho;
                let (d, rd1, _) = self.d_integral(b, rho);
                let one_eta = 1.0 - eta;
                let ln_one_eta = one_eta.ln();
                let alpha = -ln_one_eta - f * d;
                let z_model = 1.0 + (eta / one_eta - f * rd1);
                (alpha, z_model, (d, ln_one_eta))
            },
            |_, &(d, ln_one_eta), z_model, ln_z, out| {
                self.ln_phi_terms(a, b, &sum_a[..n], f * d, z_model, ln_one_eta + ln_z, out);
            },
            out,
        )
    }

    fn dlnphi_dn_tp(&self, t: f64, rho: f64, x: &[f64], jac: &mut [f64]) -> bool {
        self.dlnphi_dn_from(t, rho, x, jac)
    }

    fn ln_phi(&self, t: f64, rho: f64, x: &[f64], out: &mut [f64]) {
        let n = self.comps.len();
        let mut sum_a = [0.0; MAX_COMPONENTS];
        let (a, b) = self.mix_ab(t, x, Some(&mut sum_a[..n]));
        self.ln_phi_from(a, b, &sum_a[..n], t, rho, out);
    }

    fn densities(&self, t: f64, p: f64, x: &[f64]) -> DensityRoots {
        let (a, b) = self.mix_ab(t, x, None);
        self.roots_from(a, b, t, p)
    }

    fn max_density(&self, x: &[f64]) -> f64 {
        1.0 / x.iter().zip(&self.b).map(|(x, b)| x * b).sum::<f64>()
    }

    fn critical_z(&self) -> f64 {
        self.crit.zc
    }
}
