// Viewport maths and the round-number grid: properties on random inputs.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { fitRect, gridSteps, niceStep, project, scaleBar, toPlane, toScreen, withPlanePoint, zoomAbout } from '#shared/drawing'

const mantissa = (v: number) => Math.round(v / 10 ** Math.floor(Math.log10(v) + 1e-9))

describe('viewport', () => {
  it('zooming keeps the point under the cursor where it is', () => {
    fc.assert(fc.property(
      fc.double({ min: 0.01, max: 10, noNaN: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true }),
      fc.integer({ min: 0, max: 1600 }), fc.integer({ min: 0, max: 900 }), fc.double({ min: 0.5, max: 2, noNaN: true }),
      (scale, panX, panY, x, y, factor) => {
        const vp = { scale, panX, panY }
        const before = toPlane(vp, x, y)
        const after = toPlane(zoomAbout(vp, x, y, factor), x, y)
        expect(after.u).toBeCloseTo(before.u, 6)
        expect(after.v).toBeCloseTo(before.v, 6)
      }))
  })

  it('fits a rectangle whole inside the screen, centred', () => {
    const vp = fitRect({ minU: 0, minV: -900, maxU: 4000, maxV: 100 }, 800, 400, 40)
    const a = toScreen(vp, { u: 0, v: -900 })
    const b = toScreen(vp, { u: 4000, v: 100 })
    expect(a.x).toBeGreaterThanOrEqual(40 - 1e-9)
    expect(b.x).toBeLessThanOrEqual(760 + 1e-9)
    expect(a.y).toBeGreaterThanOrEqual(0)
    expect(b.y).toBeLessThanOrEqual(400)
    expect((a.x + b.x) / 2).toBeCloseTo(400, 6)
  })

  it('moves only the view’s two axes', () => {
    const keep = { x: 1, y: 2, z: 3 }
    expect(withPlanePoint('side', keep, project('side', { x: 10, y: 99, z: 30 }))).toEqual({ x: 10, y: 2, z: 30 })
    expect(withPlanePoint('top', keep, project('top', { x: 10, y: 20, z: 99 }))).toEqual({ x: 10, y: 20, z: 3 })
    // height points up on the side view's screen, the lateral axis up on the top view's
    expect(project('side', { x: 0, y: 0, z: 100 }).v).toBeLessThan(0)
    expect(project('top', { x: 0, y: 100, z: 0 }).v).toBeLessThan(0)
  })
})

describe('grid and scale bar in the 1–2–5 series (drawing-office practice: round steps)', () => {
  it('picks the smallest 1, 2 or 5 × 10ⁿ at or above the asked size', () => {
    fc.assert(fc.property(fc.double({ min: 1e-3, max: 1e6, noNaN: true }), (x) => {
      const s = niceStep(x)
      expect(s).toBeGreaterThanOrEqual(x * (1 - 1e-9))
      expect(s).toBeLessThan(x * 2.5 + 1e-9)
      expect([1, 2, 5]).toContain(mantissa(s))
    }))
    expect([niceStep(3), niceStep(7), niceStep(10), niceStep(0.3)]).toEqual([5, 10, 10, 0.5])
  })

  it('keeps minor lines apart on screen and majors on round numbers', () => {
    fc.assert(fc.property(fc.double({ min: 0.002, max: 40, noNaN: true }), (scale) => {
      const { minor, major } = gridSteps(scale, 12)
      expect(minor * scale).toBeGreaterThanOrEqual(12 - 1e-6)
      expect([1, 5]).toContain(mantissa(major))
      expect(major / minor).toBeGreaterThanOrEqual(5)
    }))
  })

  it('draws a bar of a round length no longer than its room', () => {
    fc.assert(fc.property(fc.double({ min: 0.002, max: 40, noNaN: true }), (scale) => {
      const bar = scaleBar(scale, 120)
      expect(bar.px).toBeLessThanOrEqual(120 + 1e-6)
      expect(bar.px).toBeGreaterThanOrEqual(120 / 2.5 - 1e-6)
      expect([1, 2, 5]).toContain(mantissa(bar.lengthMm))
    }))
    expect(scaleBar(0.1, 120).label).toBe('1 m') // 0.1 px/mm: 1 000 mm is 100 px
    expect(scaleBar(1, 120).label).toBe('100 mm')
  })
})
