import { idParam } from '#shared/schemas/common'
import { requeueMail } from '../../../mail/queue'
import { wakeMailWorker } from '../../../mail/worker'

// "Send again now" on the outbox page: a failed or waiting mail is tried at once (owner only).
export default defineEventHandler(async (event) => {
  if (!outboxPageEnabled()) notFound()
  const { workshopId } = await requireMember(event, 'members:manage')
  const { id } = await paramsOf(event, idParam)
  const row = await requeueMail(useDb(), workshopId, id)
  if (!row) notFound('No failed or waiting mail with this id')
  wakeMailWorker()
  return { id: row.id, status: row.status, attempts: row.attempts }
})
