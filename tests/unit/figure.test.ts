import { describe, expect, it } from 'vitest'
import { interpolatePose, poseAt, skeleton, type Keyframe, type Limb, type Pose } from '../../seeds/figure'
import { clipPlan } from '../../seeds/figure-clip'
import { exerciseMovements } from '../../seeds/movements'
import { starterExercises } from '../../server/starter/exercises'

const limb = (hip: number, knee = 0): Limb => ({ hip, knee, ankle: 0, shoulder: 0, elbow: 0 })
const pose = (trunk: number, hip: number, lift = 0): Pose => ({ trunk, lift, near: limb(hip), far: limb(-hip) })
const frames: Keyframe[] = [
  { at: 0, pose: pose(0, 0) },
  { at: 0.5, pose: pose(40, 100) },
]

describe('keyframe interpolation', () => {
  it('returns each keyframe exactly at its moment', () => {
    expect(interpolatePose(frames, 0).near.hip).toBe(0)
    expect(interpolatePose(frames, 0.5).near.hip).toBe(100)
    expect(interpolatePose(frames, 0.5).trunk).toBe(40)
  })

  it('is half-way at the middle and eased (slow near a keyframe) in between', () => {
    expect(interpolatePose(frames, 0.25).near.hip).toBeCloseTo(50, 9)
    // Cosine easing: a tenth of the way in time moves (1 - cos(0.2π)) / 2 ≈ 9.5% of the way.
    expect(interpolatePose(frames, 0.05).near.hip).toBeCloseTo(100 * (1 - Math.cos(Math.PI * 0.1)) / 2, 9)
    expect(interpolatePose(frames, 0.05).near.hip).toBeLessThan(10)
  })

  it('wraps from the last keyframe back to the first, and takes any moment modulo one cycle', () => {
    expect(interpolatePose(frames, 0.75).near.hip).toBeCloseTo(50, 9)
    expect(interpolatePose(frames, 1.25).near.hip).toBeCloseTo(interpolatePose(frames, 0.25).near.hip, 9)
    expect(interpolatePose(frames, -0.25).near.hip).toBeCloseTo(interpolatePose(frames, 0.75).near.hip, 9)
    // Keyframes that do not start at 0 still wrap: half-way from 0.8 (0) to 0.2 (100) is 0.0.
    const late: Keyframe[] = [{ at: 0.2, pose: pose(0, 100) }, { at: 0.8, pose: pose(0, 0) }]
    expect(interpolatePose(late, 0).near.hip).toBeCloseTo(50, 9)
  })

  it('runs the far side half a cycle behind for alternating movements', () => {
    const movement = { cycleSeconds: 2, keyframes: frames, alternate: true }
    expect(poseAt(movement, 0).far.hip).toBeCloseTo(poseAt(movement, 1).near.hip, 9)
  })

  it('puts the lowest point of the figure on the ground unless it is lifted', () => {
    const standing = skeleton(pose(0, 0))
    expect(Math.min(standing.near.heel.y, standing.near.toe.y)).toBeCloseTo(0, 9)
    const jumping = skeleton({ ...pose(0, 0), lift: 0.1 })
    expect(Math.min(jumping.near.heel.y, jumping.near.toe.y)).toBeCloseTo(0.1, 9)
  })
})

describe('demo clip plans', () => {
  it('gives every starter exercise a movement that loops in 3–6 s', () => {
    for (const exercise of starterExercises) {
      const motion = exerciseMovements[exercise.name]
      expect(motion, exercise.name).toBeDefined()
      const plan = clipPlan(motion!.movement.cycleSeconds, 24)
      expect(plan.durationSeconds, exercise.name).toBeGreaterThanOrEqual(3)
      expect(plan.durationSeconds, exercise.name).toBeLessThanOrEqual(6)
      for (const at of motion!.cueAt ?? []) expect(at).toBeLessThan(plan.durationSeconds)
    }
  })
})
