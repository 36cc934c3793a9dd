// The guided procedures, as data: the run screen, the server's checks and the tests all read these.
import { DEFAULT_IDLE_BANDS } from '../bench/dissipation'
import { GATE } from './gate-items'
import { DRAIN_HOLD_MIN_SECONDS, RECHECK_HOLD_SECONDS, TOUCH_SAFE_VOLTS, TOUCH_SAFE_WHY } from './touch-safe'
import type { ProcedureDefinition, ProcedureStep } from './types'

const STAFF_BENCH = ['owner', 'tech'] as const
const FIXED = DEFAULT_IDLE_BANDS.fixed
const percentRecord = { output: 'percent', label: 'Idle dissipation', dimension: '%', factor: 0.01 } as const

const fixedBiasTool = {
  id: 'idle-dissipation',
  presets: { mode: 'fixed', method: 'sense-resistor' },
  variantPresets: { 'transformer-resistance': { method: 'primary-drop' } },
  fresh: ['senseVolts', 'dropVolts'],
  fromReadings: { halfPrimaryOhms: 'primary-resistance' },
  record: percentRecord,
} as const

const overRating = {
  max: FIXED.overAbove / 100,
  reason: 'Above the tube\'s rated plate dissipation. Switch to standby now, then check the bias supply, the bias pot setting and the tube before powering up again.',
}

const loadFirst: ProcedureStep = {
  id: 'connect-load',
  title: 'Connect the load',
  instruction: 'With the amp unplugged, connect a speaker or a dummy load of the impedance the output is set to. Set the impedance selector to match.',
  caution: { level: 'danger', text: 'Never power the output stage without a load: the transformer and tubes can fail, and the flash-over can reach you.' },
  confirm: 'The load is connected and the impedance matches the output selected.',
}

const powerUp = (what: string): ProcedureStep => ({
  id: 'power-up',
  title: 'Power up and settle',
  instruction: `Standby on, power on, let the heaters warm, then standby off with the volume at zero and no signal. ${what}`,
  caution: { level: 'danger', text: 'B+ is live from here on. One hand, the other away from the chassis; do not move the clipped leads.' },
  hold: { seconds: 120, reason: 'Wait 2 minutes for the tubes to settle before reading.' },
  confirm: 'The amp is on, out of standby, with no signal, and has settled.',
})

const powerDown: ProcedureStep = {
  id: 'power-down',
  title: 'Power down',
  instruction: 'Standby on, power off, unplug. The filter capacitors are still charged: drain and verify before you unclip anything inside.',
  caution: { level: 'danger', text: 'Unplugged is not safe: drain and verify the filter capacitors before touching the circuit.' },
  confirm: 'The amp is off and unplugged; the capacitors are drained and verified.',
}

export const PROCEDURES: readonly ProcedureDefinition[] = [
  {
    id: 'set-fixed-bias',
    title: 'Set fixed bias',
    summary: 'Measure each power tube\'s idle current and turn the bias adjustment until it dissipates a safe share of its rating.',
    insideChassis: true,
    roles: STAFF_BENCH,
    gate: [GATE.plugControl, GATE.storedCharge, GATE.oneHand, GATE.ratedMeter, GATE.loadConnected, GATE.noJewellery, GATE.localCodes],
    variants: [
      { id: 'sense-resistor', label: 'Sense resistor', note: 'Millivolts across a small resistor (often 1 Ω) from each cathode to ground.' },
      { id: 'transformer-resistance', label: 'Transformer resistance', note: 'Volts across each half of the output transformer primary, divided by its measured resistance.' },
    ],
    steps: [
      loadFirst,
      {
        id: 'primary-resistance',
        title: 'Measure the half-primary resistance',
        only: 'transformer-resistance',
        repeat: 'tube',
        instruction: 'Unplugged, capacitors drained and verified: measure the resistance from the centre tap (B+) to the plate pin this tube sits on.',
        reading: { label: 'Half-primary resistance', dimension: 'Ω', unit: 'Ω' },
        // Common practice, no source: guitar-amp half primaries read tens to a few hundred ohms.
        expect: { min: 5, max: 1000, reason: 'Most half primaries read between a few ohms and a few hundred. Check the meter range and the pins; an open reading means a broken winding.' },
      },
      {
        id: 'clip-leads',
        title: 'Clip the meter on',
        instruction: 'With the amp off and drained, clip the meter leads where this method reads: across the sense resistor, or from the centre tap to the plate for the transformer method. Set the meter to DC volts.',
        caution: { level: 'caution', text: 'The transformer method puts the meter leads at B+: use leads rated for it and clip them on, never hold them.' },
        confirm: 'The leads are clipped on and the meter is set to DC volts.',
      },
      powerUp('Read the plate voltage to ground as well: the tool needs it.'),
      {
        id: 'measure-initial',
        title: 'Measure the idle current',
        repeat: 'tube',
        instruction: 'Read the meter for this tube and enter it with the plate voltage. The tool works out the idle dissipation.',
        tool: fixedBiasTool,
        expect: overRating,
      },
      {
        id: 'adjust',
        title: 'Adjust the bias',
        instruction: `Turn the bias adjustment in small steps toward ${FIXED.inRangeFrom}–${FIXED.inRangeTo} % of the rating (more negative grid volts = less current). Let it settle after each turn.`,
        caution: { level: 'danger', text: 'Use an insulated adjustment tool; the bias pot can sit next to B+ points.' },
        hold: { seconds: 120, reason: 'Wait 2 minutes after the last turn for the idle current to settle.' },
        confirm: 'I have adjusted the bias and let it settle.',
      },
      {
        id: 'measure-final',
        title: 'Measure again',
        repeat: 'tube',
        instruction: 'Read each tube again after settling and enter it.',
        tool: fixedBiasTool,
        expect: {
          min: FIXED.inRangeFrom / 100,
          max: FIXED.inRangeTo / 100,
          reason: `Outside the in-range band for fixed bias (${FIXED.inRangeFrom}–${FIXED.inRangeTo} % of rating). Adjust and measure again; if it will not come into range, stop and check the bias supply.`,
        },
      },
      powerDown,
    ],
  },
  {
    id: 'check-cathode-bias',
    title: 'Check cathode bias',
    summary: 'Read the volts across the cathode resistor and work out how hard the power tubes idle.',
    insideChassis: true,
    roles: STAFF_BENCH,
    gate: [GATE.plugControl, GATE.storedCharge, GATE.oneHand, GATE.ratedMeter, GATE.loadConnected, GATE.noJewellery, GATE.localCodes],
    steps: [
      loadFirst,
      {
        id: 'clip-leads',
        title: 'Clip the meter on',
        instruction: 'With the amp off and drained, clip the meter across the cathode resistor (cathode pin to ground). Note the resistor\'s value and how many tubes share it.',
        confirm: 'The leads are clipped across the cathode resistor and the meter is set to DC volts.',
      },
      powerUp('Read the plate voltage to ground as well.'),
      {
        id: 'measure',
        title: 'Read the cathode volts',
        instruction: 'Enter the cathode volts, the resistor and the plate voltage. The tool works out the current per tube and the dissipation.',
        tool: { id: 'idle-dissipation', presets: { mode: 'cathode', method: 'cathode-resistor' }, fresh: ['cathodeVolts'], record: percentRecord },
        expect: {
          max: DEFAULT_IDLE_BANDS.cathode.overAbove / 100,
          reason: 'Above the tubes\' rated plate dissipation. Switch to standby; check the cathode resistor value, its bypass capacitor and the tubes before running it again.',
        },
      },
      powerDown,
    ],
  },
  {
    id: 'retube-and-sort',
    title: 'Retube and sort',
    summary: 'Sort the candidate power tubes into matched sets and fit one.',
    insideChassis: true,
    roles: STAFF_BENCH,
    gate: [GATE.plugControl, GATE.storedCharge, GATE.hotParts, GATE.noJewellery, GATE.localCodes],
    steps: [
      {
        id: 'unplug',
        title: 'Unplug and let it cool',
        instruction: 'Power off and unplug. Let the old tubes cool before you pull them; rock them gently straight out.',
        caution: { level: 'caution', text: 'Hot glass burns. The sockets are near the filter capacitor terminals: keep fingers off the chassis underside.' },
        hold: { seconds: 300, reason: 'Wait 5 minutes for the tubes to cool.' },
        confirm: 'The old tubes are out and the amp is unplugged.',
      },
      {
        id: 'sort',
        title: 'Sort the candidates',
        instruction: 'Enter each candidate tube\'s idle current (from a tester or a reference amp) and the set size. The Tube sorter finds matched sets.',
        tool: { id: 'tube-sorter', record: { output: 'sets.length', label: 'Matched sets', dimension: 'count' } },
        expect: { min: 1, reason: 'No matched set within the tolerance. Measure more tubes or agree a wider tolerance with the customer.' },
      },
      {
        id: 'fit',
        title: 'Fit the matched set',
        instruction: 'Fit one matched set, noting which tube went in which socket. Check each tube is fully seated and its retainer in place.',
        confirm: 'The matched set is fitted and noted.',
      },
      {
        id: 'bias-next',
        title: 'Set the bias next',
        instruction: 'New tubes need their bias checked: run Set fixed bias or Check cathode bias before the amp goes back.',
        confirm: 'I will set or check the bias next.',
      },
    ],
  },
  {
    id: 'clean-power-run',
    title: 'Clean power run',
    summary: 'Drive the amp into a dummy load with a sine wave and read the clean output power.',
    insideChassis: true,
    roles: STAFF_BENCH,
    gate: [GATE.plugControl, GATE.loadConnected, GATE.ratedMeter, GATE.hotParts, GATE.noJewellery, GATE.localCodes],
    steps: [
      {
        id: 'connect-load',
        title: 'Connect the dummy load',
        instruction: 'Unplugged: connect a dummy load rated for the amp\'s full power at the output impedance selected, and the scope or AC meter across it.',
        caution: { level: 'danger', text: 'Never run the output stage without a load. A dummy load gets hot at full power.' },
        confirm: 'The dummy load and the scope or meter are connected across the output.',
      },
      {
        id: 'signal',
        title: 'Connect the signal',
        instruction: 'Connect a signal generator to the input: a sine wave at 1 kHz, level at zero, amp volume and tone controls where the shop sets them for this test.',
        confirm: 'The signal generator is connected and turned down.',
      },
      powerUp('Bring the signal up until the wave on the scope just starts to flatten, then back off to where it is clean.'),
      {
        id: 'read-power',
        title: 'Read the clean power',
        instruction: 'Enter the voltage across the load just below clipping (peak-to-peak from the scope, or RMS from the meter).',
        tool: { id: 'clean-power', record: { output: 'wattsA', label: 'Clean output power', dimension: 'W' } },
      },
      {
        id: 'hold-level',
        title: 'Hold the level',
        instruction: 'Keep the signal at this level and watch and listen: red-glowing plates, arcing, a hot smell or a wave that drifts mean stop now.',
        hold: { seconds: 60, reason: 'Run for 1 minute at this level.' },
        confirm: 'It ran for a minute with no glowing plates, arcing or drift.',
      },
      {
        id: 'power-down',
        title: 'Signal off and power down',
        instruction: 'Signal to zero, standby on, power off, unplug. Leave the load connected until the amp is off.',
        confirm: 'The signal is off and the amp is off and unplugged.',
      },
    ],
  },
  {
    id: 'drain-and-verify-caps',
    title: 'Drain and verify filter capacitors',
    summary: 'Bleed the stored charge from every filter capacitor and prove it with a meter before working inside.',
    insideChassis: true,
    roles: STAFF_BENCH,
    gate: [GATE.plugControl, GATE.storedCharge, GATE.oneHand, GATE.ratedMeter, GATE.noJewellery, GATE.localCodes],
    steps: [
      {
        id: 'unplug',
        title: 'Unplug',
        instruction: 'Standby on, power off, unplug, plug in your sight. Do not trust a bleeder resistor to have done the job.',
        confirm: 'The amp is off and unplugged.',
      },
      {
        id: 'drain-time',
        title: 'Work out the drain time',
        instruction: 'Enter the largest filter capacitor, the B+ it charges to, a safe target (a few volts) and your drain resistor. Cap drain works out how long to hold it.',
        tool: { id: 'cap-drain', record: { output: 'drainSeconds', label: 'Drain time', dimension: 's' } },
      },
      {
        id: 'drain',
        title: 'Drain each capacitor',
        instruction: 'Clip the drain resistor (with its insulated leads) from ground to each filter capacitor\'s positive terminal in turn, ground lead first, and hold it for the drain time.',
        caution: { level: 'danger', text: 'Ground lead first, then the capacitor; never short a capacitor with a screwdriver.' },
        hold: {
          seconds: DRAIN_HOLD_MIN_SECONDS,
          reason: `Hold the drain resistor on for the drain time Cap drain worked out, and never less than ${DRAIN_HOLD_MIN_SECONDS} seconds (the minimum is common practice, no source).`,
          fromStep: 'drain-time',
        },
        confirm: 'Every filter capacitor has been drained through the resistor.',
      },
      {
        id: 'verify',
        title: 'Verify each capacitor',
        repeat: 'cap',
        instruction: 'Meter on DC volts: measure from ground to this capacitor\'s positive terminal.',
        caution: { level: 'danger', text: `Touch only at ${TOUCH_SAFE_VOLTS} V or less. ${TOUCH_SAFE_WHY}` },
        reading: { label: 'Residual voltage', dimension: 'V', unit: 'V' },
        expect: { max: TOUCH_SAFE_VOLTS, reason: `Still above ${TOUCH_SAFE_VOLTS} V: do not touch. Drain it again and measure again.` },
      },
      {
        id: 'recheck',
        title: 'Check again after a minute',
        instruction: 'Residual charge can come back as the capacitor relaxes. Measure the highest-voltage capacitor again.',
        hold: {
          seconds: RECHECK_HOLD_SECONDS,
          reason: `Wait ${RECHECK_HOLD_SECONDS / 60} minute for any charge to return (common practice, no source: no rule for servicing tube amps was found).`,
        },
        reading: { label: 'Highest reading', dimension: 'V', unit: 'V' },
        expect: { max: TOUCH_SAFE_VOLTS, reason: `The charge came back above ${TOUCH_SAFE_VOLTS} V: drain again and keep the resistor on longer.` },
      },
    ],
  },
  {
    id: 'backstage-check',
    title: 'Backstage check',
    summary: 'Outside-the-chassis checks a player can do before a show: fuses, speaker load, tubes lit, standby, rattles.',
    insideChassis: false,
    roles: ['owner', 'tech', 'player'],
    gate: [GATE.neverOpen, GATE.unplugFirst, GATE.loadConnected, GATE.hotParts, GATE.localCodes],
    steps: [
      {
        id: 'fuses',
        title: 'Fuses',
        instruction: 'Unplugged: take out the mains fuse (and any fuse on the back panel) and check it is intact and the value and type printed on the amp.',
        caution: { level: 'caution', text: 'A fuse that blows again is telling you something: take the amp to a tech, do not fit a bigger one.' },
        confirm: 'The fuses are intact and the right value.',
      },
      {
        id: 'speaker',
        title: 'Speaker load',
        instruction: 'Connect the speaker cable (a speaker cable, not an instrument cable) and set the impedance selector to the cabinet\'s rating.',
        caution: { level: 'danger', text: 'Never switch on without the speaker connected.' },
        confirm: 'The speaker is connected and the impedance matches.',
      },
      {
        id: 'tubes-lit',
        title: 'Tubes lit',
        instruction: 'Standby on, power on. Look through the back: every tube\'s heater should glow faintly orange. A dark tube, or one glowing bright red on its plates, needs a tech.',
        hold: { seconds: 30, reason: 'Give the heaters 30 seconds to warm before standby off.' },
        confirm: 'Every tube is lit and none is glowing red.',
      },
      {
        id: 'standby',
        title: 'Standby sequence',
        instruction: 'Volume down, standby off. Play quietly and bring the volume up. At the end: standby on, then power off.',
        confirm: 'The amp comes out of standby cleanly.',
      },
      {
        id: 'rattles',
        title: 'Rattles and noise',
        instruction: 'Play low notes at a moderate level and listen for rattles, crackles or squeals. Tap each tube gently with a pencil\'s rubber end (amp on, hand off the chassis) and listen for ringing.',
        confirm: 'No rattles or microphonic tubes, or I have noted them for a tech.',
      },
    ],
  },
]

export function findProcedure(id: string): ProcedureDefinition | undefined {
  return PROCEDURES.find(p => p.id === id)
}
