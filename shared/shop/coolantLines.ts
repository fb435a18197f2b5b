// Concentrate and distilled water for the fill, rounded up to the containers they are sold in.
// The litres come from the engine's mix (concentrate = V × percent, water = the rest); the reserve
// and the container rounding are the shop's own rule (CONTAINER_RULE).
import type { CoolantQuantities } from '../engine'
import { chooseContainers, describeChoice, type ContainerChoice } from './containers'
import { num, volumeText } from './format'
import type { ContainerSize, ShoppingLine } from './types'

const FLUID_NAMES = { 'ethylene-glycol': 'ethylene glycol', 'propylene-glycol': 'propylene glycol' } as const

function choiceText(c: ContainerChoice): string {
  return `${describeChoice(c)} (${num(c.totalL)} L)`
}

function linesFor(
  what: 'concentrate' | 'water', name: string, needL: number, reservePercent: number, sizes: readonly ContainerSize[], basis: string,
): ShoppingLine[] {
  const withReserve = needL * (1 + reservePercent / 100)
  const { choice, alternatives } = chooseContainers(withReserve, sizes)
  if (!choice || choice.count === 0) return []
  const need = volumeText(needL)
  const notes =
    `${basis}: ${need.metric} (${need.imperial}) + ${num(reservePercent)} % top-up reserve = ${num(withReserve)} L; ` +
    `buying ${choiceText(choice)}.` +
    (alternatives.length > 0 ? ` Or ${alternatives.map(choiceText).join(', or ')}.` : '')
  return choice.items.map(({ container, count }) => {
    const total = volumeText(count * container.litres)
    return {
      id: `coolant/${what}/${container.id}`,
      section: 'coolant',
      parentId: null,
      description: `${name}, ${container.label} container`,
      quantity: count,
      unit: 'container',
      sizes: container.sizes,
      quantityText: {
        metric: `${count} × ${container.sizes.metric} = ${total.metric}`,
        imperial: `${count} × ${container.sizes.imperial} = ${total.imperial}`,
      },
      source: 'engine',
      price: null,
      supplier: null,
      notes,
      elementIds: [],
    } satisfies ShoppingLine
  })
}

export function coolantLines(
  coolant: CoolantQuantities, systemL: number, reservePercent: number,
  concentrateSizes: readonly ContainerSize[], waterSizes: readonly ContainerSize[],
): ShoppingLine[] {
  const mix = coolant.mix
  const system = volumeText(systemL)
  if (mix.fluid === 'water') {
    return linesFor('water', 'Distilled water', coolant.waterL, reservePercent, waterSizes, `Plain water fill for ${system.metric}`)
  }
  const basis = `${num(mix.percentByVolume)} % ${FLUID_NAMES[mix.fluid]} by volume for a ${system.metric} system`
  return [
    ...linesFor('concentrate', `Coolant concentrate (${FLUID_NAMES[mix.fluid]})`, coolant.concentrateL, reservePercent, concentrateSizes, basis),
    ...linesFor('water', 'Distilled water', coolant.waterL, reservePercent, waterSizes, basis),
  ]
}
