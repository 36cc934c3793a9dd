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
  /** What deleting the rig takes with it, in words for the confirmation. */
  function whatGoes(rigId: string) {
    const n = (k: number, one: string, many = `${one}s`) => `${k} ${k === 1 ? one : many}`
    const shares = sharesOf(rigId).length
    return `This deletes the rig, its ${n(setsOf(rigId).length, 'tube set')} with their readings and its ${n(gigsOf(rigId).length, 'gig')}`
      + (shares ? `, and stops sharing it with ${n(shares, 'shop')}.` : '.')
  }

  /** The rig and everything kept with it; the shares go first, so no shop sees it a moment longer. */
  async function remove(id: string) {
    for (const s of sharesOf(id)) await shareTable.remove(s.id)
    for (const g of gigsOf(id)) await gigTable.remove(g.id)
    for (const s of setsOf(id)) await setTable.remove(s.id)
    await rigTable.remove(id)
  }

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

  /** The player adopts a shop's suggestion: its thresholds become theirs (a threshold it leaves out stays as it was). */
  const adopt = (rigId: string, s: { retubeHours: number | null, retubeMonths: number | null }) => rigTable.edit(rigId, {
    ...(s.retubeHours === null ? {} : { retubeHours: s.retubeHours }), ...(s.retubeMonths === null ? {} : { retubeMonths: s.retubeMonths }),
  })

  return { rigs, loaded, byId, setsOf, gigsOf, sharesOf, readingsOf, reminderOf, create, edit, remove, whatGoes, adopt, fitSet, addReadings, retireSet, removeSet, logGig, removeGig, share, revoke }
})
