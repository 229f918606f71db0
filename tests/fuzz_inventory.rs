//! Keeps the fuzz suites complete: every public function and method of the core (everything
//! under `src/` except the JavaScript binding layer `src/wasm/`) must be called by name in one of
//! `tests/fuzz_*.rs`.
//!
//! The inventory is read from the source text: `pub fn` / `pub const fn` items outside `impl`
//! blocks are free functions (`name(` must appear in a fuzz file), inside an inherent `impl T`
//! they are methods (`T::name(` or `T::name::<` must appear — the fuzz files call methods in the
//! fully qualified form for this reason), and every `fn` of an `impl Trait for T` of one of the
//! crate's public traits is a trait method (`<T… as Trait>::name(` must appear). Items inside
//! `#[cfg(test)]` modules are skipped. A new public function therefore fails this test until a
//! fuzz case calls it. (The check is textual: it proves a call exists, not what it is fed.)

use std::fs;
use std::path::{Path, PathBuf};

/// The crate's public traits whose implementations are public API.
const TRAITS: &[&str] = &[
    "SignalModel",
    "InBand",
    "MonteCarloModel",
    "FrameInput",
    "FrameOutput",
];

fn rust_files(dir: &Path, out: &mut Vec<PathBuf>) {
    let mut entries: Vec<_> = fs::read_dir(dir)
        .unwrap()
        .map(|e| e.unwrap().path())
        .collect();
    entries.sort();
    for p in entries {
        if p.is_dir() {
            if p.file_name().is_some_and(|n| n == "wasm") {
                continue;
            }
            rust_files(&p, out);
        } else if p.extension().is_some_and(|e| e == "rs") {
            out.push(p);
        }
    }
}

/// The name of the type (or trait) in `impl<…> Trait for Type<…>` / `impl<…> Type<…>`.
fn impl_target(line: &str) -> (Option<String>, String) {
    let mut s = line.trim_start().trim_start_matches("impl");
    // Skip the generic parameter list.
    if s.starts_with('<') {
        let mut depth = 0;
        let mut end = 0;
        for (i, c) in s.char_indices() {
            match c {
                '<' => depth += 1,
                '>' => {
                    depth -= 1;
                    if depth == 0 {
                        end = i + 1;
                        break;
                    }
                }
                _ => {}
            }
        }
        s = &s[end..];
    }
    let s = s.trim();
    let base = |t: &str| -> String {
        t.trim()
            .trim_start_matches('&')
            .split(['<', ' ', '{'])
            .next()
            .unwrap_or("")
            .rsplit("::")
            .next()
            .unwrap_or("")
            .to_string()
    };
    match s.split_once(" for ") {
        Some((tr, ty)) => (Some(base(tr)), base(ty)),
        None => (None, base(s)),
    }
}

fn fn_name(rest: &str) -> String {
    rest.split(|c: char| !(c.is_alphanumeric() || c == '_'))
        .next()
        .unwrap_or("")
        .to_string()
}

/// Names of the `pub struct` / `pub enum` types (methods of private helper types that
/// implement a public trait are not API), plus the primitive pixel types.
fn public_types(files: &[PathBuf]) -> Vec<String> {
    let mut out: Vec<String> = ["u16", "f32", "f64"]
        .iter()
        .map(|s| s.to_string())
        .collect();
    for f in files {
        for line in fs::read_to_string(f).unwrap().lines() {
            let t = line.trim_start();
            if let Some(rest) = t
                .strip_prefix("pub struct ")
                .or_else(|| t.strip_prefix("pub enum "))
            {
                out.push(fn_name(rest));
            }
        }
    }
    out
}

/// (item, needles): the item's display name and the strings one of which must occur.
fn inventory(root: &Path) -> Vec<(String, Vec<String>)> {
    let mut files = Vec::new();
    rust_files(&root.join("src"), &mut files);
    let types = public_types(&files);
    let mut items = Vec::new();
    for file in files {
        let text = fs::read_to_string(&file).unwrap();
        let rel = file.strip_prefix(root).unwrap().display().to_string();
        let lines: Vec<&str> = text.lines().collect();
        let mut depth: i64 = 0;
        // (depth at which the block's body starts, trait, type)
        let mut impls: Vec<(i64, Option<String>, String)> = Vec::new();
        let mut skip_until: Option<i64> = None;
        let mut i = 0;
        while i < lines.len() {
            let line = lines[i];
            let t = line.trim_start();
            let code = t.split("//").next().unwrap_or("");
            if skip_until.is_none() && t.starts_with("#[cfg(test)]") {
                let next = lines[i + 1..].iter().find(|l| !l.trim().is_empty());
                if next.is_some_and(|l| l.trim_start().starts_with("mod ")) {
                    skip_until = Some(depth);
                }
            }
            if skip_until.is_none() && !t.starts_with("//") {
                if t.starts_with("impl") && (t.starts_with("impl ") || t.starts_with("impl<")) {
                    let (tr, ty) = impl_target(t);
                    impls.push((depth + 1, tr, ty));
                }
                let current = impls.last().filter(|(d, _, _)| *d == depth);
                let pub_fn = t
                    .strip_prefix("pub fn ")
                    .or_else(|| t.strip_prefix("pub const fn "));
                let any_fn = t.strip_prefix("fn ");
                match (current, pub_fn, any_fn) {
                    (Some((_, None, ty)), Some(rest), _) if types.contains(ty) => {
                        let name = fn_name(rest);
                        items.push((
                            format!("{rel}: {ty}::{name}"),
                            vec![format!("{ty}::{name}("), format!("{ty}::{name}::<")],
                        ));
                    }
                    (Some((_, Some(tr), ty)), _, Some(rest))
                        if TRAITS.contains(&tr.as_str()) && types.contains(ty) =>
                    {
                        let name = fn_name(rest);
                        items.push((
                            format!("{rel}: <{ty} as {tr}>::{name}"),
                            vec![format!("<{ty} as {tr}>::{name}("), format!("<{ty}<")],
                        ));
                    }
                    (None, Some(rest), _) if impls.is_empty() || depth == 0 => {
                        let name = fn_name(rest);
                        items.push((format!("{rel}: {name}"), vec![format!("{name}(")]));
                    }
                    _ => {}
                }
            }
            for c in code.chars() {
                match c {
                    '{' => depth += 1,
                    '}' => {
                        depth -= 1;
                        while impls.last().is_some_and(|(d, _, _)| *d > depth) {
                            impls.pop();
                        }
                    }
                    _ => {}
                }
            }
            if let Some(d) = skip_until {
                if depth <= d && code.contains('}') {
                    skip_until = None;
                }
            }
            i += 1;
        }
    }
    items
}

#[test]
fn every_public_function_is_fuzzed() {
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let mut fuzz_text = String::new();
    let mut names: Vec<PathBuf> = fs::read_dir(root.join("tests"))
        .unwrap()
        .map(|e| e.unwrap().path())
        .filter(|p| {
            p.file_name().and_then(|n| n.to_str()).is_some_and(|n| {
                n.starts_with("fuzz_")
                    && n.ends_with(".rs")
                    && n != "fuzz_inventory.rs"
                    && n != "fuzz_regressions.rs"
            })
        })
        .collect();
    names.sort();
    assert!(names.len() >= 4, "fuzz files: {names:?}");
    for p in &names {
        fuzz_text.push_str(&fs::read_to_string(p).unwrap());
    }
    let items = inventory(root);
    // A sanity floor, so that a parser regression cannot make the test vacuous (the core had
    // 343 public functions and methods when this test was written).
    assert!(items.len() > 300, "only {} items found", items.len());
    let has_call = |needle: &str| -> bool {
        // A free-function needle must not be the tail of a longer identifier.
        fuzz_text.match_indices(needle).any(|(i, _)| {
            needle.starts_with('<')
                || needle.contains("::")
                || !fuzz_text[..i]
                    .chars()
                    .next_back()
                    .is_some_and(|c| c.is_alphanumeric() || c == '_')
        })
    };
    let missing: Vec<&String> = items
        .iter()
        .filter(|(_, needles)| {
            // Trait methods need the qualified path with the method name on one line.
            if needles[0].starts_with('<') {
                let qualified = &needles[0];
                let tail = qualified.split_once(" as ").map(|x| x.1).unwrap_or("");
                let ty = qualified
                    .trim_start_matches('<')
                    .split(' ')
                    .next()
                    .unwrap_or("");
                !fuzz_text.lines().any(|l| {
                    l.contains(qualified.as_str())
                        || (l.contains(&format!("<{ty}<")) && l.contains(&format!(" as {tail}")))
                })
            } else {
                !needles.iter().any(|n| has_call(n))
            }
        })
        .map(|(name, _)| name)
        .collect();
    eprintln!(
        "fuzz inventory: {} public functions and methods",
        items.len()
    );
    assert!(
        missing.is_empty(),
        "{} public functions are not called by any tests/fuzz_*.rs:\n{}",
        missing.len(),
        missing
            .iter()
            .map(|s| s.as_str())
            .collect::<Vec<_>>()
            .join("\n")
    );
}
