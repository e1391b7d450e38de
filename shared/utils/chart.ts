// The arithmetic of the small SVG charts (block weeks, load by week, dated lines): where the plot sits
// inside the picture, how values map to heights, which ticks to label and the line's path. Pure
// functions, unit-tested in tests/unit/chart.test.ts; the components only draw.

export interface ChartPadding { top: number, right: number, bottom: number, left: number }

/** The plot inside a picture of `width` × `height` once the padding for labels is taken off. */
export interface PlotArea {
  width: number
  height: number
  left: number
  top: number
  right: number
  bottom: number
  /** The picture's own size, for the viewBox and labels under the plot. */
  outer: { width: number, height: number }
}

export function plotArea(width: number, height: number, pad: ChartPadding): PlotArea {
  const plotW = width - pad.left - pad.right
  const plotH = height - pad.top - pad.bottom
  return { width: plotW, height: plotH, left: pad.left, top: pad.top, right: pad.left + plotW, bottom: pad.top + plotH, outer: { width, height } }
}

/** The vertical position of a value when `top` sits at the top of the plot and 0 at its bottom. */
export function valueScale(area: PlotArea, top: number) {
  return (value: number) => area.top + area.height - (value / top) * area.height
}

/** The top of a value axis: the largest value (at least `floor`) with some room above it. */
export function topWithRoom(values: number[], floor = 1, room = 1.1) {
  return Math.max(floor, ...values) * room
}

/** The value rounded up to its leading digit (437 → 500, 1200 → 2000, 0.7 → 0.7), for an axis top. */
export function roundUpLeading(value: number) {
  const step = 10 ** Math.floor(Math.log10(value))
  return Math.ceil(value / step) * step
}

/** Equal slots side by side (one a week), with the centre of each. */
export function slots(area: PlotArea, count: number) {
  const slot = area.width / Math.max(1, count)
  return { slot, x: (index: number) => area.left + slot * index + slot / 2 }
}

const dayValue = (day: string) => Date.parse(`${day}T00:00:00Z`)

/** Calendar days (YYYY-MM-DD) spread over the plot's width; a single day sits in the middle. */
export function dayScale(area: PlotArea, days: string[]) {
  const values = days.map(dayValue)
  const min = Math.min(...values)
  const span = Math.max(1, Math.max(...values) - min)
  return (day: string) => days.length === 1 ? area.left + area.width / 2 : area.left + ((dayValue(day) - min) / span) * area.width
}

/** Labelled ticks at fractions of the axis top (0, half and top by default). */
export function fractionTicks(top: number, y: (value: number) => number, format: (value: number) => string, fractions = [0, 0.5, 1]) {
  return fractions.map(fraction => ({ y: y(top * fraction), label: format(top * fraction) }))
}

/** Labelled ticks at given values. */
export function valueTicks(values: number[], y: (value: number) => number, format: (value: number) => string) {
  return values.map(value => ({ y: y(value), label: format(value) }))
}

export const oneDecimal = (value: number) => Math.round(value * 10) / 10

/** An SVG path through the points; a `null` lifts the pen, so a gap stays a gap. */
export function linePath(points: ({ x: number, y: number } | null)[]) {
  const parts: string[] = []
  let pen = false
  for (const point of points) {
    if (!point) {
      pen = false
      continue
    }
    parts.push(`${pen ? 'L' : 'M'}${point.x.toFixed(1)},${point.y.toFixed(1)}`)
    pen = true
  }
  return parts.join(' ')
}
