/**
 * Output-side formulas: area (§4.6), dynamics (§6), noise (§8), reference load and power (§2, §6)
 * and the analytic overall yield (§4.3).
 */
import { defineFormula } from '../define'
import type { HandbookReference } from '../types'
import { Q, q } from './quantities'

const CP = (section: string, note?: string): HandbookReference => ({ section, label: 'common-practice', ...(note ? { note } : {}) })
const D = (section: string): HandbookReference => ({ section, label: 'derived' })
const K_B = { symbol: 'k_B', unit: 'J/K', description: 'Boltzmann constant (exact, SI 2019)', value: 1.380649e-23 }
const MM2 = (name: string, symbol: string, description: string) => ({ name, symbol, unit: 'mm²', description })
const TAU = q('τ', 's', 'output time constant')
const FP = q('f_p', 'Hz', 'pole of the output RC')
const T_S = q('t_s', 's', 'settling time')
const I_MAX = q('I_REF,max', 'A', 'largest reference current over codes (exact nodal solve)')
const I_MIN = q('I_REF,min', 'A', 'smallest reference current over codes (exact nodal solve)')

export const OUTPUT_FORMULAS = {
  resistorArea: defineFormula({
    id: 'area.resistors', title: 'Resistor area', expression: 'n_u * A_unit * k_ovh / 1e6',
    description: 'Unit resistors × drawn unit area × layout overhead (dummies, spacing), µm² → mm².',
    inputs: { n_u: q('n_u', '', 'unit resistors'), A_unit: q('A_unit', 'µm²', 'drawn unit area'), k_ovh: q('k_ovh', '', 'layout overhead factor') },
    output: MM2('resistorAreaMm2', 'A_R', 'resistor area'), reference: CP('§4.1, §4.6')
  }),
  switchArea: defineFormula({
    id: 'area.switches', title: 'Switch area', expression: 'n_sw * A_sw / 1e6', description: 'Switches × area per switch, µm² → mm².',
    inputs: { n_sw: q('n_sw', '', 'switches'), A_sw: q('A_sw', 'µm²', 'area of one switch') }, output: MM2('switchAreaMm2', 'A_sw,tot', 'switch area'), reference: CP('§4.6')
  }),
  decoderArea: defineFormula({
    id: 'area.decoder', title: 'Decoder area', expression: 'n_g * A_g / 1e6', description: 'Decoder gates × area per gate, µm² → mm².',
    inputs: { n_g: q('n_g', '', 'decoder gates'), A_g: q('A_g', 'µm²', 'area of one gate') }, output: MM2('decoderAreaMm2', 'A_dec', 'decoder area'), reference: CP('§4.6')
  }),
  totalArea: defineFormula({
    id: 'area.total', title: 'Total area', expression: 'A_res + A_sw + A_dec', description: 'Resistors, switches and decoder.',
    inputs: { A_res: q('A_R', 'mm²', 'resistor area'), A_sw: q('A_sw,tot', 'mm²', 'switch area'), A_dec: q('A_dec', 'mm²', 'decoder area') },
    output: MM2('totalAreaMm2', 'A_total', 'total area'), reference: CP('§4.6')
  }),
  areaShare: defineFormula({
    id: 'area.budget-share', title: 'Share of the area budget', expression: 'A_total / A_budget', description: 'Total area over the budget (1 = exactly on budget).',
    inputs: { A_total: q('A_total', 'mm²', 'total area'), A_budget: q('A_budget', 'mm²', 'area budget') },
    output: { name: 'areaBudgetShare', symbol: 'A_total/A_budget', unit: '', description: 'share of the area budget' }, reference: CP('§4.6')
  }),
  tau: defineFormula({
    id: 'dynamics.tau', title: 'Output time constant', expression: 'R_eff * C_L', description: 'The largest driving resistance into the load capacitance.',
    inputs: { R_eff: q('R_out,eff', 'Ω', 'largest output resistance over codes, in parallel with any resistive load'), C_L: Q.c },
    output: { name: 'tauS', ...TAU }, reference: CP('§6')
  }),
  settling: defineFormula({
    id: 'dynamics.settling', title: 'Full-scale settling to ±½ LSB', expression: 'tau * ((N + 1) * log(2))',
    description: 'A single pole settles a full-scale step to half an LSB in ln(2^(N+1)) = (N+1)·ln 2 time constants.',
    inputs: { tau: TAU, N: Q.N }, output: { name: 'settlingS', ...T_S }, reference: CP('§6', 'the factor is a mathematical identity')
  }),
  maxUpdateRate: defineFormula({
    id: 'dynamics.max-update-rate', title: 'Highest update rate', expression: '1 / (t_s + t_latch)', description: 'One settling and one latch delay per update.',
    inputs: { t_s: T_S, t_latch: q('t_latch', 's', 'latch delay') }, output: { name: 'maxUpdateRateHz', symbol: 'f_upd,max', unit: 'Hz', description: 'highest update rate' }, reference: CP('§1, §6')
  }),
  thermalNoise: defineFormula({
    id: 'noise.thermal', title: 'Thermal noise of a resistor', expression: 'sqrt(4 * k_B * T * R * df)', description: 'Johnson–Nyquist noise in a bandwidth Δf.',
    inputs: { T: Q.temp, R: q('R', 'Ω', 'resistance'), df: q('Δf', 'Hz', 'noise bandwidth') }, constants: { k_B: K_B },
    output: { name: 'noiseVrms', symbol: 'v_n', unit: 'V', description: 'rms noise voltage' }, reference: { section: '§8', label: 'memory', note: 'standard Johnson–Nyquist result' }
  }),
  pole: defineFormula({
    id: 'noise.pole', title: 'Pole of the output RC', expression: '1 / (2 * pi * R * C_L)', description: 'The corner of R_out driving C_L.',
    inputs: { R: q('R', 'Ω', 'resistance'), C_L: Q.c }, output: { name: 'poleHz', ...FP }, reference: D('§8')
  }),
  rcNoise: defineFormula({
    id: 'noise.rc', title: 'Thermal noise through the output pole', expression: 'sqrt(4 * k_B * T * R * f_p * atan(f_max / f_p))',
    description: 'The Johnson–Nyquist density shaped by one pole and integrated to f_max; tends to √(kT/C) for a wide band.',
    inputs: { T: Q.temp, R: q('R', 'Ω', 'resistance'), f_p: FP, f_max: q('f_max', 'Hz', 'upper band edge (half the update rate)') }, constants: { k_B: K_B },
    output: { name: 'noiseVrms', symbol: 'v_n', unit: 'V', description: 'rms noise voltage' }, reference: D('§8')
  }),
  ktcNoise: defineFormula({
    id: 'noise.ktc', title: 'kT/C noise', expression: 'sqrt(k_B * T / C_L)', description: 'Total thermal noise on a capacitor, whatever the resistance.',
    inputs: { T: Q.temp, C_L: Q.c }, constants: { k_B: K_B }, output: { name: 'noiseKtcVrms', symbol: 'v_n,kTC', unit: 'V', description: 'rms noise voltage' }, reference: CP('§8')
  }),
  quantNoise: defineFormula({
    id: 'noise.quantisation', title: 'Quantisation noise', expression: 'V_FS / 2^N / sqrt(12)', description: 'An LSB-wide uniform error has σ = V_LSB/√12.',
    inputs: { V_FS: q('V_FS', 'V', 'full-scale range'), N: Q.N }, output: { name: 'quantNoiseVrms', symbol: 'v_q', unit: 'V', description: 'rms quantisation noise' }, reference: CP('§8')
  }),
  rinMin: defineFormula({
    id: 'reference.rin-min', title: 'Smallest reference input resistance', expression: 'V_REF / I_max', description: 'The reference voltage over the largest current it supplies.',
    inputs: { V_REF: Q.vref, I_max: I_MAX }, output: { name: 'rinMinOhm', symbol: 'R_in,min', unit: 'Ω', description: 'smallest reference load' }, reference: D('§2')
  }),
  rinMax: defineFormula({
    id: 'reference.rin-max', title: 'Largest reference input resistance', expression: 'V_REF / I_min', description: 'The reference voltage over the smallest current it supplies.',
    inputs: { V_REF: Q.vref, I_min: I_MIN }, output: { name: 'rinMaxOhm', symbol: 'R_in,max', unit: 'Ω', description: 'largest reference load' }, reference: D('§2')
  }),
  powerMax: defineFormula({
    id: 'reference.power-max', title: 'Largest reference power', expression: 'V_REF * I_max', description: 'Power the reference delivers at the heaviest code.',
    inputs: { V_REF: Q.vref, I_max: I_MAX }, output: { name: 'refPowerMaxW', symbol: 'P_REF,max', unit: 'W', description: 'largest reference power' }, reference: D('§2, §6')
  }),
  powerMean: defineFormula({
    id: 'reference.power-mean', title: 'Mean reference power over codes', expression: 'V_REF * I_sum / n_codes', description: 'Power averaged over all codes equally likely.',
    inputs: { V_REF: Q.vref, I_sum: q('ΣI_REF', 'A', 'sum of the reference current over codes'), n_codes: q('2^N', '', 'codes') },
    output: { name: 'refPowerMeanW', symbol: 'P_REF,mean', unit: 'W', description: 'mean reference power' }, reference: D('§2, §6')
  }),
  yieldProduct: defineFormula({
    id: 'yield.analytic-product', title: 'Overall analytic yield', expression: 'Y_INL * Y_DNL * Y_mono',
    description: 'INL, DNL and (when required) monotonicity treated as independent; Y_mono = 1 when monotonicity is not required.',
    inputs: { Y_INL: q('Y_INL', '', 'INL yield'), Y_DNL: q('Y_DNL', '', 'DNL yield'), Y_mono: q('Y_mono', '', 'monotonicity yield (1 if not required)') },
    output: { name: 'yield', symbol: 'Y', unit: '', description: 'overall yield' }, reference: { section: '§4.3', label: 'derived', note: 'section yields multiply (Park & Yang, published)' }
  })
}
