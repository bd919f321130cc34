//! Suggestions for a name that matched nothing: the closest ids, ranked by the Jaro-Winkler
//! similarity (Winkler 1990, as implemented in the `strsim` crate) between the normalised
//! query and every normalised id, name, alias and formula, plus a bonus when one contains the
//! other.

use crate::data::db;
use crate::name::normalize;

/// Similarity below which a name is not offered.
const THRESHOLD: f64 = 0.80;

/// Up to `max` ids close to `query`, best first (empty when nothing is close).
pub fn suggestions(query: &str, max: usize) -> Vec<String> {
    let Ok(d) = db() else {
        return Vec::new();
    };
    let q = normalize(query);
    if q.is_empty() {
        return Vec::new();
    }
    let mut scored: Vec<(f64, usize)> = d
        .components
        .iter()
        .enumerate()
        .filter_map(|(i, c)| {
            let names = [Some(&c.id), Some(&c.name), c.formula.as_ref()]
                .into_iter()
                .flatten()
                .chain(c.aliases.iter());
            let best = names
                .map(|n| score(&q, &normalize(n)))
                .fold(0.0_f64, f64::max);
            (best >= THRESHOLD).then_some((best, i))
        })
        .collect();
    scored.sort_by(|a, b| b.0.total_cmp(&a.0).then(a.1.cmp(&b.1)));
    scored
        .into_iter()
        .take(max)
        .map(|(_, i)| d.components[i].id.clone())
        .collect()
}

fn score(q: &str, name: &str) -> f64 {
    let jw = strsim::jaro_winkler(q, name);
    // A query of three or more characters inside a longer name (or the reverse) is a strong hint.
    let contained = q.len() >= 3 && (name.contains(q) || q.contains(name) && name.len() >= 3);
    if contained {
        jw.max(0.9)
    } else {
        jw
    }
}
