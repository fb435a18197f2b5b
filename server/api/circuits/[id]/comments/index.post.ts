import { and, eq } from 'drizzle-orm'
import type { CircuitDocument } from '#shared/circuit'
import { anchorTargetExists, resolveMentions } from '#shared/review'
import { idParam } from '#shared/schemas/common'
import { commentCreateInput } from '#shared/schemas/comment'
import { wakeMailWorker } from '../../../../mail/worker'

// A new thread pinned to a part, a hose or a point of a saved version, or a reply to a thread.
// "@name" mentions are resolved to members here and each gets an e-mail.
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'comment:write')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, commentCreateInput)
  const db = useDb()
  const row = await db.transaction(async (tx) => {
    const circuit = await findCircuit(tx, workshopId, id)
    const rv = schema.circuitRevisions
    const [revision] = await tx.select({ document: rv.document }).from(rv)
      .where(and(eq(rv.circuitId, id), eq(rv.workshopId, workshopId), eq(rv.version, input.version)))
    if (!revision) invalidInput([{ path: 'version', message: `This circuit has no saved version ${input.version}` }])
    let parentId: string | null = null
    let anchor = input.anchor ?? null
    if (input.parentId) {
      const parent = await findComment(tx, workshopId, input.parentId).catch(() => null)
      if (!parent || parent.circuitId !== id) invalidInput([{ path: 'parentId', message: 'No such thread on this circuit' }])
      parentId = threadRootId(parent)
      anchor = null // a reply lives in its thread, pinned where the thread is
    } else if (anchor && !anchorTargetExists(revision.document as unknown as CircuitDocument, anchor)) {
      invalidInput([{ path: 'anchor.elementId', message: `Version ${input.version} has no such ${anchor.kind === 'hose' ? 'hose' : 'part'}` }])
    }
    const mentions = resolveMentions(input.body, await mentionableMembers(tx, workshopId))
    const [created] = await tx.insert(schema.comments).values({
      workshopId, circuitId: id, parentId, version: input.version, anchor, body: input.body, mentions, authorId: user.id,
    }).returning()
    await logActivity(tx, {
      workshopId, projectId: circuit.projectId, circuitId: id, actorId: user.id, action: 'comment.added',
      details: { commentId: created!.id, threadId: parentId ?? created!.id, reply: parentId !== null, version: input.version, anchor, excerpt: input.body.slice(0, 120) },
    })
    await queueMentionMails(tx, created!, circuit, { id: user.id, name: user.name }, mentions)
    return created!
  })
  wakeMailWorker()
  setResponseStatus(event, 201)
  return await commentItem(db, row)
})
