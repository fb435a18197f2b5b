// Shapes of the shop outputs: the shopping list a technician buys from and the lines the workshop prices.

/** Sections in the order they are printed. */
export const SHOP_SECTIONS = [
  'hoses', 'clamps', 'reducers', 'plugs', 'tees', 'bleed', 'drains', 'valves', 'thermostat', 'cap', 'coolant',
  'fuel-pump', 'filters', 'regulator', 'injectors', 'tank-fittings', 'sundries', 'other',
] as const
export type ShopSection = (typeof SHOP_SECTIONS)[number]

export const SECTION_TITLES: Record<ShopSection, string> = {
  hoses: 'Hose',
  clamps: 'Hose clamps',
  reducers: 'Reducers and adapters',
  plugs: 'Blanking plugs and caps',
  tees: 'Tees',
  bleed: 'Bleed valves and screws',
  drains: 'Drain taps and plugs',
  valves: 'Valves',
  thermostat: 'Thermostat',
  cap: 'Pressure cap',
  coolant: 'Coolant concentrate and distilled water',
  'fuel-pump': 'Fuel pump',
  filters: 'Fuel filters',
  regulator: 'Fuel pressure regulator',
  injectors: 'Injectors and rail',
  'tank-fittings': 'Tank fittings',
  sundries: 'Sundries',
  other: 'Other parts',
}

/** The same figure written for a metric shop and for a US shop. */
export interface DualText {
  metric: string
  imperial: string
}

export interface ShoppingLine {
  /** stable: built from the circuit's own ids and sizes, so a workshop's prices can follow a line across edits */
  id: string
  section: ShopSection
  /** a cut piece names the hose line it is cut from; everything bought has null */
  parentId: string | null
  description: string
  quantity: number
  /** 'm', 'piece', 'container' … */
  unit: string
  /** the item's size: bore, spigot, clamp range, rating, container */
  sizes: DualText
  /** the quantity with its unit, e.g. "10 m" / "32.81 ft" */
  quantityText: DualText
  source: 'engine' | 'custom'
  /** price per unit, in the workshop's currency; null until the workshop fills it in */
  price: number | null
  supplier: string | null
  notes: string
  /** parts, ports and hoses of the drawing this line is for */
  elementIds: string[]
}

export interface SectionTotal {
  section: ShopSection
  title: string
  /** lines to buy (cut pieces are not counted: they come off their hose line) */
  lines: number
  pricedLines: number
  /** Σ price × quantity over the priced lines; null when none is priced */
  priceTotal: number | null
}

export interface ShoppingList {
  circuitTitle: string
  engineVersion: string
  lines: ShoppingLine[]
  sections: SectionTotal[]
  total: { lines: number; pricedLines: number; priceTotal: number | null; complete: boolean }
  /** findings that change what has to be bought (an open port, a hose of the wrong bore …) */
  attention: string[]
  /** how the quantities were rounded, in words for the printout */
  rules: string[]
}

/** A line the workshop adds by hand: heat sleeve, cable ties, a spare clamp … */
export interface CustomLineInput {
  /** unique among the custom lines; the line's id becomes `custom/<id>` */
  id: string
  description: string
  quantity: number
  unit: string
  section?: ShopSection
  sizes?: Partial<DualText>
  price?: number | null
  supplier?: string | null
  notes?: string
}

/** A container a liquid is sold in. */
export interface ContainerSize {
  id: string
  litres: number
  /** sizes of one system are combined with each other, never with the other system's */
  system: 'metric' | 'us'
  /** how the shop names it: "5 L", "1 US gal" */
  label: string
  sizes: DualText
}

export interface ShoppingListOptions {
  customLines?: CustomLineInput[]
  /** extra coolant bought for topping up after the first run, % of the fill; default 10 */
  topUpReservePercent?: number
  concentrateContainers?: ContainerSize[]
  waterContainers?: ContainerSize[]
  /** workshop prices by line id; they survive regenerating the list because the ids are stable */
  prices?: Record<string, { price: number | null; supplier?: string | null }>
}
