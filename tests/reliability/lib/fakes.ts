// The suite's own stand-ins for object storage and SMTP (the scripts the other suites use, on free
// ports, with their data in a temporary folder), so these tests can kill and restart servers freely.
import { spawn, type ChildProcess } from 'node:child_process'
import { existsSync, mkdtempSync, readFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { HeadObjectCommand, ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3'
import { freePort, root } from './app'

export interface FakeS3 { url: string; bucket: string; client: S3Client; env: Record<string, string>; stop(): Promise<void> }
export interface FakeSmtp { port: number; apiUrl: string; env: Record<string, string>; stop(): Promise<void> }

const stopChild = (child: ChildProcess) => new Promise<void>((resolve) => {
  if (child.exitCode !== null || child.signalCode !== null) return resolve()
  child.once('exit', () => resolve())
  child.kill('SIGTERM')
})

export async function startFakeS3(bucket = 'hosewright-reliability'): Promise<FakeS3> {
  const dir = mkdtempSync(join(tmpdir(), 'hw-rel-s3-'))
  const portFile = join(dir, 'port')
  const child = spawn(process.execPath, ['scripts/fake-s3.mjs', '--dir', join(dir, 'data'), '--bucket', bucket,
    '--port', String(await freePort()), '--port-file', portFile, '--parent', String(process.pid)], { cwd: root, stdio: 'ignore' })
  for (let i = 0; i < 300 && !existsSync(portFile); i++) await new Promise(r => setTimeout(r, 100))
  if (!existsSync(portFile)) throw new Error('the fake S3 did not start')
  const url = `http://127.0.0.1:${readFileSync(portFile, 'utf8').trim()}`
  const client = new S3Client({
    endpoint: url, region: 'us-east-1', forcePathStyle: true, credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
    requestChecksumCalculation: 'WHEN_REQUIRED', responseChecksumValidation: 'WHEN_REQUIRED',
  })
  return {
    url, bucket, client,
    env: { S3_ENDPOINT: url, S3_REGION: 'us-east-1', S3_BUCKET: bucket, S3_FORCE_PATH_STYLE: '1', S3_ACCESS_KEY_ID: 'S3RVER', S3_SECRET_ACCESS_KEY: 'S3RVER' },
    stop: async () => { client.destroy(); await stopChild(child) },
  }
}

/** Every key in the bucket. */
export async function listKeys(s3: FakeS3): Promise<string[]> {
  const keys: string[] = []
  let token: string | undefined
  do {
    const page = await s3.client.send(new ListObjectsV2Command({ Bucket: s3.bucket, ContinuationToken: token }))
    keys.push(...(page.Contents ?? []).map(o => o.Key!))
    token = page.IsTruncated ? page.NextContinuationToken : undefined
  } while (token)
  return keys
}

export async function objectExists(s3: FakeS3, key: string): Promise<boolean> {
  try {
    await s3.client.send(new HeadObjectCommand({ Bucket: s3.bucket, Key: key }))
    return true
  } catch (error) {
    if ((error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return false
    throw error
  }
}

export async function startFakeSmtp(): Promise<FakeSmtp> {
  const dir = mkdtempSync(join(tmpdir(), 'hw-rel-mail-'))
  const [port, http] = [await freePort(), await freePort()]
  const child = spawn(process.execPath, ['scripts/fake-smtp.mjs', String(port), String(http), dir], { cwd: root, stdio: 'ignore' })
  const apiUrl = `http://127.0.0.1:${http}`
  for (let i = 0; i < 100; i++) {
    if (await fetch(`${apiUrl}/messages?to=-`).then(r => r.ok, () => false)) {
      return {
        port, apiUrl,
        env: { SMTP_HOST: '127.0.0.1', SMTP_PORT: String(port), SMTP_SECURE: '0', SMTP_IGNORE_TLS: '1' },
        stop: () => stopChild(child),
      }
    }
    await new Promise(r => setTimeout(r, 100))
  }
  await stopChild(child)
  throw new Error('the fake SMTP server did not start')
}

export interface CaughtMail { subject: string; text: string; envelope: { to: string[] } }

/** Messages the fake SMTP server received for one address. */
export async function mailFor(smtp: FakeSmtp, to: string): Promise<CaughtMail[]> {
  const res = await fetch(`${smtp.apiUrl}/messages?to=${encodeURIComponent(to)}`)
  return await res.json() as CaughtMail[]
}
