// The command-line check: its output and exit status (0 clean, 1 error findings, 2 invalid document).
import { spawnSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { correctedDemoDocument, demoDocument } from '#shared/demo'

const dir = mkdtempSync(join(tmpdir(), 'hosewright-check-'))
const write = (name: string, content: string) => {
  const p = join(dir, name)
  writeFileSync(p, content)
  return p
}
const run = (...args: string[]) => spawnSync('npx', ['tsx', 'scripts/check.ts', ...args], { encoding: 'utf8', cwd: process.cwd(), timeout: 60_000 })

describe('npm run check', () => {
  it('exits 1 and prints the report as JSON when the circuit has an error finding', () => {
    const r = run(write('demo.json', JSON.stringify(demoDocument())))
    expect(r.status).toBe(1)
    const report = JSON.parse(r.stdout)
    expect(report.counts.error).toBe(1)
    expect(report.findings[0].code).toBe('open-port')
  }, 60_000)
  it('exits 0 on a circuit without error findings, and prints text for people with --format text', () => {
    const r = run(write('fixed.json', JSON.stringify(correctedDemoDocument())), '--format', 'text')
    expect(r.status).toBe(0)
    expect(r.stdout).toContain('0 errors, 0 warnings')
    expect(r.stdout).toContain('Hose to buy:')
  }, 60_000)
  it('exits 2 on an invalid document and prints every failing path', () => {
    const bad = demoDocument() as unknown as { formatVersion: number; circuit: { hoses: Array<{ to: { portId: string } }> } }
    bad.formatVersion = 9
    const r = run(write('bad.json', JSON.stringify(bad)))
    expect(r.status).toBe(2)
    expect(r.stdout).toContain('formatVersion: Format version must be 1')
    const dangling = demoDocument()
    dangling.circuit.hoses[0]!.to.portId = 'missing'
    const r2 = run(write('dangling.json', JSON.stringify(dangling)))
    expect(r2.status).toBe(2)
    expect(r2.stdout).toContain('circuit.hoses[0].to.portId: No port has the id "missing"')
  }, 60_000)
  it('exits 2 when the file is missing', () => {
    expect(run(join(dir, 'nothing-here.json')).status).toBe(2)
  }, 60_000)
})
