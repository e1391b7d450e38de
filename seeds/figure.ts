// A jointed figure of our own drawing, posed from joint angles and drawn as SVG, side on, facing right.
// Angles are in degrees. Legs use anatomical angles (hip flexion relative to the trunk, knee flexion,
// ankle plantarflexion); arms are measured from hanging straight down, so a coach-style keyframe reads
// the way the movement is described: "thigh level", "arm swung forward".

export interface Limb {
  /** Hip flexion relative to the trunk: 0 standing, 90 thigh level when upright, negative behind. */
  hip: number
  /** Knee flexion: 0 straight, 90 shin square to the thigh. */
  knee: number
  /** Ankle plantarflexion: 0 foot square to the shin, positive toes pointing down, negative toes up. */
  ankle: number
  /** Upper arm from hanging straight down: positive forward, negative back. */
  shoulder: number
  /** Elbow flexion: 0 straight, 90 forearm square to the upper arm. */
  elbow: number
}

export interface Pose {
  /** Trunk lean from upright: positive forward, negative back. */
  trunk: number
  /** Height of the lowest point above the ground, in figure heights (0 = touching; more = in the air). */
  lift: number
  /** Shift forward along the ground, in figure heights (a jump onto a box). */
  forward?: number
  /** The leg and arm nearest the viewer (drawn in front) and the far ones. */
  near: Limb
  far: Limb
}

export interface Keyframe {
  /** Moment within one cycle, 0 ≤ at < 1. */
  at: number
  pose: Pose
}

export interface Movement {
  /** Seconds per cycle of the movement. */
  cycleSeconds: number
  keyframes: Keyframe[]
  /** The far side runs the near side's keyframes half a cycle later (running, skipping, walking). */
  alternate?: boolean
  /** Whole-figure tilt in degrees (positive forward), e.g. -90 for lying on the back. */
  tilt?: number
  /** How fast the ground passes under the figure, in figure heights per second. */
  travel?: number
  /** Slope of the ground in degrees, positive uphill. */
  slope?: number
  /** An object drawn beside the figure: a step, a bench or a box. */
  prop?: 'step' | 'bench' | 'box' | 'wall'
}

const limbKeys: (keyof Limb)[] = ['hip', 'knee', 'ankle', 'shoulder', 'elbow']

/** Cosine ease between two keyframes: still at each keyframe, fastest half-way, like a joint. */
function ease(fraction: number) {
  return (1 - Math.cos(Math.PI * fraction)) / 2
}

function mixLimb(a: Limb, b: Limb, weight: number): Limb {
  const mixed = {} as Limb
  for (const key of limbKeys) mixed[key] = a[key] + (b[key] - a[key]) * weight
  return mixed
}

function mixPose(a: Pose, b: Pose, weight: number): Pose {
  return {
    trunk: a.trunk + (b.trunk - a.trunk) * weight,
    lift: a.lift + (b.lift - a.lift) * weight,
    forward: (a.forward ?? 0) + ((b.forward ?? 0) - (a.forward ?? 0)) * weight,
    near: mixLimb(a.near, b.near, weight),
    far: mixLimb(a.far, b.far, weight),
  }
}

/** The keyframes' pose at a moment of the cycle (any number; it wraps), eased between neighbours. */
export function interpolatePose(keyframes: Keyframe[], at: number): Pose {
  if (!keyframes.length) throw new Error('A movement needs at least one keyframe')
  const sorted = [...keyframes].sort((a, b) => a.at - b.at)
  const t = ((at % 1) + 1) % 1
  if (sorted.length === 1) return sorted[0]!.pose
  let index = sorted.findIndex(frame => frame.at > t) - 1
  if (index === -2) index = sorted.length - 1 // past the last keyframe: between it and the first, wrapping
  if (index === -1) index = sorted.length - 1 // before the first keyframe: also wrapping
  const from = sorted[index]!
  const to = sorted[(index + 1) % sorted.length]!
  const span = ((to.at - from.at) + 1) % 1 || 1
  const into = ((t - from.at) + 1) % 1
  return mixPose(from.pose, to.pose, ease(into / span))
}

/** The pose of a movement at a moment in seconds, with the far side half a cycle behind if it alternates. */
export function poseAt(movement: Movement, seconds: number): Pose {
  const phase = seconds / movement.cycleSeconds
  const pose = interpolatePose(movement.keyframes, phase)
  if (!movement.alternate) return pose
  return { ...pose, far: interpolatePose(movement.keyframes, phase + 0.5).near }
}

// Segment lengths in figure heights.
const body = { trunk: 0.3, neck: 0.05, head: 0.065, thigh: 0.245, shin: 0.245, foot: 0.1, heel: 0.03, upperArm: 0.17, forearm: 0.15 }

interface Point { x: number, y: number }
const radians = (degrees: number) => (degrees * Math.PI) / 180
/** A unit step at an angle measured from straight down, positive turning forward (to the right). */
const down = (degrees: number): Point => ({ x: Math.sin(radians(degrees)), y: -Math.cos(radians(degrees)) })
const add = (a: Point, length: number, direction: Point): Point => ({ x: a.x + length * direction.x, y: a.y + length * direction.y })

export interface Skeleton {
  pelvis: Point
  neck: Point
  head: Point
  near: { knee: Point, ankle: Point, heel: Point, toe: Point, shoulder: Point, elbow: Point, hand: Point }
  far: { knee: Point, ankle: Point, heel: Point, toe: Point, shoulder: Point, elbow: Point, hand: Point }
}

function limbPoints(pose: Pose, limb: Limb, pelvis: Point, neck: Point) {
  const thighAngle = limb.hip - pose.trunk
  const shinAngle = thighAngle - limb.knee
  const footAngle = shinAngle + 90 - limb.ankle
  const knee = add(pelvis, body.thigh, down(thighAngle))
  const ankle = add(knee, body.shin, down(shinAngle))
  const toe = add(ankle, body.foot, down(footAngle))
  const heel = add(add(ankle, body.heel, down(footAngle + 180)), body.heel * 0.6, down(shinAngle))
  const elbow = add(neck, body.upperArm, down(limb.shoulder))
  const hand = add(elbow, body.forearm, down(limb.shoulder + limb.elbow))
  return { knee, ankle, heel, toe, shoulder: neck, elbow, hand }
}

function rotate(point: Point, degrees: number): Point {
  // Tilting forward turns the figure clockwise as seen facing right.
  const angle = -radians(degrees)
  return { x: point.x * Math.cos(angle) - point.y * Math.sin(angle), y: point.x * Math.sin(angle) + point.y * Math.cos(angle) }
}

/** Joint positions in figure heights, y up, with the lowest point `pose.lift` above the ground (y = 0). */
export function skeleton(pose: Pose, tilt = 0): Skeleton {
  const pelvis = { x: 0, y: 0 }
  const neck = add(pelvis, body.trunk, down(180 + pose.trunk))
  const head = add(neck, body.neck + body.head, down(180 + pose.trunk))
  const raw: Skeleton = { pelvis, neck, head, near: limbPoints(pose, pose.near, pelvis, neck), far: limbPoints(pose, pose.far, pelvis, neck) }
  const points: Point[] = []
  const visit = (value: unknown) => {
    if (value && typeof value === 'object' && 'x' in value) points.push(value as Point)
    else if (value && typeof value === 'object') Object.values(value).forEach(visit)
  }
  visit(raw)
  const unique = [...new Set(points)]
  for (const point of unique) Object.assign(point, rotate(point, tilt))
  const lowest = Math.min(...unique.map(point => point.y), head.y - body.head)
  for (const point of unique) {
    point.y += pose.lift - lowest
    point.x += pose.forward ?? 0
  }
  return raw
}

export interface FigureStyle {
  background: string
  ground: string
  near: string
  far: string
  head: string
  prop: string
}

export const figureStyles: Record<string, FigureStyle> = {
  strength: { background: '#24302c', ground: '#8c9a8f', near: '#f3efe4', far: '#93ad9f', head: '#e9a15d', prop: '#5d6b63' },
  hill: { background: '#2b3324', ground: '#a7b784', near: '#f6f1e2', far: '#b4c49a', head: '#e58e52', prop: '#58663f' },
  drill: { background: '#222d3a', ground: '#8ea3ba', near: '#f1f3f6', far: '#9fb6cf', head: '#f0b35e', prop: '#4c5e72' },
  stride: { background: '#1f3440', ground: '#87aabd', near: '#eef5f7', far: '#91bccd', head: '#f2a56b', prop: '#456272' },
  mobility: { background: '#33283a', ground: '#ad97b8', near: '#f6f0f7', far: '#c0a6cc', head: '#eaa866', prop: '#65527a' },
  plyometric: { background: '#3a2a24', ground: '#c09a86', near: '#f8f0ea', far: '#d2a996', head: '#7cc4b0', prop: '#70503f' },
}

/**
 * One frame as SVG: the ground (sliding past when the movement travels), an optional prop, the figure.
 * The ground moves a whole number of dash spacings per cycle, so every cycle draws the same frames.
 */
export function figureSvg(movement: Movement, seconds: number, style: FigureStyle, width = 320, height = 240) {
  const pose = poseAt(movement, seconds)
  const joints = skeleton(pose, movement.tilt ?? 0)
  const scale = height * 0.62
  const groundY = height * 0.86
  const originX = width * 0.5
  const slope = radians(movement.slope ?? 0)
  const px = (point: Point) => ({ x: originX + point.x * scale, y: groundY - point.y * scale })
  const line = (a: Point, b: Point, colour: string, thickness: number) => {
    const p = px(a)
    const q = px(b)
    return `<line x1="${p.x.toFixed(1)}" y1="${p.y.toFixed(1)}" x2="${q.x.toFixed(1)}" y2="${q.y.toFixed(1)}" stroke="${colour}" stroke-width="${thickness.toFixed(1)}" stroke-linecap="round" />`
  }
  const limb = (side: Skeleton['near'], colour: string) => [
    line(joints.pelvis, side.knee, colour, scale * 0.055),
    line(side.knee, side.ankle, colour, scale * 0.048),
    line(side.heel, side.toe, colour, scale * 0.036),
    line(side.shoulder, side.elbow, colour, scale * 0.042),
    line(side.elbow, side.hand, colour, scale * 0.036),
  ].join('')
  // The ground runs through the point under the figure and tilts with the slope; dashes show travel.
  const rise = Math.tan(slope) * width
  const groundLine = `<line x1="0" y1="${(groundY + rise / 2).toFixed(1)}" x2="${width}" y2="${(groundY - rise / 2).toFixed(1)}" stroke="${style.ground}" stroke-width="3" />`
  const spacing = width / 6
  const dashesPerCycle = Math.round(((movement.travel ?? 0) * movement.cycleSeconds * scale) / spacing)
  const phase = ((seconds / movement.cycleSeconds) % 1 + 1) % 1
  const offset = ((dashesPerCycle * phase * spacing) % spacing + spacing) % spacing
  const dashes = Array.from({ length: 8 }, (_, index) => {
    const x = index * spacing - offset
    const y = groundY + rise / 2 - (x / width) * rise
    return `<line x1="${x.toFixed(1)}" y1="${(y + 8).toFixed(1)}" x2="${(x + spacing * 0.4).toFixed(1)}" y2="${(y + 8 - (spacing * 0.4 / width) * rise).toFixed(1)}" stroke="${style.ground}" stroke-width="2" stroke-opacity="0.6" />`
  }).join('')
  const props: Record<NonNullable<Movement['prop']>, string> = {
    step: `<rect x="${originX - scale * 0.05}" y="${groundY - scale * 0.1}" width="${scale * 0.4}" height="${scale * 0.1}" fill="${style.prop}" />`,
    bench: `<rect x="${originX - scale * 0.75}" y="${groundY - scale * 0.27}" width="${scale * 0.4}" height="${scale * 0.06}" fill="${style.prop}" /><rect x="${originX - scale * 0.6}" y="${groundY - scale * 0.21}" width="${scale * 0.06}" height="${scale * 0.21}" fill="${style.prop}" />`,
    box: `<rect x="${originX + scale * 0.3}" y="${groundY - scale * 0.3}" width="${scale * 0.45}" height="${scale * 0.3}" fill="${style.prop}" />`,
    wall: `<rect x="${originX + scale * 0.42}" y="${groundY - scale * 0.9}" width="${scale * 0.08}" height="${scale * 0.9}" fill="${style.prop}" />`,
  }
  const head = px(joints.head)
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}">
<rect width="100%" height="100%" fill="${style.background}" />
${groundLine}${dashes}${movement.prop ? props[movement.prop] : ''}
${limb(joints.far, style.far)}
${line(joints.pelvis, joints.neck, style.near, scale * 0.075)}
${limb(joints.near, style.near)}
<circle cx="${head.x.toFixed(1)}" cy="${head.y.toFixed(1)}" r="${(body.head * scale).toFixed(1)}" fill="${style.head}" />
</svg>`
}
