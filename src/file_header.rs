//! The one reading of a file's column headers, shared by every file the tool reads (states
//! and reference files, audited sheets, gas analyses, component and k_ij files): a name and
//! a unit in square brackets or parentheses, "T [K]" or "Temperature (degC)"; and the one
//! way an error names its place in a file.

/// Splits a header into its name (trimmed, lowercase; text after the unit kept) and its unit.
/// Square brackets are tried first, so that a unit may hold parentheses ("cp [J/(mol K)]").
pub fn split(h: &str) -> (String, Option<String>) {
    let h = h.trim();
    for (open, close) in [('[', ']'), ('(', ')')] {
        if let (Some(a), Some(b)) = (h.find(open), h.rfind(close)) {
            if b > a {
                let unit = h[a + 1..b].trim().to_string();
                let name = format!("{} {}", h[..a].trim(), h[b + 1..].trim());
                return (
                    name.trim().to_ascii_lowercase(),
                    (!unit.is_empty()).then_some(unit),
                );
            }
        }
    }
    (h.to_ascii_lowercase(), None)
}

/// "FILE, line N, column "C"" (the parts that are known).
pub fn place(path: &str, line: Option<usize>, column: Option<&str>) -> String {
    let mut at = path.to_string();
    if let Some(l) = line {
        at.push_str(&format!(", line {l}"));
    }
    if let Some(c) = column {
        at.push_str(&format!(", column \"{c}\""));
    }
    at
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn brackets_or_parentheses() {
        assert_eq!(split("T [K]"), ("t".to_string(), Some("K".to_string())));
        assert_eq!(
            split("Temperature (degC)"),
            ("temperature".to_string(), Some("degC".to_string()))
        );
        assert_eq!(
            split("cp [J/(mol K)]"),
            ("cp".to_string(), Some("J/(mol K)".to_string()))
        );
        assert_eq!(split("Z"), ("z".to_string(), None));
        assert_eq!(split("T []"), ("t".to_string(), None));
        assert_eq!(
            place("a.csv", Some(3), Some("P [bar]")),
            "a.csv, line 3, column \"P [bar]\""
        );
    }
}
