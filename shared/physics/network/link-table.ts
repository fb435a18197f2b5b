// The solver's hot loop: head loss h(Q) and slope dh/dQ of every link, from per-link constants held
// in typed arrays, without allocating. The physics is exactly that of link-models.ts and friction.ts
// (same laminar law, Colebrook, blend and laminar floor); it is restated here in flat form because this
// loop runs once per link per Newton step.
//
// Colebrook inside the iteration. friction.ts solves it from scratch each time (Clamond's start, two
// of his third-order steps: three logarithms). Here every pipe keeps its root F = ln10/(2√f) from the
// previous Newton step, and each evaluation takes ONE of Clamond's steps from it at the new Reynolds
// number, written so that it needs one logarithm:
//   e = (ln(X1 + F) + F − X2)/(1 + X1 + F),  ln(X1 + F) − X2 = ln((X1 + F)·5.02/(Re·ln10)).
// The step is third order, so the lag costs nothing: once the flows have settled the start is within
// ~1e-7 of the root and the step leaves rounding error; early on, the Newton iteration is converging
// the flows and the friction factors together. The solver does not stop on a step whose roots were
// still moving (rootError). `exact` evaluations start from Clamond's own point and take two
// steps, as friction.ts does.

import { LAMINAR_LIMIT_RE, TURBULENT_LIMIT_RE } from '../friction'
import { STANDARD_GRAVITY } from '../units'
import { QUADRATIC_LAW_LINEAR_BELOW_M3S, pumpHead, type FrictionLaw, type LinkLaw, type PumpCurveLaw } from './link-models'
import { takeInts, takeReals } from './scratch'

// local copies: module bindings can cost a property read per use in some module loaders
const G = STANDARD_GRAVITY
const Q_LIN = QUADRATIC_LAW_LINEAR_BELOW_M3S
const RE_LAMINAR = LAMINAR_LIMIT_RE
const RE_TURBULENT = TURBULENT_LIMIT_RE

const LN10 = Math.LN10
const CLAMOND_X1 = LN10 / 18.574
const CLAMOND_X2 = Math.log(LN10 / 5.02)
/** 5.02/ln10: turns ln(X1 + F) − X2 into one logarithm, ln((X1 + F)·this/Re) */
const RE_SCALE = 5.02 / LN10
const CLAMOND_F = (LN10 / 2) ** 2
const TWO_OVER_LN10 = 2 / LN10
const BLEND_SPAN = RE_TURBULENT - RE_LAMINAR
/**
 * Bound on the root error one step leaves, relative, per (relative start error)³ (see rootError),
 * and the same per |ΔF|³ using F ≥ 4 (F = ln10/(2√f) ≥ 4 for f ≤ 0.083, which covers ε/D ≤ 0.05 at
 * every Re ≥ 2300), so that the hot loop needs no division for it.
 */
const STEP_ERROR = 1e-3
const STEP_ERROR_PER_ABSOLUTE = STEP_ERROR / 4 ** 3

const PIPE = 0
const QUADRATIC = 1
const PUMP = 2
const NONE = 3

export class LinkTable {
  readonly kind: Int32Array
  /** pipe: laminar slope 32νL/(g·D²·A); quadratic: r */
  private readonly a: Float64Array
  /** pipe: Re per |Q| = D/(A·ν) */
  private readonly reynoldsPerFlow: Float64Array
  /** pipe: (L/D)/(2g·A²), so that friction h = this·f·Q|Q| */
  private readonly frictionScale: Float64Array
  /** pipe: K/(2g·A²) */
  private readonly minorR: Float64Array
  /** pipe: Clamond's X1 per unit Re, ε/D·ln10/18.574 */
  private readonly x1PerRe: Float64Array
  private readonly relativeRoughness: Float64Array
  /** pipe: ε/D/3.7 */
  private readonly roughOver37: Float64Array
  private readonly pumps: Array<PumpCurveLaw | undefined>
  private readonly area: Float64Array
  /** Clamond's root F of each pipe at the last evaluation (0: none yet), the start of the next one */
  private readonly root: Float64Array
  /** head loss, slope and (pipes) Darcy friction factor of the last evaluate(); f is NaN when laminar at zero flow */
  readonly h: Float64Array
  readonly slope: Float64Array
  readonly friction: Float64Array
  /**
   * What the single Colebrook steps of the last evaluate() may have left, as a flow (m³/s): at most
   * the largest 1e-3·(ΔF/F)³·|Q| over the pipes, ΔF the step's correction. One of Clamond's steps from a
   * start ΔF/F off leaves at most 4e-4·(ΔF/F)³ of F (measured for ΔF/F up to 1.4e-2, Re 5e3–1e5,
   * ε/D 0–0.01; it is of fourth order below that), and a relative error e in F moves the pipe's flow
   * by about e.
   */
  rootError = 0

  constructor(laws: ReadonlyArray<LinkLaw | null>, private readonly frictionLaw?: FrictionLaw) {
    const n = laws.length
    // the arrays live in the solver's scratch space (the table does not outlive a solve)
    this.kind = takeInts(n).fill(NONE)
    this.a = takeReals(n)
    this.reynoldsPerFlow = takeReals(n)
    this.frictionScale = takeReals(n)
    this.minorR = takeReals(n)
    this.x1PerRe = takeReals(n)
    this.relativeRoughness = takeReals(n)
    this.roughOver37 = takeReals(n)
    this.pumps = new Array(n)
    this.area = takeReals(n)
    this.root = takeReals(n)
    this.h = takeReals(n)
    this.slope = takeReals(n)
    this.friction = takeReals(n)
    for (let i = 0; i < n; i++) {
      const law = laws[i]
      if (!law || law.kind === 'fixed-flow') continue
      if (law.kind === 'pipe') {
        this.kind[i] = PIPE
        const d = law.diameterM
        this.a[i] = (32 * law.kinematicViscosity * law.lengthM) / (G * d * d * law.area)
        this.reynoldsPerFlow[i] = d / (law.area * law.kinematicViscosity)
        this.frictionScale[i] = law.lengthM / d / (2 * G * law.area * law.area)
        this.minorR[i] = law.minorK / (2 * G * law.area * law.area)
        this.x1PerRe[i] = law.relativeRoughness * CLAMOND_X1
        this.relativeRoughness[i] = law.relativeRoughness
        this.roughOver37[i] = law.relativeRoughness / 3.7
        this.area[i] = law.area
      } else if (law.kind === 'quadratic') {
        this.kind[i] = QUADRATIC
        this.a[i] = law.r
        this.area[i] = law.diameterM ? (Math.PI / 4) * law.diameterM * law.diameterM : 0
      } else {
        this.kind[i] = PUMP
        this.pumps[i] = law
      }
    }
  }

  /** Mean velocity (m/s) and Reynolds number of link i at flow q; null for links without a bore. */
  velocity(i: number, q: number): number | null {
    return this.area[i]! > 0 ? q / this.area[i]! : null
  }

  reynolds(i: number, q: number): number | null {
    return this.kind[i] === PIPE ? Math.abs(q) * this.reynoldsPerFlow[i]! : null
  }

  /**
   * Fills h, slope and friction of every link at flows q (same positions). With `exact`, Colebrook is
   * solved from scratch (to rounding); otherwise one step from each pipe's last root (see the top).
   */
  evaluate(q: Float64Array, exact = false): void {
    const { kind, a, h, slope, friction, root, reynoldsPerFlow, frictionScale, minorR, x1PerRe, relativeRoughness, roughOver37, frictionLaw } = this
    const n = kind.length
    let rootError = 0
    for (let i = 0; i < n; i++) {
      const qi = q[i]!
      const aq = qi < 0 ? -qi : qi
      const type = kind[i]
      if (type === PIPE) {
        const re = aq * reynoldsPerFlow[i]!
        let hi: number
        let gi: number
        if (re < RE_LAMINAR) {
          hi = a[i]! * qi
          gi = a[i]!
          friction[i] = re > 0 ? 64 / re : Number.NaN
          // the last turbulent root stays: a start for when the pipe turns turbulent again (one that
          // is far off shows in rootError, so the solver takes another step)
        } else {
          let f: number
          let dfdRe: number
          /** 2f + Re·df/dRe, the friction part of the slope */
          let slopeFactor: number
          if (frictionLaw) {
            const point = frictionLaw(re, relativeRoughness[i]!)
            f = point.f
            dfdRe = point.dfdRe
            slopeFactor = 2 * f + re * dfdRe
          } else {
            // Clamond (2009): F + ln(X1 + F) = X2 with X1 = ε/D·Re·ln10/18.574, X2 = ln(Re·ln10/5.02).
            // His step, e = (ln(X1 + F) + F − X2)/(1 + X1 + F), F −= (1 + X1 + F + e/2)·e·(X1 + F)/
            // (1 + X1 + F + e·(1 + e/3)), is written over one division (s = 1 + X1 + F, L = e·s):
            //   ΔF = 3L·(X1 + F)·(2s² + L) / (2·(3s³ + 3s·L + L²)).
            const invRe = 1 / re
            const x1 = x1PerRe[i]! * re
            let fc = root[i]!
            let steps = 1
            if (fc === 0 || exact) {
              fc = Math.log(re) + CLAMOND_X2 - 0.2
              if (exact) steps = 2
            }
            let change = 0
            for (; steps > 0; steps--) {
              const x1f = x1 + fc
              const sf = 1 + x1f
              const l = Math.log(x1f * RE_SCALE * invRe) + fc
              change = (3 * l * x1f * (2 * sf * sf + l)) / (2 * (3 * sf * sf * sf + 3 * sf * l + l * l))
              fc -= change
            }
            if (!exact) {
              // |ΔF|³·|Q|, for rootError
              const left = change * change * change * aq
              if (left > rootError) rootError = left
              else if (-left > rootError) rootError = -left
            }
            root[i] = fc
            // f = (ln10/2)²/F², and by implicit differentiation of Colebrook, with x = 1/√f and
            // D = ε/3.7·Re + 2.51·x: 2f + Re·df/dRe = 2f·D/(5.02/ln10 + D). One division for both.
            const dd = roughOver37[i]! * re + 2.51 * fc * TWO_OVER_LN10
            const inv = 1 / (fc * fc * (RE_SCALE + dd))
            f = CLAMOND_F * (RE_SCALE + dd) * inv
            slopeFactor = 2 * CLAMOND_F * dd * inv
            dfdRe = (slopeFactor - 2 * f) * invRe
          }
          if (re < RE_TURBULENT) {
            const sb = (re - RE_LAMINAR) / BLEND_SPAN
            const w = sb * sb * (3 - 2 * sb)
            const fl = 64 / re
            dfdRe = (1 - w) * (-fl / re) + w * dfdRe + ((6 * sb * (1 - sb)) / BLEND_SPAN) * (f - fl)
            f = (1 - w) * fl + w * f
            slopeFactor = 2 * f + re * dfdRe
          }
          friction[i] = f
          const scale = frictionScale[i]!
          hi = scale * f * qi * aq
          gi = scale * aq * slopeFactor
        }
        const rm = minorR[i]!
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
      } else if (type === QUADRATIC) {
        const r = a[i]!
        if (aq < Q_LIN) {
          h[i] = r * Q_LIN * qi
          slope[i] = r * Q_LIN
        } else {
          h[i] = r * qi * aq
          slope[i] = 2 * r * aq
        }
      } else if (type === PUMP) {
        const law = this.pumps[i]!
        const { head, slope: s } = pumpHead(law, qi)
        h[i] = -head
        slope[i] = Math.max(-s, law.minSlope)
      } else {
        h[i] = 0
        slope[i] = 1
      }
    }
    this.rootError = STEP_ERROR_PER_ABSOLUTE * rootError
  }
}
