// Starts the built server as a child process of the test, on a free port, with an environment made
// here (nothing inherited from the shell but PATH and HOME), and keeps every line it writes.
import { spawn, type ChildProcess } from 'node:child_process'
import { createServer } from 'node:net'
import { fileURLToPath } from 'node:url'

export const root = fileURLToPath(new URL('../../..', import.meta.url))
/** The build the other suites run (scripts/lib/build.sh: HOSEWRIGHT_BUILD_TAG picks .output-<tag>). */
export const serverEntry = `${process.env.HOSEWRIGHT_BUILD_TAG ? `.output-${process.env.HOSEWRIGHT_BUILD_TAG}` : '.output'}/server/index.mjs`
export const sessionPassword = 'reliability-session-password-0123456789abcdef'

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer().once('error', reject).listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number }
      probe.close(() => resolve(port))
    })
  })
}

export interface Exit { code: number | null; signal: NodeJS.Signals | null }

export interface App {
  url: string
  port: number
  proc: ChildProcess
  /** stdout lines, in order */
  out: string[]
  /** stderr lines, in order */
  err: string[]
  exited: Promise<Exit>
  /** stdout lines that are JSON log records */
  records(): Array<Record<string, any>>
}

export type AppEnv = Record<string, string | undefined>

/** Spawns the server; resolves once /api/health answers 200 (or rejects when it exits first). */
export async function startApp(env: AppEnv, options: { port?: number; waitUntilHealthy?: boolean } = {}): Promise<App> {
  const port = options.port ?? await freePort()
  const proc = spawn(process.execPath, [serverEntry], {
    cwd: root,
    stdio: ['ignore', 'pipe', 'pipe'],
    env: {
      PATH: process.env.PATH, HOME: process.env.HOME, NODE_ENV: 'production',
      NITRO_HOST: '127.0.0.1', NITRO_PORT: String(port), NUXT_SESSION_PASSWORD: sessionPassword,
      HOSEWRIGHT_MAIL_POLL_MS: '200', ...env,
    } as NodeJS.ProcessEnv,
  })
  const out: string[] = []
  const err: string[] = []
  const collect = (into: string[]) => {
    let rest = ''
    return (chunk: Buffer) => {
      const lines = (rest + chunk.toString('utf8')).split('\n')
      rest = lines.pop() ?? ''
      into.push(...lines.filter(Boolean))
    }
  }
  proc.stdout!.on('data', collect(out))
  proc.stderr!.on('data', collect(err))
  const exited = new Promise<Exit>(resolve => proc.once('exit', (code, signal) => resolve({ code, signal })))
  const app: App = {
    url: `http://127.0.0.1:${port}`, port, proc, out, err, exited,
    records: () => out.flatMap((line) => { try { return [JSON.parse(line)] } catch { return [] } }),
  }
  if (options.waitUntilHealthy === false) return app
  let gone = false
  void exited.then(() => { gone = true })
  for (let i = 0; i < 600; i++) {
    if (gone) throw new Error(`the server exited before it answered:\n${[...out, ...err].slice(-20).join('\n')}`)
    if (await fetch(`${app.url}/api/health`).then(r => r.ok, () => false)) return app
    await new Promise(r => setTimeout(r, 100))
  }
  proc.kill('SIGKILL')
  throw new Error(`the server did not answer within 60 s:\n${[...out, ...err].slice(-20).join('\n')}`)
}

/** Stops a server that may already be gone. */
export async function stopApp(app: App | undefined, signal: NodeJS.Signals = 'SIGTERM'): Promise<Exit | undefined> {
  if (!app) return undefined
  if (app.proc.exitCode === null && app.proc.signalCode === null) app.proc.kill(signal)
  return await app.exited
}
