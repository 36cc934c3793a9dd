import { randomUUID } from 'node:crypto'
import nodemailer from 'nodemailer'
import type { Transporter } from 'nodemailer'

let transport: Transporter | undefined

function useTransport() {
  if (!transport) {
    const config = useRuntimeConfig()
    transport = nodemailer.createTransport({
      host: config.smtpHost,
      port: Number(config.smtpPort),
      secure: false,
      ignoreTLS: true,
      connectionTimeout: 5000,
      greetingTimeout: 5000,
      socketTimeout: 10_000,
    })
  }
  return transport
}

/** Sends one message and records it in sent_mail (the owner's Outbox), delivered or not. */
export async function sendMail(message: { to: string, subject: string, text: string, replyTo?: string, shopId?: string | null }) {
  const config = useRuntimeConfig()
  const { shopId = null, ...mail } = message
  let delivered = false
  try {
    await useTransport().sendMail({ from: config.mailFrom, ...mail })
    delivered = true
  }
  catch (error) {
    // Mail is a courtesy: the caller still answers with the link, so nothing is lost.
    console.error('mail not sent:', (error as Error).message)
  }
  try {
    await useDb().insert(tables.sentMail).values({
      id: randomUUID(), shopId, toAddress: mail.to, subject: mail.subject.slice(0, 300), body: mail.text, delivered,
    })
  }
  catch (error) {
    console.error('mail not logged:', (error as Error).message)
  }
  return delivered
}
