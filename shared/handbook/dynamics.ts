import type { HandbookSection } from './types'

/** §5–§10: glitch, dynamics and reference loading, segmentation, noise, check values, cautions. */
export const DYNAMICS: HandbookSection[] = [
  {
    id: '5',
    title: 'Glitch: a first-order model for ranking',
    body: [
      'Count what switches at a transition a → b: a binary section toggles one switch per changed bit, a thermometer section one element per leg turned on or off, and a directly decoded string always two (one tap off, one on), so a string has almost no skew glitch and its glitch hardly changes with the code.',
      'Skew term. If the elements turning on and those turning off switch Δt apart, the output spends Δt at a wrong level. Against an ideal step at the mean instant, the area is half the summed weights of both groups times V_LSB times |Δt|, and zero when only one group moves. At a binary major carry this is about half the full scale times Δt; segmenting with M unary bits cuts it by about 2^(M−1).',
      'Charge term. Each switch dumps some charge on its node; through the node\'s resistance R_out it becomes an area α·q·R_out, independent of the node capacitance. α is the share that reaches the output: near 1 for a string\'s tap switch, small for ladder legs that sit on the reference or ground.',
      'That is why a string, despite its two switches, often shows the largest glitch in a comparison: its output resistance is large (a quarter of the whole string at mid-scale, §2.1), and the tap switch sits right on the output. A 10-bit string of 10 kΩ units peaks near 2.6 MΩ, so every femtocoulomb reaching the output is about 2.6 nV·s; with a binary-tree decoder several switches in the path toggle, and tens of nV·s are the expected result, not an error of the model. A ladder\'s legs swing between low-impedance nodes and its output resistance is R or less, so the same charge costs it a tiny fraction of that. The cures differ accordingly: a string needs less charge (smaller or complementary tap switches, half-size dummies that cancel the charge) or a lower resistance for it to leave through (smaller units, an output buffer at the tap), while a binary ladder needs unary MSBs and tighter timing against its skew term.',
      'Rungwise adds both terms for each transition and reports the worst, with the major carry and the segment boundaries always included. Break-before-make gaps and unsynchronised tree decoders are not modelled and are flagged for simulation.'
    ],
    formulas: [
      { text: 'GI_skew ≈ ½ · (W_on + W_off) · V_LSB · |Δt|   (both groups non-empty)', label: 'derived' },
      { text: 'GI_q ≈ α · n_toggled · q_switch · R_out', label: 'derived' },
      { text: 'string: R_out,max ≈ 2^N · R / 4  ⇒  GI_q ≈ α · n_toggled · q_switch · 2^N · R / 4', label: 'derived' }
    ],
    sources: [
      'R. J. Baker, CMOS Circuit Design, Layout, and Simulation: skewed lower bits briefly applying the all-zeros code at mid-scale. W. Kester (ed.), Data Conversion Handbook: the string\'s code-independent switching activity.',
      'The charge term and the string\'s large impulse: derived here (charge into a resistance, independent of the capacitance). Complementary and dummy switches against charge injection: common practice, no source.'
    ],
    cautions: ['Glitch figures rank architectures; the real glitch depends on driver timing, layout, supply and reference bounce, digital feedthrough and the output buffer.']
  },
  {
    id: '6',
    title: 'Dynamics and reference loading',
    body: [
      'A single-pole output settles a full-scale step to ±½ LSB in (N + 1)·ln 2 time constants: about 7.6 τ at 10 bits, 9.0 τ at 12 and 11.8 τ at 16. τ is the worst driving resistance into the load capacitance. The update-rate check adds the latch delay; a buffer adds its own slew and settling.',
      'With a voltage-mode ladder, a reference source resistance R_s drops the internal reference by R_s·I_REF(code). Since I_REF changes with the code, that becomes INL growing roughly with 2^N·N·R_s/R. Rungwise computes the largest R_s that keeps this inside the INL budget from the exact reference current of every code, instead of a fixed rule. The same current steps must also settle on the reference within an update period.',
      'Strings and current-mode ladders load the reference with a constant resistance, so R_s only scales their gain.',
      'The same exact reference current gives the reference power: V_REF·I_REF at the heaviest code (the figure checked against the power budget) and averaged over all codes. It falls as 1/R and, in a segmented converter, grows with the 2^M − 1 unary legs in parallel; a string draws V_REF²/(2^N·R) at every code.'
    ],
    formulas: [
      { text: 't_settle = τ · (N + 1) · ln 2,  τ = R_out,max · C_load', label: 'common-practice' },
      { text: 'f_update,max ≈ 1 / (t_settle + t_latch)', label: 'common-practice' },
      { text: 'P_ref,max = V_REF · max_k I_REF(k)', label: 'derived' }
    ],
    sources: ['Single-pole settling (standard), common practice. Reference-source sensitivity derived here with the exact reference current.'],
    cautions: ['The reference buffer, its decoupling and the package and board path must be verified; the limits here assume an ideal or first-order reference.']
  },
  {
    id: '7',
    title: 'The segmentation trade',
    body: [
      'Moving from a plain ladder (M = 1) toward a full string, the worst DNL spread falls from about 2^(N−1)·σ_u to σ_u, the skew glitch from half the full scale to almost nothing, and the output resistance from R to 2R / 2^M. In exchange, switch count, decoder size and reference load grow with 2^M, and the INL-limited area stays where it was.',
      'A good default, and the advice the built-in rules give: take the smallest M that meets the DNL and glitch targets, then check that decoder area and reference load are acceptable (common practice).'
    ],
    sources: ['C.-H. Lin, K. Bult, IEEE JSSC 1998: an optimum at intermediate segmentation (details from memory). A 40-nm 10-bit segmentation sweep: DNL improves from about ±0.47 to ±0.025 LSB while INL stays about ±0.35 LSB.']
  },
  {
    id: '8',
    title: 'Noise',
    body: [
      'The output resistance produces thermal noise √(4kT·R_out·Δf); a string is worst at mid-scale. With a single-pole load the total integrated noise is √(kT/C) whatever the resistance: 64 µV rms for 1 pF at 300 K. Compare both with the quantisation noise V_LSB/√12.',
      'Reference noise passes to the output in proportion to the code for strings and voltage-mode ladders.'
    ],
    formulas: [
      { text: 'v_n = √(4 k_B T · R_out · Δf);  v_n,total = √(k_B T / C)', label: 'published' },
      { text: 'k_B = 1.380649 × 10⁻²³ J/K (exact, SI 2019)', label: 'published' }
    ],
    sources: ['Johnson–Nyquist thermal noise and kT/C (standard physics, cited from memory).']
  },
  {
    id: '9',
    title: 'Check values',
    body: [
      'The worked numbers in these sections (settling factors, noise at 10 kΩ and 1 MHz, the R-2R coefficients, the 10-bit areas) are asserted by the test suite against the engine, each with the source of its expected value named beside the check. More values are kept outside the project and run against it.'
    ],
    sources: ['The project\'s tests.']
  },
  {
    id: '10',
    title: 'Cautions',
    body: [
      'Rungwise ranks architectures with first-order models. Read every number with these limits in mind.'
    ],
    sources: ['Common practice of analog design review.'],
    cautions: [
      'Sign-off needs transistor-level simulation with the foundry\'s resistor and switch models, mismatch Monte Carlo, corners, temperature and extracted parasitics.',
      'Mismatch inputs (the coefficient, its pair or single convention, edge and contact terms, gradients) must come from the process design kit; the ranges here are illustrative.',
      'Yields depend on the INL definition (end-point, best-fit) and on whether gain and offset are trimmed or calibrated; Rungwise states which definition it used.',
      'Systematic effects lie outside the random models: gradients, voltage and temperature coefficients, self-heating of MSB legs, switch resistance and its signal dependence, contact resistance, leakage at high temperature and buffer offset.',
      'Glitch figures are relative rankings.',
      'Reference-load and settling limits assume an ideal or first-order reference.',
      'Current-mode ladders need an I-V amplifier that is stable over the code-dependent source resistance.',
      'ESD, overvoltage and safe-operating limits at the reference pins are out of scope.'
    ]
  }
]
