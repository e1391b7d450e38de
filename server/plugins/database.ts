// Migrate at start so a new or empty database is ready before the first request.
export default defineNitroPlugin(() => {
  useDb().catch((error) => {
    console.error('Database could not be opened or migrated:', error)
    process.exit(1)
  })
})
