/**
 * The local stand-in for the mail service: an SMTP server on 127.0.0.1 (smtp-server) that accepts
 * every message, parses it (mailparser) and keeps it as one JSON file in a folder, newest last.
 * `npm start` runs it in the background; the tests start their own. Never for production.
 *
 * Run: tsx scripts/mail-catcher.ts [--port 2525] [--dir .data/mail-catcher]
 */
import { mkdirSync, renameSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { pathToFileURL } from 'node:url'
import { simpleParser } from 'mailparser'
import { SMTPServer } from 'smtp-server'

export interface CaughtMail {
  id: string
  /** the Message-ID header, angle brackets included ('' when the message had none) */
  messageId: string
  receivedAt: string
  from: string
  to: string[]
  subject: string
  text: string
  html: string
}

/** Starts the catcher; resolves once it listens. */
export function startMailCatcher(options: { port: number, dir: string }): Promise<{ close: () => Promise<void> }> {
  mkdirSync(options.dir, { recursive: true })
  let counter = 0
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream).then((mail) => {
        const receivedAt = new Date()
        const id = `${receivedAt.getTime()}-${process.pid}-${counter++}`
        const caught: CaughtMail = {
          id,
          messageId: mail.messageId ?? '',
          receivedAt: receivedAt.toISOString(),
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map(r => r.address),
          subject: mail.subject ?? '',
          text: mail.text ?? '',
          html: typeof mail.html === 'string' ? mail.html : ''
        }
        // Written under a temporary name and renamed: a reader never sees half a message.
        const partial = join(options.dir, `${id}.json.partial`)
        writeFileSync(partial, JSON.stringify(caught, null, 2))
        renameSync(partial, join(options.dir, `${id}.json`))
        callback()
      }, (error: Error) => callback(error))
    }
  })
  return new Promise((resolve, reject) => {
    server.once('error', reject)
    server.listen(options.port, '127.0.0.1', () => resolve({
      close: () => new Promise<void>(done => server.close(() => done()))
    }))
  })
}

function arg(name: string, fallback: string): string {
  const i = process.argv.indexOf(`--${name}`)
  return i > 0 && process.argv[i + 1] ? process.argv[i + 1]! : fallback
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const port = Number(arg('port', process.env.RW_MAIL_PORT ?? '2525'))
  const dir = arg('dir', process.env.RW_MAIL_DIR ?? '.data/mail-catcher')
  startMailCatcher({ port, dir }).then(() => {
    // Lets whoever started it in the background stop it again.
    writeFileSync(join(dir, 'catcher.pid'), String(process.pid))
    console.log(`Mail catcher listening on smtp://127.0.0.1:${port}, keeping messages in ${dir}`)
  }, (error: Error) => {
    console.error(`Mail catcher could not start: ${error.message}`)
    process.exitCode = 1
  })
}
