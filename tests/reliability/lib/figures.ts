// Figures the reliability suites measure, printed and kept in test-results/reliability/<name>.json
// so docs/reliability.md can be brought up to date from a run.
import { mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { root } from './app'

export function recordFigures(name: string, figures: Record<string, unknown>) {
  const dir = join(root, 'test-results', 'reliability')
  mkdirSync(dir, { recursive: true })
  writeFileSync(join(dir, `${name}.json`), `${JSON.stringify(figures, null, 2)}\n`)
  console.info(`[reliability] ${name}: ${JSON.stringify(figures)}`)
}
