import type { Series } from '#shared/utils/rigs/index'

export interface ChartBox { width: number, height: number, pad: { left: number, right: number, top: number, bottom: number } }
export interface PlottedSeries { position: string, points: { x: number, y: number, on: string, mA: number }[] }

const dayNumber = (on: string) => Date.parse(`${on}T00:00:00Z`) / 86_400_000

/**
 * Readings series placed in a box: time along x (oldest left), mA up y, the mA range padded a
 * little so flat lines do not sit on the frame. One date or one value still plots (centred).
 */
export function plotSeries(series: readonly Series[], box: ChartBox) {
  const all = series.flatMap(s => s.points)
  if (!all.length) return { series: [] as PlottedSeries[], mA: { min: 0, max: 0 }, days: { first: '', last: '' } }
  const days = all.map(p => dayNumber(p.on))
  const first = Math.min(...days)
  const last = Math.max(...days)
  const lo = Math.min(...all.map(p => p.mA))
  const hi = Math.max(...all.map(p => p.mA))
  const margin = Math.max((hi - lo) * 0.1, 1)
  const min = Math.floor(lo - margin)
  const max = Math.ceil(hi + margin)
  const w = box.width - box.pad.left - box.pad.right
  const h = box.height - box.pad.top - box.pad.bottom
  const x = (d: number) => box.pad.left + (last === first ? w / 2 : ((d - first) / (last - first)) * w)
  const y = (mA: number) => box.pad.top + h - ((mA - min) / (max - min)) * h
  const onOf = (d: number) => all[days.indexOf(d)]!.on
  return {
    series: series.map(s => ({ position: s.position, points: s.points.map(p => ({ x: x(dayNumber(p.on)), y: y(p.mA), on: p.on, mA: p.mA })) })),
    mA: { min, max },
    days: { first: onOf(first), last: onOf(last) },
  }
}
