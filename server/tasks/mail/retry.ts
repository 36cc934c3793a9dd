// Mail the mail server refused waits in sent_mail; this sends what is due (see nuxt.config.ts scheduledTasks).
export default defineTask({
  meta: { name: 'mail:retry', description: 'Send queued e-mail the mail server refused earlier' },
  async run() {
    return { result: await retryDueMail() }
  },
})
