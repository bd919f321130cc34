//! Substring search over ids, names, aliases, formulas and CAS numbers, for browsing ("which
//! butanes are there?"). Matching uses the normalised form of [`crate::name::normalize`].

use crate::lookup::all;
use crate::name::normalize;
use crate::record::ComponentRecord;

/// Components whose id, name, alias, formula or CAS number contains `text`, in table order.
/// An empty `text` returns every component.
pub fn search(text: &str) -> Vec<&'static ComponentRecord> {
    let q = normalize(text);
    all()
        .iter()
        .filter(|c| {
            [Some(&c.id), Some(&c.name), c.formula.as_ref(), Some(&c.cas)]
                .into_iter()
                .flatten()
                .chain(c.aliases.iter())
                .any(|n| normalize(n).contains(&q))
        })
        .collect()
}
