import { defineStore } from 'pinia'
import { setSpread } from '#shared/utils/bench/set-spread'
import { nextStockLabel, stockTubeLabel } from '#shared/utils/stock'
import type { EntityFields } from '#shared/utils/sync/entities'
import type { MatchedSetRecord, StockTubeRecord } from '#shared/types/records'
import { validateCreate, type FieldErrors } from '~/utils/jobs/check-in'

export type LotInput = Pick<EntityFields<'tubeLots'>, 'tubeType'> & Partial<EntityFields<'tubeLots'>>
/** One tube's reading at its test point (SI). */
export type ReadingInput = Omit<EntityFields<'stockTubes'>, 'lotId' | 'setId' | 'transconductance'> & { transconductance?: number | null }
export interface TestPoint { plateVolts: number, gridVolts: number, testedOn: string, testedBy: string }
export interface SorterRun {
  lot: LotInput
  testPoint: TestPoint
  /** The sorter's readings (id as typed, amps) and the sets it made of them (by reading id). */
  readings: { id: string, amps: number }[]
  sets: { ids: string[] }[]
  sorterResultId?: string | null
}

const byLabel = (a: { label: string }, b: { label: string }) => a.label.localeCompare(b.label, undefined, { numeric: true })

/** The shop's tube stock on the device: lots, their tubes' readings and matched sets. Owner and tech change it; the desk reads it. */
export const useStockStore = defineStore('stock', () => {
  const lotTable = useEntityTable('tubeLots', { noun: 'lot', order: oldestFirst })
  const tubeTable = useEntityTable('stockTubes', { noun: 'tube', order: byLabel })
  const setTable = useEntityTable('matchedSets', { noun: 'set', order: byLabel })

  const loaded = computed(() => lotTable.loaded.value && tubeTable.loaded.value && setTable.loaded.value)
  const lots = lotTable.all
  const tubes = tubeTable.all
  const sets = setTable.all
  const inStock = computed(() => sets.value.filter(s => s.status === 'in-stock'))
  const tubesOfLot = (lotId: string) => tubes.value.filter(t => t.lotId === lotId)
  const tubesOfSet = (set: Pick<MatchedSetRecord, 'tubeIds'>) => set.tubeIds.map(id => tubeTable.byId(id)).filter((t): t is StockTubeRecord => !!t)
  const fittedTo = (jobId: string) => sets.value.filter(s => s.status === 'fitted' && s.fittedJobId === jobId)
  /** "L3": the lot's place among this shop's lots. */
  const lotCode = (lotId: string) => `L${lots.value.findIndex(l => l.id === lotId) + 1}`
  const lotOfSet = (set: Pick<MatchedSetRecord, 'tubeIds'>) => lotTable.byId(tubesOfSet(set)[0]?.lotId)

  /** Everything checked before anything is queued, so a refused reading leaves no half-saved lot. */
  function check(lot: LotInput, readings: readonly ReadingInput[]) {
    const errors: FieldErrors = {}
    const l = validateCreate('tubeLots', lot)
    if (!l.ok) Object.assign(errors, l.errors)
    readings.forEach((r, i) => {
      const v = validateCreate('stockTubes', { ...r, lotId: crypto.randomUUID() }, `tube${i}.`)
      if (!v.ok) Object.assign(errors, v.errors)
    })
    const labels = readings.map(r => r.label)
    labels.forEach((label, i) => {
      if (labels.indexOf(label) !== i) errors[`tube${i}.label`] ??= `the label ${label} is used twice`
    })
    if (Object.keys(errors).length) throw new EntityInvalidError(errors)
  }

  /** A lot and its tubes' readings; answers the lot's id. */
  async function addLot(lot: LotInput, readings: readonly ReadingInput[], tubeSets: Record<number, string> = {}): Promise<{ lotId: string, tubeIds: string[] }> {
    check(lot, readings)
    const lotId = await lotTable.create(lot)
    const tubeIds: string[] = []
    for (const [i, r] of readings.entries()) tubeIds.push(await tubeTable.create({ ...r, lotId, setId: tubeSets[i] ?? null }))
    return { lotId, tubeIds }
  }

  /**
   * The Tube sorter's result into stock in one go: the lot, every tube read (matched or not) and
   * each pair or quad as a set in stock. Tubes are queued marked for their set, then the set.
   */
  async function saveSorterRun(run: SorterRun): Promise<{ lotId: string, setIds: string[] }> {
    const bad = run.sets.find(s => s.ids.length !== 2 && s.ids.length !== 4)
    if (bad) throw new Error('Stock keeps pairs and quads: sort with set size 2 or 4 to save.')
    const code = `L${lots.value.length + 1}`
    const setIds = run.sets.map(() => crypto.randomUUID())
    const setOfReading = new Map(run.sets.flatMap((s, i) => s.ids.map(id => [id, i] as const)))
    const readings: ReadingInput[] = run.readings.map((r, i) => ({
      label: stockTubeLabel(r.id, code, i), amps: r.amps, transconductance: null, ...run.testPoint,
    }))
    const tubeSets = Object.fromEntries(run.readings.flatMap((r, i) => (setOfReading.has(r.id) ? [[i, setIds[setOfReading.get(r.id)!]!]] : [])))
    const { lotId, tubeIds } = await addLot(run.lot, readings, tubeSets)
    const labels = sets.value.map(s => s.label)
    for (const [i, s] of run.sets.entries()) {
      const label = nextStockLabel('S-', labels)
      labels.push(label)
      const ids = s.ids.map(id => tubeIds[run.readings.findIndex(r => r.id === id)]!)
      await setTable.create({
        tubeType: run.lot.tubeType, label, tubeIds: ids, size: ids.length as 2 | 4,
        spreadFraction: setSpread(s.ids.map(id => run.readings.find(r => r.id === id)!.amps)), sorterResultId: run.sorterResultId ?? null,
      }, setIds[i])
    }
    return { lotId, setIds }
  }

  /** Fit a set in stock to a job: one change; the server adds the job's part with it. */
  async function fit(setId: string, jobId: string, priceCents: number | null = null) {
    const set = await setTable.required(setId)
    if (set.status === 'fitted') throw new Error(`Set ${set.label} is already fitted to a job.`)
    await setTable.edit(setId, { status: 'fitted', fittedJobId: jobId, fittedAt: new Date().toISOString(), priceCents })
  }

  const invoices = useShopTable('invoices').list

  /** Why a fitted set cannot go back to stock now ('' when it can); the server checks the same. */
  function whyNotReturn(set: MatchedSetRecord, job: { status: string } | undefined): string {
    if (set.status !== 'fitted') return `Set ${set.label} is in stock.`
    if (job?.status === 'closed') return `Set ${set.label} cannot go back to stock: its job is closed, and its parts are the service record.`
    const paid = invoices.value.find(i => i.jobId === set.fittedJobId && i.state === 'paid')
    return paid ? `Set ${set.label} cannot go back to stock: the job's invoice ${paid.number} is paid with it.` : ''
  }

  /** A fitted set back in stock: one change; the server takes the job's part for it off the job. */
  async function returnToStock(setId: string, job?: { status: string }) {
    const set = await setTable.required(setId)
    const why = whyNotReturn(set, job)
    if (why) throw new Error(why)
    await setTable.edit(setId, { status: 'in-stock', fittedJobId: null, fittedAt: '', priceCents: null })
  }

  /** A set in stock goes (its tubes stay in their lot, matched to nothing); a fitted set is on a job's record. */
  async function removeSet(setId: string) {
    const set = await setTable.required(setId)
    if (set.status === 'fitted') throw new Error(`Set ${set.label} is fitted to a job, so it cannot be deleted: return it to stock first.`)
    await setTable.remove(setId)
  }

  /** The sets made of a lot's tubes. */
  const setsOfLot = (lotId: string) => sets.value.filter(s => tubesOfSet(s).some(t => t.lotId === lotId))

  /** A lot, its tubes' readings and the sets in stock made of them; refused while one of those sets is fitted. */
  async function removeLot(lotId: string) {
    const fittedSet = setsOfLot(lotId).find(s => s.status === 'fitted')
    if (fittedSet) throw new Error(`This lot's tubes are in set ${fittedSet.label}, which is fitted to a job: return the set to stock first, or keep the lot.`)
    for (const s of setsOfLot(lotId)) await setTable.remove(s.id)
    for (const t of tubesOfLot(lotId)) await tubeTable.remove(t.id)
    await lotTable.remove(lotId)
  }

  return {
    loaded, lots, tubes, sets, inStock, tubesOfLot, tubesOfSet, setsOfLot, fittedTo, lotCode, lotOfSet,
    lot: lotTable.byId, tube: tubeTable.byId, set: setTable.byId,
    addLot, saveSorterRun, fit, whyNotReturn, returnToStock, removeLot, removeSet,
  }
})
