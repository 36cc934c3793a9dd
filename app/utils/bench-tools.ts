// The one registry of bench tools: what each says on the Bench, its screen, and how a procedure
// step hosts the same screen inline.
import type { Component, InjectionKey, Ref } from 'vue'
import type { BenchToolId } from '#shared/utils/bench/index'

export interface BenchCautionText {
  level: 'caution' | 'danger'
  title: string
  items: string[]
}

export interface BenchToolMeta {
  id: BenchToolId
  title: string
  /** One line for the Bench list. */
  summary: string
  /** What you are about to do, at the top of the tool. */
  lead: string
  caution?: BenchCautionText
  /** "How this is worked out", one line per step, plain text. */
  formula: string[]
  next: { text: string, to?: string }[]
  /** The tool's screen, loaded when first shown (the same on the Bench and inside a step). */
  screen: () => Promise<Component>
}

const LIVE_AMP: BenchCautionText = {
  level: 'caution',
  title: 'Caution: lethal voltage',
  items: [
    'This reading is taken on a live amp. B+ of 300 to 500 V DC can kill, and the filter capacitors hold it after the amp is unplugged.',
    'Clip the meter leads on with the amp off and the capacitors drained, then switch on. Keep one hand out of the chassis.',
    'Use a meter and leads rated for at least the B+ voltage.',
  ],
}

export const BENCH_TOOLS: readonly BenchToolMeta[] = [
  {
    id: 'idle-dissipation',
    screen: () => import('~/components/bench/BenchIdleDissipation.vue').then(m => m.default),
    title: 'Idle dissipation',
    summary: 'How hot each power tube idles, from the reading you took.',
    lead: 'Turn an idle-current reading into plate dissipation per tube, and see where it sits against the tube\'s rating.',
    caution: LIVE_AMP,
    formula: [
      'Sense resistor: cathode current I = V ÷ R; plate current = I × (1 − screen share).',
      'Cathode resistor: I per tube = Vk ÷ Rk ÷ tubes sharing it; plate current = I × (1 − screen share).',
      'Half primary: plate current = drop ÷ cold resistance of that half.',
      'Plate-to-cathode voltage = plate voltage to ground − cathode voltage.',
      'Dissipation P = V × I; percent = P ÷ the tube\'s maximum plate dissipation × 100.',
      'Bands, fixed bias: cold below 50 %, in range 50–70 %, warm 70–100 %, over above 100 %.',
      'Bands, cathode bias: cold below 70 %, in range 70–95 %, warm 95–100 %, over above 100 %.',
      'The band limits are common practice, not a maker\'s rating.',
    ],
    next: [
      { text: 'In range: note the reading, let the amp settle for a few minutes and read again.' },
      { text: 'Cold or warm, fixed bias: turn the bias pot and read again. Check the adjustment range first.', to: '/bench/bias-supply' },
      { text: 'Cold or warm, cathode bias: change the cathode resistor.', to: '/bench/cathode-resistor' },
      { text: 'Over: switch off now and find out why before running the amp again.' },
    ],
  },
  {
    id: 'cathode-resistor',
    screen: () => import('~/components/bench/BenchCathodeResistor.vue').then(m => m.default),
    title: 'Cathode resistor',
    summary: 'Size a cathode resistor, its wattage and its bypass cap.',
    lead: 'Work out the cathode resistor for a target current or a target share of the tube\'s rating, with its power rating and bypass capacitor.',
    caution: LIVE_AMP,
    formula: [
      'From a target percent: plate current = max dissipation × percent ÷ (plate voltage − cathode voltage).',
      'Cathode current = plate current ÷ (1 − screen share).',
      'R = Vk ÷ (tubes sharing × cathode current per tube).',
      'Power in the resistor P = Vk² ÷ R; choose a rating of at least twice that (common practice).',
      'Bypass capacitor C = 1 ÷ (2π × R × f). The cathode\'s own impedance in parallel puts the real corner a little higher.',
    ],
    next: [
      { text: 'Fit the nearest preferred value, then check the idle dissipation with the amp running.', to: '/bench/idle-dissipation' },
      { text: 'Use a capacitor rated well above the cathode voltage.' },
    ],
  },
  {
    id: 'bias-supply',
    screen: () => import('~/components/bench/BenchBiasSupply.vue').then(m => m.default),
    title: 'Bias supply',
    summary: 'The adjustment range of a fixed-bias supply.',
    lead: 'Find the range of grid voltage a half-wave bias supply and its divider can give, and whether your target sits inside it.',
    caution: {
      level: 'caution',
      title: 'Caution: live supply',
      items: [
        'The transformer tap and the bias supply are live whenever the amp is on.',
        'Without bias voltage the power tubes run away: check the supply before fitting tubes.',
      ],
    },
    formula: [
      'DC = −(tap Vrms × √2 − diode drop): the unloaded half-wave peak. A loaded supply sits a little less negative.',
      'Divider from the negative rail: top resistor, pot, bottom resistor to ground.',
      'Least negative (wiper at the ground end) = DC × bottom ÷ total.',
      'Most negative = DC × (bottom + pot) ÷ total.',
      'Margin: the distance from the target to the nearer end of the range.',
    ],
    next: [
      { text: 'No margin: change the top or bottom resistor and try again before fitting parts.' },
      { text: 'Set the bias and check each tube.', to: '/bench/idle-dissipation' },
    ],
  },
  {
    id: 'clean-power',
    screen: () => import('~/components/bench/BenchCleanPower.vue').then(m => m.default),
    title: 'Clean power',
    summary: 'Output watts from a scope or meter reading on a dummy load.',
    lead: 'Turn the voltage across a dummy load into clean output watts, and compare two readings.',
    caution: {
      level: 'caution',
      title: 'Caution: load first',
      items: [
        'Never run the output stage without a load: connect a dummy load of the right impedance before switching on.',
        'Lethal voltage is inside the chassis. Measure across the dummy load only.',
        'The dummy load gets hot at full power.',
      ],
    },
    formula: [
      'Vrms = Vpp ÷ (2√2) for a sine wave.',
      'Power P = Vrms² ÷ load resistance.',
      'Difference in dB = 10 × log10(P B ÷ P A).',
    ],
    next: [
      { text: 'Read at the onset of clipping on the scope, at a steady test frequency.' },
      { text: 'Save both readings to compare after a retube or a bias change.' },
    ],
  },
  {
    id: 'cap-drain',
    screen: () => import('~/components/bench/BenchCapDrain.vue').then(m => m.default),
    title: 'Cap drain',
    summary: 'How long filter caps take to drain, and what they store.',
    lead: 'Estimate how long the filter capacitors take to drain through a resistor, and how much energy they hold.',
    caution: {
      level: 'danger',
      title: 'Danger: stored charge',
      items: [
        'Never trust a bleeder resistor: it can be open or missing.',
        'Drain every filter capacitor, then verify each one with a meter before you touch anything.',
        'Residual voltage can return after draining. Measure again before you work, and again after a pause.',
      ],
    },
    formula: [
      'Time constant τ = R × C.',
      'Time to drain from V0 to V: t = τ × ln(V0 ÷ V).',
      'Voltage after a time t: V = V0 × e^(−t ÷ τ).',
      'Stored energy E = ½ × C × V0².',
    ],
    next: [
      { text: 'Verify with a meter, every capacitor, before touching. The time here is an estimate.' },
      { text: 'Leave the drain resistor clipped across while you work, if you can.' },
    ],
  },
  {
    id: 'load-reflection',
    screen: () => import('~/components/bench/BenchLoadReflection.vue').then(m => m.default),
    title: 'Load reflection',
    summary: 'What a speaker on a tap looks like to the output tubes.',
    lead: 'Find the transformer\'s turns ratio and the primary impedance a speaker on a given tap reflects.',
    formula: [
      'Turns ratio n = √(primary impedance ÷ secondary impedance).',
      'Reflected impedance = speaker impedance × n².',
      'A mismatch is flagged when the reflected load is more than twice or less than half the nominal primary (common practice).',
    ],
    next: [
      { text: 'Mismatch: move the speaker to the matching tap, or change the speaker.' },
      { text: 'Never run the output stage without a load.' },
    ],
  },
  {
    id: 'rc-corner',
    screen: () => import('~/components/bench/BenchRcCorner.vue').then(m => m.default),
    title: 'RC corner',
    summary: 'Corner frequency of a resistor and capacitor, either way round.',
    lead: 'Find the −3 dB corner of an RC pair, or the capacitor for the corner you want.',
    formula: ['f = 1 ÷ (2π × R × C).', 'C = 1 ÷ (2π × R × f).'],
    next: [{ text: 'Pick the nearest preferred capacitor and check the corner again.' }],
  },
  {
    id: 'tube-sorter',
    screen: () => import('~/components/bench/BenchTubeSorter.vue').then(m => m.default),
    title: 'Tube sorter',
    summary: 'Sort tube readings into matched pairs or quads, and print labels.',
    lead: 'Type one reading per tube and get matched sets within your tolerance, plus labels to print.',
    formula: [
      'Readings are put in order; a set is matched when its highest reading is at most (1 + tolerance) × its lowest.',
      'The sorter makes as many sets as it can and, among those, the tightest ones.',
    ],
    next: [
      { text: 'Print the labels and mark each tube before it leaves the bench.' },
      { text: 'Fit a matched set and check the idle dissipation of each tube.', to: '/bench/idle-dissipation' },
    ],
  },
]

/** The tool with this id (as in its URL), if there is one. */
export const findBenchTool = (id: string): BenchToolMeta | undefined => BENCH_TOOLS.find(t => t.id === id)

export function benchTool(id: BenchToolId): BenchToolMeta {
  const meta = findBenchTool(id)
  if (!meta) throw new Error(`no bench tool ${id}`)
  return meta
}

/** A bench tool shown inside a procedure step: preset choices in, the live result out. */
export interface InlineToolContext {
  tool: BenchToolId
  /** Form values to set when the step opens (choices, values from earlier steps, cleared readings). */
  presets: Record<string, string>
  result: Ref<{ inputs: unknown, outputs: unknown } | null>
}

export const INLINE_TOOL: InjectionKey<InlineToolContext> = Symbol('inline-tool')
