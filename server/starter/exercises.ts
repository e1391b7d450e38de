import type { ExerciseInput } from '#shared/schemas/exercise'

/** How a generated demo clip looks: `seeds/clip.ts` draws it; `scripts/starter-clips.ts` writes the files. */
export interface StarterClipStyle {
  motion: 'run' | 'climb' | 'bounce'
  background: string
  marker: string
}

export type StarterExercise = ExerciseInput & { clip?: StarterClipStyle }

// The starter library, written for Switchback. Cues are in the order a coach would say them.
export const starterExercises: StarterExercise[] = [
  // Strength
  {
    name: 'Single-leg calf raise',
    category: 'strength',
    summary: 'Rise onto the ball of one foot from a step edge and lower slowly below level. Builds the calf and Achilles capacity that every running stride leans on.',
    cues: ['Stand on one foot with the heel hanging off the step', 'Rise as high as you can in one second', 'Pause at the top', 'Lower for three seconds until the heel sits below the step'],
    equipment: ['Step', 'Dumbbell'],
    cautions: [{ text: 'With a sore Achilles, keep the heel level with the step instead of dropping below it.', bodyAreas: ['achilles', 'calf'] }],
    clip: { motion: 'bounce', background: '#224668', marker: '#ec9f70' },
  },
  {
    name: 'Bent-knee calf raise',
    category: 'strength',
    summary: 'A calf raise with the knee bent about 30 degrees, which shifts the work to the deeper soleus muscle that takes most of the load when running.',
    cues: ['Bend the standing knee slightly and keep it bent', 'Rise onto the ball of the foot', 'Lower under control'],
    equipment: ['Step', 'Smith machine'],
    cautions: [{ text: 'Keep the knee angle fixed; stop if the Achilles feels sharp rather than tired.', bodyAreas: ['achilles', 'calf'] }],
  },
  {
    name: 'Bulgarian split squat',
    category: 'strength',
    summary: 'A one-leg squat with the back foot resting on a bench. Trains each leg on its own, so left-right differences show up quickly.',
    cues: ['Back foot laces-down on the bench', 'Front shin close to upright', 'Lower straight down until the back knee nearly touches', 'Drive up through the whole front foot'],
    equipment: ['Bench', 'Dumbbells'],
    cautions: [
      { text: 'Let the front knee track over the middle toes; a knee that drifts inward means the load is too heavy.', bodyAreas: ['knee'] },
      { text: 'Start with body weight if the hip flexor on the back leg feels strained.', bodyAreas: ['hip', 'groin'] },
    ],
  },
  {
    name: 'Romanian deadlift',
    category: 'strength',
    summary: 'A hip hinge with soft knees that loads the hamstrings and glutes through a long range. The bar stays close to the legs the whole way.',
    cues: ['Feet hip-width, knees softly bent', 'Push the hips back as the bar slides down the thighs', 'Keep the back long and the chest proud', 'Stand up by squeezing the glutes'],
    equipment: ['Barbell'],
    cautions: [
      { text: 'Stop the descent where the back starts to round, not where the bar touches the floor.', bodyAreas: ['lower_back'] },
      { text: 'Use light loads after a hamstring strain and progress only without pain the next day.', bodyAreas: ['hamstring'] },
    ],
  },
  {
    name: 'Single-leg Romanian deadlift',
    category: 'strength',
    summary: 'The hip hinge on one leg, with the free leg reaching back. Trains balance and hip control as much as hamstring strength.',
    cues: ['Weight in the standing heel', 'Hips stay square to the floor', 'Reach the free heel back as the chest tips forward', 'Return to tall standing'],
    equipment: ['Kettlebell'],
    cautions: [{ text: 'Hold a wall or rack lightly until balance is steady.', bodyAreas: ['ankle', 'hamstring'] }],
  },
  {
    name: 'Step-ups',
    category: 'strength',
    summary: 'Stepping onto a knee-height box with one leg doing all the work. Close to the demands of climbing on trails.',
    cues: ['Whole foot on the box', 'Lean slightly forward', 'Push through the top leg, not off the bottom foot', 'Step down slowly'],
    equipment: ['Box', 'Dumbbells'],
    cautions: [{ text: 'Lower the box height if the knee aches at the bottom position.', bodyAreas: ['knee'] }],
  },
  {
    name: 'Goblet squat',
    category: 'strength',
    summary: 'A squat holding one weight at the chest. A simple way to learn deep, upright squatting before barbell work.',
    cues: ['Hold the weight against the breastbone', 'Sit down between the heels', 'Knees follow the toes', 'Stand tall at the top'],
    equipment: ['Kettlebell'],
    cautions: [{ text: 'Squat only as deep as you can keep the lower back from tucking under.', bodyAreas: ['lower_back', 'knee'] }],
  },
  {
    name: 'Glute bridge',
    category: 'strength',
    summary: 'Lying on the back, lift the hips until the body is straight from knees to shoulders. Wakes up the glutes before running or lifting.',
    cues: ['Heels close to the hips', 'Press the lower back gently into the floor', 'Lift the hips by squeezing the glutes', 'Hold one second, lower slowly'],
    equipment: ['Mat'],
    cautions: [{ text: 'If the hamstrings cramp, bring the heels closer; if the back arches, lift less high.', bodyAreas: ['hamstring', 'lower_back'] }],
    clip: { motion: 'bounce', background: '#3f3d38', marker: '#84bf9e' },
  },
  {
    name: 'Single-leg glute bridge',
    category: 'strength',
    summary: 'The bridge on one leg with the other held up. Shows whether each side can hold the pelvis level.',
    cues: ['One knee pulled toward the chest', 'Push through the heel on the floor', 'Keep both hip bones at the same height'],
    equipment: ['Mat'],
    cautions: [{ text: 'Stop if the hamstring grips sharply; go back to two legs for a week.', bodyAreas: ['hamstring'] }],
  },
  {
    name: 'Nordic hamstring lowering',
    category: 'strength',
    summary: 'Kneeling with the ankles held, lean forward as slowly as possible. A strong eccentric load for the hamstrings.',
    cues: ['Partner or strap holds the ankles', 'Body straight from knees to head', 'Lower as slowly as you can', 'Catch yourself with the hands and push back up'],
    equipment: ['Mat', 'Partner or strap'],
    cautions: [
      { text: 'Expect strong soreness the first times: start with one set of three and build over weeks.', bodyAreas: ['hamstring'] },
      { text: 'Pad the knees well.', bodyAreas: ['knee'] },
    ],
  },
  {
    name: 'Copenhagen side plank',
    category: 'strength',
    summary: 'A side plank with the top leg resting on a bench, so the inner thigh holds the body up. Builds groin strength for uneven ground.',
    cues: ['Forearm under the shoulder', 'Top leg on the bench at the knee (easier) or the ankle (harder)', 'Lift the hips in line', 'Hold, breathing steadily'],
    equipment: ['Bench', 'Mat'],
    cautions: [{ text: 'Begin with the bench under the knee; move it out to the ankle only when holds feel easy.', bodyAreas: ['groin', 'knee'] }],
  },
  // Hill
  {
    name: 'Short hill sprints',
    category: 'hill',
    summary: 'Eight to twelve seconds of near-maximal running up a steep hill, with full walk-back recovery. Builds power with little impact.',
    cues: ['Start from a rolling jog', 'Drive the knees and arms hard', 'Stay tall, eyes up the slope', 'Walk all the way back down'],
    equipment: ['Hill'],
    cautions: [
      { text: 'Keep the efforts short: the aim is power, not fatigue.', bodyAreas: ['calf', 'achilles'] },
      { text: 'Walk down; running the descent loads the knees and shins.', bodyAreas: ['knee', 'shin'] },
    ],
    clip: { motion: 'climb', background: '#1f4d3a', marker: '#e37842' },
  },
  {
    name: 'One-minute hill climbs',
    category: 'hill',
    summary: 'About a minute uphill at a strong, even effort (around 5K effort) on a steady 5–8 % grade, jogging or walking back down. Builds leg strength and economy with less pounding than flat speed work.',
    cues: ['Shorter, quicker steps than on the flat', 'Drive the arms; stay tall from the ankles', 'Even effort to the top, not a sprint', 'Jog or walk back down gently'],
    equipment: ['Hill'],
    cautions: [
      { text: 'Ease off if the Achilles or calves tighten rather than tire; a gentler grade eases them.', bodyAreas: ['achilles', 'calf'] },
      { text: 'Keep the descents slow: running downhill loads the knees and shins.', bodyAreas: ['knee', 'shin'] },
    ],
  },
  {
    name: 'Long hill repeats',
    category: 'hill',
    summary: 'Two to four minutes uphill at about 5K to 10K effort, jogging back down. Strength endurance for the climbs in a race.',
    cues: ['Shorten the stride as the grade steepens', 'Keep the effort even, not the pace', 'Quick, light feet', 'Jog back down easily'],
    equipment: ['Hill'],
    cautions: [{ text: 'Jog the descents slowly; choose a gentler hill when knees or shins are sore.', bodyAreas: ['knee', 'shin'] }],
  },
  {
    name: 'Hill strides',
    category: 'hill',
    summary: 'Twenty-second relaxed, fast runs up a gentle grade. A way to add speed without the pounding of the flat.',
    cues: ['Gentle slope, good footing', 'Run fast but smooth', 'Tall posture, slight lean from the ankles'],
    equipment: ['Hill'],
    cautions: [{ text: 'Stop the set if the calves tighten rather than tire.', bodyAreas: ['calf'] }],
  },
  {
    name: 'Downhill running practice',
    category: 'hill',
    summary: 'Controlled running down a gentle grass slope to learn quick, light steps. Prepares the legs for descents in trail races.',
    cues: ['Gentle grade only', 'Short, quick steps under the hips', 'Arms slightly wider for balance', 'Look a few metres ahead'],
    equipment: ['Hill'],
    cautions: [
      { text: 'Downhill running loads the knees and shins heavily: start with a few short reps and expect sore quads.', bodyAreas: ['knee', 'shin', 'quad'] },
    ],
  },
  {
    name: 'Uphill walking with poles',
    category: 'hill',
    summary: 'Fast power-hiking on a steep climb, pushing with poles. The skill that saves energy on mountain races.',
    cues: ['Plant the poles level with the front foot', 'Push down and back through the poles', 'Hands on the knees on the steepest parts if no poles'],
    equipment: ['Hill', 'Trekking poles'],
    cautions: [{ text: 'Build the time on steep climbs gradually; it loads the calves more than running does.', bodyAreas: ['calf', 'achilles'] }],
  },
  // Drills
  {
    name: 'A-skips',
    category: 'drill',
    summary: 'A skipping march where the knee lifts and the foot strikes down under the hip. Teaches a quick, active foot contact.',
    cues: ['Tall posture, hips high', 'Lift the knee to hip height', 'Strike the ball of the foot down under the hip', 'Opposite arm swings with the knee'],
    equipment: [],
    cautions: [{ text: 'Keep contacts light; stop if the shins ache.', bodyAreas: ['shin', 'calf'] }],
    clip: { motion: 'run', background: '#4f4c45', marker: '#f4c5a6' },
  },
  {
    name: 'B-skips',
    category: 'drill',
    summary: 'An A-skip that adds a leg extension and a pawing pull-back before the foot lands. Trains the hamstrings for the front of the stride.',
    cues: ['Start as an A-skip', 'Extend the lower leg forward', 'Paw the foot back and down under the hip', 'Stay tall throughout'],
    equipment: [],
    cautions: [{ text: 'Skip this drill for a week after any hamstring tightness.', bodyAreas: ['hamstring'] }],
  },
  {
    name: 'High knees',
    category: 'drill',
    summary: 'Quick running in place or moving slowly forward with high knee lift. Works rhythm and hip flexor strength.',
    cues: ['Quick, light contacts', 'Knees to hip height', 'Upright, not leaning back'],
    equipment: [],
    cautions: [{ text: 'Keep it short: ten to twenty metres is enough.', bodyAreas: ['hip'] }],
  },
  {
    name: 'Butt kicks',
    category: 'drill',
    summary: 'Running with the heels flicking up toward the seat. Teaches a short, fast recovery of the swinging leg.',
    cues: ['Heel travels straight up under the hip', 'Knees point down', 'Quick cadence'],
    equipment: [],
    cautions: [{ text: 'Warm up first so the quads are not cold.', bodyAreas: ['quad'] }],
  },
  {
    name: 'Straight-leg bounds',
    // A bound is a jump in all but name: filed with the jumps so the plyometric cautions come with it.
    category: 'plyometric',
    summary: 'Moving forward with nearly straight legs, pulling the ground back under the body. Builds hamstring and hip extension strength.',
    cues: ['Legs long, slight bend at the knee', 'Pull each foot back under the hip', 'Land on the ball of the foot', 'Short, quick contacts'],
    equipment: [],
    cautions: [
      { text: 'Very demanding on the hamstrings: introduce over several weeks.', bodyAreas: ['hamstring'] },
      { text: 'Each contact is a landing: keep the set short and stop when contacts get heavy.', bodyAreas: ['achilles', 'knee', 'foot'] },
    ],
  },
  {
    name: 'Carioca',
    category: 'drill',
    summary: 'Moving sideways while the trailing leg crosses in front, then behind. Loosens the hips and trains footwork.',
    cues: ['Stay on the balls of the feet', 'Let the hips rotate, keep the shoulders square', 'Lead with each side in turn'],
    equipment: [],
    cautions: [{ text: 'Slow down on uneven ground; the crossing steps can catch an ankle.', bodyAreas: ['ankle'] }],
  },
  // Strides
  {
    name: 'Strides',
    category: 'stride',
    summary: 'Eighty to a hundred metres, building to about mile race pace and easing off. Keeps speed and good form in easy weeks.',
    cues: ['Build smoothly for the first third', 'Run fast and relaxed in the middle', 'Ease down over the last third', 'Walk or jog back fully recovered'],
    equipment: [],
    cautions: [{ text: 'Run strides on a flat, even surface after an easy run, not cold.', bodyAreas: ['hamstring', 'calf'] }],
    clip: { motion: 'run', background: '#24527d', marker: '#d8ecdf' },
  },
  {
    name: 'Barefoot grass strides',
    category: 'stride',
    summary: 'Relaxed strides barefoot on short, clean grass. Gives the feet a different stimulus and a feel for light landings.',
    cues: ['Check the grass for hazards first', 'Land softly, midfoot under the hip', 'Keep them relaxed, not all-out'],
    equipment: ['Grass field'],
    cautions: [{ text: 'Start with two or three; bare feet and calves need weeks to adapt.', bodyAreas: ['foot', 'calf', 'achilles'] }],
  },
  {
    name: 'Flying strides',
    category: 'stride',
    summary: 'A gradual build-up into twenty to thirty metres held at top relaxed speed. Trains speed without a hard start.',
    cues: ['Mark a build zone and a fast zone', 'Arrive at the fast zone already quick', 'Hold form, not effort'],
    equipment: ['Cones'],
    cautions: [{ text: 'Full recovery between reps; stop on any tightness in the back of the thigh.', bodyAreas: ['hamstring'] }],
  },
  // Mobility
  {
    name: 'Side plank',
    category: 'mobility',
    summary: 'Holding the body straight on one forearm and the side of the feet. Strengthens the side of the trunk and hips that keep the pelvis level.',
    cues: ['Elbow under the shoulder', 'Hips lifted in a straight line', 'Head in line with the spine', 'Breathe steadily'],
    equipment: ['Mat'],
    cautions: [{ text: 'Drop to the knees to shorten the lever if the shoulder complains.', bodyAreas: ['shoulder'] }],
  },
  {
    name: 'Dead bug',
    category: 'mobility',
    summary: 'Lying on the back, slowly lower opposite arm and leg while the lower back stays down. Teaches trunk control with moving limbs.',
    cues: ['Arms up, knees over hips', 'Press the lower back into the floor', 'Reach one arm and the opposite leg away slowly', 'Return and switch'],
    equipment: ['Mat'],
    cautions: [{ text: 'Reach less far if the back lifts off the floor.', bodyAreas: ['lower_back'] }],
  },
  {
    name: 'Leg swings',
    category: 'mobility',
    summary: 'Swinging each leg forward and back, then across the body, holding a wall. A quick warm-up for the hips.',
    cues: ['Hold a wall or post', 'Start small and let the swing grow', 'Keep the trunk still', 'Ten each way per leg'],
    equipment: [],
    cautions: [{ text: 'Let momentum grow gradually rather than kicking to the end of range.', bodyAreas: ['hamstring', 'groin'] }],
  },
  {
    name: 'Knee-to-wall ankle rocks',
    category: 'mobility',
    summary: 'Kneeling lunge facing a wall, rocking the knee forward over the toes. Frees the ankle bend that hills and squats need.',
    cues: ['Front foot a hand length from the wall', 'Heel stays down', 'Rock the knee toward the wall over the middle toes'],
    equipment: ['Wall'],
    cautions: [{ text: 'A pinch at the front of the ankle means you have gone far enough.', bodyAreas: ['ankle', 'achilles'] }],
  },
  {
    name: 'Hip flexor lunge stretch',
    category: 'mobility',
    summary: 'A half-kneeling lunge with the pelvis tucked under. Opens the front of the hip that sitting and running both tighten.',
    cues: ['Back knee on a pad', 'Tuck the tailbone under', 'Shift forward gently', 'Reach the same-side arm up'],
    equipment: ['Mat'],
    cautions: [{ text: 'Do not arch the lower back to get deeper.', bodyAreas: ['lower_back', 'hip'] }],
  },
  // Plyometrics
  {
    name: 'Pogo hops',
    category: 'plyometric',
    summary: 'Small, quick, stiff-ankled bounces on both feet. Trains the springy ankle that returns energy on every stride.',
    cues: ['Stay on the balls of the feet', 'Knees nearly straight', 'Bounce off the ground as if it were hot', 'Small and fast, not high'],
    equipment: [],
    cautions: [{ text: 'Start with a few sets of ten; skip these with Achilles or shin pain.', bodyAreas: ['achilles', 'shin', 'calf'] }],
    clip: { motion: 'bounce', background: '#163628', marker: '#bcd8ec' },
  },
  {
    name: 'Hill bounding',
    category: 'plyometric',
    summary: 'Exaggerated, springy running strides up a moderate hill, covering as much ground per step as possible.',
    cues: ['Moderate grade, good footing', 'Drive the knee forward and up', 'Push off hard through the back foot', 'Opposite arm drives with the knee'],
    equipment: ['Hill'],
    cautions: [
      { text: 'Very demanding: a few reps of 20–30 seconds is plenty at first.', bodyAreas: ['achilles', 'calf', 'knee'] },
      { text: 'Walk down the hill between reps.', bodyAreas: ['knee', 'shin'] },
    ],
  },
  {
    name: 'Box jumps',
    category: 'plyometric',
    summary: 'Jumping onto a box and stepping down. Builds leg power with a soft landing, since the box takes away the drop.',
    cues: ['Swing the arms and jump', 'Land softly with the whole foot on the box', 'Stand tall', 'Step down, do not jump down'],
    equipment: ['Box'],
    cautions: [{ text: 'Choose a box you clear easily; a missed jump scrapes shins.', bodyAreas: ['shin', 'knee'] }],
  },
  {
    name: 'Skater hops',
    category: 'plyometric',
    summary: 'Bounding sideways from one foot to the other and holding each landing. Trains side-to-side control for trails.',
    cues: ['Push off the outside foot', 'Land softly on the other foot and hold', 'Knee over the middle toes'],
    equipment: [],
    cautions: [{ text: 'Shorten the hops if the landing knee wobbles inward.', bodyAreas: ['knee', 'ankle'] }],
  },
  {
    name: 'Single-leg hops in place',
    category: 'plyometric',
    summary: 'Quick, low hops on one foot. A test and a trainer for the spring in each lower leg on its own.',
    cues: ['Stand tall on one foot', 'Hop low and quick', 'Land quietly on the ball of the foot', 'Twenty contacts, then switch'],
    equipment: [],
    cautions: [{ text: 'Only when two-foot pogo hops are pain-free; stop with any shin or Achilles pain.', bodyAreas: ['achilles', 'shin', 'foot'] }],
  },
]

/** A stable key for a starter exercise: its clip's file name and the copy's `starter_key`. */
export function starterSlug(name: string) {
  return name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '')
}
