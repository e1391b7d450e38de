/**
 * After a set is logged with a load, the later sets of the same step start from that load instead of the
 * prescription: an athlete who had to go lighter (or could go heavier) should not re-type it every set.
 * Sets already logged keep what was logged. Returns the drafts to replace, keyed by segment key.
 */
export function carryLoadForward<D extends { kg: number | null }>(
  segments: readonly { key: string, stepId: string, loggable: boolean }[],
  fromIndex: number,
  kg: number | null,
  drafts: Readonly<Record<string, D>>,
  logged: Readonly<Record<string, unknown>>,
): Record<string, D> {
  const from = segments[fromIndex]
  if (!from || kg === null) return {}
  const changed: Record<string, D> = {}
  for (const segment of segments.slice(fromIndex + 1)) {
    if (segment.stepId !== from.stepId || !segment.loggable || logged[segment.key]) continue
    const draft = drafts[segment.key]
    if (draft && draft.kg !== kg) changed[segment.key] = { ...draft, kg }
  }
  return changed
}
