// The scheduled retube reminders (see nuxt.config.ts scheduledTasks): e-mail each player once per
// threshold per fitted set.
export default defineTask({
  meta: { name: 'rigs:reminders', description: 'E-mail players whose rigs have reached a retube threshold' },
  async run() {
    const result = await sendRetubeReminders(utcToday())
    return { result: { checked: result.checked, sent: result.sent.length } }
  },
})
