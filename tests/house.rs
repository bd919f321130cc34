//! The house rule that no module imports a module that imports it, checked over the three
//! crates' sources (`src/`, `eos/src/`, `fluids/src/`): a module's dependencies are the
//! `crate::` and `super::` paths of its non-test code, each taken to the deepest module it
//! names; any cycle among them fails with the modules in it.

use std::collections::{BTreeMap, BTreeSet};
use std::path::{Path, PathBuf};

type Module = Vec<String>;

/// Every `.rs` file below `dir`, as (module path, file).
fn modules(root: &Path) -> BTreeMap<Module, PathBuf> {
    let mut out = BTreeMap::new();
    let mut dirs = vec![root.to_path_buf()];
    while let Some(d) = dirs.pop() {
        for entry in std::fs::read_dir(&d).unwrap() {
            let p = entry.unwrap().path();
            if p.is_dir() {
                dirs.push(p);
            } else if p.extension().is_some_and(|e| e == "rs") {
                let rel = p.strip_prefix(root).unwrap().with_extension("");
                let mut m: Module = rel
                    .components()
                    .map(|c| c.as_os_str().to_string_lossy().into_owned())
                    .collect();
                if matches!(m.last().map(String::as_str), Some("mod" | "lib" | "main")) {
                    m.pop();
                }
                out.insert(m, p);
            }
        }
    }
    out
}

/// The code of a file without its test module (the house puts it last) and comments.
fn production_code(text: &str) -> String {
    let code = text.split("#[cfg(test)]").next().unwrap_or("");
    code.lines()
        .map(|l| l.split("//").next().unwrap_or(""))
        .collect::<Vec<_>>()
        .join("\n")
}

/// The paths of `use` items, braces expanded: `use crate::a::{b, c::d}` gives `crate::a::b`
/// and `crate::a::c::d`; then every other `crate::`/`super::` path in the code.
fn paths(code: &str) -> Vec<Vec<String>> {
    fn expand(prefix: &str, body: &str, out: &mut Vec<String>) {
        match body.find('{') {
            Some(open) if body.ends_with('}') => {
                let (head, inner) = (&body[..open], &body[open + 1..body.len() - 1]);
                let mut depth = 0;
                let mut part = String::new();
                for ch in inner.chars().chain([',']) {
                    match ch {
                        '{' => depth += 1,
                        '}' => depth -= 1,
                        _ => {}
                    }
                    if ch == ',' && depth == 0 {
                        if !part.is_empty() {
                            expand(&format!("{prefix}{head}"), &part, out);
                        }
                        part.clear();
                    } else {
                        part.push(ch);
                    }
                }
            }
            _ => out.push(format!("{prefix}{body}")),
        }
    }
    let mut flat = Vec::new();
    for item in code.split("use ").skip(1) {
        let body: String = item
            .split(';')
            .next()
            .unwrap_or("")
            .chars()
            .filter(|c| !c.is_whitespace())
            .collect();
        expand("", &body, &mut flat);
    }
    let word = |c: char| c.is_alphanumeric() || c == '_' || c == ':';
    for (i, _) in code
        .match_indices("crate::")
        .chain(code.match_indices("super::"))
    {
        let rest: String = code[i..].chars().take_while(|&c| word(c)).collect();
        flat.push(rest);
    }
    flat.iter()
        .map(|p| {
            p.split(" as ")
                .next()
                .unwrap_or("")
                .split("::")
                .filter(|s| !s.is_empty())
                .map(str::to_string)
                .collect()
        })
        .collect()
}

/// The deepest module that a path from `from` names, if it is another module of the crate.
fn target(path: &[String], from: &Module, mods: &BTreeMap<Module, PathBuf>) -> Option<Module> {
    let mut full: Module = match path.first().map(String::as_str) {
        Some("crate") => path[1..].to_vec(),
        Some("super") => {
            let mut base = from.clone();
            let mut rest = path;
            while rest.first().map(String::as_str) == Some("super") {
                base.pop();
                rest = &rest[1..];
            }
            base.extend(rest.iter().cloned());
            base
        }
        _ => return None,
    };
    while !full.is_empty() {
        if mods.contains_key(&full) {
            return (&full != from).then_some(full);
        }
        full.pop();
    }
    None
}

/// The cycles of the module graph of one crate: each a set of modules that reach each other.
fn cycles(root: &Path) -> Vec<BTreeSet<String>> {
    let mods = modules(root);
    let edges: BTreeMap<Module, BTreeSet<Module>> = mods
        .iter()
        .map(|(m, file)| {
            let code = production_code(&std::fs::read_to_string(file).unwrap());
            let deps = paths(&code)
                .iter()
                .filter_map(|p| target(p, m, &mods))
                .collect();
            (m.clone(), deps)
        })
        .collect();
    // Two modules are in one cycle when each reaches the other.
    let reach = |from: &Module| {
        let mut seen = BTreeSet::new();
        let mut todo = vec![from.clone()];
        while let Some(m) = todo.pop() {
            for d in &edges[&m] {
                if seen.insert(d.clone()) {
                    todo.push(d.clone());
                }
            }
        }
        seen
    };
    let reached: BTreeMap<&Module, BTreeSet<Module>> = mods.keys().map(|m| (m, reach(m))).collect();
    let mut out: Vec<BTreeSet<String>> = Vec::new();
    for m in mods.keys() {
        let group: BTreeSet<String> = reached[m]
            .iter()
            .filter(|o| reached[o].contains(m))
            .map(|o| o.join("::"))
            .collect();
        if !group.is_empty() && !out.contains(&group) {
            out.push(group);
        }
    }
    out
}

#[test]
fn no_module_imports_a_module_that_imports_it() {
    let here = Path::new(env!("CARGO_MANIFEST_DIR"));
    for src in ["src", "eos/src", "fluids/src"] {
        let found = cycles(&here.join(src));
        assert!(found.is_empty(), "{src}: import cycles {found:?}");
    }
}

#[test]
fn the_check_finds_a_cycle_when_there_is_one() {
    let dir = std::env::temp_dir().join(format!("zfactor-house-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    std::fs::write(dir.join("lib.rs"), "pub mod a;\npub mod b;\npub mod c;\n").unwrap();
    std::fs::write(dir.join("a.rs"), "use crate::b::{self, Thing};\n").unwrap();
    std::fs::write(dir.join("b.rs"), "// crate::a in a comment is no import\n").unwrap();
    std::fs::write(dir.join("c.rs"), "#[cfg(test)]\nmod t { use crate::a; }\n").unwrap();
    assert!(cycles(&dir).is_empty());
    std::fs::write(dir.join("b.rs"), "pub fn f() { crate::a::g() }\n").unwrap();
    let found = cycles(&dir);
    std::fs::remove_dir_all(&dir).unwrap();
    let expected: BTreeSet<String> = ["a".to_string(), "b".to_string()].into();
    assert_eq!(found, vec![expected]);
}
