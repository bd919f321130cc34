//! The canonical form of a name as an engineer types it: matching ignores case and
//! surrounding whitespace and drops the separators `-`, `_` and space, so "n butane",
//! "N-Butane", "n_butane" and "nbutane" are the same query.

/// The canonical form used for matching: trimmed, lowercase, without `-`, `_` or spaces.
pub fn normalize(s: &str) -> String {
    s.trim()
        .chars()
        .filter(|c| !matches!(c, '-' | '_' | ' ' | '\t'))
        .flat_map(char::to_lowercase)
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn separators_and_case_are_ignored() {
        assert_eq!(normalize("  N-Butane "), "nbutane");
        assert_eq!(normalize("n butane"), "nbutane");
        assert_eq!(normalize("n_BUTANE"), "nbutane");
        assert_eq!(normalize("R-134a"), normalize("r134a"));
    }
}
