import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { h } from 'vue'
import { InsightsLineChart, RoutineRowActions, TableData, TablePager, TableSortHeader } from '#components'

// The shared table and chart pieces, mounted inside the app.
describe('TableData', () => {
  const columns = [
    { key: 'label', label: 'Race', rowHeader: true },
    { key: 'time', label: 'Time', numeric: true },
    { key: 'note', label: 'Note' },
  ]
  type Row = { key: string, label: string, time: string, note: string | null }
  const rows: Row[] = [{ key: '5k', label: '5 km', time: '19:40', note: null }, { key: '10k', label: '10 km', time: '41:02', note: 'windy' }]

  it('names each row by its header cell, right-aligns numbers and shows a dash for nothing', async () => {
    const table = await mountSuspended(TableData, { props: { columns, rows, rowKey: (row: unknown) => (row as Row).key, caption: 'Race equivalents' } })
    expect(table.find('caption').text()).toBe('Race equivalents')
    expect(table.findAll('thead th').map(cell => cell.text())).toEqual(['Race', 'Time', 'Note'])
    const first = table.findAll('tbody tr')[0]!
    expect(first.find('th').attributes('scope')).toBe('row')
    expect(first.find('th').text()).toBe('5 km')
    const cells = first.findAll('td')
    expect(cells[0]!.classes()).toEqual(expect.arrayContaining(['text-right', 'tabular-nums']))
    expect(cells[1]!.text()).toBe('—')
    expect(cells[1]!.classes()).not.toContain('pr-3')
  })

  it('lets the page fill a column through its slot', async () => {
    const table = await mountSuspended(TableData, {
      props: { columns, rows, rowKey: (row: unknown) => (row as Row).key },
      slots: { 'cell-time': ({ row }: { row: unknown }) => h('strong', `${(row as Row).time} min`) },
    })
    expect(table.findAll('tbody strong').map(cell => cell.text())).toEqual(['19:40 min', '41:02 min'])
    expect(table.find('caption').exists()).toBe(false)
  })
})

describe('sort header and pager', () => {
  it('puts aria-sort on the header cell and asks to sort when pressed', async () => {
    const header = await mountSuspended(TableSortHeader, { props: { label: 'Name', sort: 'descending' }, attrs: { class: 'px-4' } })
    expect(header.element.tagName).toBe('TH')
    expect(header.attributes('aria-sort')).toBe('descending')
    expect(header.classes()).toContain('px-4')
    await header.find('button').trigger('click')
    expect(header.emitted('sort')).toHaveLength(1)
  })

  it('offers the neighbouring pages and stays away when there is one page', async () => {
    const pager = await mountSuspended(TablePager, { props: { label: 'Pages', page: 1, pages: 3 } })
    expect(pager.find('nav').attributes('aria-label')).toBe('Pages')
    expect(pager.text()).toContain('Page 1 of 3')
    const [previous, next] = pager.findAll('button')
    expect(previous!.attributes('disabled')).toBeDefined()
    await next!.trigger('click')
    expect(pager.emitted('go')).toEqual([[2]])
    const single = await mountSuspended(TablePager, { props: { label: 'Pages', page: 1, pages: 1 } })
    expect(single.find('nav').exists()).toBe(false)
  })
})

describe('routine actions', () => {
  it('names each action after the routine, the same on cards and in the table', async () => {
    for (const compact of [false, true]) {
      const actions = await mountSuspended(RoutineRowActions, { props: { row: { id: 4, title: 'Ridge hills', isTemplate: false, archivedAt: null }, compact } })
      expect(actions.findAll('button, a').map(item => item.attributes('aria-label'))).toEqual(['Duplicate Ridge hills', 'Print card for Ridge hills', 'Archive Ridge hills'])
      await actions.findAll('button')[1]!.trigger('click')
      expect(actions.emitted('archive')).toEqual([[true]])
    }
    const template = await mountSuspended(RoutineRowActions, { props: { row: { id: 5, title: 'Template: strides', isTemplate: true, archivedAt: '2026-01-01T00:00:00Z' } } })
    expect(template.findAll('button').map(item => item.text())).toEqual(['Use', 'Restore'])
  })
})

describe('line chart', () => {
  it('labels the axis at 0, half and the top and draws one path through the values', async () => {
    const chart = await mountSuspended(InsightsLineChart, {
      props: { label: 'Pain after sessions', yMax: 10, points: [{ day: '2026-03-02', value: 2 }, { day: '2026-03-09', value: null }, { day: '2026-03-16', value: 4 }] },
    })
    expect(chart.attributes('aria-label')).toBe('Pain after sessions')
    expect(chart.findAll('line')).toHaveLength(3)
    expect(chart.findAll('g text').map(text => text.text())).toEqual(['0', '5', '10'])
    expect(chart.findAll('circle')).toHaveLength(2)
    expect(chart.find('path').attributes('d')).toBe('M44.0,124.4 L624.0,96.8')
  })
})
