//! Short tuning specs for the command line. The prefixes are the YAML layout keys:
//!
//! | spec | meaning |
//! |---|---|
//! | `19edo` | 19 equal divisions of the octave |
//! | `13ed3/1`, `88ed1950c` | equal divisions of any interval |
//! | `ratios:1/1,9/8,5/4,4/3,3/2,5/3,15/8` | exact ratios of one period, from 1/1 |
//! | `cents:0,200,400,500,700,900,1100` | cents of one period, from 0 |
//! | `hertz:98,110,123.47` | a fixed list of frequencies |
//! | `chain:3/2,6,5` | generator, steps up, steps down, reduced into the period |
//!
//! Equal divisions are also read in the spellings people use, and the report says so
//! ([`read_spelling`]): `17-edo`, `17 EDO`, `17tet`, `17-TET`, `17et` are 17 equal divisions of
//! the octave (`17edo`); `13edt` is 13 equal divisions of the tritave 3/1 (`13ed3`), `9edf` 9 of
//! the fifth 3/2 (`9ed3/2`). A bare whole number after `ed` is the harmonic N/1: `13ed3` is 13
//! equal divisions of 3/1, as in the usual `13ed3` for the tritave; 3 cents is written `13ed3c`.
//!
//! The list forms take a period after a second colon (`ratios:1/1,7/6,4/3:3/2`, default
//! `2/1`). Any spec may end in `@reference` (see [`super::reference`]), e.g. `31edo@A4=415`.

use super::interval::Interval;
use super::shape::Shape;
use super::{Reference, Tuning, MAX_DEGREES_PER_PERIOD};
use crate::error::{Error, Result};
use crate::tuning::pitch::{parse_finite, parse_ratio};

/// One-line summary of the inline grammar, for error help.
pub const INLINE_SYNTAX_HELP: &str = "inline tunings: `19edo`, `13ed3/1`, `ratios:1/1,9/8,5/4,...[:2/1]`, `cents:0,100,...[:1200c]`, `hertz:98,110,...`, `chain:3/2,6,5[:2/1]`, each optionally followed by `@A4=415`";

const LIST_PREFIXES: [&str; 4] = ["ratios:", "cents:", "hertz:", "chain:"];

/// Whether `spec` has the form of an inline tuning (it may still be malformed).
pub fn looks_inline(spec: &str) -> bool {
    let lower = spec.trim().to_ascii_lowercase();
    if LIST_PREFIXES.iter().any(|p| lower.starts_with(p)) {
        return true;
    }
    let unsigned = lower.trim_start_matches(['-', '+']);
    let digits = unsigned.bytes().take_while(u8::is_ascii_digit).count();
    digits > 0 && unsigned[digits..].starts_with("ed")
}

/// An equal division written in another common spelling, read into the inline form:
/// `(inline spec, note)`, where the note says what was read, e.g. ``read `17-TET` as 17edo``.
/// `None` when `spec` is no such spelling (the plain inline form `17edo` included).
///
/// Read: a whole number N, then optionally `-`, `_` or a space, then (any case) `edo`, `tet` or
/// `et` (N equal divisions of the octave), `edt` (of the tritave 3/1), `edf` (of the fifth 3/2),
/// or `ed` and an interval (`17-ed3/2`).
pub fn read_spelling(spec: &str) -> Option<(String, String)> {
    let trimmed = spec.trim();
    let digits = trimmed.bytes().take_while(u8::is_ascii_digit).count();
    if digits == 0 {
        return None;
    }
    let (count, rest) = trimmed.split_at(digits);
    let rest = rest
        .strip_prefix(['-', '_', ' '])
        .map_or(rest, str::trim_start);
    let lower = rest.to_ascii_lowercase();
    let inline = match lower.as_str() {
        "edo" | "tet" | "et" => format!("{count}edo"),
        "edt" => format!("{count}ed3"),
        "edf" => format!("{count}ed3/2"),
        _ => match lower.strip_prefix("ed") {
            Some(interval) if !interval.is_empty() => format!("{count}ed{interval}"),
            _ => return None,
        },
    };
    if inline == trimmed {
        return None;
    }
    Some((inline.clone(), format!("read `{trimmed}` as {inline}")))
}

/// A likely meant spelling for an inline spec that does not parse: the shipped tuning or the
/// `Nedo` nearest to it (e.g. `12edo` for `12edoo`).
pub fn suggestion(spec: &str) -> Option<String> {
    let trimmed = spec.trim();
    let digits = trimmed.bytes().take_while(u8::is_ascii_digit).count();
    let mut candidates: Vec<String> = super::library::names().map(str::to_string).collect();
    if digits > 0 {
        let count = &trimmed[..digits];
        candidates.push(format!("{count}edo"));
        candidates.push(format!("{count}ed3"));
    }
    crate::error::did_you_mean(
        &trimmed.to_ascii_lowercase(),
        candidates.iter().map(String::as_str),
    )
    .map(str::to_string)
}

/// Parses an inline tuning spec (without its `@reference`).
pub fn parse(spec: &str) -> Result<Tuning> {
    let origin = format!("tuning `{spec}`");
    let (shape, description) = parse_shape(spec.trim())
        .map_err(|e| e.in_origin(&origin).help(INLINE_SYNTAX_HELP.to_string()))?;
    let is_list_of_frequencies = matches!(shape, Shape::Hertz { .. });
    let layout = shape.into_layout().map_err(|e| e.in_origin(&origin))?;
    let reference = match &layout {
        super::Layout::Absolute { hz } if is_list_of_frequencies => Reference {
            degree: 0,
            hz: hz.first().copied().unwrap_or(1.0),
            concert_a4_hz: crate::tuning::pitch::ISO_16_A4_HZ,
        },
        _ => Reference::default(),
    };
    Tuning::new(spec.trim(), description, None, layout, reference).map_err(|e| e.in_origin(&origin))
}

fn parse_shape(spec: &str) -> Result<(Shape, String)> {
    let lower = spec.to_ascii_lowercase();
    if let Some((kind, rest)) = spec.split_once(':') {
        let kind = kind.to_ascii_lowercase();
        let (list, period_text) = match rest.split_once(':') {
            Some((list, period)) => (list, Some(period)),
            None => (rest, None),
        };
        let period = match period_text {
            Some(text) => Interval::parse(text).map_err(|e| e.field("period"))?,
            None => Interval::octave(),
        };
        let entries: Vec<&str> = list.split(',').map(str::trim).collect();
        if entries.len() > MAX_DEGREES_PER_PERIOD {
            return Err(Error::input(format!(
                "{} entries are too many: taut handles at most {MAX_DEGREES_PER_PERIOD}",
                entries.len()
            ))
            .field(kind));
        }
        return match kind.as_str() {
            "ratios" => {
                let ratios = entries
                    .iter()
                    .enumerate()
                    .map(|(i, e)| parse_ratio(e).map_err(|err| err.field(format!("ratios[{i}]"))))
                    .collect::<Result<Vec<_>>>()?;
                let description = format!("{} ratios repeating at {period}", ratios.len());
                Ok((Shape::Ratios { ratios, period }, description))
            }
            "cents" => {
                let cents = entries
                    .iter()
                    .enumerate()
                    .map(|(i, e)| {
                        parse_finite(e, "cents").map_err(|err| err.field(format!("cents[{i}]")))
                    })
                    .collect::<Result<Vec<_>>>()?;
                let description = format!("{} degrees in cents repeating at {period}", cents.len());
                Ok((Shape::Cents { cents, period }, description))
            }
            "hertz" => {
                if period_text.is_some() {
                    return Err(Error::input(
                        "a list of frequencies does not repeat, so it takes no period",
                    )
                    .field("period"));
                }
                let hz = entries
                    .iter()
                    .enumerate()
                    .map(|(i, e)| {
                        let lower = e.to_ascii_lowercase();
                        parse_finite(lower.strip_suffix("hz").unwrap_or(&lower), "hertz")
                            .map_err(|err| err.field(format!("hertz[{i}]")))
                    })
                    .collect::<Result<Vec<_>>>()?;
                let description = format!("{} fixed frequencies", hz.len());
                Ok((Shape::Hertz { hz }, description))
            }
            "chain" => {
                let [generator, up, down] = entries.as_slice() else {
                    return Err(Error::input(
                        "a chain is `chain:<generator>,<steps up>,<steps down>`, e.g. `chain:3/2,6,5`",
                    )
                    .field("chain"));
                };
                let generator =
                    Interval::parse(generator).map_err(|e| e.field("chain.generator"))?;
                let count = |text: &str, field: &str| -> Result<u64> {
                    text.parse::<u64>().map_err(|_| {
                        Error::input(format!(
                            "`{text}` is not a whole number of steps (0 or more)"
                        ))
                        .field(field)
                    })
                };
                let up = count(up, "chain.up")?;
                let down = count(down, "chain.down")?;
                let description =
                    format!("chain of {generator}, {up} up and {down} down, reduced into {period}");
                Ok((
                    Shape::Chain {
                        generator,
                        up,
                        down,
                        period,
                    },
                    description,
                ))
            }
            _ => Err(Error::input(format!(
                "`{kind}:` is not a kind of inline tuning"
            ))),
        };
    }
    let Some(at) = lower.find("ed") else {
        return Err(Error::input(format!("`{spec}` is not an inline tuning")));
    };
    let count_text = &spec[..at];
    let divisions: i64 = count_text.parse().map_err(|_| {
        let message = if count_text.bytes().all(|b| b.is_ascii_digit()) && !count_text.is_empty() {
            format!("{count_text} divisions are too many: taut handles at most {MAX_DEGREES_PER_PERIOD}")
        } else {
            format!("`{count_text}` is not a whole number of divisions")
        };
        Error::input(message).field("divisions")
    })?;
    if divisions <= 0 {
        return Err(Error::input(format!(
            "{divisions} divisions cannot divide an interval: there must be at least 1"
        ))
        .field("divisions"));
    }
    let interval_text = &spec[at + 2..];
    let period = if interval_text.eq_ignore_ascii_case("o") {
        Interval::octave()
    } else if !interval_text.is_empty() && interval_text.bytes().all(|b| b.is_ascii_digit()) {
        // A bare whole number is the harmonic N/1 (`13ed3`: the tritave), as equal divisions
        // are usually named; cents take their `c` (`13ed3c`).
        Interval::parse(&format!("{interval_text}/1")).map_err(|e| e.field("period"))?
    } else {
        Interval::parse(interval_text).map_err(|e| e.field("period"))?
    };
    let description = format!("{divisions} equal divisions of {period}");
    Ok((
        Shape::Equal {
            divisions: divisions.unsigned_abs(),
            period,
        },
        description,
    ))
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_abs_diff_eq;

    #[test]
    fn recognises_inline_forms() {
        for spec in [
            "19edo",
            "13ed3/1",
            "-3edo",
            "ratios:1/1",
            "CENTS:0",
            "chain:3/2,1,1",
        ] {
            assert!(looks_inline(spec), "{spec}");
        }
        for spec in ["12-edo", "pythagorean-12", "my.yaml", "edo"] {
            assert!(!looks_inline(spec), "{spec}");
        }
    }

    #[test]
    fn equal_divisions_of_any_interval() {
        // 13 equal divisions of 3/1: 1901.955/13 = 146.304 cents per step (Ellis 1885 cents).
        let tuning = parse("13ed3/1").unwrap();
        assert_abs_diff_eq!(
            tuning.degree(1).unwrap().cents_from_reference,
            146.304,
            epsilon = 5e-4
        );
        assert_eq!(tuning.degrees_per_period(), Some(13));
        let tuning = parse("4ed1200c").unwrap();
        assert_abs_diff_eq!(
            tuning.degree(1).unwrap().cents_from_reference,
            300.0,
            epsilon = 1e-9
        );
    }

    #[test]
    fn refuses_bad_specs_quickly_and_clearly() {
        let cases = [
            ("1000000edo", "too many"),
            ("99999999999999999999999999edo", "too many"),
            ("0edo", "at least 1"),
            ("-5edo", "at least 1"),
            ("12ed1/1", "wider than a unison"),
            ("12ed-5c", "wider than a unison"),
            ("ratios:1/1,3/0", "zero denominator"),
            ("ratios:1/1,5/4,9/8", "ascending"),
            ("cents:0,200,100", "ascending"),
            ("cents:0,nan", "finite"),
            ("hertz:100,inf", "finite"),
            ("chain:1/1,3,3", "unison"),
            ("chain:600c,2,0:1200c", "lands twice"),
            ("chain:3/2,6", "chain"),
            ("wobble:1,2", "not a kind"),
        ];
        for (spec, expected) in cases {
            let err = parse(spec).unwrap_err().to_string();
            assert!(err.contains(expected), "{spec}: {err}");
            assert!(err.contains(&format!("tuning `{spec}`")), "{spec}: {err}");
        }
    }
}
