import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { BenchIdlePlot } from '#components'

// What an 11 px tabular digit takes at most: Inter's figures are about 0.6 em wide (recalled from
// the font's metrics, unverified), so 6.7 px per digit leaves a little room.
const DIGIT_PX = 0.6 * 11

async function plotFor(volts: number, amps: number) {
  const w = await mountSuspended(BenchIdlePlot, { props: { maxWatts: 14, fromPercent: 50, toPercent: 70, volts, amps, band: 'over' } })
  const texts = w.findAll('text')
  const title = texts.find(t => t.text() === 'Plate current (mA)')!
  const titleX = Number(title.attributes('transform')!.match(/translate\(([\d.]+)/)![1])
  const yTicks = texts.filter(t => t.attributes('text-anchor') === 'end' && /^\d+$/.test(t.text()))
  return { yTicks, titleX }
}

describe('the operating-point plot', () => {
  it('keeps five-digit current ticks clear of the axis title (40 read as volts: 38 A)', async () => {
    // A unit slip: 40 V across a 1 ohm sense resistor read as 40 000 mA, the case that crowded the axis.
    const { yTicks, titleX } = await plotFor(285, 38)
    const widest = yTicks.reduce((a, t) => (t.text().length > a.text().length ? t : a))
    expect(widest.text().length).toBeGreaterThanOrEqual(5)
    // The title's glyphs reach about half the 12 px font either side of its baseline once rotated.
    const tickLeftEdge = Number(widest.attributes('x')) - widest.text().length * DIGIT_PX
    expect(tickLeftEdge).toBeGreaterThan(titleX + 6)
  })

  it('gives ordinary readings the narrow margin', async () => {
    const narrow = await plotFor(285, 0.035)
    const wide = await plotFor(285, 38)
    expect(Number(narrow.yTicks[0]!.attributes('x'))).toBeLessThan(Number(wide.yTicks[0]!.attributes('x')))
  })
})
