import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import StudyField from '../../../components/study/StudyField.vue'
import { findField } from '../../../shared/schemas/fields'

const vref = findField('spec', 'vrefV')!
const convention = findField('process', 'matchingConvention')!

describe('StudyField', () => {
  it('labels the input and describes it with help and the allowed range', async () => {
    const wrapper = await mountSuspended(StudyField, { props: { def: vref, entry: '2.5 V' } })
    const input = wrapper.get('input#spec-vrefV')
    expect(wrapper.get('label[for="spec-vrefV"]').text()).toBe('Reference voltage')
    expect(input.attributes('aria-describedby')).toBe('spec-vrefV-msg')
    expect(wrapper.get('#spec-vrefV-msg').text()).toContain('Allowed from 100 mV to 50 V')
  })

  it('shows an error in place, marked invalid, with a shape as well as colour', async () => {
    const wrapper = await mountSuspended(StudyField, { props: { def: vref, entry: '2 kohm', error: 'must be a voltage in V' } })
    expect(wrapper.get('input').attributes('aria-invalid')).toBe('true')
    expect(wrapper.get('[data-testid="error-spec-vrefV"]').text()).toBe('✕ Reference voltage must be a voltage in V')
  })

  it('emits what is typed, and the normalised value on leaving the field', async () => {
    const wrapper = await mountSuspended(StudyField, { props: { def: vref, entry: '2500 mV' } })
    await wrapper.get('input').setValue('2500 mV')
    await wrapper.get('input').trigger('blur')
    expect(wrapper.emitted('update')).toEqual([['2500 mV'], ['2.5 V']])
  })

  it('offers a placeholder choice while a required choice is empty, and is read-only when asked', async () => {
    const wrapper = await mountSuspended(StudyField, { props: { def: convention, entry: '', readonly: true } })
    expect(wrapper.findAll('option').map(o => o.text())).toEqual(['Choose…', 'Pair difference', 'Single element'])
    expect(wrapper.get('select').attributes('disabled')).toBeDefined()
  })
})
