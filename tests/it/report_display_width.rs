//! Wide (CJK) characters in names: every report counts the columns a name takes on screen, not
//! its characters, so a tuning, instrument, set or layout named in Japanese still fits 100
//! columns in tables and in wrapped paragraphs alike.

use std::path::Path;

use unicode_width::UnicodeWidthStr;

use crate::common;

/// A tuning, an instrument, a string set, a layout and survey settings whose names and
/// descriptions are long runs of two-column characters.
fn write_files(folder: &Path) {
    common::write_file(
        folder,
        "tuning.yaml",
        "name: 十九平均律の調律名前がとても長い場合の表示幅\n\
         description: 十九等分平均律、オクターブを十九の等しい段に分ける調律で、説明文もかなり長く書いてある場合の折り返し\n\
         divisions: 19\nperiod: 2/1\nreference: {degree: 0, note: A4, hz: 440}\n",
    );
    common::write_file(
        folder,
        "inst.yaml",
        "name: 六弦ギター、長い名前の楽器で表示幅を確かめるためのもの\n\
         description: 鋼線の六弦ギター\ntuning: tuning.yaml\nscale_length: 648mm\nrated_load: 800N\n\
         defaults:\n  tension: {target: 110N, min: 60N, max: 140N}\n  kinds: [plain-steel, phosphor-bronze-wound]\n\
         courses:\n  - {course: 1, pitch: ~E4, kinds: [plain-steel]}\n  - {course: 2, pitch: ~B3, kinds: [plain-steel]}\n\
         \x20 - {course: 3, pitch: ~G3}\n  - {course: 4, pitch: ~D3}\n  - {course: 5, pitch: ~A2}\n  - {course: 6, pitch: ~E2}\n",
    );
    common::write_file(
        folder,
        "set.yaml",
        "name: 弦のセット、とても長い名前で表示幅を確かめるためのもの\ntuning: 12edo\ncourses:\n\
         \x20 - {course: 1, strings: [{kind: plain-steel, diameter: 0.012in}]}\n\
         \x20 - {course: 2, strings: [{kind: plain-steel, diameter: 0.016in}]}\n\
         \x20 - {course: 3, strings: [{kind: phosphor-bronze-wound, diameter: 0.024in}]}\n\
         \x20 - {course: 4, strings: [{kind: phosphor-bronze-wound, diameter: 0.032in}]}\n\
         \x20 - {course: 5, strings: [{kind: phosphor-bronze-wound, diameter: 0.042in}]}\n\
         \x20 - {course: 6, strings: [{kind: phosphor-bronze-wound, diameter: 0.053in}]}\n",
    );
    common::write_file(
        folder,
        "layout.yaml",
        "name: 十八弦のプサルテリー、長い名前で表示幅を確かめるためのもの\ntuning: tuning.yaml\n\
         tension: {first: 40N, last: 60N}\ncourses:\n\
         \x20 - {pitch: ~G3, string: {kind: phosphor-bronze-wound, diameter: 0.022in}}\n\
         \x20 - {pitch: ~A3, string: {kind: phosphor-bronze-wound, diameter: 0.020in}}\n\
         \x20 - {pitch: ~B3, string: {kind: plain-steel, diameter: 0.016in}}\n\
         \x20 - {pitch: ~C4, string: {kind: plain-steel, diameter: 0.016in}}\n",
    );
    common::write_file(
        folder,
        "survey.yaml",
        "tunings:\n  list: [tuning.yaml, 12edo]\ncourse_1: E2\n\
         offset_cents: {from: -50, to: 50, step: 10}\ncourses:\n  nearest_to: 4/3\ntop: 5\n",
    );
}

/// Every report that shows one of those names, as arguments run inside the folder.
const REPORTS: &[&[&str]] = &[
    &["plan", "inst.yaml"],
    &["plan", "inst.yaml", "--wide"],
    &[
        "plan",
        "inst.yaml",
        "--tuning",
        "tuning.yaml",
        "--tuning",
        "12edo",
    ],
    &["audit", "inst.yaml", "--set", "set.yaml"],
    &[
        "audit",
        "inst.yaml",
        "--set",
        "set.yaml",
        "--tuning",
        "tuning.yaml",
        "--tuning",
        "12edo",
    ],
    &[
        "convert",
        "steel-guitar-12edo",
        "--set",
        "set.yaml",
        "--to-instrument",
        "inst.yaml",
    ],
    &["lengths", "layout.yaml"],
    &["frets", "inst.yaml"],
    &["survey", "inst.yaml", "survey.yaml"],
    &["tuning", "show", "tuning.yaml", "--to", "3"],
    &["tuning", "fit", "tuning.yaml"],
    &["tuning", "compare", "tuning.yaml", "12edo", "--to", "3"],
    &["tuning", "find", "tuning.yaml", "A4", "~E2"],
];

#[test]
fn wide_characters_in_names_fit_100_columns_in_every_report() {
    let folder = tempfile::tempdir().unwrap();
    write_files(folder.path());
    for args in REPORTS {
        let output = common::taut()
            .args(*args)
            .current_dir(folder.path())
            .env("COLUMNS", "100")
            .output()
            .unwrap();
        let text = String::from_utf8(output.stdout).unwrap();
        assert!(
            output.status.success(),
            "taut {args:?}: {}",
            String::from_utf8_lossy(&output.stderr)
        );
        // The name must be in the report, else the check proves nothing.
        assert!(
            ["十九平均律", "六弦ギター", "弦のセット", "十八弦"]
                .iter()
                .any(|name| text.contains(name)),
            "taut {args:?} shows no wide name:\n{text}"
        );
        for line in text.lines() {
            assert!(
                line.width() <= 100,
                "taut {args:?}: a line takes {} columns:\n{line}\n\n{text}",
                line.width()
            );
        }
    }
}
