//! The words a plan repeats for every string of a kind or gauge (the kind's id, construction and
//! materials, the gauge's label), written once per solve and shared by the strings that use
//! them, so describing a string allocates nothing once its kind and gauge have been seen.

use std::cell::RefCell;
use std::sync::Arc;

#[allow(unused_imports)]
use super::*;
use crate::plan::StringFlags;

/// The words of each kind and gauge met so far in one solve.
#[derive(Default)]
pub(crate) struct PlanWords {
    /// Each kind met, by its address in the stock, with its words.
    kinds: RefCell<Vec<(usize, KindWords)>>,
}

/// One kind's words, and the labels of those of its gauges met so far.
struct KindWords {
    id: Arc<str>,
    construction: Arc<str>,
    material: Arc<str>,
    /// By gauge index: the diameter's bits and its label.
    gauges: Vec<Option<(u64, Arc<str>)>>,
}

impl PlanWords {
    /// The plan's description of one evaluated gauge of `kind`.
    pub(crate) fn describe(
        &self,
        kind: &StringKind,
        choice: &Choice,
        request: &Request,
    ) -> StringChoice {
        let (id, construction, material, gauge) = self.words(kind, choice.gauge, choice.diameter);
        StringChoice {
            kind: id,
            construction,
            material,
            gauge,
            diameter_mm: choice.diameter * 1000.0,
            diameter_in: choice.diameter / METRES_PER_INCH,
            unit_mass_kg_per_m: choice.unit_mass,
            tension_n: choice.tension,
            stress_ratio: choice.stress_ratio,
            break_pitch_hz: choice.break_frequency,
            inharmonicity: kind
                .construction(choice.diameter)
                .inharmonicity(choice.tension, request.length),
            standing: select::standing(choice, request.tolerance).into(),
            flags: StringFlags::new(
                choice.warnings,
                choice.tension_error.abs() > request.tolerance,
            ),
        }
    }

    /// The id, construction, materials and gauge label of gauge `gauge` (of `diameter`) of
    /// `kind`, written the first time they are asked for.
    fn words(
        &self,
        kind: &StringKind,
        gauge: usize,
        diameter: f64,
    ) -> (Arc<str>, Arc<str>, Arc<str>, Arc<str>) {
        let mut kinds = self.kinds.borrow_mut();
        let address = std::ptr::from_ref(kind) as usize;
        let position = match kinds.iter().position(|(at, _)| *at == address) {
            Some(position) => position,
            None => {
                let (construction, material) = construction_words(kind);
                kinds.push((
                    address,
                    KindWords {
                        id: Arc::from(kind.id.as_str()),
                        construction: Arc::from(construction),
                        material: Arc::from(material),
                        gauges: vec![None; kind.gauges().len()],
                    },
                ));
                kinds.len() - 1
            }
        };
        let words = &mut kinds[position].1;
        let bits = diameter.to_bits();
        let label = match words.gauges.get_mut(gauge) {
            Some(Some((seen, label))) if *seen == bits => label.clone(),
            Some(slot) => {
                let label: Arc<str> = Arc::from(gauge_label(diameter));
                *slot = Some((bits, label.clone()));
                label
            }
            // Not a catalog step (a measured string): written each time.
            None => Arc::from(gauge_label(diameter)),
        };
        (
            words.id.clone(),
            words.construction.clone(),
            words.material.clone(),
            label,
        )
    }
}
