//! A note that an input lies outside the range a correlation was fitted over.

/// An input outside a correlation's published range. The value is still computed; the caller
/// decides whether an extrapolated answer is acceptable.
#[derive(Debug, Clone, PartialEq)]
pub struct RangeWarning {
    /// The correlation (e.g. "Dranchuk-Abou-Kassem (1975)").
    pub correlation: &'static str,
    /// The quantity (e.g. "Tpr").
    pub quantity: &'static str,
    /// Its value.
    pub value: f64,
    /// Lowest value of the published range.
    pub min: f64,
    /// Highest value of the published range.
    pub max: f64,
}

impl std::fmt::Display for RangeWarning {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(
            f,
            "{} = {} is outside {} to {} of {}",
            self.quantity, self.value, self.min, self.max, self.correlation
        )
    }
}

/// Pushes a warning when `value` is outside [min, max].
pub(crate) fn check(
    out: &mut Vec<RangeWarning>,
    correlation: &'static str,
    quantity: &'static str,
    value: f64,
    min: f64,
    max: f64,
) {
    if !(min..=max).contains(&value) {
        out.push(RangeWarning {
            correlation,
            quantity,
            value,
            min,
            max,
        });
    }
}
