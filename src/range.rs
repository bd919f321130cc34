//! Where a computed state stands against its model's range of validity: every model's range
//! read from one place (the reference formulations' published ranges through
//! [`eos::pure::PureFluid::range`], the numeric ranges of [`eos::catalogue`], the virial
//! series' density limit), and the results no stable fluid can have (a negative heat
//! capacity, a negative Z, a falling isotherm). A state outside is still computed where the
//! user asks for it, but carries these warnings next to its values, and the run ends with
//! exit code 3.

use crate::feed::Feed;
use crate::models::BuiltModel;
use eos::constants::R;
use eos::properties::Properties;

/// How far beyond half the critical density the truncated virial series is still taken as
/// within its range: none (common practice: the two-term series holds to about rho_c / 2).
const VIRIAL_MAX_DENSITY_OVER_CRITICAL: f64 = 0.5;

/// The largest |Z - 1| the truncated series is taken to describe: at half the critical
/// density B rho is about -0.3 to -0.4 for simple gases (B(Tc) is about -Vc, common
/// practice), so a larger correction means the series is used where it has no meaning.
const VIRIAL_MAX_CORRECTION: f64 = 0.5;

/// What a model's range and the fluid's solid phase say about states, prepared once for a
/// (model, feed) pair so that a grid of any size checks each state cheaply.
pub struct StateCheck {
    range: Option<eos::pure::FluidRange>,
    virial_rho_c: Option<f64>,
    solid: Option<(eos::solid::SolidLines, String)>,
}

impl StateCheck {
    /// The checks of `built` for `feed`.
    pub fn new(built: &BuiltModel, feed: &Feed) -> Self {
        StateCheck {
            solid: crate::solid_check::pure_lines(feed),
            ..Self::range_only(built, feed)
        }
    }

    /// The range checks alone (no solid curves).
    fn range_only(built: &BuiltModel, feed: &Feed) -> Self {
        StateCheck {
            range: built.pure.as_ref().map(|f| f.range()).filter(|r| r.stated),
            virial_rho_c: (built.id == "virial").then(|| pseudo_critical_density(feed)),
            solid: None,
        }
    }

    /// A short flag for a table's flag column, or `None` for a state inside the model's
    /// range and outside the solid region: "outside range", "solid", "solid may form",
    /// joined by "; ".
    pub fn flag(&self, t: f64, p: f64, rho: f64) -> Option<String> {
        let mut f = Vec::new();
        if self.outside_range(t, p).is_some() || self.beyond_virial(t, p, rho).is_some() {
            f.push("outside range");
        }
        if let Some((l, name)) = &self.solid {
            match eos::solid::check(l, name, t, p) {
                eos::solid::SolidCheck::Solid(_) => f.push("solid"),
                eos::solid::SolidCheck::MaybeSolid(_) => f.push("solid may form"),
                eos::solid::SolidCheck::Fluid => {}
            }
        }
        (!f.is_empty()).then(|| f.join("; "))
    }

    /// The flagged states among (t[i], p[i]) with compression factor z[i], as (index, flag)
    /// in index order, each flag as [`StateCheck::flag`] gives it; on all cores. A block of
    /// states whose whole (T, P) box lies inside the model's range and clear of the solid is
    /// passed over without a state-by-state check (the box test is exact for the range and,
    /// for the solid, relies on melting pressures rising with temperature above the triple
    /// point, which holds for every curve in [`eos::solid`] and is tested there). A state
    /// whose Z is not a positive number is not flagged here (it has no density to check).
    pub fn flags(&self, t: &[f64], p: &[f64], z: &[f64]) -> Vec<(usize, String)> {
        use rayon::prelude::*;
        const BLOCK: usize = 4096;
        let n = t.len().min(p.len()).min(z.len());
        (0..n.div_ceil(BLOCK))
            .into_par_iter()
            .flat_map_iter(|b| {
                let r = b * BLOCK..((b + 1) * BLOCK).min(n);
                let (tb, pb, zb) = (&t[r.clone()], &p[r.clone()], &z[r.clone()]);
                let clear = self.box_is_clear(tb, pb);
                r.zip(tb.iter().zip(pb).zip(zb))
                    .filter(move |_| !clear)
                    .filter_map(|(i, ((&t, &p), &z))| {
                        (z > 0.0)
                            .then(|| self.flag(t, p, p / (z * R * t)))
                            .flatten()
                            .map(|f| (i, f))
                    })
            })
            .collect()
    }

    /// True when no state of the box spanned by `t` and `p` can be flagged: inside the
    /// stated range, not a truncated virial series (its limit depends on each density), and
    /// above the triple point and below the melting pressure at the lowest temperature.
    fn box_is_clear(&self, t: &[f64], p: &[f64]) -> bool {
        if self.virial_rho_c.is_some() {
            return false;
        }
        // Each bound is found only where a check needs it; a NaN or an infinity in the block
        // makes its bound not finite, and the block is then checked state by state.
        let below = |bound: f64, v: f64| v.is_finite() && v <= bound;
        let t_lo = match (&self.range, &self.solid) {
            (None, None) => return true,
            _ => lowest(t),
        };
        let in_range = match &self.range {
            None => true,
            Some(r) => {
                r.t_min <= t_lo
                    && below(r.t_max, -lowest_negated(t))
                    && below(r.p_max, -lowest_negated(p))
            }
        };
        let clear_of_solid = match &self.solid {
            None => true,
            Some((l, _)) => {
                l.t_triple <= t_lo
                    && t_lo.is_finite()
                    && match l.melting {
                        None => true,
                        Some(melting) => {
                            melting(t_lo).is_some_and(|m| below(m, -lowest_negated(p)))
                        }
                    }
            }
        };
        in_range && clear_of_solid
    }

    /// The published range when (T, P) lies outside it.
    fn outside_range(&self, t: f64, p: f64) -> Option<eos::pure::FluidRange> {
        self.range
            .filter(|r| t < r.t_min || t > r.t_max || p > r.p_max)
    }

    /// (rho / rho_c, Z - 1) when the truncated virial series is used beyond its range.
    fn beyond_virial(&self, t: f64, p: f64, rho: f64) -> Option<(f64, f64)> {
        let rho_c = self.virial_rho_c?;
        let z = p / (rho * R * t);
        (rho > VIRIAL_MAX_DENSITY_OVER_CRITICAL * rho_c || (z - 1.0).abs() > VIRIAL_MAX_CORRECTION)
            .then_some((rho / rho_c, z - 1.0))
    }
}

/// Columns of the running minimum in [`lowest`]: independent chains, so that it vectorises.
const COLUMNS: usize = 8;

/// The smallest value (infinity for none); NaN where any value is NaN or infinite.
fn lowest(v: &[f64]) -> f64 {
    lowest_of(v, |x| x)
}

/// The smallest negated value, that is minus the largest; NaN where any value is NaN or
/// infinite.
fn lowest_negated(v: &[f64]) -> f64 {
    lowest_of(v, |x| -x)
}

#[allow(clippy::needless_range_loop)]
fn lowest_of(v: &[f64], f: impl Fn(f64) -> f64) -> f64 {
    let mut lo = [f64::INFINITY; COLUMNS];
    let mut poison = [0.0; COLUMNS];
    let mut chunks = v.chunks_exact(COLUMNS);
    for c in &mut chunks {
        for k in 0..COLUMNS {
            let x = f(c[k]);
            lo[k] = if x < lo[k] { x } else { lo[k] };
            poison[k] += x * 0.0;
        }
    }
    for &x in chunks.remainder() {
        let x = f(x);
        lo[0] = if x < lo[0] { x } else { lo[0] };
        poison[0] += x * 0.0;
    }
    lo.iter().fold(f64::INFINITY, |a, &b| a.min(b)) + poison.iter().sum::<f64>()
}

/// Warnings for a state of `built` at (T, P) with molar density `rho`: outside the model's
/// published range, or (for the truncated virial equation) beyond its density limit.
pub fn outside(built: &BuiltModel, feed: &Feed, t: f64, p: f64, rho: f64) -> Vec<String> {
    let check = StateCheck::range_only(built, feed);
    let mut out = Vec::new();
    if let Some(r) = check.outside_range(t, p) {
        out.push(format!(
            "outside the published range of {} ({} K to {} K, up to {} MPa): T = {} K, P = {} \
             MPa; the value is an extrapolation",
            built.name,
            r.t_min,
            r.t_max,
            r.p_max / 1e6,
            round(t),
            round(p / 1e6)
        ));
    }
    if let Some((rho_r, z1)) = check.beyond_virial(t, p, rho) {
        out.push(format!(
            "beyond the range of the truncated virial equation: it holds up to about half the \
             critical density, where B rho stays a correction well below 0.5 (common practice); \
             here rho / rho_c = {rho_r:.3} and Z - 1 = {z1:.3}"
        ));
    }
    out
}

/// Warnings for results no mechanically and thermally stable fluid can have, with the values
/// that are then withheld (set to `None` by [`withhold_impossible`]).
pub fn impossible(props: &Properties) -> Vec<String> {
    let mut out = Vec::new();
    if props.z <= 0.0 {
        out.push(format!(
            "thermodynamically impossible: Z = {:.4} is not positive; the model is far outside \
             its range",
            props.z
        ));
    }
    if props.cv <= 0.0 {
        out.push(format!(
            "thermodynamically impossible: cv = {:.4} J/(mol K) is not positive; cv and the \
             properties derived from it are withheld",
            props.cv
        ));
    }
    if let Some(cp) = props.cp.filter(|&cp| cp <= 0.0) {
        out.push(format!(
            "thermodynamically impossible: cp = {cp:.4} J/(mol K) is not positive; cp and the \
             properties derived from it are withheld"
        ));
    }
    out
}

/// Removes the caloric values that [`impossible`] found impossible: cv, cp and what derives
/// from them (speed of sound, Joule-Thomson coefficient, isentropic exponent).
pub fn withhold_impossible(props: &mut Properties) -> bool {
    let bad_cv = props.cv <= 0.0;
    let bad_cp = props.cp.is_some_and(|cp| cp <= 0.0);
    if bad_cv || bad_cp {
        props.cp = None;
        props.w = None;
        props.jt = None;
        props.isentropic_exponent = None;
    }
    bad_cv
}

/// A critical molar density (mol/m3) of the feed: Kay's rule on the components' critical
/// volumes, each from its table value or, where none is given, from Zc = 0.29 (a typical
/// value for light gases, common practice).
fn pseudo_critical_density(feed: &Feed) -> f64 {
    let vc: f64 = feed
        .records
        .iter()
        .zip(&feed.mole)
        .map(|(r, x)| x * r.vc_m3_mol.unwrap_or(0.29 * R * r.tc_k / r.pc_pa))
        .sum();
    1.0 / vc
}

/// A number as a reader would write it: six significant figures, no floating-point dust.
fn round(v: f64) -> f64 {
    if v == 0.0 || !v.is_finite() {
        return v;
    }
    let digits = 5 - v.abs().log10().floor() as i32;
    let scale = 10f64.powi(digits);
    (v * scale).round() / scale
}
