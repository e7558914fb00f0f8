import { evaluate } from 'mathjs'
import { describe, expect, it } from 'vitest'
import { formatQuantity, normaliseUnitText, parseQuantity, readBack, type UnitSpec } from '../../../../shared/utils/units'

const spec = (unit: string, symbol: string, prefixed: boolean, percent = false): UnitSpec =>
  ({ unit, quantity: 'a test quantity', symbol, prefixed, percent, example: '1' })

const VOLT = spec('V', 'V', true)
const OHM = spec('ohm', 'Ω', true)
const HZ = spec('Hz', 'S/s', true)
const MM2 = spec('mm^2', 'mm²', false)
const UM2 = spec('um^2', 'µm²', false)
const MATCH = spec('percent*um', '%·µm', false)
const FRACTION = spec('', '', false, true)
const LSB = spec('LSB', 'LSB', false)

function value(text: string, unit: UnitSpec): number {
  const r = parseQuantity(text, unit)
  if (!r.ok) throw new Error(r.message)
  return r.value
}

// Expected values: the SI prefix table (BIPM SI Brochure, 9th edition, Table 7: k = 1e3, M = 1e6,
// m = 1e-3, µ = 1e-6, p = 1e-12, f = 1e-15), cross-checked where possible by evaluating the same
// conversion with the full mathjs expression parser (the general-purpose reference library).
describe('parseQuantity', () => {
  it.each([
    ['2.5 V', VOLT, 2.5, '2.5 V to V'],
    ['-3 mV', VOLT, -3e-3, '-3 mV to V'],
    ['10 kohm', OHM, 1e4, '10 kohm to ohm'],
    ['10 kΩ', OHM, 1e4, '10 kohm to ohm'],
    ['2.2MΩ', OHM, 2.2e6, '2.2 Mohm to ohm'],
    ['100 kHz', HZ, 1e5, '100 kHz to Hz'],
    ['0.02 mm^2', MM2, 0.02, '0.02 mm^2 to mm^2'],
    ['20000 um^2', MM2, 0.02, '20000 um^2 to mm^2'],
    ['4 um^2', UM2, 4, '4 um^2 to um^2'],
    ['4 µm²', UM2, 4, '4 um^2 to um^2']
  ])('reads %s as %s in the contract unit', (text, unit, expected, reference) => {
    expect(value(text, unit)).toBeCloseTo(expected, 12)
    expect(value(text, unit)).toBeCloseTo(Number(evaluate(`number(${reference.replace(' to ', ', "')}")`)), 12)
  })

  it.each([
    ['10 pF', spec('F', 'F', true), 10e-12],
    ['100 ps', spec('s', 's', true), 100e-12],
    ['1 fC', spec('C', 'C', true), 1e-15],
    ['10 pV·s', spec('V*s', 'V·s', true), 10e-12],
    ['300 Ω/□', OHM, 300],
    ['300 ohm/sq', OHM, 300]
  ])('reads %s with the SI prefix table', (text, unit, expected) => {
    expect(value(text, unit)).toBeCloseTo(expected, 24)
  })

  it('reads sample rates in S/s, which mathjs alone would take for siemens per second', () => {
    expect(value('1 MS/s', HZ)).toBe(1e6)
    expect(value('250 kS/s', HZ)).toBe(2.5e5)
    expect(value('1 Msps', HZ)).toBe(1e6)
  })

  it('reads per cent as 0.01, alone and in a matching coefficient (definition of per cent)', () => {
    expect(value('99.7 %', FRACTION)).toBeCloseTo(0.997, 12)
    expect(value('0.997', FRACTION)).toBe(0.997)
    expect(value('1 %*um', MATCH)).toBeCloseTo(1, 12)
    expect(value('1 %·µm', MATCH)).toBeCloseTo(1, 12)
    expect(value('0.5%·µm', MATCH)).toBeCloseTo(0.5, 12)
  })

  it('reads LSB fields with or without the unit, and refuses volts there', () => {
    expect(value('0.5 LSB', LSB)).toBe(0.5)
    expect(value('0.5', LSB)).toBe(0.5)
    expect(parseQuantity('0.5 V', LSB).ok).toBe(false)
  })

  it('takes a bare number in the field\'s own unit', () => {
    expect(value('2.5', VOLT)).toBe(2.5)
    expect(value('0.02', MM2)).toBe(0.02)
  })

  it.each([
    ['2 kohm', VOLT],
    ['1 MS/s', VOLT],
    ['3 V', OHM],
    ['4 um^2', VOLT],
    ['50 %', VOLT]
  ])('refuses %s where the unit has another dimension', (text, unit) => {
    const r = parseQuantity(text, unit)
    expect(r.ok).toBe(false)
    expect(r.ok ? '' : r.message).toContain(`(got "${text}")`)
  })

  it.each(['', 'abc', '2.5 volts of joy', '1e999 V', '2..5 V'])('refuses %j with a message', (text) => {
    expect(parseQuantity(text, VOLT).ok).toBe(false)
  })
})

describe('normaliseUnitText', () => {
  it('rewrites the symbols people type into mathjs units', () => {
    expect(normaliseUnitText('10 kΩ')).toBe('10 kohm')
    expect(normaliseUnitText('1 %·µm')).toBe('1 percent*um')
    expect(normaliseUnitText('1 MS/s')).toBe('1 Msps')
    expect(normaliseUnitText('0.02 mm²')).toBe('0.02 mm^2')
  })
})

// Round trip: formatting must give text that parses back to the same value (derived).
describe('formatQuantity', () => {
  it.each([
    [2.5, VOLT, '2.5 V'],
    [1e4, OHM, '10 kΩ'],
    [1e6, HZ, '1 MS/s'],
    [0.02, MM2, '0.02 mm²'],
    [1, MATCH, '1 %·µm'],
    [0.997, FRACTION, '99.7 %'],
    [0.5, LSB, '0.5 LSB']
  ])('writes %s normalised as %s and reads it back', (v, unit, text) => {
    expect(formatQuantity(v, unit)).toBe(text)
    expect(value(text, unit)).toBeCloseTo(v, 12)
  })

  it('writes lengths kept in µm with an SI prefix (0.4 µm → 400 nm)', () => {
    const UM = spec('um', 'm', true)
    expect(formatQuantity(0.4, UM)).toBe('400 nm')
    expect(value('400 nm', UM)).toBeCloseTo(0.4, 12)
  })
})

// SPICE-style entries: scale factors of the SPICE3 user's manual (T = 1e12, G = 1e9, MEG = 1e6,
// K = 1e3, M = 1e-3, U = 1e-6, N = 1e-9, P = 1e-12, F = 1e-15, case insensitive), from memory;
// unit words in any case mean the SI unit of the same name (BIPM SI Brochure, 9th edition).
describe('parseQuantity: SPICE suffixes and case variants', () => {
  const F = spec('F', 'F', true)
  const VS = spec('V*s', 'V·s', true)
  const UM = spec('um', 'm', true)
  it.each([
    ['10k', OHM, 1e4],
    ['10K', OHM, 1e4],
    ['4.7K', OHM, 4.7e3],
    ['4.7k', OHM, 4.7e3],
    ['1meg', OHM, 1e6],
    ['1MEG', OHM, 1e6],
    ['1Meg', OHM, 1e6],
    ['2.2 meg', OHM, 2.2e6],
    ['1megohm', OHM, 1e6],
    ['10 kohm', OHM, 1e4],
    ['10 Kohm', OHM, 1e4],
    ['10Kohm', OHM, 1e4],
    ['10 KOHM', OHM, 1e4],
    ['10 Ohm', OHM, 10],
    ['10 KΩ', OHM, 1e4],
    ['1G', OHM, 1e9],
    ['10p', F, 10e-12],
    ['10P', F, 10e-12],
    ['10pf', F, 10e-12],
    ['10f', F, 10e-15],
    ['2.5 v', VOLT, 2.5],
    ['2.5v', VOLT, 2.5],
    ['100m', VOLT, 0.1],
    ['100u', VOLT, 100e-6],
    ['5n', VOLT, 5e-9],
    ['50 pVs', VS, 50e-12],
    ['50pVs', VS, 50e-12],
    ['50 pvs', VS, 50e-12],
    ['1 nVs', VS, 1e-9],
    ['0.5 lsb', LSB, 0.5],
    ['0.5 Lsb', LSB, 0.5],
    ['0.5lsb', LSB, 0.5],
    ['1 khz', HZ, 1e3],
    ['400n', UM, 400e-9]
  ])('reads %s as %s in SI', (text, unit, expected) => {
    const v = value(text, unit) * (unit.unit === 'um' ? 1e-6 : 1)
    expect(v / expected).toBeCloseTo(1, 12)
  })

  it('says how a bare m was read, and a capital M with a unit', () => {
    const r = parseQuantity('1m', OHM)
    expect(r.ok && r.value).toBe(1e-3)
    expect(r.ok && r.note).toMatch(/milli/)
    expect(readBack('1m', OHM)).toBe('1 mΩ (m read as milli (10⁻³); write meg for mega)')
    expect(readBack('1meg', OHM)).toBe('1 MΩ')
    expect(readBack('10k', OHM)).toBe('10 kΩ')
    const mega = parseQuantity('1 MOHM', OHM)
    expect(mega.ok && mega.value).toBe(1e6)
    expect(mega.ok && mega.note).toMatch(/mega.*SPICE would read milli/)
  })

  it('keeps mathjs readings first: 300K on a temperature is kelvin, 10 F is farads, 1 m on a length is a metre', () => {
    expect(value('300K', spec('K', 'K', false))).toBe(300)
    expect(value('10 F', spec('F', 'F', true))).toBe(10)
    expect(value('1 m', spec('um', 'm', true))).toBe(1e6)
  })

  it.each([
    ['1M', OHM, /ambiguous.*meg/],
    ['1 M', OHM, /ambiguous/],
    ['10x', OHM, /got "10x"/],
    ['10 kV', OHM, /got "10 kV"/],
    ['10 kk', OHM, /got "10 kk"/],
    ['k', OHM, /got "k"/],
    ['10 k ohm', OHM, /got "10 k ohm"/],
    ['0.5 lsbs', LSB, /got "0.5 lsbs"/],
    ['20m', MM2, /without a scale letter/],
    ['50 pVs', VOLT, /got "50 pVs"/]
  ])('refuses %s with a message', (text, unit, message) => {
    const r = parseQuantity(text, unit)
    expect(r.ok).toBe(false)
    expect(r.ok ? '' : r.message).toMatch(message)
  })
})
