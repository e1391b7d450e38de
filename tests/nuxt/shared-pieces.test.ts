import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { Play } from 'lucide-vue-next'
import { h } from 'vue'
import { BlockOptionalPart, InsightsExportLinks, UiCalendarTable, UiIconButton, UiPageTitle, UiSection } from '#components'

// Small pieces several screens share: what each renders is what those screens used to write out by hand.
describe('InsightsExportLinks', () => {
  const query = (href: string | undefined) => Object.fromEntries(new URL(href!, 'http://x').searchParams)

  it('links the team\'s sessions and weeks between two days', async () => {
    const links = await mountSuspended(InsightsExportLinks, { props: { from: '2026-09-01', to: '2026-11-30', weeksLabel: 'Weekly load and ratios (CSV)' } })
    const anchors = links.findAll('a')
    expect(anchors.map(anchor => anchor.text())).toEqual(['Sessions (CSV)', 'Weekly load and ratios (CSV)'])
    expect(query(anchors[0]!.attributes('href'))).toEqual({ kind: 'sessions', from: '2026-09-01', to: '2026-11-30' })
    expect(query(anchors[1]!.attributes('href'))).toEqual({ kind: 'weeks', from: '2026-09-01', to: '2026-11-30' })
    expect(anchors.every(anchor => anchor.attributes('aria-disabled') === undefined)).toBe(true)
  })

  it('names one athlete when given, and marks the links unusable while the dates are wrong', async () => {
    const links = await mountSuspended(InsightsExportLinks, { props: { from: '2026-11-01', to: '2026-10-01', athleteId: 42, disabled: true } })
    const anchors = links.findAll('a')
    expect(anchors[1]!.text()).toBe('Weekly load (CSV)')
    expect(query(anchors[0]!.attributes('href'))).toMatchObject({ athleteId: '42', kind: 'sessions' })
    expect(anchors.map(anchor => anchor.attributes('aria-disabled'))).toEqual(['true', 'true'])
  })
})

describe('UiSection and UiPageTitle', () => {
  it('names a section by its heading', async () => {
    const section = await mountSuspended(UiSection, { props: { headingId: 'upcoming-heading', title: 'Upcoming' }, slots: { default: () => 'Nothing yet' } })
    expect(section.find('section').attributes('aria-labelledby')).toBe('upcoming-heading')
    expect(section.find('h2#upcoming-heading').text()).toBe('Upcoming')
    expect(section.text()).toContain('Nothing yet')
  })

  it('shows the title and the line under it, from the prop or the slot', async () => {
    const fromProp = await mountSuspended(UiPageTitle, { props: { title: 'Planner', description: 'Plan the block.' } })
    expect(fromProp.find('h1').text()).toBe('Planner')
    expect(fromProp.find('p').text()).toBe('Plan the block.')
    const fromSlot = await mountSuspended(UiPageTitle, { props: { title: 'Today' }, slots: { default: () => 'Hello Wren.' } })
    expect(fromSlot.find('p').text()).toBe('Hello Wren.')
  })
})

describe('BlockOptionalPart', () => {
  it('shows its fields and message only while switched on', async () => {
    const part = await mountSuspended(BlockOptionalPart, {
      props: { modelValue: false, label: 'Taper', error: 'Pick 1 to 3 weeks' },
      slots: { default: () => 'Taper fields' },
    })
    expect(part.text()).toContain('Taper')
    expect(part.text()).not.toContain('Taper fields')
    await part.find('input[type="checkbox"]').setValue(true)
    expect(part.emitted('update:modelValue')?.at(-1)).toEqual([true])
    await part.setProps({ modelValue: true })
    expect(part.text()).toContain('Taper fields')
    expect(part.find('[role="alert"]').text()).toBe('Pick 1 to 3 weeks')
  })
})

describe('UiIconButton', () => {
  it('is a named button that passes its clicks, state and classes through', async () => {
    let clicks = 0
    const button = await mountSuspended(UiIconButton, {
      props: { icon: Play, label: 'Play from cue 2' },
      attrs: { class: 'btn-ghost', onClick: () => clicks++ },
    })
    const element = button.find('button')
    expect(element.attributes()).toMatchObject({ 'type': 'button', 'aria-label': 'Play from cue 2', 'class': 'btn-ghost' })
    expect(element.attributes('title')).toBeUndefined()
    expect(element.find('svg').attributes('aria-hidden')).toBe('true')
    await element.trigger('click')
    expect(clicks).toBe(1)
    await button.setProps({ title: 'Play' })
    expect(element.attributes('title')).toBe('Play')
  })
})

describe('UiCalendarTable', () => {
  it('heads the weeks with the weekdays, Monday first, and draws each day through the slot', async () => {
    const weeks = [['2026-11-30', '2026-12-01', '2026-12-02', '2026-12-03', '2026-12-04', '2026-12-05', '2026-12-06'], ['2026-12-07', '2026-12-08', '2026-12-09', '2026-12-10', '2026-12-11', '2026-12-12', '2026-12-13']]
    const table = await mountSuspended(UiCalendarTable, {
      props: { weeks, caption: 'December', headClass: 'text-left', dayKey: (day: unknown) => String(day) },
      slots: { day: ({ day }: { day: unknown }) => h('td', Number(String(day).slice(8))) },
    })
    expect(table.find('caption').text()).toBe('December')
    expect(table.findAll('th').map(cell => cell.text())).toEqual(['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'])
    expect(table.find('th').classes()).toContain('text-left')
    const rows = table.findAll('tbody tr')
    expect(rows).toHaveLength(2)
    expect(rows[1]!.findAll('td').map(cell => cell.text())).toEqual(['7', '8', '9', '10', '11', '12', '13'])
  })
})
