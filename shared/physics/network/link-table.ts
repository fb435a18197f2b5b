// The solver's hot loop: head loss h(Q) and slope dh/dQ of every link, from per-link constants held
// in typed arrays, without allocating. The physics is exactly that of link-models.ts and friction.ts
// (same laminar law, Clamond's Colebrook solution, blend and laminar floor); it is restated here in
// flat form because this loop runs once per link per Newton step.

import { LAMINAR_LIMIT_RE, TURBULENT_LIMIT_RE } from '../friction'
import { STANDARD_GRAVITY } from '../units'
import { QUADRATIC_LAW_LINEAR_BELOW_M3S, pumpHead, type FrictionLaw, type LinkLaw, type PumpCurveLaw } from './link-models'

// local copies: module bindings can cost a property read per use in some module loaders
const G = STANDARD_GRAVITY
const Q_LIN = QUADRATIC_LAW_LINEAR_BELOW_M3S
const RE_LAMINAR = LAMINAR_LIMIT_RE
const RE_TURBULENT = TURBULENT_LIMIT_RE

const LN10 = Math.LN10
const CLAMOND_X1 = LN10 / 18.574
const CLAMOND_X2 = Math.log(LN10 / 5.02)
const CLAMOND_F = (LN10 / 2) ** 2
const TWO_OVER_LN10 = 2 / LN10
const BLEND_SPAN = RE_TURBULENT - RE_LAMINAR

const PIPE = 0
const QUADRATIC = 1
const PUMP = 2
const NONE = 3

export class LinkTable {
  readonly kind: Uint8Array
  /** pipe: laminar slope 32νL/(g·D²·A); quadratic: r */
  private readonly a: Float64Array
  /** pipe: Re per |Q| = D/(A·ν) */
  private readonly reynoldsPerFlow: Float64Array
  /** pipe: (L/D)/(2g·A²), so that friction h = this·f·Q|Q| */
  private readonly frictionScale: Float64Array
  /** pipe: K/(2g·A²) */
  private readonly minorR: Float64Array
  private readonly relativeRoughness: Float64Array
  private readonly pumps: Array<PumpCurveLaw | undefined>
  private readonly area: Float64Array
  /** last Clamond root F per pipe (0: none yet), the starting point of the next evaluation */
  private readonly clamondRoot: Float64Array
  private readonly clamondRe: Float64Array
  /** head loss, slope and (pipes) Darcy friction factor of the last evaluate(); f is NaN when laminar at zero flow */
  readonly h: Float64Array
  readonly slope: Float64Array
  readonly friction: Float64Array

  constructor(laws: ReadonlyArray<LinkLaw | null>, private readonly frictionLaw?: FrictionLaw) {
    const n = laws.length
    this.kind = new Uint8Array(n).fill(NONE)
    this.a = new Float64Array(n)
    this.reynoldsPerFlow = new Float64Array(n)
    this.frictionScale = new Float64Array(n)
    this.minorR = new Float64Array(n)
    this.relativeRoughness = new Float64Array(n)
    this.pumps = new Array(n)
    this.area = new Float64Array(n)
    this.clamondRoot = new Float64Array(n)
    this.clamondRe = new Float64Array(n)
    this.h = new Float64Array(n)
    this.slope = new Float64Array(n)
    this.friction = new Float64Array(n)
    laws.forEach((law, i) => {
      if (!law || law.kind === 'fixed-flow') return
      if (law.kind === 'pipe') {
        this.kind[i] = PIPE
        const d = law.diameterM
        this.a[i] = (32 * law.kinematicViscosity * law.lengthM) / (G * d * d * law.area)
        this.reynoldsPerFlow[i] = d / (law.area * law.kinematicViscosity)
        this.frictionScale[i] = law.lengthM / d / (2 * G * law.area * law.area)
        this.minorR[i] = law.minorK / (2 * G * law.area * law.area)
        this.relativeRoughness[i] = law.relativeRoughness
        this.area[i] = law.area
      } else if (law.kind === 'quadratic') {
        this.kind[i] = QUADRATIC
        this.a[i] = law.r
        this.area[i] = law.diameterM ? (Math.PI / 4) * law.diameterM * law.diameterM : 0
      } else {
        this.kind[i] = PUMP
        this.pumps[i] = law
      }
    })
  }

  /** Mean velocity (m/s) and Reynolds number of link i at flow q; null for links without a bore. */
  velocity(i: number, q: number): number | null {
    return this.area[i]! > 0 ? q / this.area[i]! : null
  }

  reynolds(i: number, q: number): number | null {
    return this.kind[i] === PIPE ? Math.abs(q) * this.reynoldsPerFlow[i]! : null
  }

  /** Fills h[i], slope[i] and friction[i] for the listed links at flows q. */
  evaluate(links: ArrayLike<number>, q: Float64Array): void {
    const { kind, a, h, slope } = this
    for (let k = 0; k < links.length; k++) {
      const i = links[k]!
      const qi = q[i]!
      const aq = qi < 0 ? -qi : qi
      switch (kind[i]) {
        case PIPE: {
          const re = aq * this.reynoldsPerFlow[i]!
          let hi: number
          let gi: number
          if (re < RE_LAMINAR) {
            hi = a[i]! * qi
            gi = a[i]!
            this.friction[i] = re > 0 ? 64 / re : Number.NaN
            this.clamondRoot[i] = 0
          } else {
            let f: number
            let dfdRe: number
            if (this.frictionLaw) {
              const point = this.frictionLaw(re, this.relativeRoughness[i]!)
              f = point.f
              dfdRe = point.dfdRe
            } else {
              // Clamond (2009) solution of Colebrook, then df/dRe by implicit differentiation
              // Clamond's steps converge with order three or more. From his starting point two steps
              // reach machine precision; from the previous Newton step's root, once the flows have
              // settled, one step does.
              const ed = this.relativeRoughness[i]!
              const x1 = ed * re * CLAMOND_X1
              const x2 = Math.log(re) + CLAMOND_X2
              // warm only when Re has moved by less than 1e-5: then the start is within ~1e-6 of the
              // root and one step of Clamond's third-order iteration leaves rounding error
              const lastRe = this.clamondRe[i]!
              const warm = Math.abs(re - lastRe) < 1e-5 * re ? this.clamondRoot[i]! : 0
              let fc = warm > 0 ? warm : x2 - 0.2
              for (let s = warm > 0 ? 1 : 2; s > 0; s--) {
                const x1f = x1 + fc
                const x1f1 = 1 + x1f
                const e = (Math.log(x1f) + fc - x2) / x1f1
                fc -= ((x1f1 + 0.5 * e) * e * x1f) / (x1f1 + e * (1 + e / 3))
              }
              this.clamondRoot[i] = fc
              this.clamondRe[i] = re
              f = CLAMOND_F / (fc * fc)
              const x = fc * TWO_OVER_LN10 // 1/√f
              const c = (2 * 2.51) / (LN10 * (ed / 3.7 + (2.51 * x) / re) * re)
              dfdRe = (-2 * ((c * x) / (re * (1 + c)))) / (x * x * x)
              if (re < RE_TURBULENT) {
                const sb = (re - RE_LAMINAR) / BLEND_SPAN
                const w = sb * sb * (3 - 2 * sb)
                const fl = 64 / re
                dfdRe = (1 - w) * (-fl / re) + w * dfdRe + ((6 * sb * (1 - sb)) / BLEND_SPAN) * (f - fl)
                f = (1 - w) * fl + w * f
              }
            }
            this.friction[i] = f
            const scale = this.frictionScale[i]!
            hi = scale * f * qi * aq
            gi = scale * aq * (2 * f + re * dfdRe)
          }
          const rm = this.minorR[i]!
          if (rm > 0) {
            if (aq < Q_LIN) {
              hi += rm * Q_LIN * qi
              gi += rm * Q_LIN
            } else {
              hi += rm * qi * aq
              gi += 2 * rm * aq
            }
          }
          h[i] = hi
          slope[i] = gi
          break
        }
        case QUADRATIC: {
          const r = a[i]!
          if (aq < Q_LIN) {
            h[i] = r * Q_LIN * qi
            slope[i] = r * Q_LIN
          } else {
            h[i] = r * qi * aq
            slope[i] = 2 * r * aq
          }
          break
        }
        case PUMP: {
          const law = this.pumps[i]!
          const { head, slope: s } = pumpHead(law, qi)
          h[i] = -head
          slope[i] = Math.max(-s, law.minSlope)
          break
        }
        default:
          h[i] = 0
          slope[i] = 1
      }
    }
  }
}
