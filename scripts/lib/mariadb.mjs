// Starts and stops a private MariaDB server bound to 127.0.0.1, owned by this project.
import { execFileSync, spawn } from 'node:child_process'
import { existsSync, mkdirSync, readFileSync, rmSync, openSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { setTimeout as sleep } from 'node:timers/promises'
import { createConnection } from 'mysql2/promise'

function which(cmd) {
  try {
    return execFileSync('sh', ['-c', `command -v ${cmd}`], { encoding: 'utf8' }).trim() || null
  }
  catch {
    return null
  }
}

export function ensureMariadbInstalled(log = console.log) {
  if (which('mariadbd') || existsSync('/usr/sbin/mariadbd')) return
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0
  if (!isRoot) {
    throw new Error('MariaDB is not installed. Install it with: sudo apt-get install -y mariadb-server (or run npm start as root to let it do that).')
  }
  log('Installing mariadb-server from Debian packages (one time)...')
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' })
  execFileSync('apt-get', ['install', '-y', '-qq', 'mariadb-server'], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  })
}

const bin = name => which(name) || `/usr/sbin/${name}`

function readPid(dir) {
  const file = join(dir, 'mariadbd.pid')
  if (!existsSync(file)) return null
  const pid = Number(readFileSync(file, 'utf8').trim())
  if (!pid) return null
  try {
    process.kill(pid, 0)
    return pid
  }
  catch {
    return null
  }
}

async function canConnect(opts) {
  try {
    const c = await createConnection({ ...opts, connectTimeout: 1000 })
    await c.end()
    return true
  }
  catch {
    return false
  }
}

/** Make the system tables in an empty data dir; root on the socket has no password. */
export function mariadbInstallDb(dataDir, user = process.getuid?.() === 0 ? 'root' : '', tmpDir = null) {
  mkdirSync(dataDir, { recursive: true })
  user = user ? [`--user=${user}`] : []
  const tmp = tmpDir ? [`--tmpdir=${tmpDir}`] : []
  execFileSync(bin('mariadb-install-db'), [
    `--datadir=${dataDir}`, '--auth-root-authentication-method=normal', '--skip-test-db', ...tmp, ...user,
  ], { stdio: ['ignore', 'ignore', 'inherit'] })
}

/**
 * Make sure a server runs on `port` with data in `dir`. Returns { pid, socket, started }.
 * Root on the socket has no password (a private datadir only reachable by this user).
 */
export async function startMariadb({ dir, port, log = console.log }) {
  dir = resolve(dir)
  ensureMariadbInstalled(log)
  const dataDir = join(dir, 'data')
  const socket = join(dir, 'mariadbd.sock')
  // Its own temp dir: servers of parallel runs sharing /tmp can pick the same temp table names.
  const tmpDir = join(dir, 'tmp')
  mkdirSync(tmpDir, { recursive: true })
  if (!existsSync(join(dataDir, 'mysql'))) {
    log(`Initialising a MariaDB data directory in ${dataDir}`)
    mariadbInstallDb(dataDir, undefined, tmpDir)
  }
  let pid = readPid(dir)
  let started = false
  if (!pid) {
    const out = openSync(join(dir, 'mariadbd.log'), 'a')
    const user = process.getuid?.() === 0 ? ['--user=root'] : []
    const child = spawn(bin('mariadbd'), [
      '--no-defaults', `--datadir=${dataDir}`, `--socket=${socket}`, `--port=${port}`, `--tmpdir=${tmpDir}`,
      '--bind-address=127.0.0.1', `--pid-file=${join(dir, 'mariadbd.pid')}`, ...user,
      '--skip-name-resolve', '--character-set-server=utf8mb4', '--collation-server=utf8mb4_unicode_ci',
      '--innodb-flush-log-at-trx-commit=2', '--max-connections=500', '--log-error=' + join(dir, 'mariadbd.err'),
    ], { detached: true, stdio: ['ignore', out, out] })
    child.unref()
    started = true
  }
  const deadline = Date.now() + 60_000
  while (!(await canConnect({ socketPath: socket, user: 'root' }))) {
    if (Date.now() > deadline) {
      const err = existsSync(join(dir, 'mariadbd.err')) ? readFileSync(join(dir, 'mariadbd.err'), 'utf8').slice(-2000) : ''
      throw new Error(`MariaDB did not answer within 60 s on ${socket}.\n${err}`)
    }
    await sleep(200)
  }
  pid = readPid(dir)
  return { pid, socket, started }
}

/** Create (or update) the database and the application user reachable over TCP on loopback. */
export async function ensureDatabase({ socket, database, user, password }) {
  const c = await createConnection({ socketPath: socket, user: 'root', multipleStatements: true })
  try {
    await c.query(`CREATE DATABASE IF NOT EXISTS \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`)
    await c.query('CREATE USER IF NOT EXISTS ?@\'127.0.0.1\' IDENTIFIED BY ?', [user, password])
    await c.query('ALTER USER ?@\'127.0.0.1\' IDENTIFIED BY ?', [user, password])
    await c.query(`GRANT ALL PRIVILEGES ON \`${database}\`.* TO ?@'127.0.0.1'`, [user])
    await c.query('FLUSH PRIVILEGES')
  }
  finally {
    await c.end()
  }
}

export async function stopMariadb({ dir, log = console.log }) {
  dir = resolve(dir)
  const pid = readPid(dir)
  if (!pid) {
    log('MariaDB is not running (no live pid file).')
    return false
  }
  process.kill(pid, 'SIGTERM')
  const deadline = Date.now() + 30_000
  while (Date.now() < deadline) {
    try {
      process.kill(pid, 0)
    }
    catch {
      log(`Stopped MariaDB (pid ${pid}).`)
      return true
    }
    await sleep(200)
  }
  process.kill(pid, 'SIGKILL')
  return true
}

export function removeDir(dir) {
  rmSync(dir, { recursive: true, force: true })
}
