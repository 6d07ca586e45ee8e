/**
 * npm start's supervisor: runs the web server and the check workers as child processes and
 * starts again any that dies, after a back-off that doubles on each quick death (1 s, 2 s,
 * 4 s … at most 30 s) and starts from 1 s again once a process has stayed up for a minute.
 * Every start and death is logged with the exit code or signal. SIGINT / SIGTERM (Ctrl-C)
 * stop everything: each child gets SIGTERM, and SIGKILL if it is still there after 15 s.
 *
 *   node --import tsx scripts/supervise.ts [--web <nitro output dir>] [--workers N]
 *
 * The web server listens on HOST/PORT from the environment; workers read the NUXT_* and
 * SCHOLIUM_* variables they always read (server/jobs/worker-settings.ts).
 */
import { spawn, type ChildProcess } from 'node:child_process'
import { join } from 'node:path'

interface Service { name: string, command: string, args: string[] }

const FIRST_DELAY_MS = Number(process.env.SCHOLIUM_RESTART_DELAY_MS ?? 1000)
const MAX_DELAY_MS = 30_000
const STABLE_AFTER_MS = 60_000
const KILL_AFTER_MS = 15_000

function option(name: string): string | undefined {
  const at = process.argv.indexOf(name)
  return at === -1 ? undefined : process.argv[at + 1]
}

const services: Service[] = []
const web = option('--web')
if (web) services.push({ name: 'web', command: process.execPath, args: [join(web, 'server/index.mjs')] })
const workers = Number(option('--workers') ?? 1)
if (!Number.isInteger(workers) || workers < 0) throw new Error('--workers needs a whole number')
for (let i = 1; i <= workers; i++) services.push({ name: `worker-${i}`, command: process.execPath, args: ['--import', 'tsx', 'scripts/worker.ts'] })
if (services.length === 0) throw new Error('nothing to supervise: give --web and/or --workers')

const log = (message: string) => console.log(`[supervise ${new Date().toISOString().slice(11, 19)}] ${message}`)

let stopping = false
const running = new Map<string, ChildProcess>()
const pendingRestarts = new Set<ReturnType<typeof setTimeout>>()

function supervise(service: Service): void {
  let delay = FIRST_DELAY_MS
  const start = () => {
    if (stopping) return
    const startedAt = Date.now()
    const child = spawn(service.command, service.args, { stdio: 'inherit', env: process.env })
    running.set(service.name, child)
    log(`${service.name} started (pid ${child.pid})`)
    child.once('exit', (code, signal) => {
      running.delete(service.name)
      if (stopping) return
      const upMs = Date.now() - startedAt
      if (upMs >= STABLE_AFTER_MS) delay = FIRST_DELAY_MS
      log(`${service.name} (pid ${child.pid}) died with ${signal ?? `exit code ${code}`} after ${(upMs / 1000).toFixed(1)} s; restarting in ${(delay / 1000).toFixed(1)} s`)
      const timer = setTimeout(() => {
        pendingRestarts.delete(timer)
        start()
      }, delay)
      pendingRestarts.add(timer)
      delay = Math.min(delay * 2, MAX_DELAY_MS)
    })
  }
  start()
}

async function stop(signal: string): Promise<void> {
  if (stopping) return
  stopping = true
  log(`${signal}: stopping ${[...running.keys()].join(', ') || 'nothing'}`)
  for (const timer of pendingRestarts) clearTimeout(timer)
  const exits = [...running.values()].map(child => new Promise<void>((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve()
    child.once('exit', () => resolve())
    child.kill('SIGTERM')
    setTimeout(() => child.kill('SIGKILL'), KILL_AFTER_MS).unref()
  }))
  await Promise.all(exits)
  log('stopped')
  process.exit(0)
}
process.on('SIGINT', () => void stop('SIGINT'))
process.on('SIGTERM', () => void stop('SIGTERM'))

for (const service of services) supervise(service)
