//! A string the instrument file names outright (`string:` on a course or one of its strings):
//! checked at its pitch and length like an installed string, reported like a chosen one, with
//! its real warnings (stress, window, slot) and none about catalogs or targets, since nothing
//! was chosen.

use super::*;
use crate::instrument::entry::check_entry;
use crate::strings::construction::Construction;
use crate::strings::{feel, physics};

impl CourseContext<'_> {
    /// Where the fixed string of the course's string at `string_index` is written.
    fn fixed_path(&self, string_index: usize) -> Vec<PathStep<'static>> {
        let mut path = vec![PathStep::Key("courses"), PathStep::Index(self.course.index)];
        let own = self
            .course
            .strings
            .get(string_index)
            .is_some_and(|string| string.string.is_some());
        if own {
            path.extend([PathStep::Key("strings"), PathStep::Index(string_index)]);
        }
        path.push(PathStep::Key("string"));
        path
    }

    /// Checks the fixed string `entry` on `request`'s pitch and length and reports it; its
    /// warnings go to `warnings`. The caller fills in the interval.
    pub(super) fn fixed(
        &self,
        entry: &crate::instrument::StringEntryFile,
        string_index: usize,
        request: &Request,
        at: StringRef,
        warnings: &mut Vec<Warning>,
    ) -> Result<StringPlan> {
        let (kinds, materials) = (self.stock.kinds(), self.stock.materials());
        let path = self.fixed_path(string_index);
        let written = check_entry(entry.clone(), kinds, materials).map_err(|(err, key)| {
            let mut at_key = path.clone();
            at_key.push(PathStep::Key(key));
            self.instrument.point(err, &at_key)
        })?;
        let resolved = written
            .resolve(kinds, materials)
            .map_err(|err| self.instrument.point(err, &path))?;
        let construction = resolved.construction;
        let evaluation = select::evaluate(
            &construction,
            request.frequency,
            request.length,
            &request.checks,
        );
        let (Some(stress_ratio), Some(break_pitch_hz), Some(diameter)) = (
            evaluation.stress_ratio,
            evaluation.break_frequency,
            written.diameter(),
        ) else {
            return Err(self.instrument.point(
                Error::input(format!(
                    "course {}: the strength of the fixed string is unknown, so its stress cannot be checked",
                    self.course.number
                ))
                .help("name a kind whose material is known, or give `material`"),
                &path,
            ));
        };
        let limits = request.checks.limits;
        if evaluation.warnings.contains(Warnings::STRESS_DANGER) {
            warnings.push(at.stress(
                WarningKind::StressDanger,
                stress_ratio,
                limits.danger,
                break_pitch_hz,
                request.frequency,
            ));
        } else if evaluation.warnings.contains(Warnings::STRESS_CAUTION) {
            warnings.push(at.stress(
                WarningKind::StressCaution,
                stress_ratio,
                limits.caution,
                break_pitch_hz,
                request.frequency,
            ));
        }
        if let Some(widest) = request.checks.widest.filter(|&w| diameter > w) {
            warnings.push(at.wider_than_slot(diameter, widest));
        }
        if let Some(window) = at.outside_window(
            evaluation.tension,
            request.checks.min_tension,
            request.checks.max_tension,
        ) {
            warnings.push(window);
        }
        let (construction_name, material) = match (resolved.kind, &construction) {
            (Some(kind), _) => construction_words(kind),
            (None, Construction::Measured(measured)) => (
                "measured",
                measured
                    .material
                    .map_or_else(|| "unknown".to_string(), |m| m.id.as_str().to_string()),
            ),
            (None, _) => ("measured", "unknown".to_string()),
        };
        Ok(StringPlan {
            interval: String::new(),
            pitch_hz: request.frequency,
            target_tension_n: request.target_tension,
            required_unit_mass_kg_per_m: physics::unit_mass_for_tension(
                request.target_tension,
                request.length,
                request.frequency,
            ),
            choice: StringChoice {
                kind: written.label().into(),
                construction: construction_name.into(),
                material: material.into(),
                gauge: gauge_label(diameter).into(),
                diameter_mm: diameter * 1000.0,
                diameter_in: diameter / METRES_PER_INCH,
                unit_mass_kg_per_m: evaluation.unit_mass,
                tension_n: evaluation.tension,
                stress_ratio,
                break_pitch_hz,
                inharmonicity: construction.inharmonicity(evaluation.tension, request.length),
                standing: crate::plan::Standing::Fixed,
                flags: crate::plan::StringFlags::new(evaluation.warnings, false),
            },
            alternatives: Alternatives::default(),
            feel: Some(feel::feel(
                &construction,
                evaluation.tension,
                request.length,
                &feel::FeelOptions::default(),
            )),
            fixed: Some(written),
        })
    }
}
