// Prints one summary line for `npm test` from the stage list and vitest's JSON reports.
import { existsSync, readFileSync } from 'node:fs'
import { join } from 'node:path'

const dir = process.argv[2]
const stages = readFileSync(join(dir, 'stages.txt'), 'utf8').trim().split('\n').filter(Boolean)
  .map((line) => { const [name, state, seconds] = line.split(' '); return { name, ok: state === 'pass', seconds: Number(seconds) } })
let passed = 0, failed = 0, skipped = 0, brokenFiles = 0
for (const suite of ['unit', 'api', 'e2e']) {
  const file = join(dir, `${suite}.json`)
  if (!existsSync(file)) continue
  const report = JSON.parse(readFileSync(file, 'utf8'))
  passed += report.numPassedTests
  failed += report.numFailedTests
  // a file that fails to load reports no failed test, only a failed suite
  brokenFiles += report.testResults.filter(r => r.status === 'failed' && r.assertionResults.every(a => a.status !== 'failed')).length
  skipped += report.numPendingTests + (report.numTodoTests ?? 0)
}
const expected = ['typecheck', 'lint', 'unit', 'build', 'api', 'e2e', 'reliability']
const missing = expected.filter(n => !stages.some(s => s.name === n))
const failedStages = stages.filter(s => !s.ok).map(s => s.name).concat(missing.map(m => `${m} (not run)`))
console.log('')
console.log(stages.map(s => `${s.name} ${s.ok ? 'ok' : 'FAILED'} (${s.seconds}s)`).join(' · '))
console.log(`Summary: ${passed} passed, ${failed} failed, ${skipped} skipped${brokenFiles ? `, ${brokenFiles} test files failed to run` : ''}; stages ${stages.filter(s => s.ok).length}/${expected.length} ok${failedStages.length ? ` — failed: ${failedStages.join(', ')}` : ''}`)
process.exit(failedStages.length || failed || brokenFiles ? 1 : 0)
