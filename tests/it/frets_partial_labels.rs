//! Fret drawings name every fret: runs of partial frets that reach neither outer course carry
//! their number beside the board's inner lanes (issue 19, point 14). Checked on the SVG itself,
//! parsed with roxmltree: every drawn fret line belongs to a run that some number names.

use crate::common::taut;

/// A fret line as drawn: its two ends, in page millimetres.
type Segment = [(f64, f64); 2];

/// The fret lines (black, 0.3 wide) and the fret numbers of a drawing: (x, y, font size).
fn parse(svg: &str) -> (Vec<Segment>, Vec<(f64, f64, f64)>) {
    let document = roxmltree::Document::parse(svg).expect("the drawing parses as XML");
    let number = |node: roxmltree::Node, name: &str| -> f64 {
        node.attribute(name).unwrap().parse().unwrap()
    };
    // The board's outline bounds the fret lines (the scale bar's ticks lie below it).
    let board_bottom = document
        .descendants()
        .find(|n| n.has_tag_name("polygon"))
        .and_then(|n| n.attribute("points"))
        .expect("the board outline")
        .split([' ', ','])
        .skip(1)
        .step_by(2)
        .map(|y| y.parse::<f64>().unwrap())
        .fold(f64::MIN, f64::max);
    let frets = document
        .descendants()
        .filter(|n| n.has_tag_name("line"))
        .filter(|n| number(*n, "y1").max(number(*n, "y2")) <= board_bottom)
        .filter(|n| {
            n.attribute("stroke") == Some("black") && n.attribute("stroke-width") == Some("0.3")
        })
        .filter(|n| {
            n.attribute("y1") != n.attribute("y2") || n.attribute("x1") == n.attribute("x2")
        })
        .map(|n| {
            [
                (number(n, "x1"), number(n, "y1")),
                (number(n, "x2"), number(n, "y2")),
            ]
        })
        .collect();
    let labels = document
        .descendants()
        .filter(|n| n.has_tag_name("text"))
        .filter(|n| n.text().is_some_and(|t| t.parse::<u32>().is_ok()))
        .filter(|n| n.attribute("font-size") != Some("2.5")) // course numbers
        .map(|n| (number(n, "x"), number(n, "y"), number(n, "font-size")))
        .collect();
    (frets, labels)
}

/// Groups fret lines whose ends meet (one fret drawn across several lanes).
fn runs(frets: &[Segment]) -> Vec<Vec<usize>> {
    let meets = |a: &Segment, b: &Segment| {
        a.iter()
            .any(|p| b.iter().any(|q| (p.0 - q.0).hypot(p.1 - q.1) < 0.002))
    };
    let mut run_of: Vec<usize> = (0..frets.len()).collect();
    // Merge until nothing changes: small drawings, quadratic is fine.
    loop {
        let mut changed = false;
        for i in 0..frets.len() {
            for j in 0..frets.len() {
                if run_of[i] != run_of[j] && meets(&frets[i], &frets[j]) {
                    let (keep, drop) = (run_of[i].min(run_of[j]), run_of[i].max(run_of[j]));
                    run_of
                        .iter_mut()
                        .filter(|r| **r == drop)
                        .for_each(|r| *r = keep);
                    changed = true;
                }
            }
        }
        if !changed {
            break;
        }
    }
    let mut groups: Vec<Vec<usize>> = Vec::new();
    for id in 0..frets.len() {
        let members: Vec<usize> = (0..frets.len()).filter(|&i| run_of[i] == id).collect();
        if !members.is_empty() {
            groups.push(members);
        }
    }
    groups
}

fn drawing(args: &[&str]) -> String {
    let output = taut()
        .args(args)
        .args(["--format", "svg"])
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    String::from_utf8(output.stdout).unwrap()
}

/// The just-intonation fan has frets that only some inner courses share: before the fix they
/// were lines without a number. Now every run carries one: an outer number at one of its ends,
/// or a small number beside its middle.
#[test]
fn every_run_of_frets_on_a_fanned_just_board_is_numbered() {
    let svg = drawing(&["frets", "fanned-8-just", "--count", "12"]);
    let (frets, labels) = parse(&svg);
    let inner: Vec<_> = labels.iter().filter(|l| l.2 < 2.0).collect();
    assert!(!inner.is_empty(), "no inner fret numbers:\n{svg}");
    let runs = runs(&frets);
    for run in &runs {
        let named_at_an_end = run.iter().any(|&i| {
            frets[i].iter().any(|end| {
                labels
                    .iter()
                    .any(|l| l.2 > 2.0 && (l.0 - end.0).abs() < 0.001)
            })
        });
        let named_beside = run.iter().any(|&i| {
            let middle = (
                (frets[i][0].0 + frets[i][1].0) / 2.0,
                (frets[i][0].1 + frets[i][1].1) / 2.0,
            );
            inner
                .iter()
                .any(|l| (l.0 - middle.0 - 0.6).abs() < 0.01 && (l.1 - middle.1).abs() < 0.01)
        });
        assert!(
            named_at_an_end || named_beside,
            "a run of {} fret line(s) has no number: {:?}",
            run.len(),
            run.iter().map(|&i| frets[i]).collect::<Vec<_>>()
        );
    }
}

/// In 12-EDO every fret runs across the board: numbers stay at the outer courses only.
#[test]
fn frets_across_the_whole_board_get_no_inner_numbers() {
    let svg = drawing(&["frets", "steel-guitar-12edo"]);
    let (frets, labels) = parse(&svg);
    assert!(!frets.is_empty());
    assert!(labels.iter().all(|l| l.2 > 2.0), "{svg}");
}
