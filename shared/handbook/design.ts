import type { HandbookSection } from './types'

/** §4.9: how Rungwise sizes units and finds its fast yields. */
export const SAMPLED_SIZING: HandbookSection[] = [
  {
    id: '4.9',
    title: 'Sizing and fast yields on a fixed sample of circuits',
    body: [
      'The closed forms of §4.3–§4.5 treat the errors as purely random and, for most arrays, as independent steps. A real candidate also carries deterministic errors: switch on-resistance and what is left of it after compensation (§11), the loading of a two-stage string, and the spread of the switches between corners. Those errors and the random ones add code by code, and a closed form cannot know where they line up.',
      'Rungwise therefore sizes each candidate on a fixed, seeded sample of circuits (1,000 to 4,000, fewer for large arrays), each solved exactly by the same code as the Monte Carlo, with the deterministic errors in every circuit. To first order a circuit\'s error at every code is its nominal error plus σ_u times a random part, so the worst error grows with σ_u along a convex curve. Two solves of a circuit (without and with resistor mismatch) give the σ_u at which it stops meeting each target; the σ_u for a yield is then read from the sample.',
      'A unit sized exactly at the sample\'s yield would fall short of the target about half the time. The sizing therefore asks the sample to clear the target with a 99 % one-sided Wilson margin. Where the target asks for more than the sample can resolve, a Gaussian tail fitted to the sample\'s failing circuits extends it, read at half the allowed failure rate.',
      'The fast yields shown before any Monte Carlo run are the pass fractions of that same sample at the drawn unit: they include everything the Monte Carlo includes and agree with it within its confidence interval. The sample is seeded apart from the Monte Carlo seed, so a candidate\'s area never depends on the seed of a run, and the Monte Carlo is an independent check of the sizing.',
      'Arrays too large to sample within the time of a live preview (strings above 11 bits, segmented DACs with more than 2^11 unary legs) are sized by the closed forms with the targets reduced by the nominal error. Their fast yields are marked as estimates; a Monte Carlo run confirms them.'
    ],
    formulas: [
      { text: 'f(σ_u) = max_k |n_k + σ_u·g_k| (convex in σ_u); σ_crit = σ_s·(T − f(0)) / (f(σ_s) − f(0))', label: 'derived' },
      { text: 'σ_u(Y) = the largest σ_u with WilsonLow_{99 %}(passes(σ_u), K) ≥ Y', label: 'derived' },
      { text: 'tail: P(σ_crit < σ) ≈ exp(α − β/σ²) through the 2.5 % and 5/K points', label: 'derived' }
    ],
    sources: ['Derived for Rungwise and checked against its own Monte Carlo over random specs (tests/unit/shared/core/fast-yield-agreement.spec.ts)', 'Wilson score interval: E. B. Wilson, J. Am. Stat. Assoc. 1927 (from memory)'],
    cautions: ['A margin on a finite sample is not a guarantee: run Monte Carlo with more trials before a decision that rests on a yield close to its target.']
  }
]

/** §11: switch on-resistance in ladders and segmented DACs. */
export const SWITCH_DESIGN: HandbookSection[] = [
  {
    id: '11',
    title: 'Switch on-resistance and its compensation',
    body: [
      'Every leg of an R-2R ladder, and every unary and ladder leg of a segmented DAC, ends in a changeover switch whose on-resistance r adds to the leg. Left alone, equal switches break the binary weights: the midscale step of a voltage-mode ladder moves by about −2^N·r/(6R) LSB, so a few tens of ohms in 10 kΩ legs make a 12-bit ladder non-monotonic.',
      'An architect compensates before comparing. Rungwise tries four handlings, each at switch widths from 1 to 64 times the process\'s switch: none; absorbed (the leg resistor is drawn 2R − r, so leg plus switch is 2R again); a matched dummy (legs 2R + r, series arms and the segmented joint R + r/2, and an always-on dummy switch in the termination, which makes an R\'-2R\' ladder with R\' = R + r/2); and scaled widths (each switch as wide as its leg\'s weight asks, the most significant widest). The first two are exact at the design value of r; scaled widths only shrink the error.',
      'What is left in silicon is r\'s departure from the value designed for: its spread relative to the resistors over process and temperature (a MOS switch moves far more than a poly resistor) and the mismatch of each switch. Rungwise solves each design at both ends of the spread, adds switch mismatch (falling as 1/√width) to the random errors of the sample and the Monte Carlo, and picks the design with the least switch area whose worst-corner nominal INL and DNL stay within a tenth of the targets. When none does, it picks the smallest error and says so. The choice and the best of every other handling are listed with the candidate, and a study can fix the handling and the width.',
      'A wider switch costs area and injects proportionally more charge, so the candidate\'s glitch uses the chosen width. The exported netlist carries the chosen design: trimmed leg resistors, each switch as its own resistor at the analysed corner, and the dummy switch; ngspice running it reproduces the engine\'s nominal error.'
    ],
    formulas: [
      { text: 'absorbed: R_leg = 2R − r  ⇒  R_leg + r = 2R', label: 'derived' },
      { text: 'dummy: R_leg = 2R, r in the leg; R_series = R + r/2; R_term = 2R + r_dummy  ⇒  R\'-2R\' with R\' = R + r/2', label: 'derived' },
      { text: 'share of the error budget for the switches ≈ 1/10 of the INL and DNL targets', label: 'common-practice' }
    ],
    sources: ['Derived for Rungwise and checked with ngspice running each exported design (tests/unit/shared/core/switch-design.spec.ts)', 'The tenth of the error budget is common practice, no source'],
    cautions: ['Switch on-resistance depends on the signal level (the gate overdrive falls as the switched node rises); the model uses one value per switch, so check the design at transistor level.']
  }
]
