// Every API route, read from the files under server/api (Nitro's file-based routing: the method is
// the file name's suffix, [name] a parameter, index the folder itself), so suites that must cover
// every route notice a new one.
import { readdirSync } from 'node:fs'
import { join, relative } from 'node:path'
import { fileURLToPath } from 'node:url'

const apiDir = fileURLToPath(new URL('../../server/api', import.meta.url))
const METHODS = ['get', 'post', 'put', 'patch', 'delete'] as const

export interface ApiRoute {
  /** e.g. "DELETE /api/circuits/:id/photos/:photoId" */
  key: string
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'
  /** path segments; parameters as ":name" */
  segments: string[]
  params: string[]
  file: string
}

function walk(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap(e => e.isDirectory() ? walk(join(dir, e.name)) : [join(dir, e.name)])
}

export function apiRoutes(): ApiRoute[] {
  return walk(apiDir).filter(f => f.endsWith('.ts')).map((file) => {
    const rel = relative(apiDir, file).replace(/\.ts$/, '')
    const parts = rel.split('/')
    const last = parts.pop()!
    const dot = last.lastIndexOf('.')
    const method = last.slice(dot + 1) as typeof METHODS[number]
    if (!METHODS.includes(method)) throw new Error(`${rel}: the file name does not end in a method`)
    const name = last.slice(0, dot)
    if (name !== 'index') parts.push(name)
    const segments = ['api', ...parts].map(s => s.replace(/^\[(\w+)\]$/, ':$1'))
    const params = segments.filter(s => s.startsWith(':')).map(s => s.slice(1))
    return { key: `${method.toUpperCase()} /${segments.join('/')}`, method: method.toUpperCase() as ApiRoute['method'], segments, params, file: relative(join(apiDir, '../..'), file) }
  }).sort((a, b) => a.key.localeCompare(b.key))
}

/** The path of a route with its parameters filled in (each value URL-encoded). */
export function fillPath(route: ApiRoute, values: Record<string, string>): string {
  return `/${route.segments.map(s => s.startsWith(':') ? encodeURIComponent(values[s.slice(1)] ?? '') : s).join('/')}`
}
