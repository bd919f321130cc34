//! The ideal-gas map: where the shortcut P v = R T is good enough.
//!
//! At given T and P the ideal gas gives rho_ig = P/(R T) and a real fluid rho = P/(Z R T), so
//! the ideal-gas density error is
//!
//! ```text
//! rho_ig / rho - 1 = Z - 1
//! ```
//!
//! exactly; |Z - 1| is the relative error of the shortcut. For each tolerance the map marks
//! the cells where |Z - 1| exceeds it and, along each isotherm, the lowest pressure at which
//! it does (linear interpolation of |Z - 1| in P between the two grid pressures that bracket
//! the crossing; the first grid pressure when it already fails there). The verdict names the
//! largest pressure range where the shortcut holds.

use serde::Serialize;

/// Where the shortcut starts to fail along one isotherm for one tolerance.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Boundary {
    /// Temperature of the isotherm, K.
    pub temperature_k: f64,
    /// Lowest pressure at which |Z - 1| exceeds the tolerance, Pa; `None` when it holds over
    /// the whole isotherm.
    pub fails_above_pa: Option<f64>,
    /// True when it fails already at the lowest pressure of the grid (the boundary lies
    /// below the grid).
    pub below_grid: bool,
}

/// The map for one tolerance.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ToleranceMap {
    /// The tolerance, percent.
    pub tolerance_pct: f64,
    /// Cells within the tolerance.
    pub cells_within: usize,
    /// Cells outside it.
    pub cells_outside: usize,
    /// The boundary along every isotherm.
    pub boundary: Vec<Boundary>,
    /// One line for the envelope.
    pub verdict: String,
}

/// |Z - 1| in percent of one cell.
pub fn error_pct(z: f64) -> f64 {
    100.0 * (z - 1.0).abs()
}

/// Lowest pressure at which `err_pct[j]` (at pressure `p[j]`, in any order) exceeds `tol`,
/// interpolated linearly between the bracketing pressures; `None` when it never does.
/// Non-finite errors are passed over.
pub fn boundary_pressure(p: &[f64], err_pct: &[f64], tol: f64) -> Option<f64> {
    let mut order: Vec<usize> = (0..p.len().min(err_pct.len())).collect();
    order.sort_by(|&a, &b| p[a].total_cmp(&p[b]));
    let mut prev: Option<(f64, f64)> = None;
    for j in order {
        let e = err_pct[j];
        if !e.is_finite() {
            continue;
        }
        if e > tol {
            return Some(match prev {
                Some((p0, e0)) if e > e0 => p0 + (tol - e0) / (e - e0) * (p[j] - p0),
                _ => p[j],
            });
        }
        prev = Some((p[j], e));
    }
    None
}

/// Builds the map from `z[i][j]` at temperature `t[i]` and pressure `p[j]` (NaN where no
/// value), for every tolerance (percent).
pub fn build(t: &[f64], p: &[f64], z: &[Vec<f64>], tolerances: &[f64]) -> Vec<ToleranceMap> {
    tolerances
        .iter()
        .map(|&tol| {
            let (mut within, mut outside) = (0, 0);
            for row in z {
                for &zv in row {
                    if zv.is_finite() {
                        if error_pct(zv) <= tol {
                            within += 1;
                        } else {
                            outside += 1;
                        }
                    }
                }
            }
            let boundary: Vec<Boundary> = t
                .iter()
                .zip(z)
                .map(|(&ti, row)| {
                    let fails = boundary_pressure(
                        p,
                        &row.iter().map(|&z| error_pct(z)).collect::<Vec<_>>(),
                        tol,
                    );
                    let lowest = p.iter().copied().fold(f64::INFINITY, f64::min);
                    Boundary {
                        temperature_k: ti,
                        fails_above_pa: fails,
                        below_grid: fails.is_some_and(|f| f <= lowest),
                    }
                })
                .collect();
            let verdict = verdict(tol, within, outside, &boundary);
            ToleranceMap {
                tolerance_pct: tol,
                cells_within: within,
                cells_outside: outside,
                boundary,
                verdict,
            }
        })
        .collect()
}

/// One line for the envelope.
fn verdict(tol: f64, within: usize, outside: usize, boundary: &[Boundary]) -> String {
    if within + outside == 0 {
        return format!("within {tol} %: no state could be computed");
    }
    if outside == 0 {
        return format!(
            "within {tol} %: the ideal gas law holds over the whole envelope ({within} states)"
        );
    }
    if within == 0 {
        return format!(
            "within {tol} %: the ideal gas law fails at every state of the envelope; use a \
             real-gas model"
        );
    }
    let lowest = boundary
        .iter()
        .filter_map(|b| b.fails_above_pa.map(|p| (p, b.temperature_k, b.below_grid)))
        .min_by(|a, b| a.0.total_cmp(&b.0));
    match lowest {
        Some((p, t, true)) => format!(
            "within {tol} %: the ideal gas law fails already at the lowest pressure of the \
             grid ({:.4} bar) at {:.2} K; it fails at {outside} of {} states",
            p / 1e5,
            t,
            within + outside
        ),
        Some((p, t, false)) => format!(
            "within {tol} %: the ideal gas law holds below {:.4} bar at every temperature of \
             the envelope (the limit is lowest at {:.2} K); it fails at {outside} of {} states",
            p / 1e5,
            t,
            within + outside
        ),
        None => format!(
            "within {tol} %: the ideal gas law fails at {outside} of {} states",
            within + outside
        ),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn boundary_by_linear_interpolation() {
        // By hand: on the first isotherm |Z - 1| = 0.5, 1.5, 3 % at 1, 2, 3 bar; the 1 %
        // boundary lies half-way between 1 and 2 bar (1.5 bar), the 2 % boundary at
        // 2 + (2 - 1.5)/(3 - 1.5) bar = 2.3333 bar. The second isotherm stays within 1 %.
        let t = [300.0, 400.0];
        let p = [1e5, 2e5, 3e5];
        let z = vec![vec![0.995, 0.985, 0.97], vec![0.999, 0.998, 0.997]];
        let m = build(&t, &p, &z, &[1.0, 2.0, 5.0]);
        // Z - 1 of decimal inputs is rounded in the last bits: 1e-12 relative.
        assert_relative_eq!(
            m[0].boundary[0].fails_above_pa.unwrap(),
            1.5e5,
            max_relative = 1e-12
        );
        assert!(m[0].boundary[1].fails_above_pa.is_none());
        assert_relative_eq!(
            m[1].boundary[0].fails_above_pa.unwrap(),
            2e5 + 1e5 / 3.0,
            max_relative = 1e-12
        );
        assert_eq!((m[0].cells_within, m[0].cells_outside), (4, 2));
        assert_eq!((m[2].cells_within, m[2].cells_outside), (6, 0));
        assert!(m[2].verdict.contains("whole envelope"), "{}", m[2].verdict);
        assert!(m[0].verdict.contains("1.5000 bar"), "{}", m[0].verdict);
    }

    #[test]
    fn failing_at_the_first_pressure_and_unsorted_axes() {
        // Pressures given downwards: the search sorts them first.
        let p = [3e5, 1e5];
        let z = vec![vec![0.9, 0.95]];
        let m = build(&[250.0], &p, &z, &[1.0]);
        assert_relative_eq!(m[0].boundary[0].fails_above_pa.unwrap(), 1e5);
        assert!(m[0].boundary[0].below_grid);
        assert!(m[0].verdict.contains("every state"), "{}", m[0].verdict);
        // Failing at the lowest pressure on one isotherm only.
        let z = vec![vec![0.98, 0.9], vec![0.999, 0.95]];
        let m = build(&[250.0, 300.0], &[1e5, 3e5], &z, &[1.0]);
        assert!(
            m[0].verdict.contains("lowest pressure of the grid"),
            "{}",
            m[0].verdict
        );
        assert!(!m[0].boundary[1].below_grid);
    }
}
