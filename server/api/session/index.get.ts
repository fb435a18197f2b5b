// Who is signed in, their workshops and role in the current one. Signed out → { user: null }.
export default defineEventHandler(async (event) => {
  const signedIn = await requireUser(event).catch((error: { statusCode?: number }) => {
    if (error.statusCode === 401) return null
    throw error
  })
  if (!signedIn) return { user: null }
  // requireMember also repairs the current workshop when the user was removed from it
  const member = await requireMember(event, 'workshop:read').catch((error: { statusCode?: number }) => {
    if (error.statusCode === 403) return null
    throw error
  })
  return await sessionSummary(signedIn.user.id, member?.workshopId ?? null)
})
