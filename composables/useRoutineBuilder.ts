import type { InjectionKey } from 'vue'
import type { BlockKind } from '#shared/schemas/routine-steps'

// Our own colours for the kinds of step, from the app palette: effort in clay, recovery in ridge blue,
// warm-up and cool-down in two pines, rest in granite. Used by step cards, the timeline bar and the legend.
export const routineKindStyle: Record<BlockKind, { bar: string, stripe: string, swatch: string }> = {
  warmup: { bar: 'bg-pine-300', stripe: 'border-l-pine-300', swatch: 'bg-pine-300' },
  work: { bar: 'bg-clay-500', stripe: 'border-l-clay-500', swatch: 'bg-clay-500' },
  recovery: { bar: 'bg-ridge-300', stripe: 'border-l-ridge-300', swatch: 'bg-ridge-300' },
  rest: { bar: 'bg-granite-300', stripe: 'border-l-granite-300', swatch: 'bg-granite-300' },
  cooldown: { bar: 'bg-pine-600', stripe: 'border-l-pine-600', swatch: 'bg-pine-600' },
}

interface BuilderUi {
  expanded: Set<string>
  toggle: (id: string) => void
  focusAfterMove: (id: string, action: string) => Promise<void>
}

const key: InjectionKey<BuilderUi> = Symbol('routine-builder-ui')

/** Which step cards are open, shared by the nested lists of one builder. */
export function provideRoutineBuilderUi() {
  const expanded = reactive(new Set<string>())
  const ui: BuilderUi = {
    expanded,
    toggle: (id) => {
      if (expanded.has(id)) expanded.delete(id)
      else expanded.add(id)
    },
    // Moving a card re-inserts its element, which drops keyboard focus; put it back on the same button.
    focusAfterMove: async (id, action) => {
      await nextTick()
      const button = document.getElementById(`step-${id}-${action}`) as HTMLButtonElement | null
      const fallback = document.getElementById(`step-${id}-toggle`)
      if (button && !button.disabled) button.focus()
      else fallback?.focus()
    },
  }
  provide(key, ui)
  return ui
}

export function useRoutineBuilderUi(): BuilderUi {
  const ui = inject(key)
  if (!ui) throw new Error('useRoutineBuilderUi needs provideRoutineBuilderUi in a parent')
  return ui
}
