// Absolute dates for what is printed or kept ("2 Dec 2026 14:05"), where "5 min ago" would go stale on paper.
export function dateTimeText(iso: string | null | undefined): string {
  if (!iso) return ''
  const at = new Date(iso)
  if (Number.isNaN(at.getTime())) return ''
  const parts = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).formatToParts(at)
  const part = (type: Intl.DateTimeFormatPartTypes) => parts.find(p => p.type === type)?.value ?? ''
  return `${part('day')} ${part('month')} ${part('year')} ${part('hour')}:${part('minute')}`
}
