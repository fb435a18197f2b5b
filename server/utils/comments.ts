// Comments pinned to a circuit's parts, hoses and points: reading them with their authors, the
// members one can mention, and the 'mention' e-mails.
import type { H3Event } from 'h3'
import { and, asc, eq, inArray } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { alias } from 'drizzle-orm/pg-core'
import type { Mentionable } from '#shared/review'
import type { CommentAnchorInput, CommentItem } from '#shared/schemas/comment'
import type { CommentRow } from '../database/schema'
import type { Database } from './db'

type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0]

/** A comment of this workshop, or 404. */
export async function findComment(db: Executor, workshopId: string, commentId: string): Promise<CommentRow> {
  const [row] = await db.select().from(schema.comments).where(and(eq(schema.comments.id, commentId), eq(schema.comments.workshopId, workshopId)))
  if (!row) notFound('No such comment')
  return row
}

/** Every comment of a circuit, oldest first, with author and resolver names; deleted ones keep their place, not their words. */
export async function commentItems(db: Executor, workshopId: string, circuitId: string, onlyId?: string): Promise<CommentItem[]> {
  const c = schema.comments
  const author = alias(schema.users, 'author')
  const resolver = alias(schema.users, 'resolver')
  const conditions = [eq(c.workshopId, workshopId), eq(c.circuitId, circuitId)]
  if (onlyId) conditions.push(eq(c.id, onlyId))
  const rows = await db.select({ comment: c, authorName: author.name, resolverName: resolver.name }).from(c)
    .leftJoin(author, eq(author.id, c.authorId))
    .leftJoin(resolver, eq(resolver.id, c.resolvedBy))
    .where(and(...conditions))
    .orderBy(asc(c.createdAt), asc(c.id))
  return rows.map(({ comment: r, authorName, resolverName }) => ({
    id: r.id, circuitId: r.circuitId, parentId: r.parentId, version: r.version,
    anchor: (r.anchor as CommentAnchorInput | null) ?? null,
    body: r.deletedAt ? '' : r.body,
    mentions: r.deletedAt ? [] : r.mentions,
    author: r.authorId ? { id: r.authorId, name: authorName ?? '' } : null,
    createdAt: r.createdAt.toISOString(),
    editedAt: r.editedAt?.toISOString() ?? null,
    deleted: r.deletedAt !== null,
    resolvedAt: r.resolvedAt?.toISOString() ?? null,
    resolvedBy: r.resolvedBy ? { id: r.resolvedBy, name: resolverName ?? '' } : null,
  }))
}

export async function commentItem(db: Executor, row: CommentRow): Promise<CommentItem> {
  return (await commentItems(db, row.workshopId, row.circuitId, row.id))[0]!
}

/** Members of the workshop by user id, name and e-mail (the server resolves "@name" against them). */
export async function mentionableMembers(db: Executor, workshopId: string): Promise<Mentionable[]> {
  return await db.select({ id: schema.users.id, name: schema.users.name, email: schema.users.email }).from(schema.memberships)
    .innerJoin(schema.users, eq(schema.users.id, schema.memberships.userId))
    .where(eq(schema.memberships.workshopId, workshopId))
    .orderBy(asc(schema.users.name))
}

/** A 'mention' e-mail to each mentioned member except the author. */
export async function queueMentionMails(tx: Executor, comment: CommentRow, circuit: { id: string; title: string }, author: { id: string; name: string }, userIds: string[]) {
  const ids = userIds.filter((id) => id !== author.id)
  if (ids.length === 0) return
  const people = await tx.select({ email: schema.users.email, name: schema.users.name }).from(schema.users)
    .innerJoin(schema.memberships, and(eq(schema.memberships.userId, schema.users.id), eq(schema.memberships.workshopId, comment.workshopId)))
    .where(inArray(schema.users.id, ids))
  const where = comment.anchor?.kind === 'point' ? 'a point of the drawing' : comment.anchor ? `a ${comment.anchor.kind === 'hose' ? 'hose' : 'part'} (${comment.anchor.elementId})` : 'the circuit'
  for (const p of people) {
    const body = reviewMailBody(`Hello ${p.name},`, [
      `${author.name} mentioned you in a comment on ${where} of “${circuit.title}”, version ${comment.version}.`,
    ], { who: `${author.name} wrote`, text: comment.body }, { label: 'Open the drawing', url: `${appUrl()}/circuits/${circuit.id}?comment=${comment.id}` })
    await enqueueMail(tx, { workshopId: comment.workshopId, kind: 'mention', to: p.email, subject: `${author.name} mentioned you on ${circuit.title}`, ...body })
  }
}

/** The thread a reply belongs to: replies to replies join the top-level comment's thread. */
export function threadRootId(parent: CommentRow): string {
  return parent.parentId ?? parent.id
}

/** Resolve or reopen a thread (top-level comments only); logs the change, does nothing when already so. */
export async function setThreadResolved(event: H3Event, resolved: boolean) {
  const { workshopId, user } = await requireMember(event, 'comment:write')
  const { id } = await paramsOf(event, idParam)
  const db = useDb()
  const row = await db.transaction(async (tx) => {
    const comment = await findComment(tx, workshopId, id)
    if (comment.parentId) invalidInput([{ path: 'id', message: 'Resolve the thread, not a reply' }])
    if ((comment.resolvedAt !== null) === resolved) return comment
    const [updated] = await tx.update(schema.comments)
      .set(resolved ? { resolvedAt: new Date(), resolvedBy: user.id } : { resolvedAt: null, resolvedBy: null })
      .where(eq(schema.comments.id, comment.id)).returning()
    const circuit = await findCircuit(tx, workshopId, comment.circuitId)
    await logActivity(tx, {
      workshopId, projectId: circuit.projectId, circuitId: circuit.id, actorId: user.id,
      action: resolved ? 'comment.resolved' : 'comment.reopened', details: { commentId: comment.id, excerpt: comment.body.slice(0, 120) },
    })
    return updated!
  })
  return await commentItem(db, row)
}
