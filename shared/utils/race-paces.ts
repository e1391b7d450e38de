import { equivalentVo2max, formatDuration, formatPace, MARATHON_M, MILE_M, paceFromRace, raceTimeForVo2max, riegel, trainingPaces, type RaceResult } from './pace'

// Arranges the pace math from pace.ts into the athlete's paces table; no formula lives here.

export const paceSources = {
  riegel: 'Riegel (1981), "Athletic records and human endurance", American Scientist 69:285–290',
  danielsGilbert: 'Daniels & Gilbert (1979), "Oxygen Power": oxygen cost and time-to-exhaustion equations',
} as const

export const raceDistances = [
  { key: '1500m', label: '1500 m', distanceM: 1500 },
  { key: 'mile', label: 'Mile', distanceM: MILE_M },
  { key: '5k', label: '5K', distanceM: 5000 },
  { key: '10k', label: '10K', distanceM: 10_000 },
  { key: 'half', label: 'Half marathon', distanceM: MARATHON_M / 2 },
  { key: 'marathon', label: 'Marathon', distanceM: MARATHON_M },
] as const

export interface PaceText {
  secPerKm: number
  km: string
  mi: string
}

export type TrainingZone
  = | { key: string, label: string, fast: PaceText, slow: PaceText }
    | { key: string, label: string, pace: PaceText }

function paceText(secPerKm: number): PaceText {
  return { secPerKm: Math.round(secPerKm * 10) / 10, km: formatPace(secPerKm, 'km'), mi: formatPace(secPerKm, 'mi') }
}

function raceTime(distanceM: number, timeS: number) {
  return { timeS: Math.round(timeS), time: formatDuration(timeS), pace: paceText(paceFromRace(distanceM, timeS)) }
}

/** Race equivalents by both methods and the training paces, each pace in km and mile units. */
export function racePaceTable(benchmark: RaceResult) {
  const vo2max = equivalentVo2max(benchmark.distanceM, benchmark.timeS)
  const paces = trainingPaces(benchmark)
  return {
    equivalentVo2max: Math.round(vo2max * 10) / 10,
    races: raceDistances.map(race => ({
      ...race,
      riegel: raceTime(race.distanceM, riegel(benchmark.distanceM, benchmark.timeS, race.distanceM)),
      danielsGilbert: raceTime(race.distanceM, raceTimeForVo2max(vo2max, race.distanceM)),
    })),
    training: <TrainingZone[]>[
      { key: 'easy', label: 'Easy', fast: paceText(paces.easy.fast), slow: paceText(paces.easy.slow) },
      { key: 'marathon', label: 'Marathon pace', pace: paceText(paces.marathon) },
      { key: 'threshold', label: 'Threshold', pace: paceText(paces.threshold) },
      { key: 'tenK', label: '10K pace', pace: paceText(paces.tenK) },
      { key: 'fiveK', label: '5K pace', pace: paceText(paces.fiveK) },
      { key: 'mile', label: 'Mile pace', pace: paceText(paces.mile) },
    ],
    sources: {
      races: { riegel: paceSources.riegel, danielsGilbert: paceSources.danielsGilbert },
      training: `${paceSources.danielsGilbert}; zone intensities as fractions of the equivalent VO2max`,
    },
  }
}

export type RacePaceTable = ReturnType<typeof racePaceTable>
