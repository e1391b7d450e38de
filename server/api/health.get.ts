/**
 * Which part is failing, for people and monitors: 200 while the database answers (the app can serve),
 * 503 when it does not. The clip store and the mail relay are reported but do not fail the check:
 * without them the app still serves everything else (uploads answer 503, mail waits in the outbox).
 */
export default defineEventHandler(async (event) => {
  const [database, objectStore, mail] = await Promise.all([checkDatabase(), checkObjectStore(), checkMail()])
  const ok = database.ok
  setResponseHeader(event, 'cache-control', 'no-store')
  if (!ok) setResponseStatus(event, 503)
  return { ok, status: !ok ? 'down' : objectStore.ok && mail.ok ? 'ok' : 'degraded', parts: { database, objectStore, mail } }
})
