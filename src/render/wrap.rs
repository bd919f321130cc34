//! Prose lines of terminal output (notes, cautions, basis lines) folded at word boundaries so
//! that they stay within the width of the tables ([`crate::render::model_grid::WIDTH`]); a
//! folded line continues indented under its start. Tables are left whole: a table of the
//! house style is a rule of dashes, its header, a rule, its rows and a closing rule. Data
//! formats are never folded.

use crate::render::model_grid::WIDTH;

/// `text` with every line longer than [`WIDTH`] folded at spaces.
pub fn fold(text: &str) -> String {
    let mut out = String::with_capacity(text.len() + text.len() / 50);
    // Rules seen in the current table (0: outside a table).
    let mut rules = 0;
    for line in text.split_inclusive('\n') {
        let (body, end) = match line.strip_suffix('\n') {
            Some(b) => (b, "\n"),
            None => (line, ""),
        };
        let rule = !body.is_empty() && body.chars().all(|c| c == '-');
        if rule {
            rules = (rules + 1) % 3;
        }
        if rule || rules > 0 || body.chars().count() <= WIDTH {
            out.push_str(line);
            continue;
        }
        let lead = body.len() - body.trim_start().len();
        let indent = " ".repeat(lead + 2);
        let mut current = String::from(&body[..lead]);
        let mut width = lead;
        for word in body[lead..].split(' ') {
            let w = word.chars().count();
            if width > indent.len() && width + 1 + w > WIDTH {
                out.push_str(current.trim_end());
                out.push('\n');
                current = indent.clone();
                width = indent.len();
            } else if width > lead {
                current.push(' ');
                width += 1;
            }
            current.push_str(word);
            width += w;
        }
        out.push_str(&current);
        out.push_str(end);
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn long_lines_fold_at_spaces_and_short_ones_stay() {
        let long = format!("caution: {}", "word ".repeat(40).trim_end());
        let folded = fold(&format!("short\n{long}\n"));
        assert!(folded.starts_with("short\ncaution: word"));
        assert!(folded.lines().all(|l| l.chars().count() <= WIDTH));
        assert!(folded.lines().skip(2).all(|l| l.starts_with("  word")));
        // Nothing is lost: the words are the same, in order.
        let words = |s: &str| s.split_whitespace().map(str::to_string).collect::<Vec<_>>();
        assert_eq!(words(&folded), words(&format!("short\n{long}\n")));
        assert!(folded.ends_with('\n'));
        // A word longer than the width stays whole on its own line.
        let unbroken = "x".repeat(WIDTH + 20);
        assert_eq!(fold(&unbroken), unbroken);
    }

    #[test]
    fn tables_are_left_whole() {
        let rule = "-".repeat(WIDTH + 10);
        let row = format!(" {} ", "12.5     ".repeat(12));
        let table = format!("{rule}\n head  a  b\n{rule}\n{row}\n{row}\n{rule}\n");
        let note = format!("note: {}", "word ".repeat(30));
        let folded = fold(&format!("{table}{note}\n"));
        assert!(folded.starts_with(&table), "{folded}");
        assert!(folded[table.len()..].lines().count() > 1);
    }
}
