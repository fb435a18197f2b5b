// Where comment threads sit on a view: world positions of their anchors, projected onto the view's
// plane (u right, v down, mm). A part's pin sits at its centre, a hose's halfway along its drawn
// route, a free point where it was placed. Pure, so the static drawing and the editor's canvas agree.
import type { CircuitDocument } from '../circuit/document'
import type { Point3 } from '../circuit/primitives'
import { pointAlong } from '../drawing/hoseGeometry'
import { project, type ViewName } from '../drawing/projection'
import { ViewScene } from '../drawing/scene'

export interface CommentAnchor {
  kind: 'component' | 'hose' | 'point'
  elementId?: string
  point?: Point3
  /** the view a free point was placed on; such a point shows on that view only (its depth is a guess) */
  view?: ViewName
}

export interface MarkerComment {
  id: string
  parentId: string | null
  anchor: CommentAnchor | null
  resolvedAt: string | Date | null
}

export interface CommentMarker {
  commentId: string
  kind: CommentAnchor['kind']
  elementId: string | null
  u: number
  v: number
  resolved: boolean
  replies: number
  /** 0 for the first thread at this spot, 1 for the next …, so pins can be fanned out */
  stack: number
}

/** True when the anchor's part or hose is in the document (a free point always is). */
export function anchorTargetExists(doc: CircuitDocument, anchor: CommentAnchor | null): boolean {
  if (!anchor) return false
  if (anchor.kind === 'point') return anchor.point !== undefined
  if (anchor.kind === 'component') return doc.circuit.components.some((c) => c.id === anchor.elementId)
  return doc.circuit.hoses.some((h) => h.id === anchor.elementId)
}

/** Pins of the top-level threads anchored on this view; replies are counted on their thread. */
export function commentMarkers(doc: CircuitDocument, comments: readonly MarkerComment[], view: ViewName): CommentMarker[] {
  const scene = new ViewScene(view)
  scene.update(doc)
  const replies = new Map<string, number>()
  for (const c of comments) if (c.parentId) replies.set(c.parentId, (replies.get(c.parentId) ?? 0) + 1)
  const stacks = new Map<string, number>()
  const out: CommentMarker[] = []
  for (const c of comments) {
    if (c.parentId || !c.anchor) continue
    const at = anchorPlanePoint(scene, c.anchor, view)
    if (!at) continue
    const spot = `${Math.round(at.u)}:${Math.round(at.v)}`
    const stack = stacks.get(spot) ?? 0
    stacks.set(spot, stack + 1)
    out.push({
      commentId: c.id, kind: c.anchor.kind, elementId: c.anchor.elementId ?? null, u: at.u, v: at.v,
      resolved: c.resolvedAt !== null, replies: replies.get(c.id) ?? 0, stack,
    })
  }
  return out
}

function anchorPlanePoint(scene: ViewScene, anchor: CommentAnchor, view: ViewName): { u: number; v: number } | null {
  if (anchor.kind === 'point') {
    if (!anchor.point || (anchor.view && anchor.view !== view)) return null
    return project(view, anchor.point)
  }
  if (!anchor.elementId) return null
  if (anchor.kind === 'component') {
    const part = scene.parts.get(anchor.elementId)
    return part ? { u: part.u, v: part.v } : null
  }
  const hose = scene.hoses.get(anchor.elementId)
  if (!hose) return null
  const mid = pointAlong(hose.flat, 0.5)
  return mid ? { u: mid.u, v: mid.v } : { u: hose.flat[0] ?? 0, v: hose.flat[1] ?? 0 }
}
