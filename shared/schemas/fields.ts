import { EVALUATE_TOPOLOGIES } from '../core/contract/evaluate'
import type { UnitSpec } from '../utils/units'

/**
 * The one catalogue of every spec, process and option field the engine takes: label, group, help,
 * the quantity and how it is written. Names and contract units are the engine's; the allowed
 * ranges are read from the engine's zod schemas (fieldValues.ts), never copied here.
 */
export type FieldSection = 'spec' | 'process' | 'options'

export const FIELD_GROUPS = [
  { id: 'output', section: 'spec', title: 'Targets', label: 'What it must drive' },
  { id: 'accuracy', section: 'spec', title: 'Targets', label: 'Accuracy' },
  { id: 'budgets', section: 'spec', title: 'Targets', label: 'Budgets and limits' },
  { id: 'resistors', section: 'process', title: 'Process', label: 'Resistors' },
  { id: 'switches', section: 'process', title: 'Process', label: 'Switches and decoder' },
  { id: 'switch-spread', section: 'process', title: 'Process', label: 'Switch spread and mismatch (this study)' },
  { id: 'compare', section: 'options', title: 'What to compare', label: 'Candidates and Monte Carlo' }
] as const satisfies readonly { id: string, section: FieldSection, title: string, label: string }[]

export type FieldGroupId = typeof FIELD_GROUPS[number]['id']

export interface Choice { value: string, label: string }

interface FieldBase {
  section: FieldSection
  key: string
  label: string
  help: string
  group: FieldGroupId
}

export type FieldDef = FieldBase & (
  | { kind: 'quantity', units: UnitSpec, nullWord?: string, autoWord?: string }
  | { kind: 'integer', suffix?: string }
  | { kind: 'choice', choices: readonly Choice[] }
  | { kind: 'flag' }
  | { kind: 'multi', choices: readonly Choice[] })

const u = (unit: string, quantity: string, symbol: string, prefixed: boolean, example: string, percent = false): UnitSpec =>
  ({ unit, quantity, symbol, prefixed, example, percent })

const V = u('V', 'a voltage', 'V', true, '2.5 V')
const OHM = u('ohm', 'a resistance', 'Ω', true, '10 kΩ')
const LSB = u('LSB', 'a number of LSB', 'LSB', false, '0.5 LSB')
const SECONDS = u('s', 'a time', 's', true, '100 ps')
const UM2 = u('um^2', 'an area', 'µm²', false, '4 µm²')
const UM = u('um', 'a length', 'm', true, '0.4 µm')

const spec = (key: string, group: FieldGroupId, label: string, help: string) => ({ section: 'spec' as const, key, group, label, help })
const proc = (key: string, group: FieldGroupId, label: string, help: string) => ({ section: 'process' as const, key, group, label, help })
const opt = (key: string, label: string, help: string) => ({ section: 'options' as const, key, group: 'compare' as const, label, help })

export const TOPOLOGY_LABELS: Record<typeof EVALUATE_TOPOLOGIES[number], string> = {
  'string': 'Resistor string',
  'r2r-voltage': 'R-2R, voltage mode',
  'r2r-current': 'R-2R, current mode',
  'segmented': 'Segmented (unary MSBs + ladder)',
  'two-stage-string': 'Two-stage string'
}

export const FIELDS: readonly FieldDef[] = [
  { ...spec('bits', 'output', 'Resolution', 'Input word length N; the output has 2^N levels.'), kind: 'integer', suffix: 'bit' },
  { ...spec('vrefV', 'output', 'Reference voltage', 'Full-scale reference across the network.'), kind: 'quantity', units: V },
  { ...spec('updateRateHz', 'output', 'Update rate', 'New codes per second; sets the settling window.'), kind: 'quantity', units: u('Hz', 'a sample rate', 'S/s', true, '1 MS/s') },
  { ...spec('loadCapacitanceF', 'output', 'Load capacitance', 'Capacitance on the output node that must settle.'), kind: 'quantity', units: u('F', 'a capacitance', 'F', true, '10 pF') },
  { ...spec('loadResistanceOhm', 'output', 'Load resistance', 'Resistive load on the output; leave empty or write “none” for none.'), kind: 'quantity', units: OHM, nullWord: 'none' },
  { ...spec('inlTargetLsb', 'accuracy', 'INL target', 'Largest |INL| allowed over all codes.'), kind: 'quantity', units: LSB },
  { ...spec('dnlTargetLsb', 'accuracy', 'DNL target', 'Largest |DNL| allowed; below 1 LSB.'), kind: 'quantity', units: LSB },
  { ...spec('yieldTarget', 'accuracy', 'Linearity yield target', 'Share of parts that must meet INL and DNL.'), kind: 'quantity', units: u('', 'a fraction or a percentage', '', false, '99.7 %', true) },
  { ...spec('monotonicRequired', 'accuracy', 'Must be monotonic', 'Every code step must go the same way.'), kind: 'flag' },
  { ...spec('areaBudgetMm2', 'budgets', 'Area budget', 'Resistors, switches and decoder together.'), kind: 'quantity', units: u('mm^2', 'an area', 'mm²', false, '0.02 mm²') },
  { ...spec('powerBudgetW', 'budgets', 'Power budget', 'Largest power drawn from the reference.'), kind: 'quantity', units: u('W', 'a power', 'W', true, '1 mW') },
  { ...spec('glitchLimitVs', 'budgets', 'Glitch limit', 'Largest glitch impulse allowed at any code transition.'), kind: 'quantity', units: u('V*s', 'a glitch impulse', 'V·s', true, '10 pV·s') },
  { ...spec('refSourceOhm', 'budgets', 'Reference source resistance', 'Output resistance of the reference; 0 for a buffered reference.'), kind: 'quantity', units: OHM },

  { ...proc('sheetOhmPerSq', 'resistors', 'Sheet resistance', 'Of the resistor layer, per square.'), kind: 'quantity', units: u('ohm', 'a sheet resistance', 'Ω/□', true, '300 Ω/□') },
  { ...proc('matchingPctUm', 'resistors', 'Matching coefficient', 'Mismatch σ times √(W·L); see the convention below.'), kind: 'quantity', units: u('percent*um', 'a matching coefficient', '%·µm', false, '1 %·µm') },
  { ...proc('matchingConvention', 'resistors', 'Matching convention', 'Whether the coefficient gives σ of a pair difference or of one element.'), kind: 'choice', choices: [{ value: 'pair', label: 'Pair difference' }, { value: 'single', label: 'Single element' }] },
  { ...proc('unitOhm', 'resistors', 'Unit resistor', 'Value of one unit resistor; “auto” lets the engine size it.'), kind: 'quantity', units: OHM, autoWord: 'auto' },
  { ...proc('minWidthUm', 'resistors', 'Minimum resistor width', 'Narrowest drawn width the layer allows.'), kind: 'quantity', units: UM },
  { ...proc('minLengthUm', 'resistors', 'Minimum resistor length', 'Shortest drawn length the layer allows.'), kind: 'quantity', units: UM },
  { ...proc('layoutOverhead', 'resistors', 'Layout overhead', 'Factor from drawn resistor area to placed area (dummies, spacing).'), kind: 'quantity', units: u('', 'a factor', '×', false, '1.5') },
  { ...proc('switchOhm', 'switches', 'Switch on-resistance', 'Of one closed switch.'), kind: 'quantity', units: OHM },
  { ...proc('switchSkewS', 'switches', 'Switch timing skew', 'Worst mismatch in switching instants across bits.'), kind: 'quantity', units: SECONDS },
  { ...proc('switchChargeC', 'switches', 'Switch charge injection', 'Charge one switch injects when it toggles.'), kind: 'quantity', units: u('C', 'a charge', 'C', true, '1 fC') },
  { ...proc('switchAreaUm2', 'switches', 'Area per switch', 'Placed area of one switch.'), kind: 'quantity', units: UM2 },
  { ...proc('switchSpreadPct', 'switch-spread', 'Switch spread against resistors', 'How far switch on-resistance moves relative to the resistors over process and temperature (±).'), kind: 'quantity', units: u('percent', 'a percentage', '%', false, '20 %') },
  { ...proc('switchMismatchPct', 'switch-spread', 'Switch mismatch', 'σ of one switch’s on-resistance about its design value; falls as 1/√width.'), kind: 'quantity', units: u('percent', 'a percentage', '%', false, '1 %') },
  { ...proc('gateAreaUm2', 'switches', 'Area per decoder gate', 'Placed area of one decoder gate.'), kind: 'quantity', units: UM2 },

  { ...opt('topologies', 'Candidates', 'Architectures to compare.'), kind: 'multi', choices: EVALUATE_TOPOLOGIES.map(t => ({ value: t, label: TOPOLOGY_LABELS[t] })) },
  { ...opt('trials', 'Monte Carlo trials', '0 for the analytic estimate only; more trials, tighter yield.'), kind: 'integer' },
  { ...opt('seed', 'Random seed', 'The same seed gives the same Monte Carlo result.'), kind: 'integer' },
  { ...opt('inlDefinition', 'INL definition', 'Reference line for INL.'), kind: 'choice', choices: [{ value: 'endpoint', label: 'End-point' }, { value: 'best-fit', label: 'Best-fit line' }] },
  {
    ...opt('switchHandling', 'Switch handling', 'How ladder and segmented switches are compensated; “chosen by the engine” tries every handling.'), kind: 'choice',
    choices: [{ value: 'auto', label: 'Chosen by the engine' }, { value: 'none', label: 'Left as drawn' }, { value: 'absorbed', label: 'Absorbed into the leg (2R − r)' }, { value: 'dummy', label: 'Matched dummy switch' }, { value: 'scaled', label: 'Widths scaled with weight' }]
  }
]

/** The fields of one section, in catalogue order. */
export function sectionFields(section: FieldSection): FieldDef[] {
  return FIELDS.filter(f => f.section === section)
}

/** A field by section and key. */
export function findField(section: FieldSection, key: string): FieldDef | undefined {
  return FIELDS.find(f => f.section === section && f.key === key)
}

/** The process fields a preset stores (one column each in process_presets); the switch spread and mismatch are per study. */
export const PRESET_PROCESS_KEYS = sectionFields('process').map(f => f.key).filter(k => k !== 'switchSpreadPct' && k !== 'switchMismatchPct')
