// npm run db:start / db:stop: the project's own MariaDB in .data/mariadb.
import { readEnvFile } from './lib/env.mjs'
import { startMariadb, stopMariadb } from './lib/mariadb.mjs'

const env = { ...readEnvFile('.env'), ...process.env }
const action = process.argv[2]
if (action === 'stop') {
  await stopMariadb({ dir: '.data/mariadb' })
}
else if (action === 'start') {
  const r = await startMariadb({ dir: '.data/mariadb', port: Number(env.TW_DB_PORT || 3307) })
  console.log(`MariaDB running (pid ${r.pid}).`)
}
else {
  console.error('usage: node scripts/db.mjs start|stop')
  process.exit(2)
}
