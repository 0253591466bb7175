//! What would fix each warning, from the physics, as one sentence a report appends to the
//! warning's message.
//!
//! Kept apart from the wording of the warnings themselves (`warning.rs`), so severities and
//! messages can change without touching the advice.
//!
//! The physics behind the advice: a string's tension is T = μ(2Lf)² (Mersenne's laws; OpenStax
//! *University Physics* Vol. 1 §16.3), so a heavier string (μ up) or a shorter length at the
//! same pitch changes the tension; the stress in a plain string is T/A = ρ(2Lf)², which holds no
//! diameter, so its breaking pitch f = √(σ_break/ρ)/(2L) depends only on length and material
//! (see `crate::strings::physics`).

use crate::plan::warning::{Warning, WarningKind, NONE_HEAVY_ENOUGH, NONE_LIGHT_ENOUGH};

/// How the string a warning is about is built, as far as the report knows.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Build {
    /// One solid wire or filament.
    Plain,
    /// A core with wraps.
    Wound,
    /// Not known (a measured string, or a warning about the whole instrument).
    Unknown,
}

/// What the command solves for, which decides what a fix can change.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Solving {
    /// Strings for given pitches and lengths (`plan`, `audit`, `convert`): the length is fixed,
    /// so a plain string's stress ρ(2Lf)² holds no gauge.
    Strings,
    /// Lengths for given strings and tensions (`lengths`): the tension is fixed, so the stress
    /// T/A falls with a heavier gauge (whose solved length L = √(T/μ)/(2f) is then shorter),
    /// and the strings chosen do not change the total load.
    Lengths,
}

/// The fix for a warning: one sentence, or `None` when there is no advice to give.
pub fn remedy(kind: WarningKind, value: f64, build: Build) -> Option<&'static str> {
    remedy_in(Solving::Strings, kind, value, build)
}

/// The fix for a warning, for a command that solves for `solving`.
pub fn remedy_in(
    solving: Solving,
    kind: WarningKind,
    value: f64,
    build: Build,
) -> Option<&'static str> {
    if solving == Solving::Lengths {
        if let Some(text) = lengths_remedy(kind, build) {
            return Some(text);
        }
    }
    let text = match (kind, build) {
        (WarningKind::StressDanger | WarningKind::StressCaution, Build::Wound) => {
            "Fix: a wound string with a thicker core, a shorter length or a stronger core material lowers the stress."
        }
        (WarningKind::StressDanger | WarningKind::StressCaution, _) if value >= 1.0 => {
            "Fix: no gauge helps, since a plain string's breaking pitch depends only on its length and material; a shorter length, a stronger material or a wound string does."
        }
        (WarningKind::StressDanger | WarningKind::StressCaution, _) => {
            "Fix: no plain gauge helps, since a plain string's stress depends only on its length, pitch and material; a shorter length, a stronger material or a wound string lowers it."
        }
        (WarningKind::ThinnerThanPractical, _) => {
            "Fix: a shorter length, a lighter material or a kind with thinner gauges lets a string land on target."
        }
        (WarningKind::ThickerThanCatalog, Build::Wound) => {
            "Fix: heavier gauges of this kind (add them with --stock), a heavier kind (a denser wrap or more wrap layers), a longer length or a lower target lets the string reach it."
        }
        (WarningKind::ThickerThanCatalog, _) => {
            "Fix: a wound kind (more mass for its width) or a longer length lets a catalog string reach the target."
        }
        (WarningKind::WiderThanSlot, Build::Wound) => {
            "Fix: a denser wound kind (a denser wrap or more wrap layers) or less tension needs a narrower string; else the slot must be widened."
        }
        (WarningKind::WiderThanSlot, _) => {
            "Fix: a denser kind (a wound one) or less tension needs a narrower string; else the slot must be widened."
        }
        (WarningKind::TensionBelowWindow, Build::Wound) => {
            "Fix: a heavier gauge or a heavier wound kind (a denser wrap or more wrap layers) brings the tension up into the window."
        }
        (WarningKind::TensionBelowWindow, _) => {
            "Fix: a heavier gauge or a wound kind brings the tension up into the window."
        }
        (WarningKind::TensionAboveWindow, _) => {
            "Fix: a lighter gauge or a lighter kind brings the tension down into the window."
        }
        (WarningKind::OffTarget, _) => {
            "Fix: allow another kind, add the gauges in between with --stock, or widen the tolerance."
        }
        (WarningKind::ThickMonofilament, _) => {
            "Fix: a wound kind gives the mass on a thinner, brighter string (for harp basses, a wound nylon-core or steel-core kind)."
        }
        (WarningKind::OverRatedLoad, _) => {
            "Fix: lower the tension targets or use lighter strings; only the maker can raise the rating."
        }
        // Kinds added later get their advice here; until then they carry none.
        #[allow(unreachable_patterns)]
        _ => return None,
    };
    Some(text)
}

/// The fixes that differ while lengths are solved: at a fixed tension σ = T/A, so a heavier
/// gauge lowers the stress (and, being heavier, gets a shorter length); the total load is the
/// sum of the tensions asked for, whatever the strings.
fn lengths_remedy(kind: WarningKind, build: Build) -> Option<&'static str> {
    let text = match (kind, build) {
        (WarningKind::StressDanger | WarningKind::StressCaution, Build::Wound) => {
            "Fix: at this tension a heavier gauge (with its thicker core) or a stronger core material lowers the stress, and the heavier string gets a shorter length; so does less tension."
        }
        (WarningKind::StressDanger | WarningKind::StressCaution, Build::Plain) => {
            "Fix: at this tension a heavier gauge lowers the stress (σ = T/A) and gets a shorter length; so do less tension or a stronger material."
        }
        (WarningKind::StressDanger | WarningKind::StressCaution, Build::Unknown) => {
            "Fix: less tension, or a string with more load-bearing section (a heavier gauge, which gets a shorter length), lowers the stress."
        }
        (WarningKind::OverRatedLoad, _) => {
            "Fix: lower the tensions asked for (the layout's `tension` or --tension): the lengths follow the strings, the load does not; only the maker can raise the rating."
        }
        _ => return None,
    };
    Some(text)
}

/// The fix for a window warning whose string is already the heaviest (or lightest) gauge of
/// its kind: another gauge of the kind cannot be the fix.
fn catalog_end_remedy(warning: &Warning, build: Build) -> Option<&'static str> {
    let text = match (warning.kind, build) {
        (WarningKind::TensionBelowWindow, Build::Wound)
            if warning.message.ends_with(NONE_HEAVY_ENOUGH) =>
        {
            "Fix: heavier gauges of this kind (add them with --stock), a heavier wound kind (a denser wrap or more wrap layers) or a longer length brings the tension up into the window."
        }
        (WarningKind::TensionBelowWindow, _) if warning.message.ends_with(NONE_HEAVY_ENOUGH) => {
            "Fix: a wound kind (more mass for its width), heavier gauges added with --stock or a longer length brings the tension up into the window."
        }
        (WarningKind::TensionAboveWindow, _) if warning.message.ends_with(NONE_LIGHT_ENOUGH) => {
            "Fix: a lighter kind, thinner gauges added with --stock or a shorter length brings the tension down into the window."
        }
        _ => return None,
    };
    Some(text)
}

/// Appends the fix to each warning's message (once: a message that already ends with it is
/// left alone). `build_of` tells how the string a warning is about is built.
pub fn attach(warnings: &mut [Warning], build_of: impl Fn(&Warning) -> Build) {
    attach_in(Solving::Strings, warnings, build_of);
}

/// [`attach`], for a command that solves for `solving`.
pub fn attach_in(solving: Solving, warnings: &mut [Warning], build_of: impl Fn(&Warning) -> Build) {
    for warning in warnings {
        let fix = catalog_end_remedy(warning, build_of(warning))
            .or_else(|| remedy_in(solving, warning.kind, warning.value, build_of(warning)));
        if let Some(fix) = fix {
            if !warning.message.ends_with(fix) {
                warning.message.push(' ');
                warning.message.push_str(fix);
            }
        }
    }
}

/// [`attach`] over every list of `lists` (each course's warnings, then the report's own), the
/// build of each string looked up in `builds` by (course, string number); a string not listed
/// is [`Build::Unknown`].
pub fn attach_by_string<'w>(
    lists: impl IntoIterator<Item = &'w mut Vec<Warning>>,
    builds: &[(u32, usize, Build)],
) {
    // Sorted once so each warning finds its string by binary search: a 200-course plan has
    // hundreds of warnings, and a scan per warning made this step quadratic. The stable sort
    // keeps the first of any repeated (course, string) first, as a scan would find it.
    let mut sorted = builds.to_vec();
    sorted.sort_by_key(|&(course, string, _)| (course, string));
    let build_of = |warning: &Warning| {
        let (Some(course), Some(string)) = (warning.course, warning.string) else {
            return Build::Unknown;
        };
        let first = sorted.partition_point(|&(c, s, _)| (c, s) < (course, string));
        sorted
            .get(first)
            .filter(|&&(c, s, _)| (c, s) == (course, string))
            .map_or(Build::Unknown, |&(_, _, build)| build)
    };
    for list in lists {
        attach(list, build_of);
    }
}

/// Ends every warning of `plan` with what would fix it, each string's build read from its
/// chosen construction. The one place a plan's fixes are attached, so the command line and the
/// explorer page show the same sentences.
pub fn attach_to_plan(plan: &mut crate::plan::Plan) {
    let builds: Vec<(u32, usize, Build)> = plan
        .courses
        .iter()
        .flat_map(|course| {
            course.strings.iter().enumerate().map(|(index, string)| {
                let build = match &*string.choice.construction {
                    "plain" => Build::Plain,
                    "wound" => Build::Wound,
                    _ => Build::Unknown,
                };
                (course.course, index + 1, build)
            })
        })
        .collect();
    attach_by_string(
        plan.courses
            .iter_mut()
            .map(|course| &mut course.warnings)
            .chain(std::iter::once(&mut plan.warnings)),
        &builds,
    );
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_kind_has_a_fix_and_plain_strings_are_told_no_gauge_helps() {
        for kind in WarningKind::ALL {
            assert!(remedy(kind, 0.5, Build::Unknown).is_some(), "{kind:?}");
        }
        let plain = remedy(WarningKind::StressDanger, 1.2, Build::Plain).unwrap();
        assert!(plain.contains("no gauge helps") && plain.contains("shorter length"));
        let wound = remedy(WarningKind::StressDanger, 1.2, Build::Wound).unwrap();
        assert!(wound.contains("thicker core"));
        let slack = remedy(WarningKind::TensionBelowWindow, 30.0, Build::Plain).unwrap();
        assert!(slack.contains("heavier gauge") && slack.contains("wound"));
    }

    #[test]
    fn each_warning_gets_the_fix_for_its_own_string_whatever_the_order_of_builds() {
        use crate::plan::warning::StringRef;
        let danger = |course, string| {
            StringRef { course, string }.stress(WarningKind::StressDanger, 1.2, 0.85, 90.0, 100.0)
        };
        let mut warnings = vec![danger(1, 1), danger(2, 1), danger(3, 1)];
        // Course 3 has no build listed: its fix is the one for a string of unknown build.
        let builds = [(2, 1, Build::Wound), (1, 1, Build::Plain)];
        attach_by_string([&mut warnings], &builds);
        let fix = |build| remedy(WarningKind::StressDanger, 1.2, build).unwrap();
        assert!(warnings[0].message.ends_with(fix(Build::Plain)));
        assert!(warnings[1].message.ends_with(fix(Build::Wound)));
        assert!(warnings[2].message.ends_with(fix(Build::Unknown)));
        assert_ne!(fix(Build::Plain), fix(Build::Wound));
    }
}
