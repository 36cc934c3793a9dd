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

export async function sendMail(message: { to: string, subject: string, text: string }) {
  const config = useRuntimeConfig()
  try {
    await useTransport().sendMail({ from: config.mailFrom, ...message })
    return true
  }
  catch (error) {
    // Mail is a courtesy: the caller still answers with the link, so nothing is lost.
    console.error('mail not sent:', (error as Error).message)
    return false
  }
}
