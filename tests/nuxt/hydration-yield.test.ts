import { afterEach, describe, expect, it, vi } from 'vitest'
import { mount } from '@vue/test-utils'
import { h, Suspense } from 'vue'
import { UiHydrateAfterYield } from '#components'

// The page's hydration is split in two around UiHydrateAfterYield (layouts/default.vue): while the server's
// page is hydrated, what it wraps waits until the browser has had the main thread back once.
function mountWrapped() {
  return mount({ render: () => h(Suspense, null, { default: () => h(UiHydrateAfterYield, null, { default: () => h('p', 'The steps') }) }) })
}
const microtasks = async () => {
  for (let turn = 0; turn < 5; turn++) await Promise.resolve()
}

describe('UiHydrateAfterYield', () => {
  afterEach(() => {
    useNuxtApp().isHydrating = false
    vi.unstubAllGlobals()
  })

  it('renders what it wraps at once after client-side navigation', () => {
    useNuxtApp().isHydrating = false
    expect(mountWrapped().html()).toContain('The steps')
  })

  it('while hydrating, holds what it wraps until the browser\'s scheduler hands the thread back', async () => {
    useNuxtApp().isHydrating = true
    let handBack = () => {}
    const yieldCalls = vi.fn(() => new Promise<void>((resolve) => {
      handBack = resolve
    }))
    vi.stubGlobal('scheduler', { yield: yieldCalls })
    const wrapper = mountWrapped()
    await microtasks()
    expect(yieldCalls).toHaveBeenCalledOnce()
    expect(wrapper.html()).not.toContain('The steps')
    handBack()
    await microtasks()
    expect(wrapper.html()).toContain('The steps')
  })

  it('while hydrating in a browser with no scheduler.yield, waits for a timer task rather than a microtask', async () => {
    useNuxtApp().isHydrating = true
    vi.stubGlobal('scheduler', undefined)
    const wrapper = mountWrapped()
    await microtasks()
    expect(wrapper.html()).not.toContain('The steps')
    await new Promise(resolve => setTimeout(resolve, 5))
    await microtasks()
    expect(wrapper.html()).toContain('The steps')
  })
})
