/**
 * Unit sizing formulas (MODELS.md §4.1, §4.6): the single-element matching coefficient, the
 * Pelgrom unit area, the value-driven minimum, the drawn W and L, and the unit resistance the
 * 'auto' choice considers (§6 settling, power budget; common practice).
 */
import { defineFormula } from '../define'
import type { HandbookReference } from '../types'
import { Q, q } from './quantities'

const D = (section: string, note?: string): HandbookReference => ({ section, label: 'derived', ...(note ? { note } : {}) })
const CP: HandbookReference = { section: '§4.6, §6', label: 'common-practice', note: 'choosing R_unit for ranking' }
const AREA = q('A_unit', 'µm²', 'drawn unit area')
const SQUARES = q('n_□', '', 'squares of the unit resistor, R_unit / R_□')
const A_PCT = q('A_R', '%·µm', 'matching coefficient as given by the process')
const SIG_INL = q('σ_u,INL', '', 'σ_u allowed by the INL target')
const SIG_DNL = q('σ_u,DNL', '', 'σ_u allowed by the DNL target')
const W_MIN = q('W_min', 'µm', 'minimum drawn width')
const L_MIN = q('L_min', 'µm', 'minimum drawn length')
const TAU_MAX = q('τ_max', 's', 'largest time constant that still settles within the update period')
const R_SW = q('R_sw', 'Ω', 'switch on-resistance')
const R_OUT_PER_R = q('r_out', '', 'approximate largest R_out / R_unit of the shape (§2)')
const R_IN_PER_R = q('r_in', '', 'approximate smallest R_in / R_unit of the shape (§2)')
const ohm = (name: string, description: string) => ({ name, symbol: 'R_unit', unit: 'Ω', description })

export const SIZING_FORMULAS = {
  singlePair: defineFormula({
    id: 'sizing.a-single.pair', title: 'Single-element coefficient from a pair coefficient', expression: 'A_R / 100 / sqrt(2)',
    description: 'A pair measurement sees the difference of two devices, √2 times one device\'s σ about the mean.',
    inputs: { A_R: A_PCT }, output: { name: 'aSingleUm', ...Q.aSingle }, reference: D('§4.1', 'convention trap')
  }),
  singleSingle: defineFormula({
    id: 'sizing.a-single.single', title: 'Single-element coefficient as given', expression: 'A_R / 100',
    description: 'The process already quotes one element about the array mean; only %·µm becomes fraction·µm.',
    inputs: { A_R: A_PCT }, output: { name: 'aSingleUm', ...Q.aSingle }, reference: D('§4.1')
  }),
  sigmaRequired: defineFormula({
    id: 'sizing.sigma-required', title: 'σ_u both targets allow', expression: 'min(s_inl, s_dnl)',
    description: 'The unit must be matched well enough for the stricter of the INL and DNL targets.',
    inputs: { s_inl: SIG_INL, s_dnl: SIG_DNL }, output: { name: 'sigmaUnitRequired', symbol: 'σ_u,req', unit: '', description: 'required σ_u' }, reference: D('§4.3–4.5')
  }),
  matchingArea: defineFormula({
    id: 'sizing.matching-area', title: 'Unit area from the area law', expression: '(A_s / sigma_u)^2',
    description: 'σ_u = A_R,single / √(W·L) solved for W·L.', inputs: { A_s: Q.aSingle, sigma_u: Q.sigmaU },
    output: { name: 'matchingAreaUm2', symbol: 'A_match', unit: 'µm²', description: 'unit area the matching needs' },
    reference: { section: '§4.1', label: 'published', note: 'area law: Pelgrom, Duinmaijer, Welbers 1989; the solved form is derived' }
  }),
  squares: defineFormula({
    id: 'sizing.squares', title: 'Squares of the unit resistor', expression: 'R_unit / R_sq',
    description: 'A resistor of R_unit drawn in a layer of R_□ is R_unit / R_□ squares long.', inputs: { R_unit: Q.unitOhm, R_sq: Q.sheet },
    output: { name: 'squares', ...SQUARES }, reference: D('§4.1')
  }),
  minWidth: defineFormula({
    id: 'sizing.min-width', title: 'Narrowest width the length rule allows', expression: 'max(W_min, L_min / n_sq)',
    description: 'The width is at least W_min, and wide enough that L = n_□·W reaches L_min.', inputs: { W_min: W_MIN, L_min: L_MIN, n_sq: SQUARES },
    output: { name: 'minWidthUm', symbol: 'W_0', unit: 'µm', description: 'width of the smallest drawable unit' }, reference: D('§4.1, §4.6')
  }),
  minArea: defineFormula({
    id: 'sizing.min-area', title: 'Smallest drawable unit area', expression: 'n_sq * W_0 * W_0',
    description: 'W·L with L = n_□·W at the narrowest allowed width.', inputs: { n_sq: SQUARES, W_0: q('W_0', 'µm', 'width of the smallest drawable unit') },
    output: { name: 'minSizeAreaUm2', symbol: 'A_min', unit: 'µm²', description: 'value-driven minimum unit area' }, reference: D('§4.6')
  }),
  unitArea: defineFormula({
    id: 'sizing.unit-area', title: 'Drawn unit area', expression: 'max(A_match, A_min)',
    description: 'The larger of what matching needs and what the resistance value and design rules force.',
    inputs: { A_match: q('A_match', 'µm²', 'unit area the matching needs'), A_min: q('A_min', 'µm²', 'value-driven minimum unit area') },
    output: { name: 'unitAreaUm2', ...AREA }, reference: { section: '§4.6', label: 'common-practice' }
  }),
  sigmaAchieved: defineFormula({
    id: 'sizing.sigma-achieved', title: 'σ_u of the drawn unit', expression: 'A_s / sqrt(A_unit)',
    description: 'The area law applied to the drawn area.', inputs: { A_s: Q.aSingle, A_unit: AREA },
    output: { name: 'sigmaUnit', ...Q.sigmaU }, reference: { section: '§4.1', label: 'published', note: 'Pelgrom area law' }
  }),
  width: defineFormula({
    id: 'sizing.width', title: 'Unit width', expression: 'sqrt(A_unit / n_sq)', description: 'W = √(A / n_□), so that W·L = A and L/W = n_□.',
    inputs: { A_unit: AREA, n_sq: SQUARES }, output: { name: 'unitWidthUm', symbol: 'W', unit: 'µm', description: 'drawn unit width' }, reference: D('§4.1')
  }),
  length: defineFormula({
    id: 'sizing.length', title: 'Unit length', expression: 'sqrt(A_unit * n_sq)', description: 'L = √(A · n_□), so that W·L = A and L/W = n_□.',
    inputs: { A_unit: AREA, n_sq: SQUARES }, output: { name: 'unitLengthUm', symbol: 'L', unit: 'µm', description: 'drawn unit length' }, reference: D('§4.1')
  }),
  rPower: defineFormula({
    id: 'sizing.r-power', title: 'Smallest R_unit the power budget allows', expression: 'V_REF * V_REF / (P_max * r_in)',
    description: 'The heaviest reference load must not draw more than the power budget.', inputs: { V_REF: Q.vref, P_max: q('P_max', 'W', 'power budget'), r_in: R_IN_PER_R },
    output: ohm('unitOhm', 'unit resistance at the power floor'), reference: CP
  }),
  tauMax: defineFormula({
    id: 'sizing.tau-max', title: 'Largest τ that settles in time', expression: 'max(0, 1 / f_upd - t_latch) / ((N + 1) * log(2))',
    description: 'The update period less the latch delay, divided by the settling factor.',
    inputs: { f_upd: q('f_upd', 'Hz', 'update rate'), t_latch: q('t_latch', 's', 'latch delay'), N: Q.N }, output: { name: 'tauMaxS', ...TAU_MAX }, reference: CP
  }),
  rSettle: defineFormula({
    id: 'sizing.r-settle', title: 'Largest R_unit that settles in time', expression: '(tau_max / C_L - R_sw) / r_out',
    description: 'τ = (R_sw + r_out·R_unit)·C_L must not exceed τ_max.', inputs: { tau_max: TAU_MAX, C_L: Q.c, R_sw: R_SW, r_out: R_OUT_PER_R },
    output: ohm('unitOhm', 'unit resistance at the settling ceiling'), reference: CP
  }),
  rArea: defineFormula({
    id: 'sizing.r-area', title: 'R_unit of the smallest drawn unit', expression: 'R_sq * L_min / W_min',
    description: 'A unit of minimum length and width.', inputs: { R_sq: Q.sheet, L_min: L_MIN, W_min: W_MIN },
    output: ohm('unitOhm', 'unit resistance of the smallest drawn unit'), reference: CP
  })
}
