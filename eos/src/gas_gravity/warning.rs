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
        // Four significant figures: the value is compared with a range given to two or three.
        write!(
            f,
            "{} = {} is outside {} to {} of {}",
            self.quantity,
            Sig4(self.value),
            self.min,
            self.max,
            self.correlation
        )
    }
}

/// A number written to four significant figures without trailing floating-point digits.
struct Sig4(f64);

impl std::fmt::Display for Sig4 {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        let v = self.0;
        if v == 0.0 || !v.is_finite() {
            return write!(f, "{v}");
        }
        let decimals = (3 - v.abs().log10().floor() as i32).max(0) as usize;
        write!(f, "{v:.decimals$}")
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

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_warning_quotes_its_value_without_floating_point_dust() {
        let w = RangeWarning {
            correlation: "Sutton (1985)",
            quantity: "gas gravity",
            value: 0.553_862_460_167_030_9,
            min: 0.57,
            max: 1.68,
        };
        assert_eq!(
            w.to_string(),
            "gas gravity = 0.5539 is outside 0.57 to 1.68 of Sutton (1985)"
        );
        let w = RangeWarning {
            value: 212.310_519_183_895_7,
            quantity: "Ppr",
            ..w
        };
        assert!(w.to_string().starts_with("Ppr = 212.3 is"), "{w}");
    }
}
