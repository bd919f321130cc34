//! Ideal-gas heat capacities used outside the temperature range they were fitted over.

use crate::feed::Feed;

/// How far outside its fitted range (as a fraction of the range end) a heat-capacity
/// polynomial is extrapolated before the result carries a warning rather than a note; a
/// polynomial in T stays close to its end values just beyond its range (common practice).
const NOTE_ONLY: f64 = 0.1;

/// Notes (just beyond the range) and warnings (further) for every component whose heat
/// capacity is extrapolated to `t`; `affected` says which results are less certain.
pub fn extrapolation(feed: &Feed, t: f64, affected: &str) -> (Vec<String>, Vec<String>) {
    let (mut notes, mut warnings) = (Vec::new(), Vec::new());
    for r in &feed.records {
        let (lo, hi) = r.cp_range_k;
        if t < lo || t > hi {
            let text = format!(
                "the ideal-gas heat capacity of {} is fitted from {lo} K to {hi} K and is \
                 extrapolated to {t:.2} K: {affected}",
                r.name
            );
            if t >= lo * (1.0 - NOTE_ONLY) && t <= hi * (1.0 + NOTE_ONLY) {
                notes.push(text);
            } else {
                warnings.push(text);
            }
        }
    }
    (notes, warnings)
}
