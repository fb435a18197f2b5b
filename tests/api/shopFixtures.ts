// Circuits and set-ups for the shop suites, and reading PDFs back with Debian's poppler-utils.
import { execFileSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { expect } from 'vitest'
import type { CircuitDocument, Component, Hose, Port } from '#shared/circuit'
import { correctedDemoDocument } from '#shared/demo'
import { Client, addMember, baseUrl, signUp } from '../helpers/http'

const pt = (x: number, y: number, z: number) => ({ x, y, z })
const port = (id: string, spigotOdMm: number): Port => ({ id, name: id, role: 'either', spigotOdMm, offset: pt(0, 0, 0), blocked: false })
const part = (id: string, at: { x: number; y: number; z: number }, ports: Port[], volumeL: number): Component =>
  ({ id, type: 'generic', label: id.toUpperCase(), position: at, rotationDeg: 0, volumeL, params: {}, ports })
const hose = (id: string, from: string, to: string, bore: number, wall: number, material: Hose['material']): Hose =>
  ({ id, from: { portId: from, clamp: 'worm-drive' }, to: { portId: to, clamp: 'worm-drive' }, insideDiameterMm: bore, wallMm: wall, material, params: { route: [] } })

/**
 * A bench piece small enough to work out on paper: part A (1.0 L) at the origin; part B (0.5 L) at
 * x 300, y 400, so the heater hose between them runs a straight 500 mm (a 3-4-5 triangle); part C
 * (0 L) at x 1000, for a straight 1000 mm radiator hose from A. Allowance 5 % + 25 mm per end,
 * 50 % ethylene glycol by volume.
 */
export function benchDocument(): CircuitDocument {
  return {
    format: 'hosewright.circuit',
    formatVersion: 1,
    circuit: {
      kind: 'coolant',
      title: 'Bench loop',
      settings: {
        allowance: { percent: 5, perEndMm: 25 },
        datum: 'bench top',
        coolant: {
          mix: { fluid: 'ethylene-glycol', percentByVolume: 50 },
          capRatingKpa: 100, maxCoolantTempC: 105, minAmbientC: -25,
          pump: { mode: 'fixed', flowLpm: 40, atRpm: 3000 },
        },
      },
      components: [
        part('a', pt(0, 0, 0), [port('a-heater', 16), port('a-radiator', 32)], 1.0),
        part('b', pt(300, 400, 0), [port('b-heater', 16)], 0.5),
        part('c', pt(1000, 0, 0), [port('c-radiator', 32)], 0),
      ],
      hoses: [
        hose('heater', 'a-heater', 'b-heater', 15.88, 4, 'j20-r3-heater'),
        hose('radiator', 'a-radiator', 'c-radiator', 31.75, 4, 'j20-r4-radiator'),
      ],
    },
  }
}

export interface ApprovedBuild {
  owner: Client; fab: Client; rev: Client; tech: Client
  emails: Record<'owner' | 'fab' | 'rev' | 'tech', string>
  names: Record<'rev' | 'tech', string>
  projectId: string; projectTitle: string; circuitId: string; circuitTitle: string; version: number; reviewId: string
}

/** A workshop of four whose corrected demo build has been submitted by the fabricator and approved by the reviewer. */
export async function approvedDemoBuild(tag: string): Promise<ApprovedBuild> {
  const o = await signUp(`${tag}owner`, `Shop ${tag}`)
  const [f, r, t] = await Promise.all([addMember(o.client, 'fabricator', `${tag}fab`), addMember(o.client, 'reviewer', `${tag}rev`), addMember(o.client, 'technician', `${tag}tech`)])
  const projectTitle = `Shop build ${tag}`
  const projectId = (await f.client.post('/api/projects', { title: projectTitle })).body.id as string
  const circuitTitle = `Cooling ${tag}`
  const circuitId = (await f.client.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: circuitTitle })).body.id as string
  const doc = correctedDemoDocument()
  doc.circuit.title = circuitTitle
  const saved = await f.client.put(`/api/circuits/${circuitId}/graph`, { baseVersion: 1, document: doc })
  expect(saved.status).toBe(200)
  const version = saved.body.version as number
  const submitted = await f.client.post(`/api/circuits/${circuitId}/reviews`, { version, note: 'Outlet capped, heater bleed fitted.' })
  expect(submitted.status).toBe(201)
  const approved = await r.client.post(`/api/reviews/${submitted.body.id}/approve`, { note: 'Good to fill.' })
  expect(approved.status, JSON.stringify(approved.body)).toBe(200)
  return {
    owner: o.client, fab: f.client, rev: r.client, tech: t.client,
    emails: { owner: o.email, fab: f.email, rev: r.email, tech: t.email },
    names: { rev: `Test ${tag}rev`, tech: `Test ${tag}tech` },
    projectId, projectTitle, circuitId, circuitTitle, version, reviewId: submitted.body.id,
  }
}

/** A binary answer (PDF) with the client's cookies. */
export async function getBytes(client: Client, path: string): Promise<{ status: number; headers: Headers; bytes: Buffer }> {
  const res = await fetch(baseUrl + path, { headers: { cookie: [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; ') } })
  return { status: res.status, headers: res.headers, bytes: Buffer.from(await res.arrayBuffer()) }
}

/** Page count, page size and text of a PDF, by pdfinfo and pdftotext (Debian poppler-utils). */
export function readPdf(bytes: Buffer | Uint8Array): { file: string; pages: number; pageSize: string; text: string } {
  const dir = mkdtempSync(join(tmpdir(), 'hosewright-pdf-'))
  const file = join(dir, 'sheet.pdf')
  writeFileSync(file, bytes)
  const info = execFileSync('pdfinfo', [file], { encoding: 'utf8' })
  const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' })
  return {
    file,
    pages: Number(/^Pages:\s+(\d+)/m.exec(info)?.[1] ?? 0),
    pageSize: /^Page size:\s+(.+)$/m.exec(info)?.[1]?.trim() ?? '',
    text,
  }
}
