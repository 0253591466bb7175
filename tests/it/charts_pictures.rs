//! Every chart through the real binary, from shipped examples: the PNG decodes at the asked size,
//! the SVG names its axes and draws one mark per course (or per interval).

use std::fs;
use std::path::Path;

use crate::common::{json, taut};
use taut::charts::Look;

/// Runs `taut ARGS --plot NAME=FILE.svg --plot NAME=FILE.png` in `folder` and returns the SVG
/// text, after checking the PNG.
fn render(folder: &Path, args: &[&str], chart: &str, size: (u32, u32)) -> String {
    let svg = folder.join(format!("{chart}.svg"));
    let png = folder.join(format!("{chart}.png"));
    let output = taut()
        .args(args)
        .arg("--plot")
        .arg(format!("{chart}={}", svg.display()))
        .arg("--plot")
        .arg(format!("{chart}={}", png.display()))
        .args(["--plot-size", &format!("{}x{}", size.0, size.1)])
        .output()
        .unwrap();
    assert!(
        output.status.success(),
        "taut {args:?}: {}",
        String::from_utf8_lossy(&output.stderr)
    );
    let decoder = png::Decoder::new(std::io::BufReader::new(fs::File::open(&png).unwrap()));
    let mut reader = decoder.read_info().unwrap();
    let mut pixels = vec![0; reader.output_buffer_size().unwrap()];
    let frame = reader.next_frame(&mut pixels).unwrap();
    assert_eq!((frame.width, frame.height), size, "{chart}");
    // A blank picture would decode too: the chart must have drawn ink (dark pixels).
    let dark = pixels[..frame.buffer_size()]
        .chunks(3)
        .filter(|p| p.iter().all(|&c| c < 100))
        .count();
    assert!(dark > 2000, "{chart}: only {dark} dark pixels");
    let text = fs::read_to_string(&svg).unwrap();
    assert!(text.starts_with("<svg"), "{chart}");
    assert!(text.contains(&format!("viewBox=\"0 0 {} {}\"", size.0, size.1)));
    text
}

/// Discs drawn in the main data colour: one per point, plus one legend sample.
fn main_discs(svg: &str) -> usize {
    let fill = format!("fill=\"{}\"", Look::Main.hex().to_uppercase());
    svg.lines()
        .filter(|line| line.contains("<circle") && line.contains(&fill))
        .count()
}

fn courses(report: &serde_json::Value) -> usize {
    report["courses"].as_array().unwrap().len()
}

#[test]
fn plan_charts_show_tension_stress_and_diameter() {
    let folder = tempfile::tempdir().unwrap();
    let plan = json(&["plan", "guitar-19edo"]);
    let n = courses(&plan);
    assert_eq!(n, 6);
    let args = ["plan", "guitar-19edo"];
    let tension = render(folder.path(), &args, "tension", (1000, 600));
    for label in ["tension (N)", "course", "tension window", "target", "1 ~E4"] {
        assert!(tension.contains(label), "tension chart lacks {label}");
    }
    assert_eq!(main_discs(&tension), n + 1);
    let stress = render(folder.path(), &args, "stress", (800, 500));
    for label in [
        "stress (% of breaking strength)",
        "caution (65 %)",
        "danger (85 %)",
    ] {
        assert!(stress.contains(label), "stress chart lacks {label}");
    }
    assert_eq!(main_discs(&stress), n + 1);
    let diameter = render(folder.path(), &args, "diameter", (1000, 600));
    for label in ["outer diameter (mm)", "plain", "wound"] {
        assert!(diameter.contains(label), "diameter chart lacks {label}");
    }
    // Plain strings are discs, wound ones squares: three plain courses plus the legend disc.
    assert_eq!(main_discs(&diameter), 3 + 1);
}

#[test]
fn warnings_are_ringed_on_the_stress_chart() {
    let folder = tempfile::tempdir().unwrap();
    // At 250 N course 4 runs above the caution line (see the plan's own warnings).
    let args = ["plan", "guitar-19edo", "--tension", "250N"];
    let plan = json(&args);
    let cautions = plan["warnings"]
        .as_array()
        .unwrap()
        .iter()
        .filter(|w| w["severity"] == "caution" && !w["course"].is_null())
        .count();
    assert!(cautions >= 1);
    let stress = render(folder.path(), &args, "stress", (1000, 600));
    let ring = format!("stroke=\"{}\"", Look::Caution.hex().to_uppercase());
    let rings = stress
        .lines()
        .filter(|l| l.contains("<circle") && l.contains(&ring) && l.contains("fill=\"none\""))
        .count();
    // One ring per flagged string plus the legend sample.
    assert_eq!(rings, cautions + 1, "{stress}");
    assert!(stress.contains("caution warning"));
}

#[test]
fn audit_and_conversion_charts_draw_every_course() {
    let folder = tempfile::tempdir().unwrap();
    let audit = [
        "audit",
        "examples/guitar-22edo-mode.yaml",
        "--set",
        "examples/steel-guitar-set.yaml",
        "--from-instrument",
        "examples/steel-guitar-12edo.yaml",
    ];
    let n = courses(&json(&audit));
    let tension = render(folder.path(), &audit, "tension", (1000, 600));
    assert!(tension.contains("tension in 22edo") && tension.contains("tension now, in 12edo"));
    assert_eq!(main_discs(&tension), n + 1);
    let stress = render(folder.path(), &audit, "stress", (1000, 600));
    assert!(stress.contains("stress (% of breaking strength)"));

    let convert = [
        "convert",
        "examples/steel-guitar-12edo.yaml",
        "--set",
        "examples/steel-guitar-set.yaml",
        "--to-instrument",
        "examples/baritone-guitar.yaml",
    ];
    let n = courses(&json(&convert));
    for chart in ["tension", "stress"] {
        let svg = render(folder.path(), &convert, chart, (1000, 600));
        assert!(svg.contains("before: 12edo") && svg.contains("after: 12edo"));
        assert_eq!(main_discs(&svg), n + 1, "{chart}");
        // Before is drawn as squares in the second colour, one per course plus the legend.
        let second = format!("fill=\"{}\"", Look::Second.hex().to_uppercase());
        let squares = svg
            .lines()
            .filter(|l| l.contains("<rect") && l.contains(&second))
            .count();
        assert_eq!(squares, n + 1, "{chart}");
    }
}

#[test]
fn lengths_and_tuning_fit_charts() {
    let folder = tempfile::tempdir().unwrap();
    let layout = ["lengths", "examples/psaltery-layout.yaml"];
    let n = courses(&json(&layout));
    let svg = render(folder.path(), &layout, "lengths", (1000, 600));
    for label in [
        "vibrating length (mm)",
        "tension (N)",
        "tension profile (right axis)",
    ] {
        assert!(svg.contains(label), "lengths chart lacks {label}");
    }
    assert_eq!(main_discs(&svg), n + 1);

    let fit = ["tuning", "fit", "19edo", "--limit", "5"];
    let report = json(&fit);
    let intervals = report["intervals"].as_array().unwrap();
    let svg = render(folder.path(), &fit, "errors", (1000, 600));
    for label in [
        "just interval (cents)",
        "tuning minus just (cents)",
        "5/4",
        "3/2",
    ] {
        assert!(svg.contains(label), "fit chart lacks {label}");
    }
    assert_eq!(main_discs(&svg), intervals.len() + 1);
}

#[test]
fn a_plot_without_a_chart_name_draws_the_first_chart() {
    let folder = tempfile::tempdir().unwrap();
    let path = folder.path().join("first.svg");
    taut()
        .args(["plan", "psaltery-26", "--plot"])
        .arg(&path)
        .assert()
        .success();
    assert!(fs::read_to_string(&path).unwrap().contains("tension (N)"));
}

#[test]
fn the_pictures_in_readme_are_current() {
    // README shows examples/pictures/*.png; they are made by the commands README lists. Drawing is
    // deterministic, so a changed chart shows here: rerun those commands inside examples/pictures/.
    let folder = tempfile::tempdir().unwrap();
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let example = |name: &str| root.join("examples").join(name).display().to_string();
    let cases = [
        (
            vec![
                "audit".to_string(),
                example("guitar-22edo-mode.yaml"),
                "--set".to_string(),
                example("steel-guitar-set.yaml"),
                "--from-instrument".to_string(),
                example("steel-guitar-12edo.yaml"),
                "--plot".to_string(),
                "stress=audit-stress.png".to_string(),
            ],
            "audit-stress.png",
        ),
        (
            vec![
                "lengths".to_string(),
                example("psaltery-layout.yaml"),
                "--plot".to_string(),
                "bridge-line.png".to_string(),
            ],
            "bridge-line.png",
        ),
    ];
    for (args, name) in cases {
        taut()
            .current_dir(folder.path())
            .args(&args)
            .assert()
            .success();
        let fresh = fs::read(folder.path().join(name)).unwrap();
        let shipped = fs::read(root.join("examples/pictures").join(name)).unwrap();
        assert!(fresh == shipped, "examples/pictures/{name} is out of date");
    }
}

#[test]
fn a_chart_goes_to_standard_output_as_svg_when_the_report_goes_elsewhere() {
    let folder = tempfile::tempdir().unwrap();
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let layout = root.join("examples/psaltery-layout.yaml");
    let output = taut()
        .current_dir(folder.path())
        .args([
            "lengths",
            layout.to_str().unwrap(),
            "--plot",
            "-",
            "-o",
            "report.txt",
        ])
        .output()
        .unwrap();
    assert!(output.status.success());
    let svg = String::from_utf8(output.stdout).unwrap();
    assert!(
        svg.starts_with("<svg") && svg.contains("vibrating length"),
        "{svg}"
    );
    assert!(folder.path().join("report.txt").is_file());
    // The report and the chart cannot both take standard output: refused before anything is
    // written.
    for args in [
        vec!["lengths", layout.to_str().unwrap(), "--plot", "-"],
        vec!["plan", "guitar-19edo", "--plot", "-"],
    ] {
        let output = taut()
            .current_dir(folder.path())
            .args(&args)
            .output()
            .unwrap();
        assert_eq!(output.status.code(), Some(2), "{args:?}");
        assert!(output.stdout.is_empty(), "{args:?}");
    }
}
