import { defineStore } from 'pinia'
import { fittedSet, reminderText, retubeStatus, type RetubeStatus, type RetubeThreshold, type RigReading } from '#shared/utils/rigs/index'
import type { EntityFields } from '#shared/utils/sync/entities'
import type { RigRecord, RigTubeSetRecord } from '#shared/types/records'

export type RigInput = Partial<EntityFields<'rigs'>>
export type SetInput = Partial<EntityFields<'rigTubeSets'>> & { rigId: string }

/** Today on this device, as YYYY-MM-DD in local time (what a player calls "today"). */
export const localToday = (d = new Date()) => `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`

export interface RigReminder { set: RigTubeSetRecord | undefined, status: RetubeStatus | null, due: { threshold: RetubeThreshold, text: string }[] }

/**
 * A player's rigs, their tube sets, gigs and shares: kept in the person's own space on the device
 * and synced by its engine, so all of it works with no signal and without any shop.
 */
export const useRigsStore = defineStore('rigs', () => {
  const rigTable = useEntityTable('rigs', { noun: 'rig', order: (a, b) => a.description.localeCompare(b.description) })
  const setTable = useEntityTable('rigTubeSets', { noun: 'tube set', order: (a, b) => b.fittedOn.localeCompare(a.fittedOn) })
  const gigTable = useEntityTable('rigGigs', { noun: 'gig', order: (a, b) => b.playedOn.localeCompare(a.playedOn) })
  const shareTable = useEntityTable('rigShares', { noun: 'share' })

  const rigs = rigTable.all
  const loaded = computed(() => rigTable.loaded.value && setTable.loaded.value && gigTable.loaded.value && shareTable.loaded.value)
  const byId = rigTable.byId
  const setsOf = (rigId: string) => setTable.all.value.filter(s => s.rigId === rigId)
  const gigsOf = (rigId: string) => gigTable.all.value.filter(g => g.rigId === rigId)
  const sharesOf = (rigId: string) => shareTable.all.value.filter(s => s.rigId === rigId)
  /** Every reading of the rig's sets, oldest first. */
  const readingsOf = (rigId: string): RigReading[] => setsOf(rigId).flatMap(s => s.readings).sort((a, b) => a.on.localeCompare(b.on))

  /** The fitted set against the player's thresholds, worked out on the device. */
  function reminderOf(rig: RigRecord, today = localToday()): RigReminder {
    const set = fittedSet(setsOf(rig.id))
    if (!set) return { set, status: null, due: [] }
    const thresholds = { hours: rig.retubeHours, months: rig.retubeMonths }
    const status = retubeStatus({ fittedOn: set.fittedOn, today, gigs: gigsOf(rig.id), thresholds })
    return { set, status, due: status.due.map(t => ({ threshold: t, text: reminderText(t, status, thresholds) })) }
  }

  const create = (fields: RigInput) => rigTable.create(fields)
  const edit = (id: string, fields: RigInput) => rigTable.edit(id, fields)
  const remove = (id: string) => rigTable.remove(id)

  /** A new set fitted (or carried as a spare); a fitted set retires the one it replaces. */
  async function fitSet(fields: SetInput) {
    const replaced = fields.spare ? undefined : fittedSet(setsOf(fields.rigId))
    const id = await setTable.create(fields)
    if (replaced && fields.fittedOn) await setTable.edit(replaced.id, { retiredOn: fields.fittedOn })
    return id
  }

  /** Readings taken today (or on `on`) added to a set's history. */
  async function addReadings(setId: string, readings: RigReading[]) {
    const set = await setTable.required(setId)
    return setTable.edit(setId, { readings: [...set.readings, ...readings] })
  }

  const retireSet = (setId: string, on = localToday()) => setTable.edit(setId, { retiredOn: on })
  const removeSet = (setId: string) => setTable.remove(setId)
  const logGig = (rigId: string, hours: number, playedOn = localToday(), note = '') => gigTable.create({ rigId, hours, playedOn, note })
  const removeGig = (id: string) => gigTable.remove(id)
  const share = (rigId: string, sharedShopId: string) => shareTable.create({ rigId, sharedShopId })
  const revoke = (shareId: string) => shareTable.remove(shareId)

  return { rigs, loaded, byId, setsOf, gigsOf, sharesOf, readingsOf, reminderOf, create, edit, remove, fitSet, addReadings, retireSet, removeSet, logGig, removeGig, share, revoke }
})
