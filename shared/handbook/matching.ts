import type { HandbookSection } from './types'

/** §4: mismatch, INL and DNL statistics, yield and area. */
export const MATCHING: HandbookSection[] = [
  {
    id: '4',
    title: 'Mismatch, linearity statistics, yield and area',
    body: [
      'Random mismatch between nominally equal resistors sets how large the units must be, and the units\' area usually dominates the converter\'s area. Rungwise sizes each candidate\'s unit so that the analytic INL and DNL yields reach the target, then reports area, yields and margins; Monte Carlo on exactly solved sampled circuits checks the analytic yield.'
    ],
    sources: ['See the subsections.']
  },
  {
    id: '4.1',
    title: 'The area law for resistor matching',
    body: [
      'Two identical, nearby resistors differ by a random amount whose standard deviation falls with the square root of their area. The coefficient A_R is a property of the resistor layer and must come from the foundry.',
      'Watch the convention: a coefficient measured on pairs describes the difference of two devices. The spread of one device about the array mean, which the converter formulas use, is smaller by √2. The process form asks which convention a number follows.',
      'Given the allowed σ_u, the unit area follows directly; the unit\'s width and length then follow from the unit value and the sheet resistance. Resistor area is units × unit area × a layout overhead for dummies and spacing (typically 1.5 to 3, common practice). When matching needs less area than the minimum drawable unit, the minimum decides.'
    ],
    formulas: [
      { text: 'σ(ΔR/R) = A_R,pair / √(W·L);  σ_u = A_R,pair / √(2·W·L)', label: 'published' },
      { text: 'W·L ≥ (A_R,single / σ_u)²', label: 'derived' }
    ],
    sources: [
      'M. J. M. Pelgrom, A. C. J. Duinmaijer, A. P. G. Welbers, "Matching properties of MOS transistors", IEEE JSSC 24(5), 1989: the area law (stated for MOS parameters; applied to resistors in common practice).',
      'P. G. Drennan, C. C. McAndrew, IEEE JSSC 38(3), 2003: the simple law fails for narrow and short devices.',
      'T. O\'Dwyer, M. Kennedy, PRIME 2009: resistor layers in one process match differently.'
    ],
    cautions: ['Typical coefficients span roughly 0.3 to 5 %·µm across layers (from memory); never size a real design without foundry data, including edge, contact and gradient terms.']
  },
  {
    id: '4.2',
    title: 'Resistor string statistics',
    body: [
      'With independent unit errors, a string normalises itself to the reference, so its INL at code k is a partial sum of errors minus its share of the total: a random walk pinned at both ends. Its spread is largest at mid-scale, half of σ_u·√(2^N). Each step carries one unit\'s own error, so σ_DNL is about σ_u.',
      'Systematic effects behave differently. Half the string high and half low by δ gives a worst INL of 2^(N−1)·δ; a linear gradient gives a parabola peaking at mid-scale. Common-centroid and folded layouts aim at the gradient.'
    ],
    formulas: [
      { text: 'Var INL(k) = σ_u² · k (2^N − k) / 2^N;  σ_INL,mid = ½ · σ_u · √(2^N)', label: 'derived' },
      { text: 'σ_DNL ≈ σ_u', label: 'derived' },
      { text: 'gradient g end to end: INL_peak = g · 2^N / 8', label: 'derived' }
    ],
    sources: ['R. J. Baker, CMOS Circuit Design, Layout, and Simulation: the worst-case string INL and its worked example. M. Pelgrom, Analog-to-Digital Conversion: the ½√n law for unary arrays (memory). Checked here by Monte Carlo.']
  },
  {
    id: '4.3',
    title: 'INL yield: which formula to use',
    body: [
      'Item 1. The current-steering yield model of Van den Bosch, Steyaert and Sansen bounds σ_u by 1 / (2·C·√(2^N)). For strings it is safe but conservative: it asks for about 2.7 times the area at 99.7 %.',
      'Item 2. For strings and the end-point INL of any unary array, INL is a pinned random walk, and the chance that its largest excursion stays inside the target follows the Kolmogorov distribution. Rungwise uses this for strings and unary sections; Monte Carlo reproduces the target yield closely.',
      'Item 3. Checking only the mid-scale code is optimistic (it gave 97.8 % where 99.7 % was asked) and is not used.',
      'Item 4. Best-fit INL yields are much higher than end-point yields for the same circuit. Always read a yield together with its INL definition.',
      'Item 5. Segmented and arbitrary arrays have published refinements; binary and thermometer sections\' DNL are nearly uncorrelated, so section yields multiply. DNL yield treats the steps as nearly independent; monotonicity at a step is the chance that its DNL stays above −1 LSB.'
    ],
    formulas: [
      { text: 'Y_INL ≈ K(T_INL / (σ_u · √(2^N)))   with K(x) = 1 − 2 Σ (−1)^(j−1) e^(−2 j² x²)', label: 'derived' },
      { text: 'Y_DNL ≈ Π_k [2Φ(T_DNL / σ_DNL,k) − 1];  Y_mono ≈ Π_k Φ(1 / σ_DNL,k)', label: 'derived' },
      { text: 'Van den Bosch: σ_u ≤ 1 / (2 · C(Y) · √(2^N))', label: 'memory' }
    ],
    sources: [
      'J. Van den Bosch, M. Steyaert, W. Sansen, an accurate statistical yield model for CMOS current-steering D/A converters (ISCAS 2000; AICSP 2001): the claim confirmed, the formula from memory.',
      'M. Kosunen et al., ISCAS 2003, and H. Park, C.-K. K. Yang, IEEE TCAS-II 59(9), 2012: segmented yield models and the independence of section DNL.',
      'K. R. Lakshmikumar et al., IEEE JSSC SC-21(6), 1986, and their 1988 reply: early yield models underestimated yield because outputs are correlated.',
      'Kolmogorov distribution of the supremum of a Brownian bridge (standard mathematics, from memory); checked here by Monte Carlo.'
    ]
  },
  {
    id: '4.4',
    title: 'R-2R ladders: a different scaling',
    body: [
      'A binary array built from 2^i parallel units has a mid-scale DNL spread that grows with √(2^N). An R-2R ladder does not: its MSB weight is set by one leg and one series resistor, so the mid-scale step error grows with 2^(N−1) itself. The coefficient depends on how 2R is built: about 0.894 for two units in series and about 1.155 for a single unit-area element. The worst end-point INL spread is half the mid-scale DNL spread.',
      'Uniform units are therefore expensive at high resolution. Scaling the units down toward the LSB end (about three times smaller per stage) keeps the DNL spread within about 10 % while cutting matching area several-fold.',
      'Equal switch resistance r in every leg gives a systematic mid-scale DNL of about −2^N·r / (6R); binary-scaled switches or leg trimming are the usual remedies (common practice).'
    ],
    formulas: [
      { text: 'σ_DNL,mid = κ · 2^(N−1) · σ_u,  κ = √0.8 (2R = two units) or √(4/3) (one element)', label: 'derived' },
      { text: 'DNL_mid ≈ −2^N · r_switch / (6R)', label: 'derived' }
    ],
    sources: ['Derived here and checked with exact nodal sensitivities and Monte Carlo; the unit-element binary case from a public design-forum derivation, re-derived.']
  },
  {
    id: '4.5',
    title: 'Segmented arrays',
    body: [
      'In the segmented form the worst step is at the boundary between the unary and binary parts; its spread scales with 2^L, so every extra unary bit roughly halves it and quarters the DNL-limited area, until INL takes over.',
      'INL behaves like a string of 2^M legs of weight 2^L. Once M is about 3 or more, the INL-limited area is the same as that of a full string of the same resolution and no longer depends on M. This mirrors the known current-steering result: segmentation improves DNL, not INL.'
    ],
    formulas: [
      { text: 'σ_DNL,boundary ≈ √0.8 · 2^L · σ_u', label: 'derived' },
      { text: 'σ_INL,mid ≈ ½ · 2^L · √(2^M) · σ_u / √2', label: 'derived' }
    ],
    sources: ['C.-H. Lin, K. Bult, IEEE JSSC 33(12), 1998: the segmentation trade-off (details from memory). A 40-nm 10-bit segmentation study: DNL falls sharply with segmentation while INL stays put. Resistive forms derived here.']
  },
  {
    id: '4.6',
    title: 'Area: how the comparison adds it up',
    body: [
      'Each candidate\'s unit is sized for whichever of INL and DNL asks more; the drawn unit is the larger of that matching area and the smallest unit the width and length rules allow for the chosen unit value. Reported area is resistors (with overhead) plus switches plus decoder gates.',
      'As an order of magnitude at 10 bits, 99.7 % and A_R,single = 1 %·µm: a string needs about 1 400 µm² of matching area in total, a uniform-unit R-2R about 23 000 µm², and a segmented converter with M ≥ 3 about the string\'s figure plus its decoder. Real strings are often set by the value-driven minimum unit and by their switches instead.'
    ],
    formulas: [
      { text: 'area = units × max(A_matching, A_minimum) × overhead + switches × A_switch + gates × A_gate', label: 'common-practice' }
    ],
    sources: ['Derived here from §4.1–§4.5; the overhead factor is common practice.'],
    cautions: ['Trimming or calibration changes the picture: fewer, larger elements are easier to trim, and a calibrated design can use far smaller units.']
  },
  {
    id: '4.7',
    title: 'Switch on-resistance in ladders and how designers compensate it',
    body: [
      'Every leg of an R-2R ladder (voltage or current mode) and every leg of a segmented converter reaches the reference or ground through a switch. Its on-resistance R_on adds to the leg, so the leg is no longer exactly 2R and the binary weights drift. The error is systematic: every part made has it, and no amount of matching area removes it. It grows with 2^N·R_on/R (§4.4 gives the mid-scale step), and when the step reaches −1 LSB the nominal circuit itself is non-monotonic (§4.8). Rungwise\'s exact solve includes R_on in every leg, so the systematic INL and DNL it reports already contain it.',
      'Three compensations are standard. Absorb the switch: draw each leg resistor as 2R − R_on, so leg plus switch is 2R again. Match it with a dummy: keep the legs at 2R + R_on, put a dummy switch (always on) in the termination, and make each series arm R + R_on/2; every node then sees the same resistance both ways and the weights are binary again. Scale the switch widths with the current each leg carries, so each switch drops the same share of its leg (used mostly in current-mode ladders, where leg currents are fixed). A dummy in the termination alone does not fix the weights.',
      'What remains after any of these is R_on\'s departure from the value it was compensated for: its spread over process corners and temperature relative to the resistor (a MOS switch moves far more with temperature than a poly resistor), the difference between the switch to the reference and the switch to ground, and the mismatch between switches, which falls with the switch\'s area like any device. Wider switches lower all of these but cost area and inject more charge (glitch, §5).',
      'A working rule: give the switches no more than about a tenth of the INL and DNL budget, and size them (or choose R) so that the residual fits.'
    ],
    formulas: [
      { text: 'absorbed: R_leg = 2R − R_on  ⇒  R_leg + R_on = 2R', label: 'derived' },
      { text: 'dummy: legs 2R + R_on, series arms R + R_on/2, termination 2R + R_on', label: 'derived' },
      { text: 'residual ≈ 2^N · ΔR_on / (6R),  ΔR_on = spread (process, temperature) + mismatch of R_on', label: 'derived' },
      { text: 'switch share of the error budget ≈ 1/10', label: 'common-practice' }
    ],
    sources: [
      'Both exact compensations derived (every node again sees the same resistance toward both ends, so the weights are binary); the engine builds every handling (§11) and ngspice reproduces each exported design to 1e-9 of full scale (tests/unit/shared/core/switch-design.spec.ts). The uncompensated 8-bit case (R = 10 kΩ, R_on = 50 Ω: DNL about −0.21 LSB) is checked in the rule tests against the §4.4 estimate.',
      'Scaled switch widths in current-mode ladders and the tenth-of-the-budget rule: common practice, no source.',
      'On-resistance spread with temperature larger than a poly resistor\'s, and mismatch falling with area: from memory.'
    ],
    cautions: ['The engine models the spread of R_on as two corners (± the process\'s switch spread) and its mismatch as a random σ falling with width (§11); check the residual after compensation against the foundry\'s switch models over corners and temperature.']
  },
  {
    id: '4.8',
    title: 'Systematic errors: the nominal circuit, loading and buffer offset',
    body: [
      'Rungwise solves the nominal circuit (no mismatch) exactly at every code and reports its INL and DNL as the systematic part. It contains every deterministic effect the solver models: switch on-resistance (§4.7), one string loading another in an unbuffered two-stage string (§2.5), and, when the spec names a load resistance, the divider between the output resistance and that load. The per-code chart of nominal DNL shows where each systematic step sits.',
      'A nominal step at or below −1 LSB means the output falls (or stalls) when the code rises in every part made: a monotonicity requirement then fails outright, whatever the yield figures say, and the findings report it as failing the spec rather than as a risk.',
      'Loaded INL is the nominal INL with the load resistance R_L on the output. A string\'s output resistance changes with the code (largest at mid-scale), so R_out(k)/(R_out(k) + R_L) bends the transfer into a bow; an R-2R ladder\'s output resistance is the same at every code, so the load only scales the gain. The cure is an output buffer or a much larger load.',
      'In a buffered two-stage string the two buffers that copy the segment ends onto the fine string each have an offset. Their difference adds directly to the step at every coarse-segment boundary; it is random from part to part, so it enters the DNL and monotonic yields with σ √2·σ_offset, and no resistor area reduces it. A larger input pair, offset trim or auto-zero lowers it.'
    ],
    formulas: [
      { text: 'DNL_nominal(k) ≤ −1 LSB  ⇒  not monotonic at step k → k + 1', label: 'published' },
      { text: 'V_loaded(k) = V(k) · R_L / (R_out(k) + R_L)', label: 'derived' },
      { text: 'σ_DNL,boundary = √2 · σ_offset / V_LSB   (two independent buffer offsets)', label: 'derived' }
    ],
    sources: [
      'Monotonicity from the DNL definition: IEEE Std 1658-2011, from memory for the clause.',
      'Loaded transfer and the boundary offset: derived here; the loaded INL comes from the same exact nodal solve with the load added.'
    ],
    cautions: ['A buffer adds its own offset drift, noise and settling; the two-stage model takes its offset as a random σ only.']
  }
]
