// What the shop page's parts share: the routes of one version's shop outputs and the way readings
// are written back to the person in their own units.
import { formatQuantity, type UnitPreferences } from '#shared/physics/units'
import type { UnitPreferences as SessionUnits } from '#shared/schemas/preferences'
import type { ShopTick } from '#shared/schemas/shop'

export const shopBase = (circuitId: string, version: number) => `/api/circuits/${circuitId}/versions/${version}/shop`

/** The app's own pages for a version. */
export const shopPage = (circuitId: string, version: number) => `/circuits/${circuitId}/shop/${version}`
export const buildSheetPage = (circuitId: string, version: number) => `/circuits/${circuitId}/build-sheet/${version}`

export function when(iso: string): string {
  return new Date(iso).toLocaleString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' })
}

export function tickText(t: ShopTick | null): string {
  return t ? `${t.by?.name ?? 'a former member'}, ${when(t.at)}` : ''
}

function units(prefs: SessionUnits): UnitPreferences {
  return { ...prefs, flow: prefs.volume === 'qt' ? 'gal/min' : 'L/min' }
}

export const pressureIn = (kpa: number, prefs: SessionUnits) => formatQuantity('pressure', kpa, units(prefs), { decimals: prefs.pressure === 'kPa' ? 1 : prefs.pressure === 'bar' ? 3 : 2 })
export const volumeIn = (litres: number, prefs: SessionUnits) => formatQuantity('volume', litres, units(prefs))

/** A typed number ("12.5", "12,5", " 3 "), or null when the box is empty; NaN when it is not a number. */
export function typedNumber(text: string): number | null {
  const t = text.trim().replace(',', '.')
  if (t === '') return null
  return /^[-+]?(\d+(\.\d*)?|\.\d+)$/.test(t) ? Number(t) : Number.NaN
}
