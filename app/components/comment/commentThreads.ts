// Threads out of the flat comment list, and the anchor a new thread gets from the selection.
import type { CircuitDocument, Point3 } from '#shared/circuit'
import type { CommentAnchorInput, CommentItem } from '#shared/schemas/comment'

export interface CommentThreadData {
  root: CommentItem
  replies: CommentItem[]
}

export function groupThreads(comments: readonly CommentItem[]): CommentThreadData[] {
  const threads = new Map<string, CommentThreadData>()
  for (const c of comments) if (!c.parentId) threads.set(c.id, { root: c, replies: [] })
  for (const c of comments) if (c.parentId) threads.get(c.parentId)?.replies.push(c)
  // newest activity first, open threads before resolved ones
  const last = (t: CommentThreadData) => (t.replies.at(-1) ?? t.root).createdAt
  return [...threads.values()].sort((a, b) => Number(a.root.resolvedAt !== null) - Number(b.root.resolvedAt !== null) || last(b).localeCompare(last(a)))
}

/** The part or hose a new thread is pinned to: the first selected one (a port stands for its part). */
export function anchorFromSelection(doc: CircuitDocument | null | undefined, ids: readonly string[], point?: { point: Point3; view: 'side' | 'top' } | null): CommentAnchorInput | null {
  if (doc) {
    for (const id of ids) {
      if (doc.circuit.hoses.some((h) => h.id === id)) return { kind: 'hose', elementId: id }
      const comp = doc.circuit.components.find((c) => c.id === id || c.ports.some((p) => p.id === id))
      if (comp) return { kind: 'component', elementId: comp.id }
    }
  }
  if (point) return { kind: 'point', point: point.point, view: point.view }
  return null
}

/** Words for where a thread is pinned. */
export function anchorText(doc: CircuitDocument | null | undefined, anchor: CommentAnchorInput | null): string {
  if (!anchor) return 'the whole circuit'
  if (anchor.kind === 'point') return `a point on the ${anchor.view ?? 'drawing'} view`
  if (anchor.kind === 'hose') {
    const hose = doc?.circuit.hoses.find((h) => h.id === anchor.elementId)
    return `hose ${hose?.params.label || anchor.elementId}${doc && !hose ? ' (not in this version)' : ''}`
  }
  const comp = doc?.circuit.components.find((c) => c.id === anchor.elementId)
  return `${comp?.label || anchor.elementId}${doc && !comp ? ' (not in this version)' : ''}`
}

/** Does the thread concern one of these ids (a port counts for its part)? */
export function threadTouches(doc: CircuitDocument | null | undefined, thread: CommentThreadData, ids: readonly string[]): boolean {
  const a = thread.root.anchor
  if (!a || a.kind === 'point') return false
  if (ids.includes(a.elementId)) return true
  const comp = doc?.circuit.components.find((c) => c.id === a.elementId)
  return comp ? comp.ports.some((p) => ids.includes(p.id)) : false
}

/** The body split so @mentions of known people can be shown as such. */
export function bodyParts(body: string, names: readonly string[]): Array<{ text: string; mention: boolean }> {
  const sorted = [...names].filter(Boolean).sort((a, b) => b.length - a.length)
  const out: Array<{ text: string; mention: boolean }> = []
  let i = 0
  let plain = ''
  while (i < body.length) {
    if (body[i] === '@') {
      const hit = sorted.find((n) => body.slice(i + 1, i + 1 + n.length).toLocaleLowerCase() === n.toLocaleLowerCase())
      if (hit) {
        if (plain) out.push({ text: plain, mention: false })
        plain = ''
        out.push({ text: body.slice(i, i + 1 + hit.length), mention: true })
        i += 1 + hit.length
        continue
      }
    }
    plain += body[i]
    i++
  }
  if (plain) out.push({ text: plain, mention: false })
  return out
}
