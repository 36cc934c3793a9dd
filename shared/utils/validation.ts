import type { z } from 'zod'

/** One short, human sentence for the first problem in a zod error ("password: at least 10 characters"). */
export function zodMessage(error: z.ZodError): string {
  const issue = error.issues[0]
  if (!issue) return 'Invalid input'
  const path = issue.path.map(String).join('.')
  return path ? `${path}: ${issue.message}` : issue.message
}
