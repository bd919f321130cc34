//! One rule for every command that runs several models: a model that cannot answer is left
//! out with a warning naming it and why, and the others are reported (exit 3). Only when a
//! single model was asked, or when no model could answer, is the failure the run's answer.

use crate::error::CliError;

/// The answers of the models that could answer, and a warning for each that could not.
pub struct Answers<T> {
    /// One answer per model that answered, in the order asked.
    pub results: Vec<T>,
    /// "ID left out: reason" for each model that did not.
    pub warnings: Vec<String>,
}

/// Runs `job` for each id, in order. With one id its error is returned as it is; with more,
/// a failing model is left out with a warning. When every model fails, the first failure
/// is returned with the others' reasons appended (the exit code follows the first's kind).
pub fn run<T>(
    ids: &[String],
    mut job: impl FnMut(&str) -> Result<T, CliError>,
) -> Result<Answers<T>, CliError> {
    let mut results = Vec::new();
    let mut warnings = Vec::new();
    let mut first_err: Option<CliError> = None;
    for id in ids {
        match job(id) {
            Ok(r) => results.push(r),
            Err(e) if ids.len() == 1 => return Err(e),
            Err(e) => {
                warnings.push(format!("{id} left out: {e}"));
                first_err.get_or_insert(e);
            }
        }
    }
    match first_err {
        Some(e) if results.is_empty() => Err(CliError::NoModel {
            summary: warnings.join("; "),
            first: Box::new(e),
        }),
        _ => Ok(Answers { results, warnings }),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn ids(v: &[&str]) -> Vec<String> {
        v.iter().map(|s| s.to_string()).collect()
    }

    #[test]
    fn one_failing_model_of_several_is_left_out_with_a_warning() {
        let a = run(&ids(&["a", "b", "c"]), |id| {
            if id == "b" {
                Err(CliError::Computation("no root".into()))
            } else {
                Ok(id.to_string())
            }
        })
        .unwrap();
        assert_eq!(a.results, ["a", "c"]);
        assert_eq!(a.warnings, ["b left out: no root"]);
    }

    #[test]
    fn a_single_model_fails_with_its_own_error() {
        let e = run(&ids(&["a"]), |_| -> Result<(), _> {
            Err(CliError::BadInput("outside".into()))
        })
        .err()
        .unwrap();
        assert_eq!(e.to_string(), "outside");
    }

    #[test]
    fn when_every_model_fails_the_first_kind_decides_the_exit_code() {
        let e = run(&ids(&["a", "b"]), |id| -> Result<(), _> {
            if id == "a" {
                Err(CliError::BadInput("outside".into()))
            } else {
                Err(CliError::Computation("no root".into()))
            }
        })
        .err()
        .unwrap();
        assert_eq!(e.exit_code(), crate::exit::Exit::BadInput);
        assert!(
            matches!(e, CliError::NoModel { ref first, .. } if matches!(**first, CliError::BadInput(_)))
        );
        assert!(e.to_string().contains("a left out: outside"));
        assert!(e.to_string().contains("b left out: no root"));
    }
}
