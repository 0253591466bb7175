//! The physics of a stretched string, as pure functions in SI units.
//!
//! Every function takes and returns SI values (m, kg/m, N, Pa, Hz, kg/m³); conversion to the
//! units people write happens at the edges ([`crate::input::units`]). Nothing here allocates, so the
//! selector can call these millions of times.
//!
//! Sources are cited per function as `REFERENCES §x.y`, the section of [`crate::references`]
//! that collects them, with its provenance tag (READ / from memory / DERIVED / PRACTICE).

use std::f64::consts::PI;

/// Vibrating frequency of an ideal string: f = (1/2L)·√(T/μ).
///
/// Mersenne's laws combined with Taylor's wave speed v = √(T/μ) (REFERENCES §1.1, READ: OpenStax
/// *University Physics* Vol. 1 §16.3; Mersenne, *Harmonie universelle*, 1636).
pub fn frequency(tension: f64, unit_mass: f64, length: f64) -> f64 {
    (tension / unit_mass).sqrt() / (2.0 * length)
}

/// Tension that brings a string of linear density μ and vibrating length L to frequency f:
/// T = μ·(2Lf)² (REFERENCES §1.2, DERIVED from §1.1).
pub fn tension(unit_mass: f64, length: f64, frequency: f64) -> f64 {
    let two_l_f = 2.0 * length * frequency;
    unit_mass * two_l_f * two_l_f
}

/// Linear density a string needs to sound f at length L under tension T: μ = T/(2Lf)²
/// (REFERENCES §1.2, DERIVED from §1.1).
pub fn unit_mass_for_tension(tension: f64, length: f64, frequency: f64) -> f64 {
    let two_l_f = 2.0 * length * frequency;
    tension / (two_l_f * two_l_f)
}

/// Vibrating length at which a string of linear density μ sounds f under tension T:
/// L = √(T/μ)/(2f) (REFERENCES §1.2, DERIVED from §1.1). Instrument builders use it to place a
/// bridge for a chosen string and tension.
pub fn length_for_tension(tension: f64, unit_mass: f64, frequency: f64) -> f64 {
    (tension / unit_mass).sqrt() / (2.0 * frequency)
}

/// Area of a circle of diameter d: πd²/4.
pub fn circle_area(diameter: f64) -> f64 {
    PI * diameter * diameter / 4.0
}

/// Linear density of a round solid wire: μ = ρ·πd²/4 (REFERENCES §1.2, DERIVED).
pub fn unit_mass_round(density: f64, diameter: f64) -> f64 {
    density * circle_area(diameter)
}

/// Diameter of a round solid wire of density ρ with linear density μ: d = √(4μ/(πρ))
/// (REFERENCES §1.2, DERIVED).
pub fn diameter_for_unit_mass_round(density: f64, unit_mass: f64) -> f64 {
    (4.0 * unit_mass / (PI * density)).sqrt()
}

/// Cross-section of a string's core: a round wire or a hexagonal wire.
///
/// For a hexagon the nominal "diameter" is not standardised (REFERENCES §6.2, DERIVED geometry):
/// makers may quote it across the corners or across the flats, so both are offered.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize, serde::Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum CoreShape {
    /// A round wire; the nominal diameter is its diameter.
    Round,
    /// A regular hexagon whose nominal diameter is measured across the corners (2 × circumradius).
    HexAcrossCorners,
    /// A regular hexagon whose nominal diameter is measured across the flats (√3 × circumradius).
    HexAcrossFlats,
}

/// Area of a hexagon of circumradius R divided by the area of the circle of the same nominal
/// diameter, measured across the corners: (3√3/2)R² / (πR²) = 0.8270 (REFERENCES §6.2, DERIVED).
pub const HEX_ACROSS_CORNERS_AREA_RATIO: f64 = 0.826_993_343_132_688_1;
/// The same ratio for a nominal diameter measured across the flats: 1.1027 (REFERENCES §6.2,
/// DERIVED).
pub const HEX_ACROSS_FLATS_AREA_RATIO: f64 = 1.102_657_790_843_584_2;

impl CoreShape {
    /// Circumradius of a hexagon of this shape's nominal diameter (unused for round cores).
    fn circumradius(self, nominal_diameter: f64) -> f64 {
        match self {
            CoreShape::Round | CoreShape::HexAcrossCorners => nominal_diameter / 2.0,
            CoreShape::HexAcrossFlats => nominal_diameter / 3.0_f64.sqrt(),
        }
    }

    /// Cross-section area for a nominal diameter. Hexagon area = (3√3/2)·R² (REFERENCES §6.2).
    pub fn area(self, nominal_diameter: f64) -> f64 {
        match self {
            CoreShape::Round => circle_area(nominal_diameter),
            CoreShape::HexAcrossCorners | CoreShape::HexAcrossFlats => {
                let r = self.circumradius(nominal_diameter);
                1.5 * 3.0_f64.sqrt() * r * r
            }
        }
    }

    /// Second moment of area about a centroidal axis, which sets bending stiffness.
    ///
    /// Circle: πd⁴/64. Regular hexagon of side (= circumradius) a: (5√3/16)·a⁴, the same about
    /// every centroidal axis (standard section property, from memory; it follows from splitting
    /// the hexagon into six equilateral triangles).
    pub fn second_moment(self, nominal_diameter: f64) -> f64 {
        match self {
            CoreShape::Round => PI * nominal_diameter.powi(4) / 64.0,
            CoreShape::HexAcrossCorners | CoreShape::HexAcrossFlats => {
                let a = self.circumradius(nominal_diameter);
                5.0 * 3.0_f64.sqrt() / 16.0 * a.powi(4)
            }
        }
    }
}

/// One layer of round wrap wire: its density and wire diameter.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct WrapLayer {
    /// Density of the wrap wire, kg/m³.
    pub density: f64,
    /// Diameter of the wrap wire, m.
    pub wire_diameter: f64,
}

/// Linear density added by one close-wound layer of round wire of diameter w on a body of
/// diameter D beneath it: ρ_w·π²·w·(D + w)/4.
///
/// REFERENCES §6.1 (DERIVED, confirmed by the structure of piano technicians' formulas, READ).
/// Assumptions: turns touch (close winding), so there are 1/w turns per metre; each turn is a
/// circle of the wire's centre-line diameter D + w (the helix pitch ≈ w is neglected); the wire
/// keeps its round section (real wraps flatten a little under winding tension). Equivalently the
/// wrap fills π/4 of the annulus between D and D + 2w (the packing identity, §6.1).
pub fn unit_mass_wrap_layer(density: f64, wire_diameter: f64, under_diameter: f64) -> f64 {
    density * PI * PI * wire_diameter * (under_diameter + wire_diameter) / 4.0
}

/// Linear density of a round-wound string: core plus each wrap layer in turn,
/// μ = μ_core + Σ ρ_i·π²·w_i·(D_{i−1} + w_i)/4 with D_i = D_{i−1} + 2w_i and D_0 the core's
/// nominal diameter (REFERENCES §6.1 and §6.2, DERIVED).
///
/// For a hexagonal core the first layer is taken to seat on the nominal diameter; in truth it
/// sits partly on the flats, between the flat and corner diameters (§6.2), which this model does
/// not resolve. Silk or other under-layers are not modelled.
pub fn unit_mass_wound(
    core_density: f64,
    core_shape: CoreShape,
    core_diameter: f64,
    layers: &[WrapLayer],
) -> f64 {
    let mut unit_mass = core_density * core_shape.area(core_diameter);
    let mut under = core_diameter;
    for layer in layers {
        unit_mass += unit_mass_wrap_layer(layer.density, layer.wire_diameter, under);
        under += 2.0 * layer.wire_diameter;
    }
    unit_mass
}

/// Outer diameter of a wound string: core plus twice each wrap wire (REFERENCES §6.1).
pub fn outer_diameter_wound(core_diameter: f64, layers: &[WrapLayer]) -> f64 {
    core_diameter
        + layers
            .iter()
            .map(|layer| 2.0 * layer.wire_diameter)
            .sum::<f64>()
}

/// Axial stress in the load-bearing cross-section: σ = T/A. For a wound string only the core
/// carries the tension (REFERENCES §6.2, PRACTICE), so pass the core area.
pub fn axial_stress(tension: f64, load_area: f64) -> f64 {
    tension / load_area
}

/// Axial stress in a plain (solid, one-material) string at pitch: σ = ρ·(2Lf)², independent of
/// the diameter (REFERENCES §1.2, DERIVED).
pub fn plain_stress(density: f64, length: f64, frequency: f64) -> f64 {
    let two_l_f = 2.0 * length * frequency;
    density * two_l_f * two_l_f
}

/// Frequency at which a plain string of any diameter reaches its breaking strength:
/// f_break = √(σ_UTS/ρ)/(2L) (REFERENCES §1.2, DERIVED).
pub fn breaking_frequency_plain(strength: f64, density: f64, length: f64) -> f64 {
    (strength / density).sqrt() / (2.0 * length)
}

/// Frequency at which any string of linear density μ reaches its breaking tension T_break
/// (strength × load-bearing area): f_break = √(T_break/μ)/(2L) (§1.1 solved for f at T_break).
pub fn breaking_frequency(breaking_tension: f64, unit_mass: f64, length: f64) -> f64 {
    frequency(breaking_tension, unit_mass, length)
}

/// Fletcher's inharmonicity coefficient of a round stiff string with pinned ends:
/// B = π³·E·d⁴/(64·T·L²).
///
/// H. Fletcher, *J. Acoust. Soc. Am.* 36, 203 (1964); REFERENCES §5.1 (READ, cross-checked by
/// R. W. Young 1952). For a wound string pass the core diameter and the core's modulus with the
/// actual tension (§5.3, PRACTICE / from memory: the wrap adds mass, not stiffness).
pub fn inharmonicity(modulus: f64, diameter: f64, tension: f64, length: f64) -> f64 {
    PI.powi(3) * modulus * diameter.powi(4) / (64.0 * tension * length * length)
}

/// Fletcher's coefficient written with the section's second moment of area I, so that
/// hexagonal cores can be used: B = π²·E·I/(T·L²). For a circle I = πd⁴/64 and this equals
/// [`inharmonicity`] (REFERENCES §5.1, DERIVED by substitution).
pub fn inharmonicity_from_second_moment(
    modulus: f64,
    second_moment: f64,
    tension: f64,
    length: f64,
) -> f64 {
    PI * PI * modulus * second_moment / (tension * length * length)
}

/// Frequency of partial n of a stiff string: f_n = n·f₀·√(1 + B·n²), where f₀ is the ideal
/// (zero-stiffness) fundamental of §1.1 (Fletcher 1964; REFERENCES §5.1).
pub fn partial_frequency(ideal_fundamental: f64, inharmonicity: f64, n: u32) -> f64 {
    let n = f64::from(n);
    n * ideal_fundamental * (1.0 + inharmonicity * n * n).sqrt()
}

/// How far partial n sits above n times the *sounding* fundamental, in cents:
/// 1200·log₂(f_n/(n·f_1)) with f_1 = f₀·√(1+B), i.e. 600·log₂((1+Bn²)/(1+B))
/// (REFERENCES §5.1, DERIVED). Partial 1 is 0 by definition.
pub fn partial_offset_cents(inharmonicity: f64, n: u32) -> f64 {
    let n = f64::from(n);
    600.0 * ((1.0 + inharmonicity * n * n) / (1.0 + inharmonicity)).log2()
}

/// The interval between two frequencies in cents: 1200·log₂(f2/f1) (Ellis 1885; REFERENCES §7.3).
pub fn cents(from: f64, to: f64) -> f64 {
    1200.0 * (to / from).log2()
}

/// Where a string is anchored, for the bend model: the vibrating length plus the lengths beyond
/// the nut and the bridge that stretch with it.
///
/// When a string is pushed aside, the added tension equalises along everything between its two
/// fixed anchors (tuner post and tailpiece or ball end), assuming it slides freely over the nut
/// and saddle. Friction there makes the real string stiffer to bend than this model says.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct BendGeometry {
    /// Vibrating length, m.
    pub vibrating_length: f64,
    /// Free string from the nut to its anchor (tuner post or pin), m.
    pub nut_afterlength: f64,
    /// Free string from the bridge or saddle to its anchor, m.
    pub bridge_afterlength: f64,
}

/// Default string length beyond the nut for the bend model, 0.080 m: a typical distance from nut
/// to tuner post on a guitar headstock. An assumption we chose (PRACTICE), not a measurement.
pub const DEFAULT_NUT_AFTERLENGTH: f64 = 0.080;
/// Default string length beyond the bridge for the bend model, 0.040 m: a typical distance from
/// saddle to the anchoring pin or ball end. An assumption we chose (PRACTICE), not a measurement.
pub const DEFAULT_BRIDGE_AFTERLENGTH: f64 = 0.040;

impl BendGeometry {
    /// A vibrating length with the default afterlengths [`DEFAULT_NUT_AFTERLENGTH`] and
    /// [`DEFAULT_BRIDGE_AFTERLENGTH`].
    pub fn with_default_afterlengths(vibrating_length: f64) -> Self {
        BendGeometry {
            vibrating_length,
            nut_afterlength: DEFAULT_NUT_AFTERLENGTH,
            bridge_afterlength: DEFAULT_BRIDGE_AFTERLENGTH,
        }
    }

    /// Total stretching length between the anchors.
    pub fn anchored_length(self) -> f64 {
        self.vibrating_length + self.nut_afterlength + self.bridge_afterlength
    }

    /// Extra length when the midpoint of the vibrating length is pushed aside by δ: the straight
    /// length L becomes two legs of √((L/2)² + δ²).
    fn stretch(self, displacement: f64) -> f64 {
        let half = self.vibrating_length / 2.0;
        2.0 * half.hypot(displacement) - self.vibrating_length
    }
}

/// Pitch rise in cents when the string's midpoint is pushed aside by `displacement` (m).
///
/// Model (Hooke's law on the load-bearing section; DERIVED from REFERENCES §1.1 and §6.2):
/// ΔL = 2√((L/2)² + δ²) − L, ΔT = E·A·ΔL/L_total with L_total the anchored length, and the
/// rise is 1200·log₂√((T + ΔT)/T) because f ∝ √T (§1.1). Neglected: the fall of μ as the string
/// stretches (ΔL/L is of order 10⁻³) and friction at nut and saddle. `stiffness` is E·A of the
/// load-bearing section (core only for wound strings), in N.
///
/// For small δ the stretch is ≈ 2δ²/L, so the rise grows with the square of the displacement.
pub fn bend_rise_cents(
    geometry: BendGeometry,
    stiffness: f64,
    tension: f64,
    displacement: f64,
) -> f64 {
    let added = stiffness * geometry.stretch(displacement) / geometry.anchored_length();
    600.0 * ((tension + added) / tension).log2()
}

/// Sideways force at the midpoint that holds the string displaced by δ: the two legs pull back
/// with 2·T'·sin θ, sin θ = δ/√((L/2)² + δ²), T' the raised tension (statics, DERIVED).
pub fn bend_force(geometry: BendGeometry, stiffness: f64, tension: f64, displacement: f64) -> f64 {
    let half = geometry.vibrating_length / 2.0;
    let leg = half.hypot(displacement);
    let raised = tension + stiffness * geometry.stretch(displacement) / geometry.anchored_length();
    2.0 * raised * displacement / leg
}

/// Midpoint displacement (m) that raises the pitch by `rise_cents`: the exact inverse of
/// [`bend_rise_cents`]. Zero or negative rises give 0.
pub fn bend_displacement_for_rise(
    geometry: BendGeometry,
    stiffness: f64,
    tension: f64,
    rise_cents: f64,
) -> f64 {
    if rise_cents <= 0.0 {
        return 0.0;
    }
    let added = tension * ((rise_cents / 600.0).exp2() - 1.0);
    let stretch = added * geometry.anchored_length() / stiffness;
    let half = geometry.vibrating_length / 2.0;
    let leg = half + stretch / 2.0;
    (leg * leg - half * half).max(0.0).sqrt()
}

/// Midpoint displacement (m) produced by a sideways push `force` (N): the inverse of
/// [`bend_force`], found by Newton's method inside a bracket that bisection keeps when a step
/// would leave it (the force grows monotonically with δ, so the root is unique).
///
/// Newton's steps use the exact slope of [`bend_force`]: with h = L/2, ℓ = √(h² + δ²),
/// T' = T + k·(2ℓ − L) and k = E·A/L_total,
/// dF/dδ = 2·(T'·h²/ℓ³ + 2·k·δ²/ℓ²) (DERIVED). A few steps reach the double-precision answer
/// that plain bisection needs some sixty halvings for; this runs for every planned string.
pub fn bend_displacement_for_force(
    geometry: BendGeometry,
    stiffness: f64,
    tension: f64,
    force: f64,
) -> f64 {
    if force <= 0.0 {
        return 0.0;
    }
    // Start from the small-angle answer δ = F·L/(4T) and double until the push is bracketed.
    let mut high = force * geometry.vibrating_length / (4.0 * tension);
    let mut guard = 0;
    while bend_force(geometry, stiffness, tension, high) < force && guard < 200 {
        high *= 2.0;
        guard += 1;
    }
    let mut low = 0.0;
    let half = geometry.vibrating_length / 2.0;
    let spring = stiffness / geometry.anchored_length();
    let mut guess = high;
    for _ in 0..200 {
        let leg = half.hypot(guess);
        let raised = tension + spring * (2.0 * leg - geometry.vibrating_length);
        let excess = 2.0 * raised * guess / leg - force;
        if excess < 0.0 {
            low = guess;
        } else {
            high = guess;
        }
        let slope = 2.0
            * (raised * half * half / (leg * leg * leg)
                + 2.0 * spring * guess * guess / (leg * leg));
        let mut next = guess - excess / slope;
        if !(next > low && next < high) {
            next = 0.5 * (low + high);
        }
        if (next - guess).abs() <= 4.0 * f64::EPSILON * guess || next <= low || next >= high {
            return next;
        }
        guess = next;
    }
    guess
}

/// Pitch rise in cents for a sideways push `force` (N) at the midpoint.
pub fn bend_rise_for_force(
    geometry: BendGeometry,
    stiffness: f64,
    tension: f64,
    force: f64,
) -> f64 {
    let displacement = bend_displacement_for_force(geometry, stiffness, tension, force);
    bend_rise_cents(geometry, stiffness, tension, displacement)
}

/// Sideways push (N) at the midpoint that raises the pitch by `rise_cents`.
pub fn bend_force_for_rise(
    geometry: BendGeometry,
    stiffness: f64,
    tension: f64,
    rise_cents: f64,
) -> f64 {
    let displacement = bend_displacement_for_rise(geometry, stiffness, tension, rise_cents);
    bend_force(geometry, stiffness, tension, displacement)
}

/// Tension (N) at which a sideways push of `force` (N) at the midpoint raises the pitch by
/// `rise_cents`: the inverse in T of [`bend_force_for_rise`], found by bisection. The force
/// grows monotonically with the tension (both the raised tension T' and the displacement for a
/// given rise grow with T), so the answer is unique. Used to keep the bend force of a string
/// when it moves to another length or pitch.
pub fn tension_for_bend_force(
    geometry: BendGeometry,
    stiffness: f64,
    force: f64,
    rise_cents: f64,
) -> f64 {
    if force <= 0.0 || stiffness <= 0.0 || rise_cents <= 0.0 {
        return 0.0;
    }
    let at = |tension: f64| bend_force_for_rise(geometry, stiffness, tension, rise_cents);
    let mut high = 1.0;
    let mut guard = 0;
    while at(high) < force && guard < 200 {
        high *= 2.0;
        guard += 1;
    }
    let mut low = 0.0;
    for _ in 0..200 {
        let mid = 0.5 * (low + high);
        if mid <= low || mid >= high {
            break;
        }
        if at(mid) < force {
            low = mid;
        } else {
            high = mid;
        }
    }
    0.5 * (low + high)
}
