/**
 * An in-process map whose entries end at a time of their own, bounded by a budget: when a new entry would not
 * fit, the least recently used go first. Each entry weighs 1 unless `weigh` says otherwise (a kept answer
 * weighs its characters); one heavier than the whole budget is not kept. Plain Node, no Nitro globals.
 */
export class ExpiringCache<V> {
  private readonly entries = new Map<string, { value: V, until: number, weight: number }>()
  private weight = 0

  constructor(private readonly budget: number, private readonly weigh: (value: V) => number = () => 1) {}

  get size() {
    return this.entries.size
  }

  get(key: string): V | undefined {
    const entry = this.entries.get(key)
    if (!entry) return undefined
    if (entry.until <= Date.now()) {
      this.delete(key)
      return undefined
    }
    // Most recently used last, so the oldest is first to go when the budget is spent.
    this.entries.delete(key)
    this.entries.set(key, entry)
    return entry.value
  }

  set(key: string, value: V, until: number) {
    this.delete(key)
    const weight = this.weigh(value)
    if (weight > this.budget) return
    while (this.weight + weight > this.budget) this.delete(this.entries.keys().next().value!)
    this.entries.set(key, { value, until, weight })
    this.weight += weight
  }

  delete(key: string) {
    const entry = this.entries.get(key)
    if (!entry) return
    this.entries.delete(key)
    this.weight -= entry.weight
  }

  /** Drops every entry whose value `matches`. */
  deleteWhere(matches: (value: V) => boolean) {
    for (const [key, entry] of this.entries) {
      if (matches(entry.value)) this.delete(key)
    }
  }
}
