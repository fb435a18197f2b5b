import { describe, expect, it } from 'vitest'
import { demoDocument } from '#shared/demo'
import type { CommentItem } from '#shared/schemas/comment'
import { anchorFromSelection, anchorText, bodyParts, groupThreads, threadTouches } from '../../../app/components/comment/commentThreads'

const doc = demoDocument()
const item = (id: string, extra: Partial<CommentItem> = {}): CommentItem => ({
  id, circuitId: 'c', parentId: null, version: 2, anchor: null, body: id, mentions: [], author: null,
  createdAt: '2026-01-01T10:00:00.000Z', editedAt: null, deleted: false, resolvedAt: null, resolvedBy: null, ...extra,
})

describe('the comment panel’s threads', () => {
  it('groups replies under their thread; open threads first, then by latest activity', () => {
    const threads = groupThreads([
      item('old', { createdAt: '2026-01-01T09:00:00.000Z' }),
      item('done', { createdAt: '2026-01-01T12:00:00.000Z', resolvedAt: '2026-01-01T13:00:00.000Z' }),
      item('new', { createdAt: '2026-01-01T11:00:00.000Z' }),
      item('late-reply', { parentId: 'old', createdAt: '2026-01-01T14:00:00.000Z' }),
    ])
    expect(threads.map((t) => [t.root.id, t.replies.map((r) => r.id)])).toEqual([['old', ['late-reply']], ['new', []], ['done', []]])
  })

  it('pins a new thread to the selected hose or part (a port stands for its part), else a picked point, else the circuit', () => {
    expect(anchorFromSelection(doc, ['hose-top'])).toEqual({ kind: 'hose', elementId: 'hose-top' })
    expect(anchorFromSelection(doc, ['engine-third'])).toEqual({ kind: 'component', elementId: 'engine' })
    const point = { point: { x: 1, y: 2, z: 3 }, view: 'side' as const }
    expect(anchorFromSelection(doc, [], point)).toEqual({ kind: 'point', ...point })
    expect(anchorFromSelection(doc, [])).toBeNull()
    expect(anchorText(doc, { kind: 'component', elementId: 'heater-bleed' })).toBe('heater-bleed (not in this version)')
  })

  it('a thread on a part concerns its ports too', () => {
    const [t] = groupThreads([item('a', { anchor: { kind: 'component', elementId: 'engine' } })])
    expect(threadTouches(doc, t!, ['engine-third'])).toBe(true)
    expect(threadTouches(doc, t!, ['pump'])).toBe(false)
  })

  it('marks known @names in the text, longest first', () => {
    expect(bodyParts('ask @Ada Marsh and @Ada now', ['Ada', 'Ada Marsh'])).toEqual([
      { text: 'ask ', mention: false }, { text: '@Ada Marsh', mention: true }, { text: ' and ', mention: false },
      { text: '@Ada', mention: true }, { text: ' now', mention: false },
    ])
  })
})
