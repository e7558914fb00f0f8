import type { HandbookSection } from './types'

/** §0–§3: symbols, definitions, the ideal circuits and what they are made of. */
export const BASICS: HandbookSection[] = [
  {
    id: '0',
    title: 'Symbols and conventions',
    body: [
      'N is the resolution in bits; a converter has n = 2^N codes numbered k = 0 … n − 1. Outputs are unipolar and referred to ground, so the full-scale range equals the reference voltage and one ideal step is V_LSB = V_REF / 2^N.',
      'R is the unit resistor. A "2R" element is two units in series unless the process field "2R construction" says it is one element of twice the value. σ_u is the relative standard deviation of one unit about the mean of its array. In segmented converters M is the number of unary (thermometer-decoded) upper bits and L = N − M the number of binary lower bits.',
      'Bits are counted from the most significant one. All INL and DNL figures are in LSB. Y is a yield target written as a fraction (0.997 for 99.7 %).'
    ],
    formulas: [
      { text: 'V_LSB = V_REF / 2^N', label: 'common-practice' },
      { text: 'C(Y) = Φ⁻¹((1 + Y) / 2)   (two-sided normal factor)', label: 'published' }
    ],
    sources: ['Standard notation of data-converter texts (Johns & Martin; Razavi), from memory.']
  },
  {
    id: '1',
    title: 'Definitions: what Rungwise reports',
    body: [
      'Integral non-linearity (INL) is how far each code\'s output sits from a straight line, measured in steps of that line. Rungwise offers two lines and always says which one a number refers to. The end-point line runs through the first and last code, so INL is zero at both ends. The best-fit line is the least-squares line through all codes; it usually gives smaller numbers, and yields quoted against it are higher.',
      'Differential non-linearity (DNL) is how much one step k → k + 1 differs from the line\'s step. A converter whose DNL stays above −1 LSB everywhere is monotonic: the output never falls when the code rises.',
      'The transfer error shown in the charts is the output minus the ideal staircase k·V_LSB, in LSB. Unlike INL it keeps offset and gain error, so it shows what a system without trimming sees.',
      'A major-carry transition is a one-code step where a high bit switches one way and every lower bit the other (0111…1 → 1000…0 at mid-scale). It is the hardest step for binary weighting, for both DNL and glitch.',
      'Glitch impulse is the net area of the output\'s departure from a clean step during a code change, in volt-seconds (usually nV·s or pV·s). It is an area, not an energy. Settling time runs from the input change to the moment the output last enters an error band (±½ LSB by default) around its final value. A design meets an update rate when settling plus the latch delay fits in one update period.'
    ],
    formulas: [
      { text: 'INL(k) = (V(k) − V(0)) / LSB_a − k,  LSB_a = (V(n−1) − V(0)) / (n − 1)   (end-point)', label: 'published' },
      { text: 'DNL(k) = (V(k+1) − V(k)) / LSB_a − 1,  k = 0 … n − 2', label: 'published' },
      { text: 'transfer error(k) = V(k) / V_LSB − k', label: 'derived' }
    ],
    sources: [
      'IEEE Std 1658-2011 (terminology and test methods for DACs): the governing definitions; clause numbers not checked (memory).',
      'IEEE Std 1241-2010: the terminal-based and least-squares line conventions (memory for the naming).',
      'JEDEC JESD99B: settling time measured to the last entry into the error band.',
      'E. Balestrieri, IMTC 2006: why glitch "energy" is really an area.'
    ],
    cautions: ['A best-fit INL is not bounded by the end-point INL; quote the line with every yield.']
  },
  {
    id: '2',
    title: 'Ideal transfer functions and impedances',
    body: [
      'Each architecture below is described as it is built in Rungwise\'s solver: ideal switches apart from their on-resistance, no parasitic capacitance, and a load only where the spec names one. The exact nodal solve of every code then adds what the simple formulas leave out: switch resistance, the loading of one string by another, and the code-dependent current drawn from the reference.',
      'Two impedances matter in every comparison: the output resistance, which sets settling into the load and the thermal noise; and the input resistance seen by the reference, whose variation with code turns a reference source resistance into INL.'
    ],
    sources: ['Derived here with the exact nodal solver and checked against ngspice in the test suite.']
  },
  {
    id: '2.1',
    title: 'Resistor string',
    body: [
      '2^N equal resistors in series from the reference to ground; code k connects the output to the tap with k resistors below it. The taps are ordered, so a string is monotonic whatever the mismatch.',
      'The output resistance is that of the two string parts in parallel plus the selecting switch. It peaks at mid-scale, where it is a quarter of the whole string: a 16-bit string of 1 kΩ units shows about 16 MΩ, which is why strings are slow into a load and need an output buffer.',
      'The reference sees the whole string at every code, so a source resistance in the reference only changes the gain. A binary-tree decoder puts N switches in series in the signal path; a direct 1-of-2^N decoder puts one.'
    ],
    formulas: [
      { text: 'V(k) = V_REF · k / 2^N', label: 'published' },
      { text: 'R_out(k) = R · k (2^N − k) / 2^N + R_switch path,  maximum 2^N·R / 4 at mid-scale', label: 'derived' }
    ],
    sources: ['W. Kester (ed.), Data Conversion Handbook, Newnes 2005: the Kelvin divider, its monotonicity and its element count.']
  },
  {
    id: '2.2',
    title: 'R-2R ladder, voltage mode',
    body: [
      'A chain of series R with a 2R leg at every node; each leg switches between the reference and ground and the output is the MSB end of the chain. Because every leg always ends on a source, the network\'s conductances do not depend on the code, and the output is exactly a weighted sum of the bits even with mismatch. That makes exact Monte Carlo cheap.',
      'The output resistance is R at every code. The reference current, however, changes with the code: nothing flows at code 0, the heaviest load is near the alternating code 0101…, roughly 9R/(N + 1). A reference with any source resistance therefore produces code-dependent errors, which is why voltage-mode ladders normally get a low-impedance reference buffer.',
      'Switch on-resistance adds to every leg and spoils the binary weights; the solver includes it.'
    ],
    formulas: [
      { text: 'V_out = V_REF · Σ b_i 2^−i   (i = 1 is the MSB)', label: 'common-practice' },
      { text: 'R_in,min ≈ 9R / (N + 1)   (compute the exact value with the solver)', label: 'derived' }
    ],
    sources: ['Standard ladder analysis (Johns & Martin), from memory; the reference-load values derived here and checked by exhaustive nodal solves.']
  },
  {
    id: '2.3',
    title: 'R-2R ladder, current mode',
    body: [
      'The reference drives the ladder end and each 2R leg is steered either to the output pin, held at virtual ground by an amplifier, or to ground. Both destinations sit at 0 V, so the ladder currents do not change with the code and the reference sees a constant R.',
      'The resistance seen from the output pin does change with the code (open at code 0, about 2R with only the MSB on, lower with many bits on). With a feedback resistor R_fb = R the amplifier\'s noise gain 1 + R_fb / R_out(k) moves with the code, and its stability has to hold at the worst code.'
    ],
    formulas: [
      { text: 'I_out = (V_REF / R) · Σ b_i 2^−i,  V_out = −I_out · R_fb', label: 'common-practice' },
      { text: 'noise gain(k) = 1 + R_fb / R_out(k)', label: 'derived' }
    ],
    sources: ['A semiconductor vendor\'s public DAC-architecture tutorial: constant reference impedance and code-dependent output impedance of the inverted ladder.'],
    cautions: ['Check the I-V amplifier\'s phase margin over the whole range of R_out(k), not at one code.']
  },
  {
    id: '2.4',
    title: 'Segmented: unary upper bits over an R-2R lower section',
    body: [
      'Rungwise\'s segmented form has 2^M − 1 identical 2R legs on the output node, switched by a thermometer decoder, and an L-bit voltage-mode ladder joined to the same node through one extra series R so that it too looks like 2R. Every branch on the output node is then 2R.',
      'The output resistance falls to 2R / 2^M, which helps settling; the reference load rises roughly in proportion to 2^M. Other published segmented ladders place the scaling resistor elsewhere: re-derive with the solver rather than reusing these numbers.'
    ],
    formulas: [
      { text: 'V_out = V_REF · (m · 2^L + c) / 2^N   (m legs on, lower code c)', label: 'derived' },
      { text: 'R_out = 2R / 2^M', label: 'derived' }
    ],
    sources: ['Derived here; the general segmentation idea from Lin & Bult (IEEE JSSC 1998), from memory for its details.']
  },
  {
    id: '2.5',
    title: 'Two-stage string',
    body: [
      'A coarse string of 2^M resistors selects a segment and a fine string of 2^L resistors divides it. With buffers copying the segment ends onto the fine string, the coarse string is not loaded, but the difference of the two buffer offsets adds straight to the DNL at each segment boundary.',
      'Without buffers the fine string hangs across the selected coarse resistor and lowers that segment\'s voltage; the boundary step error is about R_c / R_f LSB when the fine string is much larger. The solver computes the exact value.'
    ],
    formulas: [
      { text: 'σ_DNL,boundary ≈ √2 · σ_offset / V_LSB   (buffered, independent offsets)', label: 'derived' },
      { text: 'DNL_boundary ≈ R_c / R_f   (unbuffered, R_f ≫ R_c)', label: 'derived' }
    ],
    sources: ['Derived here; the exact unbuffered fix (a Kelvin–Varley arrangement) is a classic metrology circuit, from memory.']
  },
  {
    id: '3',
    title: 'Element counts',
    body: [
      'Counts are made the way the netlist builder builds the circuits. A 2R element counts as two unit resistors (or one, with the single-element construction). A string has 2^N resistors and, with a direct decoder, 2^N tap switches; a binary tree needs 2^(N+1) − 2 switches. An R-2R ladder has N legs, N − 1 series resistors and one termination: 2N elements or 3N + 1 units, and N changeover switches. The segmented form has 2^M + 2L elements and 2^(M+1) + 3L units; its decoder grows with 2^M.',
      'The counts grow exponentially for strings: 65 536 resistors and switches at 16 bits. Beyond about 10 bits a plain string is rarely practical on area and decoder size alone (common practice).'
    ],
    formulas: [
      { text: 'R-2R: 3N + 1 units;  segmented M + L: 2^(M+1) + 3L units', label: 'derived' }
    ],
    sources: ['W. Kester (ed.), Data Conversion Handbook, Newnes 2005: string counts. Ladder, tree and segmented counts counted in the builder.']
  }
]
