import { describe, expect, it } from 'vitest'
import { demoDocument } from '#shared/demo'
import { portWorldPosition } from '#shared/circuit'
import { commentMarkers, type MarkerComment } from '#shared/review'

const doc = demoDocument()
const c = (id: string, anchor: MarkerComment['anchor'], extra: Partial<MarkerComment> = {}): MarkerComment =>
  ({ id, parentId: null, anchor, resolvedAt: null, ...extra })

describe('comment pins', () => {
  it('a part’s pin sits at its centre on both views (side: u = x, v = −z; top: u = x, v = −y)', () => {
    const engine = doc.circuit.components.find((x) => x.id === 'engine')!
    const [side] = commentMarkers(doc, [c('a', { kind: 'component', elementId: 'engine' })], 'side')
    const [top] = commentMarkers(doc, [c('a', { kind: 'component', elementId: 'engine' })], 'top')
    expect(side).toMatchObject({ u: engine.position.x, v: -engine.position.z })
    expect(top).toMatchObject({ u: engine.position.x, v: -engine.position.y })
  })

  it('a hose’s pin sits halfway along its drawn route', () => {
    // hose-bypass-pump has no route points: the halfway point is the middle of its two port positions
    const hose = doc.circuit.hoses.find((h) => h.id === 'hose-bypass-pump')!
    const end = (portId: string) => {
      const comp = doc.circuit.components.find((x) => x.ports.some((p) => p.id === portId))!
      return portWorldPosition(comp, comp.ports.find((p) => p.id === portId)!)
    }
    const a = end(hose.from.portId!)
    const b = end(hose.to.portId!)
    const [m] = commentMarkers(doc, [c('h', { kind: 'hose', elementId: hose.id })], 'side')
    expect(m!.u).toBeCloseTo((a.x + b.x) / 2, 6)
    expect(m!.v).toBeCloseTo(-(a.z + b.z) / 2, 6)
  })

  it('a free point shows on the view it was placed on only; gone parts and replies get no pin', () => {
    const comments = [
      c('p', { kind: 'point', point: { x: 100, y: 50, z: 400 }, view: 'top' }),
      c('gone', { kind: 'component', elementId: 'no-such-part' }),
      c('r', null, { parentId: 'p' }),
      c('r2', null, { parentId: 'p' }),
    ]
    expect(commentMarkers(doc, comments, 'side')).toEqual([])
    expect(commentMarkers(doc, comments, 'top')).toEqual([
      { commentId: 'p', kind: 'point', elementId: null, u: 100, v: -50, resolved: false, replies: 2, stack: 0 },
    ])
  })

  it('threads on the same spot are numbered so they can be fanned out', () => {
    const ms = commentMarkers(doc, [c('1', { kind: 'component', elementId: 'pump' }), c('2', { kind: 'component', elementId: 'pump' }, { resolvedAt: '2026-01-01' })], 'side')
    expect(ms.map((m) => [m.stack, m.resolved])).toEqual([[0, false], [1, true]])
  })
})
