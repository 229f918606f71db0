//! The JavaScript facade builds the statement of a GUM method from the method's codes
//! (`src/wasm/js/uncertainty_results.js`, `PROPAGATION_TEXT` + `COVERAGE_TEXT`) instead of
//! asking the module for it: this checks that every combination reads exactly as the core's
//! `GumMethod::describe`.

use quantaband::thermometry::gum::{CoverageMethod, GumMethod, Propagation};

/// The string literals of the JavaScript array `const NAME = [ … ];` in `src`.
fn js_strings(src: &str, name: &str) -> Vec<String> {
    let start = src
        .find(&format!("const {name} = ["))
        .unwrap_or_else(|| panic!("{name} not found"));
    let body = &src[start..];
    let body = &body[body.find('[').unwrap() + 1..body.find("];").unwrap()];
    body.lines()
        .map(str::trim)
        .filter(|l| !l.is_empty())
        .map(|l| {
            let l = l.trim_end_matches(',');
            let q = l.chars().next().unwrap();
            assert!(
                q == '\'' || q == '"',
                "{name}: not a plain string literal: {l}"
            );
            assert!(l.ends_with(q), "{name}: not a plain string literal: {l}");
            l[1..l.len() - 1].to_string()
        })
        .collect()
}

#[test]
fn facade_statements_match_the_core() {
    let src = std::fs::read_to_string(concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/src/wasm/js/uncertainty_results.js"
    ))
    .unwrap();
    let propagation = js_strings(&src, "PROPAGATION_TEXT");
    let coverage = js_strings(&src, "COVERAGE_TEXT");
    assert_eq!((propagation.len(), coverage.len()), (2, 3));
    // Codes as the module writes them (src/wasm/uncertainty.rs, push_gum).
    let props = [
        Propagation::FirstOrderUncorrelated,
        Propagation::FirstOrderCorrelated,
    ];
    let covs = [
        CoverageMethod::StudentT,
        CoverageMethod::Normal,
        CoverageMethod::StatedFactor,
    ];
    for (p, &propagation_kind) in props.iter().enumerate() {
        assert_eq!(propagation_kind as u8 as usize, p);
        for (c, &coverage_kind) in covs.iter().enumerate() {
            assert_eq!(coverage_kind as u8 as usize, c);
            let m = GumMethod {
                propagation: propagation_kind,
                coverage: coverage_kind,
                degrees_of_freedom_used: None,
            };
            assert_eq!(
                format!("{}{}", propagation[p], coverage[c]),
                m.describe(),
                "propagation {p}, coverage {c}"
            );
        }
    }
}
