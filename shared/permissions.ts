// Who may do what. The server enforces this table through requireMember(); the client only uses
// it to hide buttons a user could not use anyway.
import type { Role } from './schemas/membership'

export const capabilities = {
  'workshop:read': ['owner', 'fabricator', 'reviewer', 'technician'],
  'members:manage': ['owner'],
  'project:read': ['owner', 'fabricator', 'reviewer', 'technician'],
  'project:write': ['owner', 'fabricator'],
  'circuit:read': ['owner', 'fabricator', 'reviewer', 'technician'],
  'circuit:write': ['owner', 'fabricator'],
  'template:read': ['owner', 'fabricator', 'reviewer', 'technician'],
  'template:write': ['owner', 'fabricator'],
  // review before the first fill: who draws submits, reviewers and owners sign off (and nobody their
  // own submission unless the workshop allows it: shared/review/approval.ts)
  'review:read': ['owner', 'fabricator', 'reviewer', 'technician'],
  'review:submit': ['owner', 'fabricator'],
  'review:decide': ['owner', 'reviewer'],
  // everyone on the job may pin a remark to the drawing; owners may remove anyone's
  'comment:read': ['owner', 'fabricator', 'reviewer', 'technician'],
  'comment:write': ['owner', 'fabricator', 'reviewer', 'technician'],
  'comment:moderate': ['owner'],
  'activity:read': ['owner', 'fabricator', 'reviewer', 'technician'],
  // the shop outputs of a version: everyone reads them; those who buy, fit and fill record on them
  'shop:read': ['owner', 'fabricator', 'reviewer', 'technician'],
  'shop:record': ['owner', 'fabricator', 'technician'],
  'workshop:settings': ['owner'],
} as const satisfies Record<string, readonly Role[]>

export type Capability = keyof typeof capabilities

export function can(role: Role | null | undefined, capability: Capability): boolean {
  return role != null && (capabilities[capability] as readonly Role[]).includes(role)
}

export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  fabricator: 'Fabricator',
  reviewer: 'Reviewer',
  technician: 'Technician',
}

export const roleDescriptions: Record<Role, string> = {
  owner: 'Manages members and can do everything',
  fabricator: 'Creates projects and draws circuits',
  reviewer: 'Reads everything and signs off before the first fill',
  technician: 'Reads everything and works the shopping list and procedures',
}
