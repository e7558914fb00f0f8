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
  }
]
