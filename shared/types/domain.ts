import type { RoutineStep } from '../schemas/routine-steps'

export const bodyAreas = ['achilles', 'calf', 'knee', 'hip', 'lower_back', 'hamstring', 'quad', 'shin', 'foot', 'ankle', 'glute', 'groin', 'shoulder', 'neck'] as const
export type BodyArea = typeof bodyAreas[number]

export const bodyAreaLabels: Record<BodyArea, string> = {
  achilles: 'Achilles', calf: 'Calf', knee: 'Knee', hip: 'Hip', lower_back: 'Lower back', hamstring: 'Hamstring',
  quad: 'Quadriceps', shin: 'Shin', foot: 'Foot', ankle: 'Ankle', glute: 'Glute', groin: 'Groin', shoulder: 'Shoulder', neck: 'Neck',
}

export interface ExerciseCaution {
  text: string
  bodyAreas: BodyArea[]
}

/** What an exercise looked like when a routine was assigned: enough to run the session later. */
export interface SnapshotExercise {
  id: number
  name: string
  category: string
  summary: string
  cues: string[]
  equipment: string[]
  cautions: ExerciseCaution[]
}

export interface AssignmentSnapshot {
  title: string
  category: string
  description: string
  steps: RoutineStep[]
  exercises: SnapshotExercise[]
}

export type Role = 'head_coach' | 'coach' | 'athlete'
export const roleLabels: Record<Role, string> = { head_coach: 'Head coach', coach: 'Coach', athlete: 'Athlete' }
