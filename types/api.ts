import type { InternalApi } from 'nitropack/types'

/**
 * The one place client code takes API answer types from. Each is what the route's handler returns
 * (its typed view built in server/utils/), as the browser receives it (dates become strings), inferred
 * by Nitro from the handler itself: change the server's view and the pages follow, or fail typecheck.
 */
export type ApiResponse<Route extends keyof InternalApi, Method extends keyof InternalApi[Route] = 'get' & keyof InternalApi[Route]> = InternalApi[Route][Method]

export type TeamInsights = ApiResponse<'/api/insights/team'>
export type TeamInsightsRow = TeamInsights['rows'][number]
export type Compliance = TeamInsightsRow['compliance7']

export type AthleteReport = NonNullable<ApiResponse<'/api/insights/athletes/:id'>>
export type ReportWeek = AthleteReport['weeks'][number]
export type ReportCalendarDay = AthleteReport['calendar'][number]

export type PainFlagItem = ApiResponse<'/api/pain-flags'>[number]

export type Logbook = ApiResponse<'/api/me/logbook'>
export type LogSession = Logbook['sessions'][number]
export type LogEntry = LogSession['entries'][number]
export type MyAssignments = ApiResponse<'/api/me/assignments'>
export type MyAssignment = MyAssignments['assignments'][number]
export type ProfileView = ApiResponse<'/api/me/profile'>
export type PacesView = ApiResponse<'/api/me/paces'>
export type ClipPlayback = ApiResponse<'/api/exercises/:id/clip'>
export type ExerciseList = ApiResponse<'/api/exercises'>
export type ClipUploadUrl = ApiResponse<'/api/exercises/:id/clip/upload-url', 'post'>
export type PlannedAssignments = ApiResponse<'/api/assignments'>
export type AssignmentsCreated = ApiResponse<'/api/assignments', 'post'>
export type ClipCue = ApiResponse<'/api/exercises/:id/cues'>[number]
export type SessionPlan = ApiResponse<'/api/assignments/:id/plan'>
export type StartedSession = ApiResponse<'/api/assignments/:id/sessions', 'post'>
export type LoggedEntry = ApiResponse<'/api/sessions/:id/entries', 'post'>
export type FinishedSession = ApiResponse<'/api/sessions/:id/finish', 'post'>
export type RoutineDetail = ApiResponse<'/api/routines/:id'>
export type RoutineList = ApiResponse<'/api/routines'>
export type FormReview = ApiResponse<'/api/reviews/:id'>
export type ReviewUploadUrl = ApiResponse<'/api/reviews/upload-url', 'post'>
