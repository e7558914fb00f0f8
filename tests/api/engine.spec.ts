import { beforeAll, describe, expect, it } from 'vitest'
import { api, DEMO, signIn } from '../support/http'

let cookie: string
beforeAll(async () => {
  cookie = await signIn(DEMO.engineer)
})

/** An ideal 5-bit voltage-mode ladder of 10 kΩ units (2R legs = 20 kΩ). */
const ladder = {
  topology: 'r2r-voltage', bits: 5, vrefV: 1,
  legsOhm: [20e3, 20e3, 20e3, 20e3, 20e3], seriesOhm: [10e3, 10e3, 10e3, 10e3], terminationOhm: 20e3
}

describe('POST /api/solve', () => {
  it('needs a session', async () => {
    expect((await api('/api/solve', { method: 'POST', body: ladder })).status).toBe(401)
  })

  it('solves every code; code 10110 gives 0.6875 V_REF (superposition ½ + ⅛ + 1/16, common practice, no source)', async () => {
    const res = await api<{ codes: { code: number, voutV: number, routOhm: number }[] }>('/api/solve', { method: 'POST', cookie, body: ladder })
    expect(res.status).toBe(200)
    expect(res.body.codes).toHaveLength(32)
    expect(res.body.codes[0b10110]!.voutV).toBeCloseTo(0.6875, 12)
    // Output resistance of an ideal voltage-mode ladder is R for every code (derived, exact nodal).
    for (const c of res.body.codes) expect(c.routOhm).toBeCloseTo(10e3, 6)
  })

  it.each([
    ['bits out of range', { ...ladder, bits: 40 }, 'bits'],
    ['a leg array of the wrong length', { ...ladder, legsOhm: [20e3, 20e3] }, 'legsOhm'],
    ['a negative resistor', { ...ladder, seriesOhm: [10e3, -1, 10e3, 10e3] }, 'seriesOhm[1]'],
    ['an unknown topology', { ...ladder, topology: 'flash' }, 'topology']
  ])('answers %s with 400 naming the field', async (_label, body, field) => {
    const res = await api<{ message: string, data: { issues: { path: string }[] } }>('/api/solve', { method: 'POST', cookie, body })
    expect(res.status).toBe(400)
    expect(res.body.data.issues.map(i => i.path)).toContain(field)
    expect(res.body.message).toContain(field)
  })
})

describe('POST /api/netlist', () => {
  it('returns a SPICE netlist with one element line per resistor and a DC sweep over the codes', async () => {
    const res = await api<{ netlist: string, format: string, bits: number }>('/api/netlist', { method: 'POST', cookie, body: { circuit: ladder } })
    expect(res.status).toBe(200)
    expect(res.body.format).toBe('spice')
    expect(res.body.netlist).toMatch(/^dc vcode 0 31 1$/m)
    expect(res.body.netlist).toMatch(/^\.end\s*$/im)
  })

  it('answers a bad circuit with 400 naming the field', async () => {
    const res = await api<{ message: string }>('/api/netlist', { method: 'POST', cookie, body: { circuit: { ...ladder, terminationOhm: 0 } } })
    expect(res.status).toBe(400)
    expect(res.body.message).toContain('circuit.terminationOhm')
  })
})
