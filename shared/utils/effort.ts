// Our own words for points on the 0–10 effort scale, shown beside RPE targets.
const anchors: [number, string][] = [
  [0, 'At rest'],
  [2, 'Very light: chatting with ease'],
  [4, 'Comfortable: steady breathing'],
  [6, 'Working: short sentences only'],
  [8, 'Hard: a word or two at a time'],
  [9, 'Very hard: close to your limit'],
  [10, 'All you have'],
]

export function effortWords(rpe: number): string {
  return anchors.find(([upTo]) => rpe <= upTo)?.[1] ?? anchors.at(-1)![1]
}
