// The two views of one circuit. Each view shows two of the three vehicle axes on a plane; the plane's
// u runs right and v runs down, like a screen, so that height (side view) and the lateral axis (top
// view) point up on the screen. Moving something in a view changes only that view's two axes.
import type { Point3 } from '../circuit/primitives'

export type ViewName = 'side' | 'top'
export const viewNames: readonly ViewName[] = ['side', 'top']

/** A point on a view's plane, mm: u to the right, v down. */
export interface PlanePoint {
  u: number
  v: number
}

export interface ViewInfo {
  name: ViewName
  title: string
  /** the vehicle axis drawn upwards */
  upAxis: 'z' | 'y'
  horizontalLabel: string
  verticalLabel: string
}

export const VIEWS: Record<ViewName, ViewInfo> = {
  side: { name: 'side', title: 'Side view (x–z)', upAxis: 'z', horizontalLabel: 'x · fore–aft', verticalLabel: 'z · up' },
  top: { name: 'top', title: 'Top view (x–y)', upAxis: 'y', horizontalLabel: 'x · fore–aft', verticalLabel: 'y · left–right' },
}

export function project(view: ViewName, p: Point3): PlanePoint {
  return { u: p.x, v: view === 'side' ? -p.z : -p.y }
}

/** A distance on the plane as a change of the view's two vehicle axes. */
export function planeDeltaToWorld(view: ViewName, du: number, dv: number): Partial<Point3> {
  return view === 'side' ? { x: du, z: -dv } : { x: du, y: -dv }
}

/** `keep` with the view's two axes taken from a plane point; the third axis is kept. */
export function withPlanePoint(view: ViewName, keep: Point3, q: PlanePoint): Point3 {
  return view === 'side' ? { x: q.u, y: keep.y, z: -q.v } : { x: q.u, y: -q.v, z: keep.z }
}

/** The world axis the view leaves out (its depth). */
export const depthAxis = (view: ViewName): 'y' | 'z' => (view === 'side' ? 'y' : 'z')
