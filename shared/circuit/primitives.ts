import { z } from 'zod'

/** Ids are short, printable and case-sensitive; the database stores them as text columns. */
export const ID_MAX_LENGTH = 64
export const elementId = z
  .string({ message: 'Id must be text' })
  .min(1, 'Id must not be empty')
  .max(ID_MAX_LENGTH, `Id is at most ${ID_MAX_LENGTH} characters`)
  .regex(/^[A-Za-z0-9._:-]+$/, 'Id may use letters, digits and . _ : - only')

/** A finite number inside a range that a real vehicle build can reach; the unit goes into the message. */
export function bounded(min: number, max: number, unit: string) {
  return z
    .number({ message: `Must be a number (${unit})` })
    .min(min, `Must be at least ${min} ${unit}`)
    .max(max, `Must be at most ${max} ${unit}`)
}

/** Coordinates in mm in vehicle axes: x fore–aft, y lateral, z height above the datum. 100 m either way is plenty. */
export const COORDINATE_LIMIT_MM = 100_000
const coordinate = bounded(-COORDINATE_LIMIT_MM, COORDINATE_LIMIT_MM, 'mm')
export const point3 = z.strictObject({ x: coordinate, y: coordinate, z: coordinate })
export type Point3 = z.infer<typeof point3>

export const labelText = (what: string, max = 120) =>
  z.string({ message: `${what} must be text` }).max(max, `${what} is at most ${max} characters`)
