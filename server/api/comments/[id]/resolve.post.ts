// Mark a thread done.
export default defineEventHandler(event => setThreadResolved(event, true))
