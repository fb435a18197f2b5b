import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { spawn, type ChildProcess } from 'node:child_process'
import { createHash } from 'node:crypto'
import { createServer } from 'node:net'
import { existsSync, readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { GetObjectCommand, HeadObjectCommand, ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3'
import sharp from 'sharp'
import { Client, addMember, baseUrl, signUp } from '../helpers/http'
import { sql } from '../helpers/db'

// Photos go to object storage (the fake S3 the test scripts start); these checks look inside the
// bucket with their own S3 client, so "stored" means stored, not just "the API said 201".

afterAll(() => sql.end())

/** Where the test server's fake S3 is: set by scripts/test.sh, or noted by scripts/test-server.sh. */
function fakeS3(): { url: string; bucket: string } {
  let url = process.env.HOSEWRIGHT_TEST_S3_URL
  let bucket = process.env.HOSEWRIGHT_TEST_S3_BUCKET
  if (!url) {
    const root = fileURLToPath(new URL('../..', import.meta.url)).replace(/\/$/, '')
    const port = new URL(baseUrl).port
    const stateDirs = [process.env.HOSEWRIGHT_STATE_DIR, `${root}/.data`,
      `/var/tmp/hosewright-${createHash('sha1').update(root).digest('hex').slice(0, 12)}`].filter(Boolean) as string[]
    const note = stateDirs.map(d => `${d}/test-server-${port}.s3`).find(f => existsSync(f))
    if (!note) throw new Error('HOSEWRIGHT_TEST_S3_URL is not set and scripts/test-server.sh left no note: run the suites through npm test')
    const vars = Object.fromEntries(readFileSync(note, 'utf8').trim().split('\n').map(l => l.split('=', 2) as [string, string]))
    url = vars.HOSEWRIGHT_TEST_S3_URL
    bucket = vars.HOSEWRIGHT_TEST_S3_BUCKET
  }
  return { url: url!, bucket: bucket ?? 'hosewright-test' }
}

const s3Target = fakeS3()
const s3 = new S3Client({
  endpoint: s3Target.url, region: process.env.S3_REGION ?? 'us-east-1', forcePathStyle: true,
  credentials: { accessKeyId: process.env.S3_ACCESS_KEY_ID ?? 'S3RVER', secretAccessKey: process.env.S3_SECRET_ACCESS_KEY ?? 'S3RVER' },
  requestChecksumCalculation: 'WHEN_REQUIRED', responseChecksumValidation: 'WHEN_REQUIRED',
})
afterAll(() => s3.destroy())

async function objectInfo(key: string) {
  try {
    const head = await s3.send(new HeadObjectCommand({ Bucket: s3Target.bucket, Key: key }))
    return { contentType: head.ContentType, size: head.ContentLength }
  } catch (e) {
    if ((e as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return null
    throw e
  }
}

async function objectBytes(key: string): Promise<Buffer> {
  const res = await s3.send(new GetObjectCommand({ Bucket: s3Target.bucket, Key: key }))
  return Buffer.from(await res.Body!.transformToByteArray())
}

interface Upload { data: Buffer; name: string; type?: string }

/** multipart/form-data as a browser sends it, with the client's cookies. */
async function upload(client: Client, circuitId: string, componentId: string | null, file: Upload | null, server = baseUrl) {
  const form = new FormData()
  if (componentId !== null) form.append('componentId', componentId)
  if (file) form.append('file', new Blob([new Uint8Array(file.data)], { type: file.type ?? 'image/png' }), file.name)
  const headers: Record<string, string> = { accept: 'application/json' }
  if (client.cookies.size) headers.cookie = [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; ')
  if (client.forwardedFor) headers['x-forwarded-for'] = client.forwardedFor
  const res = await fetch(`${server}/api/circuits/${circuitId}/photos`, { method: 'POST', body: form, headers })
  const text = await res.text()
  let body: any = text
  try { body = JSON.parse(text) } catch { /* not JSON */ }
  return { status: res.status, body }
}

async function rawGet(client: Client, path: string) {
  const headers: Record<string, string> = {}
  if (client.cookies.size) headers.cookie = [...client.cookies].map(([k, v]) => `${k}=${v}`).join('; ')
  const res = await fetch(baseUrl + path, { headers })
  return { status: res.status, headers: res.headers, bytes: Buffer.from(await res.arrayBuffer()) }
}

// Real images made here: a 1200 × 800 photo-like gradient (JPEG) and a small PNG.
async function jpegPhoto(width = 1200, height = 800) {
  const pixels = Buffer.alloc(width * height * 3)
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = (y * width + x) * 3
      pixels[i] = (x * 255) / width; pixels[i + 1] = (y * 255) / height; pixels[i + 2] = 128
    }
  }
  return await sharp(pixels, { raw: { width, height, channels: 3 } }).jpeg({ quality: 80 }).toBuffer()
}
const pngPhoto = () => sharp({ create: { width: 200, height: 150, channels: 3, background: '#0d6b73' } }).png().toBuffer()

let owner: Client
let circuitId: string
let limits: { maxBytes: number; types: string[] }
beforeAll(async () => {
  owner = (await signUp('photos')).client
  const projectId = (await owner.post('/api/projects', { title: 'Photo host' })).body.id
  circuitId = (await owner.post(`/api/projects/${projectId}/circuits`, { kind: 'coolant', title: 'Photographed cooling' })).body.id
  const list = await owner.get(`/api/circuits/${circuitId}/photos`)
  expect(list.status).toBe(200)
  limits = list.body.limits
})

describe('uploading photos of a part', () => {
  it('stores a JPEG and its thumbnail in object storage, under keys made of ids, and lists it', async () => {
    const data = await jpegPhoto()
    const res = await upload(owner, circuitId, 'radiator', { data, name: 'radiator-front.jpg', type: 'image/jpeg' })
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({ componentId: 'radiator', label: 'radiator-front.jpg', contentType: 'image/jpeg', sizeBytes: data.length, width: 1200, height: 800 })

    const [row] = await sql`select * from part_photos where id = ${res.body.id}`
    const [membership] = await sql`select workshop_id from circuits where id = ${circuitId}`
    expect(row!.object_key).toBe(`${membership!.workshop_id}/${circuitId}/${res.body.id}`)
    expect(row!.thumbnail_key.startsWith(`${membership!.workshop_id}/${circuitId}/${res.body.id}`)).toBe(true)

    expect(await objectInfo(row!.object_key)).toEqual({ contentType: 'image/jpeg', size: data.length })
    expect((await objectBytes(row!.object_key)).equals(data)).toBe(true)
    expect((await objectInfo(row!.thumbnail_key))?.contentType).toBe('image/webp')
    const thumb = await sharp(await objectBytes(row!.thumbnail_key)).metadata()
    expect(thumb.format).toBe('webp')
    expect(Math.max(thumb.width!, thumb.height!)).toBe(320)
    // the aspect ratio survives: 1200 × 800 → 320 × 213
    expect(thumb.height).toBe(Math.round((800 * 320) / 1200))

    const list = await owner.get(`/api/circuits/${circuitId}/photos?componentId=radiator`)
    expect(list.body.photos.map((p: any) => p.id)).toEqual([res.body.id])
    expect(list.body.photos[0].uploadedBy.name).toBe('Test photos')
  })

  it('serves the image and the thumbnail with their types, private caching and nosniff', async () => {
    const data = await pngPhoto()
    const created = (await upload(owner, circuitId, 'thermostat', { data, name: 'stat.png' })).body
    const image = await rawGet(owner, created.imageUrl)
    expect(image.status).toBe(200)
    expect(image.headers.get('content-type')).toBe('image/png')
    expect(image.headers.get('cache-control')).toMatch(/\bprivate\b/)
    expect(image.headers.get('x-content-type-options')).toBe('nosniff')
    expect(image.bytes.equals(data)).toBe(true)
    const thumb = await rawGet(owner, created.thumbnailUrl)
    expect(thumb.headers.get('content-type')).toBe('image/webp')
    // never enlarged: a 200 px picture stays 200 px
    expect((await sharp(thumb.bytes).metadata()).width).toBe(200)
    expect((await rawGet(new Client(), created.imageUrl)).status).toBe(401)
  })

  it('lists one part or the whole circuit', async () => {
    const circuitList = await owner.get(`/api/circuits/${circuitId}/photos`)
    const components = circuitList.body.photos.map((p: any) => p.componentId)
    expect(components).toContain('radiator')
    expect(components).toContain('thermostat')
    const none = await owner.get(`/api/circuits/${circuitId}/photos?componentId=no-such-part`)
    expect(none.body.photos).toEqual([])
    expect((await owner.get(`/api/circuits/${circuitId}/photos?componentId=${encodeURIComponent('bad id!')}`)).status).toBe(400)
  })

  it('keeps a path-like file name as its label only: it never reaches the object key', async () => {
    const name = '../../../etc/passwd;x=1.png'
    const res = await upload(owner, circuitId, 'radiator', { data: await pngPhoto(), name })
    expect(res.status).toBe(201)
    expect(res.body.label).toBe(name)
    const [row] = await sql`select object_key, thumbnail_key, label from part_photos where id = ${res.body.id}`
    expect(row!.label).toBe(name)
    for (const key of [row!.object_key, row!.thumbnail_key]) {
      expect(key).not.toMatch(/\.\.|passwd|etc/)
      expect(key).toMatch(/^[0-9a-f-]{36}\/[0-9a-f-]{36}\/[0-9a-f-]{36}(-thumb)?$/)
    }
    const listed = await s3.send(new ListObjectsV2Command({ Bucket: s3Target.bucket, Prefix: row!.object_key.split('/')[0] }))
    expect((listed.Contents ?? []).some(o => o.Key!.includes('passwd'))).toBe(false)
  })
})

describe('refused uploads', () => {
  it('judges by content: a text file named .png answers 415 and stores nothing', async () => {
    const before = await sql`select count(*)::int as n from part_photos where circuit_id = ${circuitId}`
    const res = await upload(owner, circuitId, 'radiator', { data: Buffer.from('just some notes, not a picture\n'.repeat(20)), name: 'notes.png', type: 'image/png' })
    expect(res.status).toBe(415)
    expect(res.body.message).toMatch(/JPEG, PNG and WebP/)
    const gif = await sharp({ create: { width: 10, height: 10, channels: 3, background: '#000' } }).gif().toBuffer()
    const asJpeg = await upload(owner, circuitId, 'radiator', { data: gif, name: 'holiday.jpg', type: 'image/jpeg' })
    expect(asJpeg.status).toBe(415)
    expect(asJpeg.body.message).toMatch(/GIF/)
    const after = await sql`select count(*)::int as n from part_photos where circuit_id = ${circuitId}`
    expect(after[0]!.n).toBe(before[0]!.n)
  })

  it('a photo over the limit answers 413, just over and far over', async () => {
    const png = await pngPhoto()
    // a real PNG head padded past the limit by one byte
    const justOver = Buffer.concat([png, Buffer.alloc(limits.maxBytes + 1 - png.length)])
    const res = await upload(owner, circuitId, 'radiator', { data: justOver, name: 'big.png' })
    expect(res.status).toBe(413)
    expect(res.body.message).toMatch(/larger than/)
    const farOver = await upload(owner, circuitId, 'radiator', { data: Buffer.alloc(limits.maxBytes * 2, 1), name: 'huge.png' })
    expect(farOver.status).toBe(413)
  })

  it('asks for the missing part id and the missing file by field', async () => {
    const noPart = await upload(owner, circuitId, null, { data: await pngPhoto(), name: 'a.png' })
    expect(noPart.status).toBe(400)
    expect(Object.keys(noPart.body.data.fields)).toEqual(['componentId'])
    const noFile = await upload(owner, circuitId, 'radiator', null)
    expect(noFile.status).toBe(400)
    expect(noFile.body.data.fields.file).toMatch(/photo/)
  })

  it('another workshop sees neither the circuit nor its photos; a technician may look but not change', async () => {
    const created = (await upload(owner, circuitId, 'radiator', { data: await pngPhoto(), name: 'guarded.png' })).body
    const stranger = (await signUp('photo-stranger')).client
    expect((await stranger.get(`/api/circuits/${circuitId}/photos`)).status).toBe(404)
    expect((await upload(stranger, circuitId, 'radiator', { data: await pngPhoto(), name: 'x.png' })).status).toBe(404)
    expect((await rawGet(stranger, created.imageUrl)).status).toBe(404)
    expect((await rawGet(stranger, created.thumbnailUrl)).status).toBe(404)
    expect((await stranger.delete(`/api/circuits/${circuitId}/photos/${created.id}`)).status).toBe(404)

    // the stranger's own circuit cannot reach the owner's photo either
    const otherProject = (await stranger.post('/api/projects', { title: 'Elsewhere' })).body.id
    const otherCircuit = (await stranger.post(`/api/projects/${otherProject}/circuits`, { kind: 'coolant', title: 'Theirs' })).body.id
    expect((await rawGet(stranger, `/api/circuits/${otherCircuit}/photos/${created.id}/image`)).status).toBe(404)

    const { client: technician } = await addMember(owner, 'technician')
    expect((await technician.get(`/api/circuits/${circuitId}/photos`)).status).toBe(200)
    expect((await rawGet(technician, created.thumbnailUrl)).status).toBe(200)
    expect((await upload(technician, circuitId, 'radiator', { data: await pngPhoto(), name: 't.png' })).status).toBe(403)
    expect((await technician.delete(`/api/circuits/${circuitId}/photos/${created.id}`)).status).toBe(403)
    expect((await sql`select 1 from part_photos where id = ${created.id}`).length).toBe(1)
  })
})

describe('deleting a photo', () => {
  it('removes the row and both objects', async () => {
    const created = (await upload(owner, circuitId, 'tank', { data: await jpegPhoto(400, 300), name: 'tank.jpg', type: 'image/jpeg' })).body
    const [row] = await sql`select object_key, thumbnail_key from part_photos where id = ${created.id}`
    expect(await objectInfo(row!.object_key)).not.toBeNull()
    const res = await owner.delete(`/api/circuits/${circuitId}/photos/${created.id}`)
    expect(res.status).toBe(200)
    expect((await sql`select 1 from part_photos where id = ${created.id}`).length).toBe(0)
    expect(await objectInfo(row!.object_key)).toBeNull()
    expect(await objectInfo(row!.thumbnail_key)).toBeNull()
    expect((await rawGet(owner, created.imageUrl)).status).toBe(404)
    expect((await owner.delete(`/api/circuits/${circuitId}/photos/${created.id}`)).status).toBe(404)
  })
})

// A second instance of the built app, on the same database, whose storage address answers nothing.
describe('when object storage is down', () => {
  let app: ChildProcess | undefined
  let appUrl = ''
  const freePort = () => new Promise<number>((resolve) => {
    const probe = createServer().listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number }
      probe.close(() => resolve(port))
    })
  })
  beforeAll(async () => {
    const root = fileURLToPath(new URL('../..', import.meta.url))
    const [port, deadPort] = [await freePort(), await freePort()]
    appUrl = `http://127.0.0.1:${port}`
    // the same build the test server runs (scripts/lib/build.sh: HOSEWRIGHT_BUILD_TAG picks .output-<tag>)
    const output = process.env.HOSEWRIGHT_BUILD_TAG ? `.output-${process.env.HOSEWRIGHT_BUILD_TAG}` : '.output'
    app = spawn(process.execPath, [`${output}/server/index.mjs`], {
      cwd: root, stdio: 'ignore',
      env: {
        ...process.env, DATABASE_URL: process.env.HOSEWRIGHT_TEST_DATABASE_URL, HOSEWRIGHT_SKIP_MIGRATE: '1', HOSEWRIGHT_SEED_DEMO: '0',
        // same secret as the test server (scripts/test.sh), so the owner's cookie is valid here too
        NUXT_SESSION_PASSWORD: 'test-session-password-0123456789abcdef',
        NITRO_HOST: '127.0.0.1', NITRO_PORT: String(port),
        S3_ENDPOINT: `http://127.0.0.1:${deadPort}`, S3_BUCKET: s3Target.bucket, S3_FORCE_PATH_STYLE: '1',
        S3_ACCESS_KEY_ID: 'S3RVER', S3_SECRET_ACCESS_KEY: 'S3RVER',
      },
    })
    for (let i = 0; i < 200; i++) {
      if (await fetch(`${appUrl}/api/health`).then(r => r.ok, () => false)) return
      await new Promise(r => setTimeout(r, 100))
    }
    throw new Error('second app instance did not start')
  })
  afterAll(() => { app?.kill('SIGTERM') })

  it('an upload answers 503 in plain words and leaves no row', async () => {
    const before = await sql`select count(*)::int as n from part_photos where circuit_id = ${circuitId}`
    const res = await upload(owner, circuitId, 'radiator', { data: await pngPhoto(), name: 'offline.png' }, appUrl)
    expect(res.status).toBe(503)
    expect(res.body.message).toMatch(/Nothing was saved/)
    const after = await sql`select count(*)::int as n from part_photos where circuit_id = ${circuitId}`
    expect(after[0]!.n).toBe(before[0]!.n)
    // deleting keeps the photo (and says so) rather than leaving its files behind unlisted
    const kept = (await upload(owner, circuitId, 'radiator', { data: await pngPhoto(), name: 'kept.png' })).body
    const refused = await fetch(`${appUrl}/api/circuits/${circuitId}/photos/${kept.id}`, {
      method: 'DELETE', headers: { accept: 'application/json', cookie: [...owner.cookies].map(([k, v]) => `${k}=${v}`).join('; ') },
    })
    expect(refused.status).toBe(503)
    expect((await sql`select 1 from part_photos where id = ${kept.id}`).length).toBe(1)
    // the list still works: it needs only the database
    expect((await fetch(`${appUrl}/api/circuits/${circuitId}/photos`, { headers: { cookie: [...owner.cookies].map(([k, v]) => `${k}=${v}`).join('; ') } })).status).toBe(200)
  })
})
