/** Readiness: send traffic here only while the database answers (migrations ran before listening). */
export default defineEventHandler(async (event) => {
  const database = await checkDatabase()
  setResponseHeader(event, 'cache-control', 'no-store')
  if (!database.ok) setResponseStatus(event, 503)
  return { ok: database.ok, parts: { database } }
})
