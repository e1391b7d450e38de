import { request as httpRequest, createServer, type Server } from 'node:http'
import { spawnApp, spawnAppOnFreePort, startStack, type AppProcess, type Stack } from './stack'

export interface Replicas {
  stack: Stack
  /** The round-robin address in front of the replicas (also the stack's APP_URL). */
  url: string
  apps: AppProcess[]
  /** Starts replica `index` again on its own port (after a stop or a kill). */
  restart: (index: number) => Promise<AppProcess>
  stop: () => Promise<void>
}

/** A plain round-robin balancer: each request goes to the next replica that is still running. */
function roundRobin(port: number, apps: () => AppProcess[]): Promise<Server> {
  let next = 0
  const server = createServer((incoming, outgoing) => {
    const alive = apps().filter(app => app.child.exitCode === null && app.child.signalCode === null)
    const target = alive[next++ % Math.max(alive.length, 1)]
    if (!target) {
      outgoing.writeHead(502).end()
      return
    }
    const upstream = httpRequest(`${target.url}${incoming.url}`, { method: incoming.method, headers: incoming.headers }, (answer) => {
      outgoing.writeHead(answer.statusCode ?? 502, answer.headers)
      answer.pipe(outgoing)
    })
    upstream.on('error', () => {
      if (!outgoing.headersSent) outgoing.writeHead(502)
      outgoing.end()
    })
    incoming.pipe(upstream)
  })
  return new Promise(resolveListen => server.listen(port, '127.0.0.1', () => resolveListen(server)))
}

/**
 * `count` built app processes on one SQLite file (WAL), one object store and one mail catcher, behind a
 * round-robin balancer at the stack's address, as a small deployment runs them.
 */
export async function startReplicas(count = 3, extraEnv: Record<string, string> = {}): Promise<Replicas> {
  const stack = await startStack(extraEnv, { startApp: false })
  const ports: number[] = []
  const apps: AppProcess[] = []
  // One at a time: the first one migrates the new database, the others find it ready.
  for (let index = 0; index < count; index += 1) {
    const started = await spawnAppOnFreePort(port => ({ ...stack.env, PORT: String(port) }))
    apps.push(started.app)
    ports.push(started.port)
  }
  const balancer = await roundRobin(Number(new URL(stack.url).port), () => apps)
  return {
    stack,
    url: stack.url,
    apps,
    restart: async (index) => {
      await apps[index]!.stop()
      apps[index] = await spawnApp({ ...stack.env, PORT: String(ports[index]) })
      return apps[index]!
    },
    stop: async () => {
      balancer.closeAllConnections()
      await new Promise(resolveClose => balancer.close(resolveClose))
      await Promise.all(apps.map(app => app.stop()))
      await stack.stop()
    },
  }
}
