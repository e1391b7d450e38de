import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import FormChoiceGroup from '~/components/form/FormChoiceGroup.vue'
import FormSelect from '~/components/form/FormSelect.vue'
import FormFieldError from '~/components/form/FormFieldError.vue'
import FormTextField from '~/components/form/FormTextField.vue'

const options = [{ value: 'knee', label: 'Knee' }, { value: 'calf', label: 'Calf' }]

describe('FormSelect', () => {
  it('labels its select, lists the placeholder then the options, and reports the choice', async () => {
    const wrapper = await mountSuspended(FormSelect, {
      props: { label: 'Body area', name: 'bodyArea', placeholder: 'Choose', options, modelValue: '' },
    })
    const select = wrapper.get('select')
    const label = wrapper.get('label')
    expect(label.text()).toBe('Body area')
    expect(select.attributes('id')).toBeTruthy()
    expect(label.attributes('for')).toBe(select.attributes('id'))
    expect(select.attributes('name')).toBe('bodyArea')
    expect(wrapper.findAll('option').map(option => option.text())).toEqual(['Choose', 'Knee', 'Calf'])
    expect(select.attributes('aria-invalid')).toBeUndefined()

    await select.setValue('calf')
    expect(wrapper.emitted('update:modelValue')?.at(-1)).toEqual(['calf'])
  })

  it('marks the select invalid and points it at the announced error', async () => {
    const wrapper = await mountSuspended(FormSelect, {
      props: { label: 'Body area', options, modelValue: '', error: 'Choose a body area' },
    })
    const select = wrapper.get('select')
    expect(select.attributes('aria-invalid')).toBe('true')
    const describedBy = select.attributes('aria-describedby')!
    const message = wrapper.get(`#${CSS.escape(describedBy)}`)
    expect(message.text()).toBe('Choose a body area')
    expect(message.attributes('role')).toBe('alert')
  })

  it('describes the select by its hint while there is no error, and passes other attributes to the select', async () => {
    const wrapper = await mountSuspended(FormSelect, {
      props: { label: 'Routine', options, modelValue: 'knee', hint: 'Build one first' },
      attrs: { 'class': 'grow', 'data-testid': 'routine-choice' },
    })
    const select = wrapper.get('select')
    expect(wrapper.get(`#${CSS.escape(select.attributes('aria-describedby')!)}`).text()).toBe('Build one first')
    expect(select.attributes('data-testid')).toBe('routine-choice')
    expect(wrapper.classes()).toContain('grow')
    expect(select.classes()).not.toContain('grow')
  })
})

describe('FormFieldError', () => {
  it('renders nothing without a message', async () => {
    const wrapper = await mountSuspended(FormFieldError, { props: { message: '' } })
    expect(wrapper.find('p').exists()).toBe(false)
  })

  it('announces its message under the id a control names', async () => {
    const wrapper = await mountSuspended(FormFieldError, { props: { message: 'Too long', id: 'note-error' } })
    const message = wrapper.get('p')
    expect(message.attributes('role')).toBe('alert')
    expect(message.attributes('id')).toBe('note-error')
    expect(message.text()).toBe('Too long')
  })
})

describe('FormTextField', () => {
  it('keeps a caller\'s aria-invalid when the error is shown elsewhere', async () => {
    const wrapper = await mountSuspended(FormTextField, {
      props: { label: 'Weeks', type: 'number', modelValue: 3 },
      attrs: { 'aria-invalid': 'true', 'min': '1' },
    })
    const input = wrapper.get('input')
    expect(input.attributes('aria-invalid')).toBe('true')
    expect(input.attributes('min')).toBe('1')
    expect(wrapper.get('label').attributes('for')).toBe(input.attributes('id'))
  })
})

describe('FormTextField with rows', () => {
  it('is a labelled textarea that reports what is typed', async () => {
    const wrapper = await mountSuspended(FormTextField, { props: { label: 'Summary', rows: 3, modelValue: '' } })
    const textarea = wrapper.get('textarea')
    expect(wrapper.find('input').exists()).toBe(false)
    expect(textarea.attributes('rows')).toBe('3')
    expect(wrapper.get('label').attributes('for')).toBe(textarea.attributes('id'))
    await textarea.setValue('Drive the knee')
    expect(wrapper.emitted('update:modelValue')?.at(-1)).toEqual(['Drive the knee'])
  })
})

describe('FormChoiceGroup', () => {
  const units = [{ value: 'km', label: 'Kilometres' }, { value: 'mi', label: 'Miles' }]

  it('names its radios by the legend and hands back the chosen value', async () => {
    const wrapper = await mountSuspended(FormChoiceGroup, { props: { legend: 'Units', name: 'units', options: units, modelValue: 'km' } })
    expect(wrapper.get('legend').text()).toBe('Units')
    const radios = wrapper.findAll('input[type="radio"]')
    expect(radios.map(radio => radio.element.closest('label')?.textContent?.trim())).toEqual(['Kilometres', 'Miles'])
    expect((radios[0]!.element as HTMLInputElement).checked).toBe(true)
    await radios[1]!.setValue(true)
    expect(wrapper.emitted('update:modelValue')?.at(-1)).toEqual(['mi'])
  })

  it('ticks checkboxes into a list and describes the group by its error', async () => {
    const wrapper = await mountSuspended(FormChoiceGroup, {
      props: { legend: 'Body areas', type: 'checkbox', options, modelValue: ['knee'], error: 'Pick at most three' },
    })
    const boxes = wrapper.findAll('input[type="checkbox"]')
    expect((boxes[0]!.element as HTMLInputElement).checked).toBe(true)
    await boxes[1]!.setValue(true)
    expect(wrapper.emitted('update:modelValue')?.at(-1)).toEqual([['knee', 'calf']])
    const describedBy = wrapper.get('fieldset').attributes('aria-describedby')!
    expect(wrapper.get(`#${CSS.escape(describedBy)}`).text()).toBe('Pick at most three')
  })
})
