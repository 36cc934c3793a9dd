import { and, eq, inArray, isNull, or, isNotNull } from 'drizzle-orm'
import { fittedSet, reminderText, retubeStatus, type RetubeThreshold } from '#shared/utils/rigs/index'

/**
 * One pass of the retube reminders: every rig whose fitted set has reached one of its player's
 * thresholds on `today` (YYYY-MM-DD) e-mails the player, once per threshold per fitted set.
 * The row in rig_reminders is claimed first (INSERT IGNORE on its unique key), so two passes
 * running at once, or a pass run again, never send the same reminder twice. `onlyUserId`: one
 * player's rigs only (the trigger route).
 */
export async function sendRetubeReminders(today: string, onlyUserId?: string): Promise<{ checked: number, sent: { rigId: string, setId: string, threshold: RetubeThreshold }[] }> {
  const db = useDb()
  const r = tables.rigs
  const rigs = await db.select({ rig: r, email: tables.users.email, name: tables.users.name }).from(r)
    .innerJoin(tables.shops, and(eq(tables.shops.id, r.shopId), eq(tables.shops.kind, 'personal')))
    .innerJoin(tables.users, eq(tables.users.id, r.createdBy))
    .where(and(isNull(r.deletedAt), isNull(tables.users.deletedAt), or(isNotNull(r.retubeHours), isNotNull(r.retubeMonths)),
      onlyUserId ? eq(r.createdBy, onlyUserId) : undefined))
  if (!rigs.length) return { checked: 0, sent: [] }
  const ids = rigs.map(x => x.rig.id)
  const [sets, gigs] = await Promise.all([
    db.select().from(tables.rigTubeSets).where(and(inArray(tables.rigTubeSets.rigId, ids), isNull(tables.rigTubeSets.deletedAt))),
    db.select().from(tables.rigGigs).where(and(inArray(tables.rigGigs.rigId, ids), isNull(tables.rigGigs.deletedAt))),
  ])
  const sent: { rigId: string, setId: string, threshold: RetubeThreshold }[] = []
  for (const { rig, email, name } of rigs) {
    // Only the rig's own space: a set or gig is in the same space as its rig.
    const set = fittedSet(sets.filter(s => s.rigId === rig.id && s.shopId === rig.shopId))
    if (!set) continue
    const thresholds = { hours: rig.retubeHours, months: rig.retubeMonths }
    const status = retubeStatus({ fittedOn: set.fittedOn, today, gigs: gigs.filter(g => g.rigId === rig.id && g.shopId === rig.shopId), thresholds })
    for (const threshold of status.due) {
      const [claim] = await db.insert(tables.rigReminders).ignore().values({ setId: set.id, threshold, rigId: rig.id, userId: rig.createdBy })
      if (claim.affectedRows !== 1) continue
      await sendMail({
        to: email,
        subject: `Retube reminder: ${rig.description}`.slice(0, 300),
        text: `Hello ${name},\n\n${rig.description}: ${reminderText(threshold, status, thresholds)}\n\n`
          + 'Tube checks and replacement inside the chassis are for qualified people: the amp holds lethal voltages even unplugged. '
          + 'Take it to your tech, and follow local electrical codes and licensed practice.\n\nTubewright',
      })
      sent.push({ rigId: rig.id, setId: set.id, threshold })
    }
  }
  return { checked: rigs.length, sent }
}

/** Today in UTC, as the scheduled task counts days. */
export const utcToday = (d = new Date()) => d.toISOString().slice(0, 10)
