//! Checking one string entry as written, so each mistake names its key.

#[allow(unused_imports)]
use super::*;

/// A refusal and the key it concerns.
pub(crate) type Refusal = (Error, &'static str);

/// The checks that need no stock: one way of naming the string, the keys each way takes, a core
/// thinner than the string. Run while reading, where the line is still known.
pub(crate) fn check_form(entry: &StringEntryFile) -> std::result::Result<(), Refusal> {
    let ways = [
        entry.kind.is_some(),
        entry.unit_mass.is_some(),
        entry.mass.is_some() || entry.length.is_some(),
    ]
    .iter()
    .filter(|&&given| given)
    .count();
    if ways != 1 {
        let key = if entry.kind.is_some() {
            "kind"
        } else if entry.unit_mass.is_some() {
            "unit_mass"
        } else {
            "diameter"
        };
        return Err((
            Error::input(if ways == 0 {
                "the string says neither its kind nor its linear density"
            } else {
                "give one of `kind`, `unit_mass`, or `mass` with `length`, not several"
            })
            .help("write e.g. `{kind: plain-steel, diameter: 0.012in}`, `{unit_mass: 6.2g/m}` or `{mass: 1.4g, length: 900mm}`"),
            key,
        ));
    }
    let diameter = entry.diameter.map(|d| d.0.si());
    let core_diameter = entry.core_diameter.map(|d| d.0.si());
    if let Some(kind) = &entry.kind {
        if entry.material.is_some() {
            return Err((
                Error::input("a string given by `kind` takes its materials from the kind")
                    .help("leave out `material`"),
                "material",
            ));
        }
        let diameter = diameter.ok_or((
            Error::input(format!("the `{}` string has no `diameter`", kind.trim()))
                .help("write its outer diameter, e.g. `diameter: 0.012in`"),
            "kind",
        ))?;
        if let Some(core) = core_diameter {
            if core < diameter && !crate::input::units::CORE_RATIO_BOUNDS.contains(core / diameter)
            {
                return Err((
                    Error::input(format!(
                        "a core of {:.3} mm in a string of {:.3} mm is a core-to-outer ratio of {}, outside the range taut accepts: {}",
                        core * 1000.0,
                        diameter * 1000.0,
                        crate::input::units::short_number(core / diameter),
                        crate::input::units::CORE_RATIO_BOUNDS.shown
                    )),
                    "core_diameter",
                ));
            }
            if core >= diameter {
                return Err((
                    Error::input(format!(
                        "the core ({:.3} mm) must be thinner than the whole string ({:.3} mm)",
                        core * 1000.0,
                        diameter * 1000.0
                    )),
                    "core_diameter",
                ));
            }
        }
        return Ok(());
    }
    if core_diameter.is_some() {
        return Err((
            Error::input("`core_diameter` belongs to strings given by a wound `kind`"),
            "core_diameter",
        ));
    }
    match (entry.unit_mass, entry.mass, entry.length) {
        (Some(_), _, _) | (None, Some(_), Some(_)) => Ok(()),
        (None, Some(_), None) => Err((
            Error::input("a weighed string needs the `length` that was weighed")
                .help("write e.g. `{mass: 1.4g, length: 900mm}`"),
            "mass",
        )),
        _ => Err((
            Error::input("a weighed string needs its `mass`")
                .help("write e.g. `{mass: 1.4g, length: 900mm}`"),
            "length",
        )),
    }
}

/// The checks of [`check_form`] for a string an instrument file fixes on a course, which the
/// plan reports like a chosen one: it needs its diameter (for the slot check and the table) and,
/// when given by its linear density, the `material` that carries the load (for its stress).
pub(crate) fn check_fixed(entry: &StringEntryFile) -> std::result::Result<(), Refusal> {
    check_form(entry)?;
    if entry.diameter.is_none() {
        return Err((
            Error::input("a fixed string needs its outer `diameter`")
                .help("add e.g. `diameter: 0.80mm`, so the slot check and the table can use it"),
            if entry.kind.is_some() {
                "kind"
            } else {
                "unit_mass"
            },
        ));
    }
    if entry.kind.is_none() && entry.material.is_none() {
        return Err((
            Error::input("a fixed string given by its linear density needs the `material` that carries the load")
                .help("add e.g. `material: music-wire` or `material: nylon`, so its stress can be checked"),
            if entry.unit_mass.is_some() { "unit_mass" } else { "mass" },
        ));
    }
    Ok(())
}

/// Checks one string entry against the kinds and materials in stock; on failure returns the
/// error and the key it concerns.
pub(crate) fn check_entry(
    entry: StringEntryFile,
    kinds: &StringKinds,
    materials: &Materials,
) -> std::result::Result<SetString, Refusal> {
    check_form(&entry)?;
    let diameter = entry.diameter.map(|d| d.0.si());
    let core_diameter = entry.core_diameter.map(|d| d.0.si());
    let material = match entry.material {
        Some(id) => {
            let found = materials.get(id.trim()).map_err(|err| (err, "material"))?;
            if found.breaking_strength.is_none() {
                return Err((
                    Error::input(format!(
                        "material `{}` has no breaking strength, so it cannot be the load-bearing material",
                        found.id.as_str()
                    ))
                    .help("name the material of the core (or of the whole string)"),
                    "material",
                ));
            }
            Some(found.id.as_str().to_string())
        }
        None => None,
    };
    if let (Some(kind_id), Some(diameter)) = (entry.kind, diameter) {
        let kind = kinds.get(kind_id.trim()).map_err(|err| (err, "kind"))?;
        if core_diameter.is_some() && !matches!(kind.build, KindBuild::Wound { .. }) {
            return Err((
                Error::input(format!(
                    "`{}` is a plain kind; only wound strings have a core",
                    kind.id.as_str()
                )),
                "core_diameter",
            ));
        }
        return Ok(SetString::Kind {
            kind: kind.id.as_str().to_string(),
            diameter,
            core_diameter,
        });
    }
    if let Some(unit_mass) = entry.unit_mass {
        crate::input::units::check_measured_string(unit_mass.0.si(), diameter)
            .map_err(|err| (err, "unit_mass"))?;
        return Ok(SetString::Measured {
            unit_mass: unit_mass.0.si(),
            diameter,
            material,
            weighed: None,
        });
    }
    match (entry.mass, entry.length) {
        (Some(mass), Some(length)) => {
            let measured = Measured::from_weighing(mass.0.si(), length.0.si(), None, None);
            crate::input::units::check_measured_string(measured.unit_mass, diameter)
                .map_err(|err| (err, "mass"))?;
            Ok(SetString::Measured {
                unit_mass: measured.unit_mass,
                diameter,
                material,
                weighed: Some((mass.0.si(), length.0.si())),
            })
        }
        // `check_form` has refused every other combination.
        _ => Err((
            Error::input("a weighed string needs its `mass` and the `length` that was weighed"),
            "mass",
        )),
    }
}
