// System coolant volume and the mix to make it.
import type { CoolantSettings } from '../../circuit'
import type { AnalysisContext } from '../context'
import { hoseName } from '../model'
import { boilingPoint, coolantProperties, freezePoint } from '../physics'
import type { CoolantQuantities, VolumeShare } from './types'

/** Bore volume of a hose, L: π/4 · d² · L with d and L in mm (1 L = 1e6 mm³). */
export function boreVolumeL(insideDiameterMm: number, lengthMm: number): number {
  return ((Math.PI / 4) * insideDiameterMm * insideDiameterMm * lengthMm) / 1e6
}

export function systemVolume(ctx: AnalysisContext): { totalL: number; parts: VolumeShare[] } {
  const { components, hoses } = ctx.model
  const volumes = new Float64Array(components.length + hoses.length)
  let totalL = 0
  for (let i = 0; i < components.length; i++) { volumes[i] = components[i]!.comp.volumeL; totalL += volumes[i]! }
  for (let i = 0; i < hoses.length; i++) {
    const h = hoses[i]!
    const v = boreVolumeL(h.hose.insideDiameterMm, h.lengthMm)
    volumes[components.length + i] = v
    totalL += v
  }
  const parts: VolumeShare[] = new Array(volumes.length)
  for (let i = 0; i < components.length; i++) {
    const c = components[i]!.comp
    parts[i] = { elementId: c.id, name: c.label, volumeL: volumes[i]!, share: totalL > 0 ? volumes[i]! / totalL : 0 }
  }
  for (let i = 0; i < hoses.length; i++) {
    const h = hoses[i]!
    const v = volumes[components.length + i]!
    parts[components.length + i] = { elementId: h.hose.id, name: hoseName(h), volumeL: v, share: totalL > 0 ? v / totalL : 0 }
  }
  return { totalL, parts }
}

/** Temperature at which the workshop fills: the density there sets the cold level. */
export const FILL_TEMPERATURE_C = 20

export function coolantQuantities(settings: CoolantSettings, totalL: number): CoolantQuantities {
  const mix = settings.mix
  const glycolShare = mix.fluid === 'water' ? 0 : mix.percentByVolume / 100
  const freeze = freezePoint(mix)
  const boil = boilingPoint(mix, settings.capRatingKpa)
  const cold = coolantProperties(mix, FILL_TEMPERATURE_C).densityKgM3
  const hot = coolantProperties(mix, settings.maxCoolantTempC).densityKgM3
  return {
    mix,
    concentrateL: totalL * glycolShare,
    waterL: totalL * (1 - glycolShare),
    freezePointC: freeze.tempC,
    freezePointSource: freeze.source,
    boilingPointC: boil.tempC,
    boilingPointSource: boil.source,
    capRatingKpa: settings.capRatingKpa,
    // the same mass takes ρ_cold/ρ_hot times the volume when hot
    expansionL: totalL * (cold / hot - 1),
  }
}
