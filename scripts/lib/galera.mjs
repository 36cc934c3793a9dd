// A private MariaDB Galera cluster on loopback for the cluster soak: one data dir and four ports
// per node (SQL, group communication, IST, SST), SST by rsync, the first node bootstrapping.
import { execFileSync, spawn } from 'node:child_process'
import { chmodSync, existsSync, mkdirSync, openSync, readFileSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { setTimeout as sleep } from 'node:timers/promises'
import { createConnection } from 'mysql2/promise'
import { ensureMariadbInstalled, mariadbInstallDb } from './mariadb.mjs'

export const GALERA_PROVIDER = '/usr/lib/galera/libgalera_smm.so'

/** Galera, rsync (its SST) and the server's SST script, from Debian's packages when run as root. */
function ensureGaleraInstalled(log = console.log) {
  const missing = []
  if (!existsSync(GALERA_PROVIDER)) missing.push('galera-4')
  if (!existsSync('/usr/bin/rsync')) missing.push('rsync')
  if (!existsSync('/usr/bin/wsrep_sst_rsync')) missing.push('mariadb-server')
  if (!missing.length) return
  if (process.getuid?.() !== 0) throw new Error(`The cluster soak needs Debian packages: sudo apt-get install -y ${missing.join(' ')}`)
  log(`Installing ${missing.join(', ')} from Debian packages (one time)...`)
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' })
  execFileSync('apt-get', ['install', '-y', '-qq', ...missing], { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } })
}

async function query(socket, sql) {
  const c = await createConnection({ socketPath: socket, user: 'root', connectTimeout: 1000 })
  try {
    const [rows] = await c.query(sql)
    return rows
  }
  finally {
    await c.end()
  }
}

/** wsrep status values of one node, or null while it does not answer. */
export async function wsrepStatus(node) {
  try {
    const rows = await query(node.socket, 'SHOW GLOBAL STATUS LIKE \'wsrep_%\'')
    return Object.fromEntries(rows.map(r => [r.Variable_name, r.Value]))
  }
  catch {
    return null
  }
}

function tailOf(file) {
  return existsSync(file) ? readFileSync(file, 'utf8').slice(-3000) : ''
}

/**
 * Describe `count` nodes under `dir` on the given free ports (4 per node). Nothing starts yet.
 * `ports` is an array of 4 * count distinct free loopback ports.
 */
export function galeraNodes({ dir, count = 3, ports, clusterName = 'tubewright-soak' }) {
  dir = resolve(dir)
  // As root the nodes run as the Debian `mysql` user: the joiner's rsync daemon, started by the
  // server, would otherwise drop to `nobody` and could not write the data dir.
  const asRoot = process.getuid?.() === 0
  if (asRoot) {
    mkdirSync(dir, { recursive: true })
    chmodSync(dir, 0o755)
  }
  const nodes = Array.from({ length: count }, (_, i) => {
    const [port, gcomm, ist, sst] = ports.slice(i * 4, i * 4 + 4)
    const home = join(dir, `node${i + 1}`)
    return { name: `node${i + 1}`, home, dataDir: join(home, 'data'), socket: join(home, 'mariadbd.sock'), port, gcomm, ist, sst, child: null }
  })
  const address = `gcomm://${nodes.map(n => `127.0.0.1:${n.gcomm}`).join(',')}`
  for (const n of nodes) {
    n.args = [
      '--no-defaults', `--datadir=${n.dataDir}`, `--socket=${n.socket}`, `--port=${n.port}`,
      '--bind-address=127.0.0.1', `--pid-file=${join(n.home, 'mariadbd.pid')}`, `--log-error=${join(n.home, 'mariadbd.err')}`,
      ...(asRoot ? ['--user=mysql'] : []),
      '--skip-name-resolve', '--character-set-server=utf8mb4', '--collation-server=utf8mb4_unicode_ci',
      '--innodb-flush-log-at-trx-commit=2', '--max-connections=500', '--innodb-buffer-pool-size=64M',
      // What Galera requires of every node.
      '--binlog-format=ROW', '--innodb-autoinc-lock-mode=2', '--default-storage-engine=InnoDB',
      '--wsrep-on=ON', `--wsrep-provider=${GALERA_PROVIDER}`, `--wsrep-cluster-name=${clusterName}`,
      `--wsrep-cluster-address=${address}`, `--wsrep-node-name=${n.name}`, `--wsrep-node-address=127.0.0.1:${n.gcomm}`,
      `--wsrep-provider-options=gmcast.listen_addr=tcp://127.0.0.1:${n.gcomm};ist.recv_addr=127.0.0.1:${n.ist};gcache.size=64M`,
      '--wsrep-sst-method=rsync', `--wsrep-sst-receive-address=127.0.0.1:${n.sst}`,
      // A read waits until this node has applied what the cluster committed before it, so a pull
      // on one node sees a push acknowledged by another.
      '--wsrep-sync-wait=1',
      '--wsrep-slave-threads=2',
      // A single autocommit statement that loses certification is run again by the server itself.
      '--wsrep-retry-autocommit=3',
    ]
  }
  return nodes
}

/** Start one node (the first with --wsrep-new-cluster) and wait until it is Synced. */
export async function startGaleraNode(node, { bootstrap = false, timeoutMs = 120_000 } = {}) {
  ensureMariadbInstalled(() => {})
  ensureGaleraInstalled()
  mkdirSync(node.dataDir, { recursive: true })
  if (process.getuid?.() === 0) execFileSync('chown', ['-R', 'mysql:mysql', node.home])
  const out = openSync(join(node.home, 'mariadbd.log'), 'a')
  const args = bootstrap ? [...node.args, '--wsrep-new-cluster'] : node.args
  const child = spawn(existsSync('/usr/sbin/mariadbd') ? '/usr/sbin/mariadbd' : 'mariadbd', args, { stdio: ['ignore', out, out] })
  node.child = child
  node.exited = new Promise(r => child.once('exit', r))
  const deadline = Date.now() + timeoutMs
  for (;;) {
    if (child.exitCode !== null) throw new Error(`${node.name} exited with code ${child.exitCode}.\n${tailOf(join(node.home, 'mariadbd.err'))}`)
    const s = await wsrepStatus(node)
    if (s?.wsrep_local_state_comment === 'Synced' && s.wsrep_ready === 'ON') return s
    if (Date.now() > deadline) throw new Error(`${node.name} was not Synced within ${timeoutMs / 1000} s.\n${tailOf(join(node.home, 'mariadbd.err'))}`)
    await sleep(300)
  }
}

/** Stop one node cleanly (SIGTERM; SIGKILL after 60 s). */
export async function stopGaleraNode(node) {
  const child = node.child
  if (!child || child.exitCode !== null || child.signalCode !== null) return
  child.kill('SIGTERM')
  const done = await Promise.race([node.exited.then(() => true), sleep(60_000).then(() => false)])
  if (!done) {
    child.kill('SIGKILL')
    await node.exited
  }
  node.child = null
}

/** Bootstrap node 1, then join the others one at a time (each takes a full SST from a donor). */
export async function startGaleraCluster(nodes, log = console.log) {
  mariadbInstallDb(nodes[0].dataDir, process.getuid?.() === 0 ? 'mysql' : '')
  await startGaleraNode(nodes[0], { bootstrap: true })
  log(`${nodes[0].name} bootstrapped the cluster on 127.0.0.1:${nodes[0].port}`)
  for (const n of nodes.slice(1)) {
    await startGaleraNode(n)
    log(`${n.name} joined on 127.0.0.1:${n.port}`)
  }
  const s = await wsrepStatus(nodes[0])
  if (Number(s?.wsrep_cluster_size) !== nodes.length) throw new Error(`cluster size is ${s?.wsrep_cluster_size}, expected ${nodes.length}`)
}

export async function stopGaleraCluster(nodes) {
  for (const n of [...nodes].reverse()) await stopGaleraNode(n)
}
