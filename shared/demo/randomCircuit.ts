// Random but schema-valid coolant circuits for property tests and the benchmark: a main loop (pump,
// engine, thermostat with bypass, radiator, tank) with heater-like rungs between a supply rail and a
// return rail, laid at random positions. With `faults`, some rungs end at a plug or an open port.
import type { CircuitDocument, Component, Hose, Point3, Port } from '../circuit'

export interface RandomCircuitOptions {
  seed: number
  /** parallel rungs between the rails; each adds 3 parts and 4 hoses */
  rungs: number
  /** turn some rungs into dead legs and leave some ports open */
  faults?: boolean
  /**
   * Lay it out the way a careful workshop would: hoses rise or fall steadily between their ends, every
   * tee and heater has a bleed screw at its top, and every spigot suits its hose. Such a circuit gives
   * few findings, like a real one; without it the random heights make many air traps.
   */
  tidy?: boolean
}

/** mulberry32: small, fast, and the same sequence on every machine for a seed. */
function prng(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

const BORES = [15.88, 19.05, 25.4, 31.75]

/** Rungs needed for about `elements` parts plus hoses. */
export function rungsFor(elements: number): number {
  return Math.max(1, Math.round((elements - 12) / 7))
}

export function randomCircuit(options: RandomCircuitOptions): CircuitDocument {
  const rnd = prng(options.seed)
  const int = (lo: number, hi: number) => Math.floor(lo + rnd() * (hi - lo + 1))
  const pt = (x: number, y: number, z: number): Point3 => ({ x, y, z })
  const comps: Component[] = []
  const hoses: Hose[] = []
  let hoseNo = 0
  const port = (id: string, role: Port['role'], od: number, blocked = false): Port => ({
    id, name: id, role, spigotOdMm: od, offset: pt(int(-100, 100), int(-100, 100), int(-50, 50)), blocked,
  })
  const tidy = options.tidy === true
  const heightOf = new Map<string, number>()
  const join = (from: string, to: string, bore: number, straight = false) => {
    const route: Point3[] = []
    const n = straight ? 0 : int(0, 3)
    const z0 = heightOf.get(from) ?? 0
    const z1 = heightOf.get(to) ?? 0
    for (let i = 1; i <= n; i++) {
      route.push(pt(int(0, 4000), int(-800, 800), tidy ? Math.round(z0 + ((z1 - z0) * i) / (n + 1)) : int(-100, 900)))
    }
    hoses.push({
      id: `h${hoseNo++}`, from: { portId: from, clamp: 'worm-drive' }, to: { portId: to, clamp: 'worm-drive' },
      insideDiameterMm: bore, wallMm: 4, material: bore >= 25 ? 'j20-r4-radiator' : 'j20-r3-heater',
      params: { route },
    })
  }
  const place = () => pt(int(0, 4000), int(-800, 800), int(0, 800))
  /** Adds parts, noting each port's height for the tidy routes; tidy parts get a bleed screw on top. */
  const addParts = (...list: Component[]) => {
    for (const c of list) {
      if (tidy && (c.type === 'tee' || c.type === 'heater-core')) {
        c.ports.push({ id: `${c.id}-bleed`, name: 'bleed screw', role: 'vent', spigotOdMm: 8, offset: pt(0, 0, 120), blocked: true })
      }
      for (const q of c.ports) heightOf.set(q.id, c.position.z + q.offset.z)
      comps.push(c)
    }
  }
  const main = 31.75
  addParts(
    { id: 'pump', type: 'water-pump', label: 'Pump', position: place(), rotationDeg: 0, volumeL: 0.3, params: {},
      ports: [port('pump-in', 'inlet', 32), port('pump-bypass', 'inlet', 19), port('pump-out', 'outlet', 32)] },
    { id: 'engine', type: 'engine', label: 'Engine', position: place(), rotationDeg: int(0, 359), volumeL: 3,
      params: { resistance: { dropKpa: 12, atFlowLpm: 100 } },
      ports: [port('engine-in', 'inlet', 32), port('engine-out', 'outlet', 32)] },
    { id: 'stat', type: 'thermostat', label: 'Thermostat', position: place(), rotationDeg: 0, volumeL: 0.2,
      params: { resistance: { k: 2.5, diameterMm: 32 }, openingTempC: 88, fullOpenTempC: 100, valvedPortId: 'stat-out' },
      ports: [port('stat-in', 'inlet', 32), port('stat-out', 'outlet', 32), port('stat-bypass', 'outlet', 19)] },
    { id: 'rad', type: 'radiator', label: 'Radiator', position: place(), rotationDeg: 0, volumeL: 2.5,
      params: { resistance: { dropKpa: 6, atFlowLpm: 100 } },
      ports: [port('rad-in', 'inlet', 32), port('rad-out', 'outlet', 32), port('rad-bleed', 'vent', 8, true)] },
    { id: 'tank', type: 'expansion-tank', label: 'Tank', position: pt(2000, 0, 1500), rotationDeg: 0, volumeL: 1, params: { capRatingKpa: 100 },
      ports: [port('tank-cap', 'fill', 40, true), port('tank-out', 'outlet', 16)] },
  )
  join('pump-out', 'engine-in', main)
  join('engine-out', 'stat-in', main)
  join('stat-bypass', 'pump-bypass', 19.05)
  let supply = 'stat-out'
  let ret = 'rad-out'
  const rungs = Math.max(1, options.rungs)
  for (let i = 0; i < rungs; i++) {
    const bore = BORES[int(0, BORES.length - 1)]!
    const od = tidy ? Number(bore.toFixed(2)) : Math.round(bore)
    const dead = options.faults === true && i % 5 === 2
    // tidy rails are manifolds: tees close together, so the rails barely resist and every rung gets its share
    const railX = 200 + (i * 3600) / rungs
    addParts(
      { id: `s${i}`, type: 'tee', label: `Supply tee ${i}`, position: tidy ? pt(Math.round(railX), 300, 500) : place(), rotationDeg: 0, volumeL: 0.05, params: {},
        ports: [port(`s${i}-a`, 'either', 32), port(`s${i}-b`, 'either', 32), port(`s${i}-c`, 'either', od)] },
      { id: `r${i}`, type: 'tee', label: `Return tee ${i}`, position: tidy ? pt(Math.round(railX), -300, 450) : place(), rotationDeg: 0, volumeL: 0.05, params: {},
        ports: [port(`r${i}-a`, 'either', 32), port(`r${i}-b`, 'either', 32), port(`r${i}-c`, 'either', od, dead)] },
      { id: `x${i}`, type: 'heater-core', label: `Heater ${i}`, position: place(), rotationDeg: int(0, 359), volumeL: 0.3,
        params: { resistance: { dropKpa: 8, atFlowLpm: 10 } },
        ports: [port(`x${i}-in`, 'inlet', od), port(`x${i}-out`, 'outlet', od, dead && i % 2 === 0)] },
    )
    join(supply, `s${i}-a`, main, tidy)
    join(ret, `r${i}-a`, main, tidy)
    join(`s${i}-c`, `x${i}-in`, bore)
    if (!dead) join(`x${i}-out`, `r${i}-c`, bore)
    supply = `s${i}-b`
    ret = `r${i}-b`
  }
  join(supply, 'rad-in', main)
  join(ret, 'pump-in', main)
  // the tank's static line joins the last return tee's run... through its own tee on the pump inlet side
  addParts({ id: 'tank-tee', type: 'tee', label: 'Tank tee', position: place(), rotationDeg: 0, volumeL: 0.05, params: {},
    ports: [port('tt-a', 'either', 19), port('tt-b', 'either', 19), port('tt-c', 'either', 16)] })
  // splice the tank tee into the bypass hose
  const bypass = hoses.find((h) => h.from.portId === 'stat-bypass')!
  bypass.to = { portId: 'tt-a', clamp: 'worm-drive' }
  join('tt-b', 'pump-bypass', 19.05)
  join('tank-out', 'tt-c', 15.88)
  return {
    format: 'hosewright.circuit',
    formatVersion: 1,
    circuit: {
      kind: 'coolant',
      title: `Random circuit ${options.seed}/${rungs}`,
      settings: {
        allowance: { percent: 5, perEndMm: 25 },
        datum: 'top of the chassis rails',
        coolant: {
          mix: { fluid: 'ethylene-glycol', percentByVolume: 50 },
          capRatingKpa: 100, maxCoolantTempC: 105, minAmbientC: -25,
          pump: { mode: 'curve', atRpm: 3000, points: [{ flowLpm: 0, headM: 12 }, { flowLpm: 100, headM: 9 }, { flowLpm: 200, headM: 3 }] },
        },
      },
      components: comps,
      hoses,
    },
  }
}
