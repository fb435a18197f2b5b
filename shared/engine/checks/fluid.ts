// Boil and freeze margins, and room for the coolant to expand: figures from the physics layer.
import { makeFinding, type AnalysisContext } from '../context'
import { fmt } from '../model'
import type { CoolantQuantities } from '../quantities/types'
import type { Finding } from '../report'
import { freezePoint } from '../physics'

export function fluidFindings(ctx: AnalysisContext, q: CoolantQuantities | null): Finding[] {
  const s = ctx.doc.circuit.settings.coolant
  if (!s || !q) return []
  const out: Finding[] = []
  const margin = q.boilingPointC - s.maxCoolantTempC
  if (margin < ctx.thresholds.boilMarginK) {
    out.push(makeFinding(ctx, 'boil-margin', 'warning',
      `Under the ${fmt(s.capRatingKpa, 0)} kPa cap the coolant boils at ${fmt(q.boilingPointC, 1)} °C, only ${fmt(margin, 1)} K above the ${fmt(s.maxCoolantTempC, 0)} °C the engine may reach (at least ${fmt(ctx.thresholds.boilMarginK, 0)} K wanted).`,
      [], 'Fit a higher-rated cap (if the radiator and tank are rated for it), raise the glycol share, or cool the engine better.'))
  }
  if (q.freezePointC > s.minAmbientC) {
    const target = percentFor(s.mix.fluid, s.minAmbientC)
    out.push(makeFinding(ctx, 'freeze-risk', 'warning',
      `The coolant (${s.mix.fluid === 'water' ? 'plain water' : `${fmt(s.mix.percentByVolume, 0)} % ${s.mix.fluid.replace('-', ' ')}`}) freezes at ${fmt(q.freezePointC, 1)} °C, warmer than the ${fmt(s.minAmbientC, 0)} °C the vehicle may stand in: it can crack the block or radiator.`,
      [],
      target !== null
        ? `Mix ${fmt(target, 0)} % ${s.mix.fluid === 'water' ? 'ethylene glycol' : s.mix.fluid.replace('-', ' ')} by volume (freezes below ${fmt(s.minAmbientC, 0)} °C).`
        : 'No usual mix protects that far; keep the vehicle warm or drain it.',
      target !== null ? { type: 'set-coolant-percent', percentByVolume: target } : undefined))
  }
  for (const c of ctx.model.components) {
    if (c.comp.type !== 'expansion-tank' || c.comp.params.capacityL === undefined) continue
    const room = c.comp.params.capacityL - c.comp.volumeL
    if (room < q.expansionL) {
      out.push(makeFinding(ctx, 'no-expansion-space', 'warning',
        `${c.comp.label} has ${fmt(room, 2)} L of room above the cold mark, but the coolant grows by ${fmt(q.expansionL, 2)} L from 20 °C to ${fmt(s.maxCoolantTempC, 0)} °C.`,
        [c.comp.id], `Use a tank with at least ${fmt(Math.ceil((q.expansionL + c.comp.volumeL) * 10) / 10, 1)} L capacity, or lower the cold mark.`))
    }
  }
  return out
}

/** Smallest whole percentage (5 % steps, 60 % at most, common practice) whose mix freezes below the ambient. */
function percentFor(fluid: 'water' | 'ethylene-glycol' | 'propylene-glycol', ambientC: number): number | null {
  const glycol = fluid === 'water' ? 'ethylene-glycol' : fluid
  for (let p = 5; p <= 60; p += 5) if (freezePoint({ fluid: glycol, percentByVolume: p }).tempC < ambientC) return p
  return null
}
