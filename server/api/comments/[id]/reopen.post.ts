// Open a resolved thread again.
export default defineEventHandler(event => setThreadResolved(event, false))
