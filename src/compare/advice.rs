//! Model advice: the simplest model that stays within the user's tolerance over the envelope.
//!
//! Models are ranked by complexity, simplest first:
//!
//! ```text
//! ideal gas < cubic (vdw < rk < srk < pr < pr78) < corresponding states < reference formulation
//! ```
//!
//! For each tolerance the advice is the first model on that ladder whose maximum absolute
//! density deviation from the reference, over every point used (two-phase points excluded),
//! does not exceed the tolerance. The statistics that justify the choice, and the maximum
//! deviation of every simpler model that was rejected, go with it. A model with points it
//! could not compute is not advised (it does not cover the envelope).
//!
//! Model ids the ladder does not know yet are placed after the known ones of their tier when
//! the id says which tier it is, and last otherwise; see [`rank`].
//!
//! Warnings where a model is known to be weak carry their basis: a citation, "derived" (from
//! the model's own constants), or "common practice" (engineering experience stated in most
//! textbooks, no single source).

use super::region::Region;
use super::stats::DeviationStats;
use serde::Serialize;

/// Position of a model on the complexity ladder and the name of its tier.
pub fn rank(id: &str) -> (u32, &'static str) {
    match id {
        "ideal" => (0, "ideal gas"),
        "virial" => (5, "virial equation"),
        "dak" | "hy" => (6, "gas-gravity correlation"),
        "vdw" => (10, "cubic"),
        "rk" => (11, "cubic"),
        "srk" => (12, "cubic"),
        "pr" => (13, "cubic"),
        "pr78" => (14, "cubic"),
        "srk-pen" => (15, "cubic, volume-translated"),
        "pr-pen" => (16, "cubic, volume-translated"),
        "pr78-pen" => (17, "cubic, volume-translated"),
        "lk" => (20, "corresponding states"),
        "sw12" => (25, "technical Helmholtz equation"),
        "if97" => (28, "industrial formulation"),
        "reference" => (30, "reference formulation"),
        _ => (40, "other"),
    }
}

/// One model's result over the envelope, as the advice reads it.
#[derive(Debug, Clone)]
pub struct Candidate {
    /// Model id.
    pub model: String,
    /// Its statistics against the reference over the points used.
    pub stats: Option<DeviationStats>,
    /// Points it could not compute.
    pub failed: usize,
}

/// The advice for one tolerance.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Advice {
    /// The tolerance, percent (maximum absolute density deviation).
    pub tolerance_pct: f64,
    /// The simplest model within it; `None` when no compared model is.
    pub model: Option<String>,
    /// Its tier on the ladder.
    pub tier: Option<&'static str>,
    /// Mean absolute deviation of that model, percent.
    pub mean_abs_dev_pct: Option<f64>,
    /// Maximum absolute deviation of that model, percent.
    pub max_abs_dev_pct: Option<f64>,
    /// Bias of that model, percent.
    pub bias_pct: Option<f64>,
    /// Why the simpler models were not chosen, one line each.
    pub rejected: Vec<String>,
    /// One line.
    pub summary: String,
}

/// The advice for each tolerance.
pub fn advise(candidates: &[Candidate], tolerances: &[f64], reference: &str) -> Vec<Advice> {
    let mut ladder: Vec<&Candidate> = candidates.iter().collect();
    ladder.sort_by_key(|c| rank(&c.model).0);
    tolerances
        .iter()
        .map(|&tol| {
            let mut rejected = Vec::new();
            for c in &ladder {
                match (&c.stats, c.failed) {
                    (Some(s), 0) if s.max_abs_dev_pct <= tol => {
                        return Advice {
                            tolerance_pct: tol,
                            model: Some(c.model.clone()),
                            tier: Some(rank(&c.model).1),
                            mean_abs_dev_pct: Some(s.mean_abs_dev_pct),
                            max_abs_dev_pct: Some(s.max_abs_dev_pct),
                            bias_pct: Some(s.bias_pct),
                            rejected,
                            summary: format!(
                                "within {tol} %: {} is the simplest model that stays within \
                                 the tolerance against {reference} (max {:.3} %, mean {:.3} %, \
                                 bias {:+.3} % over {} points)",
                                c.model,
                                s.max_abs_dev_pct,
                                s.mean_abs_dev_pct,
                                s.bias_pct,
                                s.points
                            ),
                        };
                    }
                    (Some(s), 0) => rejected.push(format!(
                        "{}: max {:.3} % > {tol} %",
                        c.model, s.max_abs_dev_pct
                    )),
                    (_, f) if f > 0 => rejected.push(format!(
                        "{}: could not compute {f} point(s) of the envelope",
                        c.model
                    )),
                    _ => rejected.push(format!("{}: no point to judge it by", c.model)),
                }
            }
            Advice {
                tolerance_pct: tol,
                model: None,
                tier: None,
                mean_abs_dev_pct: None,
                max_abs_dev_pct: None,
                bias_pct: None,
                rejected,
                summary: format!(
                    "within {tol} %: no compared model stays within the tolerance against \
                     {reference}; use the reference itself or a more accurate model"
                ),
            }
        })
        .collect()
}

/// A known weakness that applies to this comparison.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Weakness {
    /// What to watch.
    pub text: String,
    /// Its basis: a citation, "derived: ...", or "common practice".
    pub basis: String,
}

/// Components for which cubic models with a Soave-type alpha are known to be weak: quantum
/// gases.
const QUANTUM: [&str; 3] = ["hydrogen", "helium", "neon"];
/// Strongly polar or hydrogen-bonding components.
const POLAR: [&str; 5] = ["water", "ammonia", "methanol", "ethanol", "hcl"];

/// Weaknesses of the compared models for these components (ids as in `fluids`) over the
/// regions that occur.
pub fn weaknesses(components: &[&str], models: &[&str], regions: &[Region]) -> Vec<Weakness> {
    let cubic = models.iter().any(|m| rank(m).1.starts_with("cubic"));
    let mut out = Vec::new();
    if !cubic {
        return out;
    }
    let quantum: Vec<&str> = components
        .iter()
        .copied()
        .filter(|c| QUANTUM.contains(c))
        .collect();
    if !quantum.is_empty() {
        out.push(Weakness {
            text: format!(
                "{}: the cubic models' alpha functions are fitted to classical fluids; for \
                 quantum gases their densities and especially their energies are less \
                 reliable, more so at low temperature",
                quantum.join(", ")
            ),
            basis: "common practice".to_string(),
        });
    }
    let polar: Vec<&str> = components
        .iter()
        .copied()
        .filter(|c| POLAR.contains(c))
        .collect();
    if !polar.is_empty() {
        out.push(Weakness {
            text: format!(
                "{}: polar or hydrogen-bonding fluid; the cubic models with generalised alpha \
                 functions describe its vapour pressure and liquid density poorly",
                polar.join(", ")
            ),
            basis: "common practice".to_string(),
        });
    }
    if regions.contains(&Region::Liquid) {
        out.push(Weakness {
            text: "liquid states: cubic models without volume translation give liquid \
                   densities that are typically several percent off; a volume shift corrects \
                   them without changing phase equilibria"
                .to_string(),
            basis: "Peneloux, A., Rauzy, E., Freze, R., A consistent correction for \
                    Redlich-Kwong-Soave volumes, Fluid Phase Equilibria 8 (1982) 7-23"
                .to_string(),
        });
    }
    if regions.contains(&Region::NearCritical) {
        out.push(Weakness {
            text: "near-critical states: a cubic model has one fixed critical compressibility \
                   factor (vdw 0.375, rk and srk 1/3, pr 0.307) where real fluids have about \
                   0.23 to 0.30, so densities near the critical point are the least reliable"
                .to_string(),
            basis: "derived: Zc follows from the model's constants (Omega_a, Omega_b); \
                    tabulated Zc of real fluids in the fluids data"
                .to_string(),
        });
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    fn stats(max: f64) -> Option<DeviationStats> {
        Some(DeviationStats {
            points: 4,
            mean_abs_dev_pct: max / 2.0,
            max_abs_dev_pct: max,
            bias_pct: -max / 4.0,
            max_at: 0,
        })
    }

    fn cand(model: &str, max: f64, failed: usize) -> Candidate {
        Candidate {
            model: model.to_string(),
            stats: stats(max),
            failed,
        }
    }

    #[test]
    fn the_simplest_model_within_each_tolerance() {
        // Constructed inputs: the ladder order and the tolerance test are the rules above.
        let c = vec![
            cand("pr", 0.4, 0),
            cand("ideal", 6.0, 0),
            cand("srk", 1.5, 0),
            cand("vdw", 3.0, 0),
        ];
        let a = advise(&c, &[0.5, 2.0, 5.0, 10.0, 0.1], "reference");
        let picks: Vec<Option<&str>> = a.iter().map(|x| x.model.as_deref()).collect();
        assert_eq!(
            picks,
            vec![Some("pr"), Some("srk"), Some("vdw"), Some("ideal"), None]
        );
        assert_eq!(a[0].rejected.len(), 3);
        assert!(a[0].rejected[0].starts_with("ideal: max 6.000 %"));
        assert_eq!(a[1].tier, Some("cubic"));
        // A model with failed points is never advised.
        let f = advise(&[cand("ideal", 0.1, 2), cand("pr", 0.2, 0)], &[1.0], "x");
        assert_eq!(f[0].model.as_deref(), Some("pr"));
    }

    #[test]
    fn weaknesses_for_quantum_polar_liquid_and_near_critical() {
        let w = weaknesses(
            &["hydrogen", "water", "methane"],
            &["ideal", "pr"],
            &[Region::Liquid, Region::NearCritical],
        );
        assert_eq!(w.len(), 4);
        assert!(w[0].text.starts_with("hydrogen"));
        assert!(w[2].basis.contains("Fluid Phase Equilibria"));
        assert!(weaknesses(&["hydrogen"], &["ideal"], &[Region::Liquid]).is_empty());
    }
}
