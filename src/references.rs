//! The published sources behind `taut`'s physics, material data and checks, in numbered sections.
//!
//! This page is what a citation of the form **`REFERENCES §6.2`** in the code, the tests, the
//! data files and the documentation means: section 6.2 of this file, `src/references.rs`. A
//! citation names the section, and the sentence beside it usually repeats the provenance tag.
//! `tests/it/references.rs` walks the repository and fails on any citation whose section is
//! missing here, on any section here without a provenance tag, and on older citation forms
//! (a file name with an extension, or a second sheet).
//!
//! Each entry gives the published source (author, title, year, and the section or table), what
//! `taut` takes from it, and one or more provenance tags:
//!
//! | tag | meaning |
//! |---|---|
//! | **read** | the value or formula was read in the named source, or in a faithful reproduction of it (said so where the original was not seen) |
//! | **derived** | worked out here from other entries by algebra or arithmetic; a test can recompute it |
//! | **common practice** | a rule or figure of the trade with no citable published source; treat it as a default, not a fact |
//! | **from memory** | recalled from the named source but not checked against it; lower confidence |
//!
//! In comments and data files the same tags are often written READ, DERIVED, PRACTICE and from
//! memory. Only published sources are named here: standards, handbooks, textbooks and papers.
//! Where a number was read in a reproduction (a supplier's copy of a standard's table, a quotation
//! in a later text), the standard or paper is cited, and the reproduction is only described.
//!
//! ## 1 The ideal string
//!
//! ### 1.1 Mersenne's laws and Taylor's wave speed
//!
//! ```text
//! v   = √(T/μ)                 speed of a transverse wave on a string under tension T
//! f_n = n·v/(2L) = (n/2L)·√(T/μ)   n = 1, 2, 3, …   (perfectly flexible, both ends fixed)
//! ```
//!
//! L is the vibrating length (m), T the tension (N), μ the mass per unit length (kg/m).
//!
//! - *Sources:* M. Mersenne, *Harmonie universelle* (Paris, 1636), for the three proportions
//!   f ∝ 1/L, f ∝ √T, f ∝ 1/√μ; the wave speed and the standing-wave condition in any
//!   introductory physics text, e.g. OpenStax, *University Physics*, Vol. 1 (Ling, Sanny, Moebs
//!   et al., 2016), §16.3 (wave speed on a string, μ = m/l) and the section on standing waves;
//!   H. D. Young & R. A. Freedman, *University Physics*, 14th ed., ch. 15; J. H. Jeans, *Science &
//!   Music* (1937), pp. 62–64, for the laws as a whole.
//! - *Taken:* the frequency of an ideal string and its consequences: halving the length, or
//!   four times the tension, or a quarter of the mass per length raises the pitch an octave; the
//!   third harmonic needs a third of the length or nine times the tension.
//! - *Provenance:* **read** (OpenStax §16.3 and Young & Freedman for the formula; an encyclopedia
//!   article for the proportions and the octave table); Jeans's page numbers **from memory**.
//!
//! ### 1.2 The same law solved for each unknown, for a plain round string
//!
//! ```text
//! T     = μ·(2Lf)²                  μ = T/(2Lf)²          L = √(T/μ)/(2f)
//! μ     = ρ·πd²/4                   d = √(4μ/(πρ))        (solid round wire, density ρ)
//! T     = π·ρ·d²·L²·f²
//! σ     = T/A = ρ·(2Lf)²            (axial stress: the diameter drops out)
//! f_brk = √(σ_UTS/ρ)/(2L)           (pitch at which a plain string of any gauge breaks)
//! ```
//!
//! - *Source:* §1.1, rearranged.
//! - *Taken:* every tension, unit mass, length and stress in the planner and selector. Because
//!   σ ∝ f², a string tuned k semitones below its breaking pitch runs at 2^(−k/6) of its breaking
//!   stress: 0.891 at one semitone, 0.707 at three, 0.5 at six, 0.25 at twelve. Tension also grows
//!   with μ at a fixed pitch and length, and with the square of pitch on a fixed string.
//! - *Provenance:* **derived** (exact algebra).
//!
//! ### 1.3 Units
//!
//! - *Source:* the international yard and pound (1959) and the standard acceleration of gravity,
//!   as tabulated in NIST Special Publication 811, *Guide for the Use of the International System
//!   of Units*.
//! - *Taken:* 1 in = 0.0254 m, 1 lb = 0.453 592 37 kg and g_n = 9.806 65 m/s², all exact; from
//!   them 1 lbf = 4.448 221 615 260 5 N, 1 kgf = 9.806 65 N, 1 ksi = 6.894 757 293 168 MPa.
//! - *Provenance:* the definitions **from memory** (the SP 811 tables were not opened); the
//!   derived factors **derived**.
//!
//! ## 2 Densities
//!
//! Densities of the shipped materials (`src/strings/data/materials.yaml`, whose `source` fields
//! repeat the provenance per value).
//!
//! ### 2.1 Metals
//!
//! - *Sources:* F. P. Beer, E. R. Johnston, J. T. DeWolf & D. F. Mazurek, *Mechanics of
//!   Materials*, Appendix B (typical properties of engineering materials): steel
//!   0.284 lb/in³ (7861 kg/m³), stainless AISI 302 0.286 lb/in³ (7916 kg/m³), oxygen-free copper
//!   0.322 lb/in³; *CRC Handbook of Chemistry and Physics* for the pure elements (copper 8.96,
//!   nickel 8.90, silver 10.49 g/cm³); the UNS C51000 (phosphor bronze, 8.86 g/cm³) and C24000
//!   (low brass Cu80–Zn20, 8.66 g/cm³) alloy data published by copper-alloy producers.
//! - *Taken:* carbon-steel music wire 7850 kg/m³, the round figure piano technicians also build
//!   into their tension constants; stainless 7916; copper 8960; nickel 8908; phosphor bronze
//!   8860; "80/20" wrap wire 8660 (it is the brass C24000, whatever its trade name says).
//!   Plated wraps take a rule of mixtures over the plated share of the section, about 4t/d for a
//!   plating t on a wire d: nickel-plated steel about 7880, silver-plated copper about 9000.
//! - *Provenance:* steel 7850 **common practice**, agreeing with Beer et al. (**read**);
//!   stainless, phosphor bronze and brass **read**; copper, nickel and silver element values
//!   **read** in element tables and **from memory** for the CRC figures; the plated values
//!   **derived**, with an assumed plating thickness (**common practice**).
//!
//! ### 2.2 Polymers, gut and silk
//!
//! - *Sources:* *Encyclopedia of Physical Science and Technology*, 3rd ed. (Academic Press,
//!   2001), article "Plastics Engineering", Table I (PA66 1140 kg/m³); Beer et al., Appendix B
//!   (nylon 6/6, 0.0412 lb/in³); plastics property tables measured to DIN 53479 (PVDF
//!   1.75–1.78 g/cm³); N. Lynch-Aird & J. Woodhouse, "Comparison of mechanical properties of
//!   natural gut and synthetic polymer harp strings", *Materials* 11(11):2160 (2018), for the
//!   facts that fluorocarbon strings are much denser than nylon and that gut's mass per length
//!   moves with humidity; W. E. Morton & J. W. S. Hearle, *Physical Properties of Textile Fibres*,
//!   for silk (about 1.34 g/cm³).
//! - *Taken:* nylon 1140, fluorocarbon (PVDF) 1780, gut 1300, silk 1340 kg/m³; a multifilament
//!   nylon core is referred to its nominal round section with an assumed 80 % fill (912 kg/m³).
//!   For gut, T. Satoh's rule F·L·d = 49·√k (Hz, m, mm, kgf; *Journal of the Lute Society of
//!   America*), quoted in later lute literature, implies ρ = g_n/(π·0.049²) = 1300.1 kg/m³.
//! - *Provenance:* nylon and PVDF **read**; gut **from memory**, cross-checked by the Satoh figure
//!   (**derived**; Satoh's paper itself not seen); silk **from memory** (Morton & Hearle) and
//!   **read** in a weaker web table; the core fill **common practice**.
//!
//! ### 2.3 A nylon string at pitch: stretched, lighter per metre
//!
//! - *Source:* N. Lynch-Aird & J. Woodhouse, "Mechanical properties of nylon harp strings",
//!   *Materials* 10(5):497 (2017), doi:10.3390/ma10050497, §4.1 and Fig. 4: monofilament nylon
//!   strings stretch as they are brought to pitch and settle; their bulk density falls a little
//!   on first stretching (to about 97 % of the unstretched value for most strings tested, 92 %
//!   for one) and then stays constant, so the mass per metre falls with the stretch.
//! - *Taken:* `taut` computes μ from the diameter a string is sold at and the bulk density
//!   (§2.2), which is the mass per metre before stretching. Once settled at pitch the string has
//!   stretched by a fraction ε and carries μ/(1+ε), so it pulls T/(1+ε) for the same pitch
//!   (§1.2). For normal-tension classical trebles sold at 0.72, 0.82 and 1.02 mm on 650 mm,
//!   `taut` gives 85.2, 62.0 and 60.5 N (E4, B3, G3); Woodhouse's measured set (§5.4) pulls
//!   70.3, 53.4 and 58.3 N, 4-18 % less; the figure shown is 4-21 % above the measured one
//!   (its diameters are not given). `taut` keeps the unstretched figure: it is the upper bound, so a load or a stress is never understated, and
//!   the stretch at pitch depends on the string's make and history, which `taut` cannot know.
//! - *Provenance:* the density finding **read** (the paper's results section, in a copy of the
//!   published article); the μ/(1+ε) relation **derived** (mass conserved over a longer string);
//!   the treble diameters **common practice**, from memory.
//!
//! ## 3 Young's modulus
//!
//! ### 3.1 Metals
//!
//! - *Sources:* R. G. Budynas & J. K. Nisbett, *Shigley's Mechanical Engineering Design*, 9th ed.
//!   (McGraw-Hill, 2011), Table 10-5, "Mechanical properties of some spring wires": music wire
//!   ASTM A228 29.5, 29.0, 28.5 and 28.0 Mpsi for diameters up to 0.032, 0.063, 0.125 in and
//!   above; Beer et al., Appendix B: stainless 302 28 Mpsi, oxygen-free copper 17 Mpsi; the UNS
//!   C51000 and C24000 alloy data (16 Mpsi each).
//! - *Taken:* music wire 203.4 / 200 / 196.5 / 193 GPa, each value held at the top of its size
//!   range (0.032, 0.063, 0.125, 0.250 in) and joined by straight lines between them, so the
//!   stiffness of a string never jumps at a range edge (a step of 1.7 % at 0.032 in before);
//!   stainless 193 GPa; copper 117 GPa; phosphor bronze and brass 110 GPa; nickel and
//!   nickel-plated steel 200 GPa. Only the load-bearing core's modulus matters for stiffness
//!   (§5.3).
//! - *Provenance:* **read** (Shigley, Beer et al., alloy data); the joined curve **derived** (it
//!   stays within 1.8 % of the table); nickel **from memory** (handbook range 200–207 GPa).
//!
//! ### 3.2 Polymers and gut
//!
//! - *Sources:* *Encyclopedia of Physical Science and Technology*, "Plastics Engineering",
//!   Table I, and Beer et al., Appendix B: bulk PA66 about 2.7–3 GPa; plastics tables to
//!   DIN 53457 for PVDF (0.8–2.2 GPa); N. Lynch-Aird & J. Woodhouse, "Mechanical properties of
//!   nylon harp strings", *Materials* 10(5):497 (2017): drawn string monofilament is stiffer than
//!   bulk polymer and its dynamic modulus rises with stress; J. Woodhouse & N. Lynch-Aird,
//!   "Choosing strings for plucked musical instruments", *Acta Acustica united with Acustica*
//!   105(3), 516–529 (2019), for a bending modulus of nylon that grows linearly with tensile
//!   stress (about 4.5 GPa plus some 39 times the stress).
//! - *Taken:* nylon 3 GPa, fluorocarbon 2.2 GPa, gut 3 GPa, a multifilament core 4 GPa. These
//!   bulk-like values understate the stiffness of a string at playing stress (the 2019 relation
//!   gives about 12 GPa for nylon at 0.2 GPa), so `taut`'s inharmonicity of plain polymer strings
//!   is a low estimate.
//! - *Provenance:* bulk values **read**; the stress-dependent relation **read** in quotations of
//!   the 2019 paper (the paper itself not seen: constants uncertain); gut's modulus **from
//!   memory** ("a few GPa").
//!
//! ## 4 Tensile strength
//!
//! ### 4.1 Music wire: ASTM A228/A228M, Table 1
//!
//! - *Source:* ASTM A228/A228M, *Standard Specification for Steel Wire, Music Spring Quality*,
//!   Table 1, tensile requirements in inch-pound units (rows from 0.004 in, 439–485 ksi, to
//!   0.250 in, 230–255 ksi).
//! - *Taken:* the minimum column, interpolated linearly in diameter and clamped at both ends, as
//!   the breaking strength of music wire (e.g. 0.010 in 387 ksi, 0.016 in 362 ksi, 0.026 in
//!   337 ksi, 0.036 in 321 ksi). The values in MPa that tests quote are conversions (§1.3), not
//!   the metric table of A228M, which was not read.
//! - *Provenance:* **read** in a wire supplier's reproduction of the table; the scope pages of
//!   several editions were read directly. One maximum in that reproduction (0.036 in, printed
//!   255) is an evident misprint for 355; `taut` uses only the minimum column.
//!
//! ### 4.2 Stainless spring wire: ASTM A313/A313M
//!
//! - *Source:* ASTM A313/A313M, *Standard Specification for Stainless Steel Spring Wire*, the
//!   tensile table for Types 302 (Class 1) and 304.
//! - *Taken:* the minimum column by diameter step, from 325 ksi at 0.009 in and below to 246 ksi
//!   at 0.080 in; thicker wire keeps the 0.080 in value.
//! - *Provenance:* **read** in a supplier's reproduction, which stops at 0.080 in. Its minimum for
//!   "over 0.012 to 0.013 in" reads 324 ksi and breaks the falling trend (316 before, 312 after);
//!   `taut` takes 314 (**derived** from the trend).
//!
//! ### 4.3 Other metals
//!
//! - *Sources:* the UNS C51000 data (phosphor bronze strip to ASTM B103: spring temper
//!   655–760 MPa) and UNS C24000 data (low brass strip, spring temper 585–640 MPa); Shigley,
//!   Table 10-5, for the elastic limit of music wire in tension, 65–75 % of its tensile strength.
//! - *Taken:* phosphor bronze 655 MPa and brass 585 MPa (lower bounds for strip; wire was not
//!   read). Pure copper, nickel and plated wraps get no strength: a wrap carries no load in
//!   `taut`'s model (§6.2).
//! - *Provenance:* **read**.
//!
//! ### 4.4 Polymer strings, gut and silk
//!
//! - *Sources:* W. E. Morton & J. W. S. Hearle, *Physical Properties of Textile Fibres*
//!   (Woodhead), ch. 13, Table 13.2 (tensile properties at 65 % r.h., 20 °C): high-tenacity
//!   nylon 6.6 about 0.66 N/tex, medium-tenacity 0.48 N/tex; Lynch-Aird & Woodhouse (2018, §2.2)
//!   for the qualitative facts that fluorocarbon strings reach higher stress than nylon but break
//!   at lower strain, and that gut's strength falls as its twist rises; a review table of fibre
//!   properties in *Materials Science in Additive Manufacturing* 4(2) (2025), "Fibrous silk in
//!   biomedicine", Table 1 (silk about 600 MPa and 7 GPa; drawn nylon fibre about 5 GPa).
//! - *Taken:* a tenacity in N/tex times the density in kg/m³ times 10⁶ is a stress in Pa, so
//!   0.66 N/tex at 1140 kg/m³ is 752 MPa; a multifilament core at 80 % fill gets 600 MPa. Plain
//!   nylon 350 MPa and fluorocarbon 400 MPa sit at the low end of what string-grade monofilament
//!   reaches, so warnings come early. Gut gets 300 MPa: a breaking index f·L of about 240 Hz·m at
//!   1300 kg/m³ gives σ = ρ(2fL)² = 300 MPa (§1.2). Silk 600 MPa.
//! - *Provenance:* the textile and silk figures **read** and their conversion **derived**; the
//!   plain nylon and fluorocarbon strengths **from memory**, low confidence; the gut breaking
//!   index **common practice** (it traces to string makers' measurements, not to a paper).
//!
//! ## 5 Stiffness and inharmonicity
//!
//! ### 5.1 The stiff string: Fletcher (1964)
//!
//! ```text
//! f_n = n·f₀·√(1 + B·n²)          f₀ = the ideal-string frequency of §1.1
//! B   = π³·E·d⁴ / (64·T·L²)        E Young's modulus, d the diameter of the bending section
//! B   = π²·(E/ρ)·d² / (64·f₀²·L⁴)  the same for a plain wire, with T = πρd²L²f₀²
//! ```
//!
//! - *Sources:* H. Fletcher, "Normal vibration frequencies of a stiff piano string", *J. Acoust.
//!   Soc. Am.* 36(1), 203–209 (1964); N. H. Fletcher & T. D. Rossing, *The Physics of Musical
//!   Instruments*, 2nd ed. (Springer, 1998), §2.18.
//! - *Taken:* B and the sharpening of every partial, for pinned ends. The fundamental that sounds
//!   is f₁ = f₀·√(1+B), so a string tuned by ear or tuner to f₁ hears partial n at
//!   n·√((1+Bn²)/(1+B)) times f₁; `taut` reports offsets in cents against n·f₁ (§7.3),
//!   1200·log₂ of that ratio, about 865.6·B·(n² − 1) for small B. Clamped ends add a small
//!   correction factor 1 + (2/π)√B + (4/π²)B that `taut` leaves out.
//! - *Provenance:* the formula **read** in a quotation of Fletcher & Rossing §2.18 and confirmed
//!   by the constant of §5.2; the plain-wire form and the cents **derived**; the clamped-end
//!   factor **from memory**.
//!
//! ### 5.2 Earlier measurements: Schuck & Young (1943), Young (1952)
//!
//! - *Sources:* O. H. Schuck & R. W. Young, "Observations on the vibrations of piano strings",
//!   *J. Acoust. Soc. Am.* 15, 1–11 (1943): partials of piano strings run sharp roughly as the
//!   square of their number, one string's 15th partial sitting near a 16th harmonic; R. W.
//!   Young, "Inharmonicity of plain wire piano strings", *J. Acoust. Soc. Am.* 24(3)
//!   (1952): for steel with Q/ρ = 25.5×10¹⁰ cm²/s² (Q the modulus), the sharpening of mode n is
//!   3.4×10¹³·n²·d²/(ν₀²·l⁴) cents, d and l in cm.
//! - *Taken:* two outside checks of §5.1: Fletcher's B with the same E/ρ reproduces Young's
//!   constant through 1200·log₂√(1+Bn²) ≈ 865.6·B·n², and the 15th-near-16th observation fixes
//!   B = (256/225 − 1)/(225 − 256/225) ≈ 6.155×10⁻⁴. With ρ = 7850, Young's Q/ρ is E = 200 GPa.
//! - *Provenance:* the abstracts **read** (Young 1952 in a transcription); the checks
//!   **derived**. Note that piano technicians' "B" in
//!   cents (after Young) is not Fletcher's dimensionless B.
//!
//! ### 5.3 Wound strings: the core bends, the wrap weighs
//!
//! ```text
//! B_wound ≈ π³·E_core·d_core⁴ / (64·T·L²)     T the tension of the whole string, μ_total·(2Lf)²
//! ```
//!
//! - *Sources:* M. Zollner, *Physik der Elektrogitarre* (Regensburg; English edition *Physics of
//!   the Electric Guitar*), §1.2 on wound strings: the core sets the bending stiffness and the
//!   winding mainly adds mass; Fletcher & Rossing (§5.1) for applying the stiff-string result to
//!   the core. P. Chumnantas, *Inharmonicity in the natural mode frequencies of overwound strings*
//!   (PhD thesis, University of Edinburgh, 1995) shows that end effects of the covering add further
//!   inharmonicity that stiffness alone does not explain.
//! - *Taken:* a wound string's B from its core's diameter and modulus and the whole string's
//!   tension.
//! - *Provenance:* Zollner **read**; the use of the core in B **common practice** (also **from
//!   memory** in Fletcher & Rossing); Chumnantas's abstract **read**, not modelled.
//!
//! ### 5.4 Measured strings of guitars and basses
//!
//! - *Sources:*
//!   - J. Woodhouse, "Plucked guitar transients: comparison of measurements and synthesis",
//!     *Acta Acustica united with Acustica* 90(5), 945–965 (2004), Table I (corrected): a
//!     normal-tension classical set on 0.65 m, tensions E2…E4 71.6, 73.9, 71.2, 58.3, 53.4,
//!     70.3 N and bending stiffness EI 57, 40, 51, 310, 160, 130 ×10⁻⁶ N·m² (E2, A2, D3 wound;
//!     G3, B3, E4 plain nylon); μ of E2 6.24 g/m, of A2 3.61 g/m.
//!   - H. Järveläinen & M. Karjalainen, *Acta Acustica united with Acustica* 92 (2006): measured
//!     open-string B of a steel-string acoustic guitar's E2, A2 and D3, 1.08×10⁻⁴, 6.6×10⁻⁵ and
//!     5.0×10⁻⁵ (gauges not given).
//!   - I. Barbancho et al., "Inharmonicity-based method for the automatic generation of guitar
//!     tablature", *IEEE Trans. Audio, Speech, and Language Processing* 20 (2012): B about
//!     1.56×10⁻⁴ for a 0.046 in electric E2.
//!   - H. Fastl & F. Völk, "Inharmonicity of sounds from electric guitars: physical flaw or
//!     musical asset?": inharmonicity grows with the core's diameter, so a plain G3 can exceed a
//!     wound D3.
//!   - J. A. Kemp, "On inharmonicity in bass guitar strings with application to tapered and lumped
//!     constructions", *SN Applied Sciences* 2:636 (2020): a five-string bass's B0 string reaches
//!     about 100 cents at partial 10 when stopped at fret 12 and at partial 6 at fret 21.
//! - *Taken:* outside bands for the default core ratios of wound strings (§6.3): f = √(T/μ)/(2L)
//!   and B = π²·EI/(T·L²) reproduce Woodhouse's set (μ of D3 = 1.954 g/m from its tension), the
//!   computed B of common steel-string sets must fall near the measured ones, and B of a stopped
//!   string grows as (L_open/L_stopped)², which makes Kemp's two figures agree (B about 3×10⁻⁴ open).
//! - *Provenance:* Woodhouse's table, Järveläinen & Karjalainen and Barbancho **read** in
//!   reproductions that quote them (the originals not seen); Fastl & Völk and Kemp **read**
//!   (abstracts); the recomputed μ, B and the fretting law **derived**.
//!
//! ## 6 Mass per length of a wound string
//!
//! ### 6.1 One layer of round wire, close wound
//!
//! ```text
//! μ = ρ_core·πc²/4 + ρ_wrap·π²·w·(c + w)/4        D = c + 2w
//! ```
//!
//! c is the core diameter, w the wrap wire's, D the outer diameter.
//!
//! - *Source:* geometry: the wrap's centre line runs on a circle of diameter c + w, one turn is
//!   π(c + w) long (the helix pitch neglected) and there are 1/w turns per metre. The piano
//!   trade's covered-string tension formulas, of the form T = (P·L·d/K)²·(1 + f·(D²/d² − 1)) with
//!   a "covering factor" f, have the same structure.
//! - *Taken:* the mass of every wound string. The annulus between c and D has area πw(c + w), so
//!   the wrap term is π/4 of the wrap density times that annulus: round wire fills about 78.5 %
//!   of it.
//! - *Provenance:* **derived**; the agreement with piano practice **common practice**.
//!
//! ### 6.2 Hexagonal cores, several layers, and what carries the load
//!
//! - *Source:* geometry, and trade practice.
//! - *Taken:*
//!   - A regular hexagon of circumradius R has area (3√3/2)·R². Against the circle of the same
//!     nominal diameter that is 0.8270 when the diameter is measured across the corners and
//!     1.1027 across the flats; makers do not agree which one they quote.
//!   - Several layers: apply the one-layer wrap term per layer, each seated on the outer
//!     diameter beneath it, D_i = D_(i−1) + 2w_i.
//!   - Only the core carries tension: core stress = T / A_core. Wraps bear no load.
//! - *Provenance:* the hexagon ratios and the layer rule **derived**; load on the core only,
//!   two copper layers on piano basses, and slightly flattened real wraps **common practice**.
//!
//! ### 6.3 Core ratios and published wound-string masses
//!
//! - *Sources:* J. Chabassier, A. Chaigne & P. Joly, "Modeling and simulation of a grand piano",
//!   *J. Acoust. Soc. Am.* 134(1), 648–665 (2013), string table: the wrapped C2 has a 1.051 mm
//!   steel core and an effective density that gives μ = 20.75 g/m; D♯1 a 1.492 mm core and
//!   μ = 75.5 g/m; plain strings use 7850 kg/m³. Woodhouse (2004, §5.4) for the masses of
//!   nylon-cored guitar basses.
//! - *Taken:* sanity checks for the default core ratios in `src/strings/construction.rs`: the
//!   ratios must be able to represent these masses. The core usually makes up roughly a third to
//!   two thirds of a wound string's outer diameter.
//! - *Provenance:* the piano table **read** in a reproduction that names its source (the pairing
//!   with the 2013 paper **from memory**); the one-third-to-two-thirds band **common practice**
//!   (a trade magazine's article on bass strings); the illustrative wraps that would give these
//!   masses **derived**.
//!
//! ## 7 Pitch
//!
//! ### 7.1 Standard pitch: ISO 16
//!
//! - *Source:* ISO 16:1975, *Acoustics — Standard tuning frequency (Standard musical pitch)*,
//!   which replaced ISO Recommendation R 16 (1955) without technical change.
//! - *Taken:* A4, the A above middle C, is 440 Hz: the default reference of every tuning.
//! - *Provenance:* **read** (the standard's front matter).
//!
//! ### 7.2 Equal divisions, MIDI numbers and just ratios
//!
//! ```text
//! 12-EDO at A4 = 440 Hz:   f = 440·2^((m − 69)/12)    m the MIDI note number, A4 = 69, C4 = 60
//! N equal divisions of P:  f = f_ref·P^(k/N)
//! a just ratio p/q:        f = f_ref·p/q
//! ```
//!
//! - *Source:* the definition of equal temperament, with ISO 16 (§7.1) as the reference.
//! - *Taken:* every pitch of a tuning. Check values: E2 82.4069, A2 110, D3 146.8324, G3 195.9977,
//!   B3 246.9417, C4 261.6256, E4 329.6276 Hz; a textbook guitar problem (Young & Freedman, 14th
//!   ed., ch. 15) lists the open strings as 82.4 … 329.6 Hz.
//! - *Provenance:* the values **derived**; MIDI numbering **from memory**; the textbook list
//!   **read**.
//!
//! ### 7.3 Cents: Ellis (1885)
//!
//! ```text
//! cents = 1200·log₂(f₂/f₁)        ratio = 2^(cents/1200)
//! ```
//!
//! - *Source:* A. J. Ellis, "On the musical scales of various nations", *Journal of the Society of
//!   Arts* 33, no. 1688 (27 March 1885), which introduced the cent as a hundredth of an
//!   equal-tempered semitone; J. P. J. Stock, "Alexander J. Ellis and his place in the history of
//!   ethnomusicology", *Ethnomusicology* 51(2), 306–325 (2007).
//! - *Taken:* every interval in cents. Check values: 3/2 701.9550, 4/3 498.0450, 5/4 386.3137,
//!   6/5 315.6413, 7/4 968.8259, 9/8 203.9100, 81/80 21.5063 cents; the step of 19-EDO 63.1579,
//!   of 31-EDO 38.7097, of 53-EDO 22.6415 cents; a 12-EDO semitone exactly 100.
//! - *Provenance:* the definition **read** (in a contemporary summary and in Stock); the page
//!   range of the paper **from memory**; the values **derived**.
//!
//! ## 8 Fret placement
//!
//! ### 8.1 Where a fret stops the string
//!
//! ```text
//! x(r) = L·(1 − 1/r)        stop for a pitch r times the open string's (any ratio)
//! x_n  = L·(1 − 2^(−n/N))   fret n of N equal divisions of the octave
//! ```
//!
//! - *Source:* Mersenne's first law (§1.1): at fixed tension and mass, frequency goes inversely
//!   with length, so the sounding length for ratio r is L/r. Mersenne, *Harmonie universelle*,
//!   books on string instruments, also describes dividing the octave into twelve equal parts for
//!   the frets of a lute.
//! - *Taken:* every fret position. Check values for L = 648 mm: 12-EDO fret 1 36.3694, fret 5
//!   162.5485, fret 7 215.5119, fret 12 324, fret 24 486 mm; just 9/8 72, 5/4 129.6, 4/3 162,
//!   3/2 216, 5/3 259.2, 15/8 302.4 mm. The old "rule of 18" approximates the exact 12-EDO
//!   constant 1/(1 − 2^(−1/12)) = 17.817154.
//! - *Provenance:* **derived**; the Mersenne passage **read** in its English translation's
//!   table of contents (R. E. Chapman, 1957).
//!
//! ### 8.2 Other divisions and older rules
//!
//! - *Sources:* W. A. Sethares, "Tunings for 19 tone equal tempered guitar", *Experimental Musical
//!   Instruments* VI(6) (1991): a 19-EDO step is 1200/19 ≈ 63.16 cents; V. Galilei, *Dialogo della
//!   musica antica et della moderna* (1581): each fret one eighteenth of the remaining length
//!   beyond the one before.
//! - *Taken:* checks of the general fret formula on other divisions. For 648 mm, 19-EDO frets 1,
//!   9 and 19 lie at 23.214, 181.360 and 324 mm, 31-EDO fret 1 at 14.328 mm. Galilei's rule is a
//!   constant step of ratio 18/17 (98.955 cents), so twelve steps fall about 25 cents short of an
//!   octave; on 648 mm its first two frets are at exactly 36 and 70 mm.
//! - *Provenance:* Sethares **read**; the attribution of the rule of 18 to Galilei's *Dialogo*
//!   **from memory**; the distances and the ratio **derived**.
//!
//! ### 8.3 Levers, pedal discs and pulling changers
//!
//! ```text
//! stop (lever, disc):   x = L·(1 − 1/r)    the grip, from the nut or top; T unchanged, L' = L/r
//! pull (changer):       T' = T·r²          same length and μ (§1.2); stress grows by r² too
//! ```
//!
//! - *Source:* §8.1 for the stop (a lever or a pedal disc stops the string as a fret does) and
//!   §1.2 for the pull (T = μ(2Lf)² at fixed L and μ); that harp levers and pedal discs shorten
//!   the string while the tension stays, and that a pedal harp's strings sound flat when open,
//!   natural and sharp with one and two discs engaged, is common practice.
//! - *Taken:* every position `taut plan` reports for a course's `raises`, the stress checked at
//!   the highest position, the tension at the lowest and the load at the worst setting. The
//!   small rise in tension as a lever deflects the string is left out.
//! - *Provenance:* the formulas **derived**; the mechanisms **common practice**; the keys a
//!   lever harp tuned in E-flat reaches (E-flat to E major, eight keys) **common practice**.
//!
//! ## 9 Working stress
//!
//! - *Sources:* Shigley, Table 10-5 (§4.3): music wire starts to take a set above 65–75 % of its
//!   tensile strength; Zollner (§5.3), §1.2: plain guitar strings at pitch run at up to about
//!   2000 N/mm².
//! - *Taken:* the stress bands of the selector and the warnings. Piano makers treat about 70 % of
//!   the breaking strength as the upper limit for plain wire and design well below it, most
//!   strings sitting between roughly 30 and 60 %; harp and early-music makers keep a string about
//!   three to six semitones below its breaking pitch, i.e. 71 % to 50 % of its breaking stress by
//!   §1.2; beyond about 80–90 % breakage becomes likely.
//! - *Provenance:* Shigley and Zollner **read**; the percentages **common practice** (no textbook
//!   statement found; they depend on which breaking-strength figures one uses); the conversion
//!   from semitones **derived**.
//!
//! ## 10 Known gaps and cautions
//!
//! - The ASTM tables (§4.1, §4.2) were read in reproductions: cite the standard and its table,
//!   and never present converted MPa values as the standard's own metric figures.
//! - No published B was found together with the d, L and T that produced it and readable here;
//!   the Young (1952) constant (§5.2) is the closest outside check of Fletcher's formula, and
//!   the measured guitar values (§5.4) come without gauges, so their tests use wide bands.
//! - Strengths of string-grade nylon, fluorocarbon and gut (§4.4) are weakly sourced; tests on
//!   them should use ranges. Gut's density moves with humidity.
//! - Inharmonicity in cents has two conventions, against n·f₀ and against n·f₁ (§5.1); `taut` uses
//!   n·f₁, which is what a player tuning the fundamental hears.
//! - Published piano tables give the sounding fundamental, so T = μ(2Lf)² overshoots their treble
//!   tensions by about 1 %; a stiffness correction or a tolerance of about 1.5 % is needed.
//! - Bulk polymer moduli (§3.2) understate a string's stiffness at playing stress by a factor of
//!   about four.
//! - *Provenance:* **derived** from the entries above; the caution about conventions also
//!   **read** in the sources of §5.
//!
//! ## 11 Sound and MIDI
//!
//! ### 11.1 The ideal pluck: partial amplitudes
//!
//! ```text
//! y(x, 0) = a triangle of height h with its apex at x = βL, released from rest
//! c_n     = 2h·sin(nπβ) / (n²·π²·β·(1 − β))      amplitude of mode n (displacement)
//!         ∝ sin(nπβ) / n²
//! ```
//!
//! - *Source:* N. H. Fletcher & T. D. Rossing, *The Physics of Musical Instruments*, 2nd ed.
//!   (Springer, 1998), ch. 2, the section on the plucked string (time and frequency analysis);
//!   the same Fourier series in any text on the wave equation.
//! - *Taken:* the amplitude of every partial of `taut`'s string sound (`src/sound/`): partial n
//!   goes as sin(nπβ)/n² for a pluck at the fraction β of the length, so a pluck at β = 1/k has
//!   no partials at multiples of k (at β = 1/2 no even partials). `taut` keeps the shape and
//!   drops the constant, and applies the same amplitudes to a stiff string's modes (the mode
//!   shapes of a pinned stiff string are the same sines).
//! - *Provenance:* the series **derived** (the Fourier sine series of the triangle); the book's
//!   section **from memory** (its number not checked).
//!
//! ### 11.2 Damping: one decay rate per partial
//!
//! ```text
//! σ(ω) = b₁ + b₃·ω²          decay rate of a partial at angular frequency ω = 2πf, in 1/s
//! a(t) = a₀·e^(−σt)          T₆₀ = ln(1000)/σ ≈ 6.91/σ
//! ```
//!
//! - *Source:* A. Chaigne & A. Askenfelt, "Numerical simulations of piano strings. I. A
//!   physical model for a struck string using finite difference methods", *J. Acoust. Soc. Am.*
//!   95(2), 1112–1118 (1994): the damped stiff-string equation with a first-order loss term
//!   −2b₁·∂y/∂t and a third-order term 2b₃·∂³y/∂t³, whose modes decay at σ ≈ b₁ + b₃·ω².
//! - *Taken:* the frequency-dependent decay of every rendered partial: high partials die away
//!   faster, as on a real string. The defaults b₁ = 0.6 s⁻¹ and b₃ = 4×10⁻⁹ s are `taut`'s own
//!   choice, of the order of the paper's fitted piano-string values: a fundamental rings for
//!   about 11 s (T₆₀) and a partial at 5 kHz for about 1.5 s. They are not a measurement of any
//!   particular string, body or room.
//! - *Provenance:* the paper, its damping terms and the list of symbols **read** (in a
//!   reproduction of the paper's first page); the decay rate of a mode **derived** from the
//!   equation for light damping; the order of magnitude of the paper's values **from memory**.
//!
//! ### 11.3 A fretted note's inharmonicity
//!
//! ```text
//! L' = L·f_open/f          (§8.1: same tension and mass, shorter length)
//! B' = B·(f/f_open)²       (§5.1: B ∝ 1/L² at fixed d, E and T)
//! ```
//!
//! - *Source:* §5.1 and §8.1.
//! - *Taken:* a degree played on a string stopped above its open pitch keeps the string's
//!   tension and takes the shorter length's B. The small rise in tension from pressing the
//!   string to the fret is left out.
//! - *Provenance:* **derived**.
//!
//! ### 11.4 The MIDI Tuning Standard
//!
//! ```text
//! frequency data  xx yy zz         xx the 12-EDO semitone (MIDI note, A4 = 69 at 440 Hz) at or
//!                                  below the frequency; yy zz a 14-bit fraction of 100 cents above
//!                                  it, yy the high 7 bits (resolution 100/16384 ≈ 0.0061 cents)
//!                                  7F 7F 7F means "no change"
//! m = 69 + 12·log₂(f / 440 Hz)     the fractional note number the three bytes encode
//! bulk tuning dump                 F0 7E dev 08 01 pp name[16] (xx yy zz)×128 checksum F7
//! single-note change (real time)   F0 7F dev 08 02 pp ll (kk xx yy zz)×ll F7
//! checksum                         XOR of every byte from 7E to the last data byte, & 7F
//! ```
//!
//! - *Source:* MIDI Manufacturers Association, *MIDI Tuning Standard* (1992), a part of *The
//!   Complete MIDI 1.0 Detailed Specification*, the sections "Frequency data format", "Bulk
//!   tuning dump" and "Single note tuning change (real-time)". Its worked examples of the
//!   frequency data: 00 00 00 = 8.1758 Hz (note 0), 01 00 00 = 8.6620 Hz, 0C 00 00 = 16.3516 Hz,
//!   3C 00 00 = 261.6256 Hz (middle C), 3D 00 00 = 277.1826 Hz, 44 7F 7F = 439.9984 Hz,
//!   45 00 00 = 440.0000 Hz, 78 00 00 = 8372.018 Hz, 7F 7F 7E the highest value (about
//!   13289.66 Hz). The printed table has known errors in its last decimals (00 00 01 is printed
//!   as 8.2104 Hz, and 7F 7F 7E as 13289.73 Hz); the values above are the formula's, which the
//!   MIDI association's forum confirms.
//! - *Taken:* every byte of `taut tuning midi` (`src/midi/`): the frequency data, the bulk dump
//!   with its checksum, the single-note changes, and the range the standard can express.
//! - *Provenance:* the frequency data format and the worked values **read** (in a quotation of
//!   the specification's text and the association's forum); the message layouts and the
//!   checksum **from memory** (the specification itself not opened), consistent with the forum's
//!   quotation of the single-note message.
//!
//! ### 11.5 Standard MIDI Files and WAV
//!
//! - *Sources:* MIDI Manufacturers Association, *Standard MIDI Files 1.0* (1988), in *The
//!   Complete MIDI 1.0 Detailed Specification*: the `MThd` and `MTrk` chunks, variable-length
//!   delta times, the `F0 length bytes` form of a system-exclusive event, the tempo meta event
//!   (FF 51 03) and end of track (FF 2F 00); the WAV (RIFF) format of Microsoft and IBM's
//!   *Multimedia Programming Interface and Data Specifications 1.0* (1991), written and read
//!   through the `hound` crate.
//! - *Taken:* the layout of the MIDI files and the sound files `taut` writes.
//! - *Provenance:* **from memory** (the specifications not opened); the files `taut` writes are
//!   read back by independent parsers in the tests (`midly`, `hound`).
//!
//! ## 12 Builders' sheets
//!
//! ### 12.1 Colour marking of harp strings
//!
//! - *Source:* the trade; no published standard was found.
//! - *Taken:* the order sheet's optional marking column: the C strings of a harp are coloured
//!   red and the F strings dark blue (some makers use black), so a harpist finds the octaves at
//!   a glance; the other strings are left plain.
//! - *Provenance:* **common practice**, **from memory**.
//!
//! ### 12.2 Cut length
//!
//! ```text
//! cut = anchor length + vibrating length + post length
//! ```
//!
//! - *Source:* geometry of a string run from its anchor over the two ends of its vibrating
//!   length to the tuning post.
//! - *Taken:* the order sheet's cut length, where the instrument states its anchor and post
//!   lengths; the turns round the post are left to the maker.
//! - *Provenance:* **derived**.
//!
//! ### 12.3 The same strings on another scale length
//!
//! ```text
//! T = μ·(2Lf)²   ⇒   T₂/T₁ = (L₂/L₁)²   at the same μ and f
//! 647.7 mm → 685.8 mm:  (685.8/647.7)² − 1 = 12.11 %
//! ```
//!
//! - *Source:* §1.2 (Mersenne's law, §1.1, solved for the tension).
//! - *Taken:* the outside check of `taut compare`: one set moved from a 25.5 in to a 27 in
//!   scale at the same pitches pulls 12.11 % more on every string and in total.
//! - *Provenance:* **derived**.
