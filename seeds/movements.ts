import type { Keyframe, Limb, Movement, Pose } from './figure'

// Joint-angle keyframes for the demo figure, one movement per starter exercise. Many exercises share a
// base movement with their own numbers (a stride and a hill sprint are both a running cycle). Angles are
// set by eye for a clear demonstration, not measured from anyone: common practice, no published source.

const limb = (hip = 0, knee = 0, ankle = 0, shoulder = 0, elbow = 15): Limb => ({ hip, knee, ankle, shoulder, elbow })
const pose = (trunk: number, near: Limb, far: Limb = near, lift = 0, forward = 0): Pose => ({ trunk, lift, near, far, forward })
/** The ankle angle that keeps the foot flat on level ground for this leg and trunk. */
const flat = (trunk: number, hip: number, knee: number) => hip - trunk - knee
const standing = limb(0, 0, 0, 0, 15)

export function calfRaise({ knee = 0, singleLeg = true } = {}): Movement {
  const far = singleLeg ? limb(15, 75, 20, 0, 15) : undefined
  const down = pose(0, limb(0, knee, flat(0, 0, knee), 10, 20), far ?? limb(0, knee, flat(0, 0, knee), 10, 20))
  const up = pose(0, limb(0, knee, flat(0, 0, knee) + 38, 10, 20), far ?? limb(0, knee, flat(0, 0, knee) + 38, 10, 20))
  // Up in one second, a pause at the top, three seconds down.
  return { cycleSeconds: 5, prop: 'step', keyframes: [{ at: 0, pose: down }, { at: 0.2, pose: up }, { at: 0.3, pose: up }, { at: 0.92, pose: down }] }
}

export function squat({ hip = 105, knee = 115, trunk = 30, cycleSeconds = 3, arms = limb(0, 0, 0, 25, 130) } = {}): Movement {
  const top = pose(0, { ...standing, shoulder: arms.shoulder, elbow: arms.elbow })
  const bottomLeg = { ...arms, hip, knee, ankle: flat(trunk, hip, knee) }
  const bottom = pose(trunk, bottomLeg)
  return { cycleSeconds, keyframes: [{ at: 0, pose: top }, { at: 0.45, pose: bottom }, { at: 0.55, pose: bottom }] }
}

export function splitSquat(): Movement {
  const top = pose(8, limb(12, 5, flat(8, 12, 5), 0, 10), limb(-25, 70, 40, 0, 10))
  const bottom = pose(10, limb(85, 95, flat(10, 85, 95), 0, 10), limb(-5, 120, 40, 0, 10))
  return { cycleSeconds: 3, prop: 'bench', keyframes: [{ at: 0, pose: top }, { at: 0.45, pose: bottom }, { at: 0.55, pose: bottom }] }
}

export function stepUp(): Movement {
  const onStep = pose(15, limb(70, 85, flat(15, 70, 85), -15, 30), limb(0, 0, 0, 20, 30))
  const up = pose(0, limb(0, 0, 0, 25, 60), limb(75, 90, 10, -25, 60), 0.1)
  return { cycleSeconds: 2.5, prop: 'step', keyframes: [{ at: 0, pose: onStep }, { at: 0.45, pose: up }, { at: 0.6, pose: up }] }
}

export function hinge({ singleLeg = false, depth = 75 } = {}): Movement {
  const top = pose(0, limb(0, 12, flat(0, 0, 12), 0, 0), singleLeg ? limb(-5, 15, 20, 0, 0) : undefined)
  const bottom = pose(depth, limb(depth + 8, 18, flat(depth, depth + 8, 18), 0, 0), singleLeg ? limb(-5, 5, 20, 0, 0) : undefined)
  return { cycleSeconds: 3.5, keyframes: [{ at: 0, pose: top }, { at: 0.45, pose: bottom }, { at: 0.55, pose: bottom }] }
}

export function bridge({ singleLeg = false } = {}): Movement {
  const arms = { shoulder: 0, elbow: 0 }
  const downNear = { ...limb(60, 130, 20), ...arms }
  const upNear = { ...limb(-5, 100, 10), ...arms }
  const down = pose(0, downNear, singleLeg ? { ...limb(60, 0, 0), ...arms } : downNear)
  const up = pose(-25, upNear, singleLeg ? { ...limb(-5, 0, 0), ...arms } : upNear)
  return { cycleSeconds: 3, tilt: -90, keyframes: [{ at: 0, pose: down }, { at: 0.4, pose: up }, { at: 0.6, pose: up }] }
}

export function nordic(): Movement {
  const kneel = (trunk: number) => pose(trunk, limb(0, 90 - trunk, 90, 35, 70))
  // Three seconds or more on the way down, then a quick push back up.
  return { cycleSeconds: 4.5, keyframes: [{ at: 0, pose: kneel(0) }, { at: 0.7, pose: kneel(62) }, { at: 0.78, pose: kneel(65) }] }
}

export function sidePlank({ bench = false } = {}): Movement {
  const hold = (sag: number) => pose(sag, limb(sag, 0, 0, -72, 95), limb(sag, 0, 0, 10, 40))
  return { cycleSeconds: 3, tilt: -72, prop: bench ? 'bench' : undefined, keyframes: [{ at: 0, pose: hold(0) }, { at: 0.5, pose: hold(6) }] }
}

export function deadBug(): Movement {
  const table = limb(90, 90, 0, 90, 0)
  const reach = { ...table, shoulder: 165 }
  const extend = { ...table, hip: 15, knee: 0 }
  const frames: Keyframe[] = [
    { at: 0, pose: pose(0, table) },
    { at: 0.25, pose: pose(0, reach) },
    { at: 0.5, pose: pose(0, table) },
    { at: 0.75, pose: pose(0, extend) },
  ]
  return { cycleSeconds: 4, tilt: -90, alternate: true, keyframes: frames }
}

interface RunOptions { cycleSeconds?: number, kneeLift?: number, heel?: number, lean?: number, travel?: number, slope?: number, bounce?: number, armSwing?: number }

/** A running cycle for the near leg; the far leg follows half a cycle later. */
export function run({ cycleSeconds = 0.7, kneeLift = 55, heel = 105, lean = 6, travel = 2.2, slope = 0, bounce = 0, armSwing = 40 }: RunOptions = {}): Movement {
  const frames: Keyframe[] = [
    { at: 0, pose: pose(lean, limb(28, 12, 0, -armSwing, 80), undefined, 0) },
    { at: 0.2, pose: pose(lean, limb(2, 38, -12, -5, 85), undefined, 0) },
    { at: 0.4, pose: pose(lean, limb(-22, 18, 32, armSwing, 80), undefined, bounce) },
    { at: 0.6, pose: pose(lean, limb(8, heel, 12, armSwing * 0.5, 90), undefined, 0) },
    { at: 0.82, pose: pose(lean, limb(kneeLift, 80, 0, -armSwing * 0.6, 85), undefined, bounce) },
  ]
  return { cycleSeconds, keyframes: frames, alternate: true, travel, slope }
}

export function walk({ cycleSeconds = 1.1, lean = 4, travel = 0.9, slope = 0, poles = false } = {}): Movement {
  const arm = (swing: number) => (poles ? { shoulder: 25 + swing, elbow: 35 } : { shoulder: swing, elbow: 20 })
  const frames: Keyframe[] = [
    { at: 0, pose: pose(lean, { ...limb(22, 5, 0), ...arm(-20) }) },
    { at: 0.3, pose: pose(lean, { ...limb(0, 10, -5), ...arm(0) }) },
    { at: 0.55, pose: pose(lean, { ...limb(-15, 15, 20), ...arm(20) }) },
    { at: 0.75, pose: pose(lean, { ...limb(10, 55, 5), ...arm(10) }) },
  ]
  return { cycleSeconds, keyframes: frames, alternate: true, travel, slope }
}

/** A skip: a small hop on the stance leg while the other knee drives up (and, for B-skips, reaches out). */
export function skip({ reach = false } = {}): Movement {
  const frames: Keyframe[] = [
    { at: 0, pose: pose(4, limb(0, 8, 15, 35, 85), undefined, 0) },
    { at: 0.2, pose: pose(4, limb(-5, 5, 25, 40, 85), undefined, 0.04) },
    { at: 0.42, pose: pose(4, limb(90, 105, -15, -40, 85), undefined, 0) },
    ...(reach ? [{ at: 0.55, pose: pose(4, limb(75, 15, -5, -30, 85), undefined, 0) }] : []),
    { at: 0.7, pose: pose(4, limb(15, 5, 5, 0, 85), undefined, 0.04) },
  ]
  return { cycleSeconds: 1.2, keyframes: frames, alternate: true, travel: 0.8 }
}

export function bound(): Movement {
  const frames: Keyframe[] = [
    { at: 0, pose: pose(5, limb(35, 5, 0, -45, 20), undefined, 0) },
    { at: 0.25, pose: pose(5, limb(0, 5, 10, 0, 20), undefined, 0.05) },
    { at: 0.5, pose: pose(5, limb(-35, 5, 25, 45, 20), undefined, 0) },
    { at: 0.75, pose: pose(5, limb(0, 5, 10, 0, 20), undefined, 0.05) },
  ]
  return { cycleSeconds: 1, keyframes: frames, alternate: false, travel: 1.6 }
}

export function carioca(): Movement {
  // Side on, the crossing step reads as the trailing leg passing in front, then behind.
  const frames: Keyframe[] = [
    { at: 0, pose: pose(0, limb(30, 40, 10, 60, 20), limb(-10, 10, 10, 60, 20)) },
    { at: 0.25, pose: pose(0, limb(5, 10, 5, 60, 20), limb(5, 10, 5, 60, 20)) },
    { at: 0.5, pose: pose(0, limb(-20, 20, 15, 60, 20), limb(25, 35, 10, 60, 20)) },
    { at: 0.75, pose: pose(0, limb(5, 10, 5, 60, 20), limb(5, 10, 5, 60, 20)) },
  ]
  return { cycleSeconds: 1, keyframes: frames, travel: 0.7 }
}

export function legSwing(): Movement {
  const frames: Keyframe[] = [
    { at: 0, pose: pose(0, limb(-30, 15, 20, 70, 20), limb(0, 5, 0, 70, 20)) },
    { at: 0.5, pose: pose(0, limb(70, 10, 0, 70, 20), limb(0, 5, 0, 70, 20)) },
  ]
  return { cycleSeconds: 1.5, prop: 'wall', keyframes: frames }
}

export function ankleRock(): Movement {
  const at = (knee: number) => pose(0, limb(knee * 0.45, knee, flat(0, knee * 0.45, knee), 75, 40), limb(-20, 10, 25, 75, 40))
  return { cycleSeconds: 2, prop: 'wall', keyframes: [{ at: 0, pose: at(35) }, { at: 0.5, pose: at(75) }] }
}

export function lungeStretch(): Movement {
  const at = (push: number, arms: number) => pose(-push * 0.3, limb(90 - push * 0.6, 90 - push * 0.4, flat(-push * 0.3, 90 - push * 0.6, 90 - push * 0.4), arms, 10), limb(-10 - push, 95, 60, arms, 10))
  return { cycleSeconds: 4, keyframes: [{ at: 0, pose: at(0, 0) }, { at: 0.4, pose: at(20, 170) }, { at: 0.7, pose: at(20, 170) }] }
}

export function hop({ singleLeg = false, height = 0.07, cycleSeconds = 0.5 } = {}): Movement {
  const far = singleLeg ? limb(30, 85, 15, 20, 80) : undefined
  const land = pose(3, limb(8, 18, flat(3, 8, 18) + 10, 20, 80), far ?? limb(8, 18, flat(3, 8, 18) + 10, 20, 80))
  const air = pose(2, limb(2, 5, 35, 30, 80), far ?? limb(2, 5, 35, 30, 80), height)
  return { cycleSeconds, keyframes: [{ at: 0, pose: land }, { at: 0.5, pose: air }] }
}

export function boxJump(): Movement {
  const stand = pose(0, limb(0, 0, 0, 0, 15))
  const load = pose(35, limb(75, 80, flat(35, 75, 80), -55, 10))
  const air = pose(10, limb(80, 95, 20, 90, 30), undefined, 0.34, 0.3)
  const landed = pose(20, limb(50, 55, flat(20, 50, 55), 40, 40), undefined, 0.3, 0.52)
  const tall = pose(0, limb(0, 0, 0, 0, 15), undefined, 0.3, 0.52)
  return {
    cycleSeconds: 4,
    prop: 'box',
    keyframes: [
      { at: 0, pose: stand }, { at: 0.15, pose: load }, { at: 0.27, pose: air }, { at: 0.36, pose: landed },
      { at: 0.5, pose: tall }, { at: 0.75, pose: tall }, { at: 0.9, pose: stand },
    ],
  }
}

export function skaterHop(): Movement {
  const left = pose(35, limb(65, 60, flat(35, 65, 60), -30, 40), limb(-15, 80, 30, 40, 40))
  const right = pose(35, limb(-15, 80, 30, 40, 40), limb(65, 60, flat(35, 65, 60), -30, 40))
  const airborne = (from: Pose) => ({ ...from, lift: 0.08, trunk: 25 })
  return { cycleSeconds: 1.4, keyframes: [{ at: 0, pose: left }, { at: 0.25, pose: airborne(pose(25, limb(20, 40, 20, 0, 40))) }, { at: 0.5, pose: right }, { at: 0.75, pose: airborne(pose(25, limb(20, 40, 20, 0, 40))) }] }
}

export interface ExerciseMovement {
  movement: Movement
  /** Seconds into the clip at which each of the exercise's cues is said; evenly spread when absent. */
  cueAt?: number[]
}

/** The demo figure's movement for each starter exercise, by name. */
export const exerciseMovements: Record<string, ExerciseMovement> = {
  'Single-leg calf raise': { movement: calfRaise(), cueAt: [0.1, 0.5, 1.1, 1.8] },
  'Bent-knee calf raise': { movement: calfRaise({ knee: 30, singleLeg: false }), cueAt: [0.1, 0.5, 1.8] },
  'Bulgarian split squat': { movement: splitSquat() },
  'Romanian deadlift': { movement: hinge() },
  'Single-leg Romanian deadlift': { movement: hinge({ singleLeg: true, depth: 70 }) },
  'Step-ups': { movement: stepUp() },
  'Goblet squat': { movement: squat(), cueAt: [0.1, 0.7, 1.35, 1.9] },
  'Glute bridge': { movement: bridge() },
  'Single-leg glute bridge': { movement: bridge({ singleLeg: true }) },
  'Nordic hamstring lowering': { movement: nordic() },
  'Copenhagen side plank': { movement: sidePlank({ bench: true }) },
  'Short hill sprints': { movement: run({ cycleSeconds: 0.6, kneeLift: 70, lean: 12, slope: 8, travel: 2.4 }) },
  'One-minute hill climbs': { movement: run({ cycleSeconds: 0.65, kneeLift: 60, lean: 10, slope: 7, travel: 2 }) },
  'Long hill repeats': { movement: run({ cycleSeconds: 0.7, kneeLift: 55, lean: 9, slope: 6, travel: 1.8 }) },
  'Hill strides': { movement: run({ cycleSeconds: 0.65, kneeLift: 60, lean: 9, slope: 5, travel: 2.2 }) },
  'Downhill running practice': { movement: run({ cycleSeconds: 0.6, kneeLift: 40, lean: 2, slope: -5, travel: 2.4 }) },
  'Uphill walking with poles': { movement: walk({ lean: 16, slope: 10, poles: true, cycleSeconds: 1.2 }) },
  'A-skips': { movement: skip(), cueAt: [0.25, 0.5, 1.0, 1.8] },
  'B-skips': { movement: skip({ reach: true }) },
  'High knees': { movement: run({ cycleSeconds: 0.5, kneeLift: 92, heel: 110, lean: 0, travel: 0.5 }) },
  'Butt kicks': { movement: run({ cycleSeconds: 0.5, kneeLift: 20, heel: 145, lean: 2, travel: 0.5 }) },
  'Straight-leg bounds': { movement: bound() },
  'Carioca': { movement: carioca() },
  'Strides': { movement: run({ cycleSeconds: 0.65, kneeLift: 60, lean: 6, travel: 2.6 }) },
  'Barefoot grass strides': { movement: run({ cycleSeconds: 0.7, kneeLift: 50, lean: 5, travel: 2.2 }) },
  'Flying strides': { movement: run({ cycleSeconds: 0.6, kneeLift: 65, lean: 7, travel: 3 }) },
  'Side plank': { movement: sidePlank() },
  'Dead bug': { movement: deadBug() },
  'Leg swings': { movement: legSwing() },
  'Knee-to-wall ankle rocks': { movement: ankleRock() },
  'Hip flexor lunge stretch': { movement: lungeStretch() },
  'Pogo hops': { movement: hop() },
  'Hill bounding': { movement: run({ cycleSeconds: 0.9, kneeLift: 75, heel: 95, lean: 10, slope: 8, travel: 2, bounce: 0.06, armSwing: 55 }) },
  'Box jumps': { movement: boxJump() },
  'Skater hops': { movement: skaterHop() },
  'Single-leg hops in place': { movement: hop({ singleLeg: true, height: 0.06, cycleSeconds: 0.55 }) },
}
