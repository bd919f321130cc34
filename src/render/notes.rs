//! Notes of several models printed once each: a note that several models share (the same
//! k_ij list for the Peng-Robinson members, say) is printed once, headed by every model it
//! belongs to, in the order the notes first appear.

/// "pr, pr78: note" lines from each model's id and notes; notes for which `skip` is true are
/// left out.
pub fn grouped<'a>(
    models: impl IntoIterator<Item = (&'a str, &'a [String])>,
    skip: impl Fn(&str) -> bool,
) -> Vec<String> {
    let mut groups: Vec<(Vec<&str>, &str)> = Vec::new();
    for (model, notes) in models {
        for n in notes.iter().filter(|n| !skip(n)) {
            match groups.iter_mut().find(|(_, text)| *text == n.as_str()) {
                Some((ids, _)) => ids.push(model),
                None => groups.push((vec![model], n.as_str())),
            }
        }
    }
    groups
        .into_iter()
        .map(|(ids, text)| format!("{}: {text}", ids.join(", ")))
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn shared_notes_are_printed_once_with_every_model() {
        let a = vec!["k_ij: x".to_string(), "only a".to_string()];
        let b = vec!["k_ij: x".to_string(), "warning: w".to_string()];
        let lines = grouped([("pr", a.as_slice()), ("pr78", b.as_slice())], |n| {
            n.starts_with("warning: ")
        });
        assert_eq!(lines, vec!["pr, pr78: k_ij: x", "pr: only a"]);
    }
}
