import { z } from 'zod'
import { component, type Component, type ComponentType } from '../circuit/component'
import type { Point3 } from '../circuit/primitives'
import { trimmed } from './common'

/**
 * A part template: a part the workshop fits again and again, kept with everything a drawn part has
 * except its id and position. Port ids inside a template are local to it; placing the template
 * gives every port a fresh id (see componentFromTemplate).
 */
type DistributiveOmit<T, K extends PropertyKey> = T extends unknown ? Omit<T, K> : never
export type TemplateBody = DistributiveOmit<Component, 'id' | 'position'>

const bodyVariants = component.options.map((variant) => variant.omit({ id: true, position: true })) as unknown as [
  z.ZodType<TemplateBody>,
  ...z.ZodType<TemplateBody>[],
]

/** Checks the part schema cannot make on its own: port ids unique, thermostat settings that agree. */
function checkBody(body: TemplateBody, ctx: z.RefinementCtx, at: PropertyKey[]) {
  const seen = new Map<string, number>()
  body.ports.forEach((p, i) => {
    const first = seen.get(p.id)
    if (first !== undefined) ctx.addIssue({ code: 'custom', path: [...at, 'ports', i, 'id'], message: `Port id "${p.id}" is already used by port ${first + 1}` })
    else seen.set(p.id, i)
  })
  if (body.type === 'thermostat') {
    if (!body.ports.some((p) => p.id === body.params.valvedPortId)) {
      ctx.addIssue({ code: 'custom', path: [...at, 'params', 'valvedPortId'], message: `"${body.params.valvedPortId}" is not a port of this thermostat` })
    }
    if (body.params.fullOpenTempC <= body.params.openingTempC) {
      ctx.addIssue({ code: 'custom', path: [...at, 'params', 'fullOpenTempC'], message: 'Full-open temperature must be above the opening temperature' })
    }
  }
}

export const templateBody = z
  .discriminatedUnion('type', bodyVariants as never, { error: 'Choose a part type Hosewright knows' })
  .superRefine((body, ctx) => checkBody(body as TemplateBody, ctx, [])) as unknown as z.ZodType<TemplateBody>

export const templateName = trimmed('Name', 120)

export const templateInput = z.object({ name: templateName, body: templateBody })
export type TemplateInput = z.infer<typeof templateInput>

export const templateUpdateInput = z
  .object({ name: templateName.optional(), body: templateBody.optional() })
  .refine((v) => v.name !== undefined || v.body !== undefined, { message: 'Change the name or the part' })
export type TemplateUpdateInput = z.infer<typeof templateUpdateInput>

export const templateListQuery = z.object({
  q: z.string().trim().max(120, 'Search is at most 120 characters').optional(),
})

/** Drag-and-drop data type of a template dragged from the palette; the data is the body as JSON. */
export const TEMPLATE_DRAG_TYPE = 'application/x-hosewright-template'

/** Part types as the workshop says them, for pickers and lists. */
export const partTypeLabels: Record<ComponentType, string> = {
  engine: 'Engine',
  'water-pump': 'Water pump',
  radiator: 'Radiator',
  thermostat: 'Thermostat',
  'thermostat-housing': 'Thermostat housing',
  'pressure-cap': 'Pressure cap',
  'expansion-tank': 'Expansion tank',
  'overflow-bottle': 'Overflow bottle',
  'heater-core': 'Heater core',
  'heater-valve': 'Heater valve',
  'bleed-valve': 'Bleed valve',
  tee: 'Tee',
  reducer: 'Reducer',
  'blanking-plug': 'Blanking plug',
  drain: 'Drain',
  'deaeration-pot': 'De-aeration pot',
  generic: 'Other part',
  'fuel-tank': 'Fuel tank',
  'in-tank-pump': 'In-tank fuel pump',
  'inline-pump': 'Inline fuel pump',
  'fuel-filter': 'Fuel filter',
  'fuel-regulator': 'Fuel pressure regulator',
  'fuel-rail': 'Fuel rail',
  injector: 'Injectors',
  'bulkhead-fitting': 'Bulkhead fitting',
}

/** A stored template as the API returns it. */
export interface PartTemplate {
  id: string
  name: string
  type: ComponentType
  body: TemplateBody
  createdAt: string
  updatedAt: string
}

/** A drawn part → template body: drops id and position, keeps port ids (they are local from now on). */
export function templateFromComponent(part: Component): TemplateBody {
  const { id: _id, position: _position, ...body } = structuredClone(part)
  return body as TemplateBody
}

/**
 * Template body → a part to put into a drawing. `portId` names each port afresh (its local id and
 * index are passed), and references to ports inside the part (a thermostat's valved port) follow.
 */
export function componentFromTemplate(
  body: TemplateBody,
  id: string,
  position: Point3,
  portId: (localId: string, index: number) => string,
): Component {
  const copy = structuredClone(body)
  const idMap = new Map<string, string>()
  copy.ports.forEach((p, i) => {
    const fresh = portId(p.id, i)
    idMap.set(p.id, fresh)
    p.id = fresh
  })
  if (copy.type === 'thermostat') {
    copy.params.valvedPortId = idMap.get(copy.params.valvedPortId) ?? copy.params.valvedPortId
  }
  const { type, label, rotationDeg, volumeL, params, ports } = copy
  // keys in the document's order: id, type, the flat columns, params, ports
  return { id, type, label, position: { ...position }, rotationDeg, volumeL, params, ports } as Component
}
