// A local SMTP server that accepts every message and stores it as a JSON file in `dir`.
import { mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { randomUUID } from 'node:crypto'
import { SMTPServer } from 'smtp-server'

export function startSmtpFake({ port, dir, log = () => {} }) {
  mkdirSync(dir, { recursive: true })
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      const chunks = []
      stream.on('data', c => chunks.push(c))
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8')
        const at = new Date().toISOString()
        const id = `${at.replace(/[:.]/g, '-')}-${randomUUID().slice(0, 8)}`
        const message = {
          id,
          receivedAt: at,
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
          to: session.envelope.rcptTo.map(r => r.address),
          raw,
        }
        writeFileSync(join(dir, `${id}.json`), JSON.stringify(message))
        log(`mail to ${message.to.join(', ')}`)
        callback()
      })
    },
  })
  return new Promise((resolve, reject) => {
    server.once('error', reject)
    server.listen(port, '127.0.0.1', () => resolve(server))
  })
}
