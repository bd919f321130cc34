//! Number formatting for people: significant figures, no trailing noise.

/// `v` with `sig` significant figures; scientific notation outside 1e-4..1e7.
pub fn sig(v: f64, sig: usize) -> String {
    if !v.is_finite() {
        return "-".to_string();
    }
    if v == 0.0 {
        return "0".to_string();
    }
    let mag = v.abs().log10().floor() as i32;
    if !(-4..7).contains(&mag) {
        return format!("{:.*e}", sig.saturating_sub(1), v);
    }
    let decimals = (sig as i32 - 1 - mag).max(0) as usize;
    format!("{v:.decimals$}")
}

/// An optional value, "-" when absent.
pub fn opt(v: Option<f64>, s: usize) -> String {
    v.map_or_else(|| "-".to_string(), |v| sig(v, s))
}

/// `v` with `decimals` decimals; a value that rounds to zero prints without a sign.
pub fn fixed(v: f64, decimals: usize) -> String {
    if !v.is_finite() {
        return "-".to_string();
    }
    let text = format!("{v:.decimals$}");
    match text.strip_prefix('-') {
        Some(rest) if rest.chars().all(|c| c == '0' || c == '.') => rest.to_string(),
        _ => text,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn fixed_decimals_without_a_negative_zero() {
        assert_eq!(fixed(-195.904, 2), "-195.90");
        assert_eq!(fixed(-0.0004, 2), "0.00");
        assert_eq!(fixed(13.735, 1), "13.7");
    }

    #[test]
    fn significant_figures() {
        assert_eq!(sig(0.892345678, 6), "0.892346");
        assert_eq!(sig(123456.789, 6), "123457");
        assert_eq!(sig(1.5e-7, 3), "1.50e-7");
        assert_eq!(sig(-12.0, 4), "-12.00");
        assert_eq!(sig(f64::NAN, 4), "-");
        assert_eq!(opt(None, 4), "-");
    }
}
