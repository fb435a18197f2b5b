// The workshops the signed-in user belongs to, with their role in each.
export default defineEventHandler(async (event) => {
  const { user, workshopId } = await requireUser(event)
  const summary = await sessionSummary(user.id, workshopId)
  return summary.workshops
})
