//! Every warning kind: one instrument that fires it and one that does not.
//!
//! Figures in the comments are DERIVED from T = μ(2Lf)² (REFERENCES §1.2) with the shipped
//! plain steel catalog (0.007–0.026 in) and the density 7850 kg/m³ (§2).

use taut::instrument::Instrument;
use taut::plan::solve::{self, SolveOptions};
use taut::plan::warning::{Severity, WarningKind};
use taut::plan::Plan;
use taut::strings::stock::Stock;

fn plan(courses: &str, extra: &str) -> Plan {
    let text = format!(
        "name: probe\ntuning: 12edo\nscale_length: 648mm\n{extra}defaults:\n  kinds: [plain-steel]\n  tension: 72N\ncourses:\n{courses}"
    );
    let instrument = Instrument::from_text(text, "probe.yaml").unwrap();
    solve::plan(
        &instrument,
        Stock::builtin().unwrap(),
        &SolveOptions::default(),
    )
    .unwrap()
}

fn kinds(plan: &Plan) -> Vec<WarningKind> {
    plan.warnings.iter().map(|warning| warning.kind).collect()
}

const E4: &str = "  - pitch: E4\n";

#[test]
fn a_usual_string_raises_nothing() {
    let plan = plan(E4, "rated_load: 500N\n");
    assert!(plan.warnings.is_empty(), "{:?}", plan.warnings);
    assert!(!plan.needs_safety_cautions());
}

#[test]
fn stress_danger_above_the_breaking_region() {
    // A4 on 648 mm: σ = 7850·(2·0.648·440)² = 2.56 GPa, about 96 % of A228's 2.67 GPa.
    let plan = plan("  - pitch: A4\n", "");
    assert!(kinds(&plan).contains(&WarningKind::StressDanger));
    let warning = &plan.warnings[0];
    assert_eq!(warning.severity, Severity::Danger);
    assert_eq!(warning.course, Some(1));
    assert!(
        warning.message.contains("breaking strength"),
        "{}",
        warning.message
    );
    assert!(warning.value > 0.85 && warning.limit == 0.85);
    assert!(plan.needs_safety_cautions());
    assert!(!kinds(&self::plan(E4, "")).contains(&WarningKind::StressDanger));
}

#[test]
fn stress_caution_between_the_limits() {
    // F#4 on 648 mm: σ = 7850·(2·0.648·369.99)² = 1.81 GPa, 0.66–0.70 of A228's strength
    // for 0.009–0.012 in: above the 65 % caution, below the 85 % danger.
    let plan = plan("  - pitch: F#4\n", "");
    assert_eq!(kinds(&plan), [WarningKind::StressCaution]);
    assert_eq!(plan.warnings[0].severity, Severity::Caution);
    assert!(!kinds(&self::plan(E4, "")).contains(&WarningKind::StressCaution));
}

#[test]
fn stress_limits_can_be_set_per_instrument() {
    let strict = plan(E4, "stress_limits: {caution: 50%, danger: 90%}\n");
    assert_eq!(kinds(&strict), [WarningKind::StressCaution]);
    assert_eq!(strict.caution_stress_ratio, 0.5);
}

#[test]
fn thinner_than_practical() {
    // 20 N at E4 asks for μ = 20/182 498 = 0.110 g/m; the thinnest (0.007 in) weighs 0.195 g/m.
    let light = plan("  - pitch: E4\n    tension: 20N\n", "");
    assert!(kinds(&light).contains(&WarningKind::ThinnerThanPractical));
    assert!(!kinds(&plan(E4, "")).contains(&WarningKind::ThinnerThanPractical));
}

#[test]
fn thicker_than_catalog() {
    // 72 N at E2 asks for μ = 72/(2·0.648·82.407)² = 6.31 g/m; 0.026 in weighs 2.69 g/m.
    let heavy = plan("  - pitch: E2\n", "");
    assert!(kinds(&heavy).contains(&WarningKind::ThickerThanCatalog));
    assert!(!kinds(&plan(E4, "")).contains(&WarningKind::ThickerThanCatalog));
}

#[test]
fn wider_than_slot() {
    // No plain steel gauge is as thin as 0.1 mm (the thinnest is 0.007 in = 0.178 mm).
    let narrow = plan("  - pitch: E4\n    max_diameter: 0.1mm\n", "");
    let found = kinds(&narrow);
    assert!(found.contains(&WarningKind::WiderThanSlot), "{found:?}");
    assert!(
        !kinds(&plan("  - pitch: E4\n    max_diameter: 0.3mm\n", ""))
            .contains(&WarningKind::WiderThanSlot)
    );
}

#[test]
fn tension_below_window() {
    // At E2 even the heaviest plain string (0.026 in) carries only 2.69e-3·11 405 = 30.7 N.
    let slack = plan("  - pitch: E2\n    tension: {min: 60N, max: 100N}\n", "");
    assert!(kinds(&slack).contains(&WarningKind::TensionBelowWindow));
    let fine = plan("  - pitch: E4\n    tension: {min: 60N, max: 100N}\n", "");
    assert!(fine.warnings.is_empty(), "{:?}", fine.warnings);
}

#[test]
fn tension_above_window() {
    // At E4 even the thinnest plain string (0.007 in) carries 1.95e-4·182 498 = 35.6 N.
    let tight = plan("  - pitch: E4\n    tension: {min: 10N, max: 30N}\n", "");
    assert!(kinds(&tight).contains(&WarningKind::TensionAboveWindow));
    let fine = plan("  - pitch: E4\n    tension: {min: 40N, max: 100N}\n", "");
    assert!(!kinds(&fine).contains(&WarningKind::TensionAboveWindow));
}

#[test]
fn off_target() {
    let far = plan("  - pitch: E2\n", "");
    let warning = far
        .warnings
        .iter()
        .find(|warning| warning.kind == WarningKind::OffTarget)
        .unwrap();
    assert!(warning.message.contains("72.0 N"), "{}", warning.message);
    assert!(!kinds(&plan(E4, "")).contains(&WarningKind::OffTarget));
    // A looser tolerance accepts what a tight one refuses: for 69 N the neighbouring steps give
    // 65.5 N (0.0095 in, −5.1 %) and 72.6 N (0.010 in, +5.2 %).
    let course = "  - pitch: E4\n    tension: 69N\n";
    assert!(kinds(&plan(course, "tolerance: 5%\n")).contains(&WarningKind::OffTarget));
    assert!(!kinds(&plan(course, "tolerance: 10%\n")).contains(&WarningKind::OffTarget));
}

#[test]
fn over_rated_load() {
    let two = "  - pitch: E4\n  - pitch: E4\n";
    let over = plan(two, "rated_load: 100N\n");
    let warning = over.warnings.last().unwrap();
    assert_eq!(warning.kind, WarningKind::OverRatedLoad);
    assert_eq!(warning.course, None);
    assert_eq!(warning.severity, Severity::Danger);
    assert!(warning.message.contains("100 N"), "{}", warning.message);
    assert!(plan(two, "rated_load: 200N\n").warnings.is_empty());
    assert!(plan(two, "").warnings.is_empty());
}

#[test]
fn thick_monofilament() {
    // Plain nylon (1140 kg/m³, REFERENCES §2.2) at C2 on 1.3 m for 150 N needs
    // d = √(4μ/(πρ)) with μ = 150/(2·1.3·65.41)² = 5.19 g/m: 2.41 mm, over the 2.0 mm at which
    // plain nylon strings stop in common practice. At D3 on 0.68 m for 120 N it needs 1.83 mm.
    let course = |pitch: &str, length: &str, tension: &str| {
        format!("  - pitch: {pitch}\n    scale_length: {length}\n    kinds: [nylon]\n    tension: {tension}\n")
    };
    let thick = plan(&course("C2", "1300mm", "150N"), "");
    let warning = thick
        .warnings
        .iter()
        .find(|warning| warning.kind == WarningKind::ThickMonofilament)
        .unwrap();
    assert_eq!(warning.severity, Severity::Note);
    assert!(warning.value > 0.002 && warning.limit == 0.002);
    assert!(
        warning.message.contains("plain nylon"),
        "{}",
        warning.message
    );
    let usual = plan(&course("D3", "680mm", "120N"), "");
    assert!(!kinds(&usual).contains(&WarningKind::ThickMonofilament));
}

#[test]
fn every_kind_is_covered_above() {
    // Keeps this file honest when a kind is added: each must get its own pair of tests here.
    assert_eq!(WarningKind::ALL.len(), 10);
}
