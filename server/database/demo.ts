// The invented demo workshop. Every name here is made up for the demo.
import type { Role } from '../../shared/schemas/membership'

export const demoPassword = 'hosewright-demo'

export const demoWorkshop = { name: 'Quillfeather Swap Works' }

export const demoAccounts: Array<{ email: string; name: string; role: Role }> = [
  { email: 'owner@quillfeather.test', name: 'Mara Quillfeather', role: 'owner' },
  { email: 'fabricator@quillfeather.test', name: 'Bram Solderby', role: 'fabricator' },
  { email: 'reviewer@quillfeather.test', name: 'Ines Weldmark', role: 'reviewer' },
  { email: 'technician@quillfeather.test', name: 'Tobi Clampett', role: 'technician' },
]

export const demoProject = {
  title: 'Camper van turbo-four transplant',
  vehicle: '1970s forward-control camper van; the original small air-cooled rear engine is gone, so every coolant line is new',
  engine: '2.0 L turbocharged inline four from a front-wheel-drive hatchback, mounted in the rear; three coolant outlets on the head',
  notes: 'Radiator stays up front behind the nose grille: about 3.6 m of coolant line each way under the floor. '
    + 'The cabin heater core sits under the front seat, above the engine ports.',
  status: 'fabrication' as const,
}
