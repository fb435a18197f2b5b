// Runs the Python reference scripts in tests/reference against Debian's python3-fluids and
// python3-iapws. A missing interpreter or module is an error, never a skip: the comparison is the point.

import { spawnSync } from 'node:child_process'
import { fileURLToPath } from 'node:url'

const PYTHON = '/usr/bin/python3'
const INSTALL_HINT = 'apt-get install python3-fluids python3-iapws'

export interface ReferenceOutput<T> {
  library: string
  version: string
  results: T[]
}

export function runReference<T = unknown>(script: 'fluids_reference.py' | 'iapws_reference.py', cases: unknown[]): ReferenceOutput<T> {
  const path = fileURLToPath(new URL(`../../reference/${script}`, import.meta.url))
  const run = spawnSync(PYTHON, [path], { input: JSON.stringify(cases), encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 })
  if (run.error) {
    throw new Error(`cannot run ${PYTHON} (${run.error.message}); install the reference libraries: ${INSTALL_HINT}`)
  }
  if (run.status !== 0) {
    throw new Error(`${script} failed (exit ${run.status}): ${run.stdout.trim()} ${run.stderr.trim()}; install the reference libraries: ${INSTALL_HINT}`)
  }
  const out = JSON.parse(run.stdout) as ReferenceOutput<T>
  out.results.forEach((r, i) => {
    if (r && typeof r === 'object' && 'error' in r) throw new Error(`${script} case ${i} ${JSON.stringify(cases[i])}: ${(r as { error: string }).error}`)
  })
  return out
}

/** Relative difference |a − b| / |b|. */
export function relativeDifference(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b)
}
