/** Glitch formulas (MODELS.md §5): the skew and charge terms of one transition and their sum. */
import { defineFormula } from '../define'
import { q } from './quantities'

const VS = (name: string, symbol: string, description: string) => ({ name, symbol, unit: 'V·s', description })

export const GLITCH_FORMULAS = {
  skew: defineFormula({
    id: 'glitch.skew', title: 'Skew term of a transition', expression: 'W_on > 0 and W_off > 0 ? 0.5 * (W_on + W_off) * V_LSB * abs(dt) : 0',
    description: 'When elements turn on and off Δt apart, the output sits at a wrong level for Δt; relative to an ideal step at the mean instant the area is ½(W_on + W_off)·V_LSB·|Δt|. No skew term when one group is empty.',
    inputs: { W_on: q('W_on', 'LSB', 'summed weight of elements turning on'), W_off: q('W_off', 'LSB', 'summed weight of elements turning off'), V_LSB: q('V_LSB', 'V', 'one LSB'), dt: q('Δt', 's', 'switch timing skew') },
    output: VS('glitchSkewVs', 'GI_skew', 'skew glitch impulse'), reference: { section: '§5', label: 'derived', note: 'mechanism: Baker\'s worked example (published)' }
  }),
  charge: defineFormula({
    id: 'glitch.charge', title: 'Charge term of a transition', expression: 'alpha * n_tog * q_sw * R_out',
    description: 'Charge dumped on the output decays with τ = R_out·C, so its area is α·q_net·R_out whatever C is; q_net counts every toggled switch (no credit for cancellation).',
    inputs: { alpha: q('α', '', 'fraction of the charge reaching the output'), n_tog: q('n_tog', '', 'switches toggled'), q_sw: q('q', 'C', 'charge injected per switch'), R_out: q('R_out', 'Ω', 'output resistance at the new code') },
    output: VS('glitchChargeVs', 'GI_q', 'charge glitch impulse'), reference: { section: '§5', label: 'derived', note: 'the injected charge itself is from memory' }
  }),
  total: defineFormula({
    id: 'glitch.total', title: 'Glitch impulse of a transition', expression: 'GI_skew + GI_q', description: 'Skew and charge terms added for ranking.',
    inputs: { GI_skew: q('GI_skew', 'V·s', 'skew term'), GI_q: q('GI_q', 'V·s', 'charge term') }, output: VS('glitchVs', 'GI', 'glitch impulse'), reference: { section: '§5', label: 'common-practice' }
  })
}
