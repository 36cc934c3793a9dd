// The invented demo shop. Fixed ids keep the seed idempotent.
import type { Role } from '../../shared/utils/roles'

export const DEMO_SHOP = { id: '6f1c2a10-0000-4000-8000-000000000001', name: 'Larkspur Amp Works' }

export const DEMO_USERS: { id: string, email: string, name: string, role: Role }[] = [
  { id: '6f1c2a10-0000-4000-8000-000000000101', email: 'owner@larkspur.example', name: 'Mira Castell', role: 'owner' },
  { id: '6f1c2a10-0000-4000-8000-000000000102', email: 'tech@larkspur.example', name: 'Owen Pryde', role: 'tech' },
  { id: '6f1c2a10-0000-4000-8000-000000000103', email: 'desk@larkspur.example', name: 'Jo Ames', role: 'desk' },
  { id: '6f1c2a10-0000-4000-8000-000000000201', email: 'dana@players.example', name: 'Dana Whitlow', role: 'player' },
  { id: '6f1c2a10-0000-4000-8000-000000000202', email: 'sam@players.example', name: 'Sam Okafor', role: 'player' },
]

// A week of the demo shop's jobs, one in every state. Invented people, generic amps.
const idOf = (group: string, n: number) => `6f1c2a10-0000-4000-8${group}-${String(n).padStart(12, '0')}`
const [, TECH, DESK] = DEMO_USERS.map(u => u.id)
export const DEMO_SEED_CLIENT = 'seed'
export const DEMO_SETTINGS = {
  address: 'Unit 3, 18 Kiln Row', phone: '555-0100', email: 'desk@larkspur.example',
  labourRateCents: 9000, taxRateBasisPoints: 825, currency: 'usd', readyEmail: true, invoiceEmail: true, paymentEmail: true,
}

export const DEMO_CUSTOMERS = [
  { id: idOf('001', 1), name: 'Dana Whitlow', email: 'dana@players.example', phone: '555-0141', notes: '', playerUserId: DEMO_USERS[3]!.id },
  { id: idOf('001', 2), name: 'Sam Okafor', email: 'sam@players.example', phone: '555-0142', notes: 'Prefers a text when ready.', playerUserId: DEMO_USERS[4]!.id },
  { id: idOf('001', 3), name: 'Priya Venn', email: 'priya.venn@customers.example', phone: '', notes: '', playerUserId: null },
  { id: idOf('001', 4), name: 'Marcus Hale', email: 'marcus.hale@customers.example', phone: '555-0144', notes: '', playerUserId: null },
  { id: idOf('001', 5), name: 'Lena Ostrow', email: '', phone: '555-0145', notes: 'No e-mail; call.', playerUserId: null },
  { id: idOf('001', 6), name: 'Ike Brannigan', email: 'ike.b@customers.example', phone: '', notes: '', playerUserId: null },
]
const C = DEMO_CUSTOMERS.map(c => c.id)

type BiasMode = 'fixed' | 'cathode'
const amp = (n: number, customerId: string, description: string, serial: string, tubeComplement: string, powerTubeCount: number, biasMode: BiasMode, rectifier = 'solid state') =>
  ({ id: idOf('002', n), customerId, description, serial, tubeComplement, powerTubeCount, biasMode, rectifier, notes: '' })

// Dana's combo at the shop is her rig, shared with the shop (see DEMO_RIGS).
export const DANA_COMBO_RIG = idOf('010', 1)
export const DEMO_AMPS = [
  { ...amp(1, C[0]!, '18 W two-EL84 combo, cathode biased', 'LAW-0412', '3 x 12AX7, 2 x EL84, EZ81', 2, 'cathode', 'EZ81'), rigId: DANA_COMBO_RIG as string | null },
  amp(2, C[1]!, 'two-6V6 combo, fixed bias', 'LAW-0419', '2 x 12AX7, 1 x 12AT7, 2 x 6V6GT', 2, 'fixed'),
  amp(3, C[1]!, '100 W four-6L6 head', 'LAW-0427', '4 x 12AX7, 4 x 6L6GC', 4, 'fixed'),
  amp(4, C[2]!, '50 W two-EL34 head, fixed bias', 'LAW-0431', '3 x 12AX7, 2 x EL34', 2, 'fixed'),
  amp(5, C[3]!, '5 W single-ended 6V6 combo, cathode biased', 'LAW-0436', '1 x 12AX7, 1 x 6V6GT, 5Y3', 1, 'cathode', '5Y3'),
  amp(6, C[4]!, 'two-6L6 combo, fixed bias, tube rectifier', 'LAW-0398', '4 x 12AX7, 2 x 6L6GC, 5AR4', 2, 'fixed', '5AR4'),
  amp(7, C[5]!, 'bass head, four 6550, fixed bias', 'LAW-0377', '3 x 12AX7, 1 x 12AU7, 4 x 6550', 4, 'fixed'),
  amp(8, C[2]!, '30 W four-EL84 combo, cathode biased', 'LAW-0440', '3 x 12AX7, 4 x EL84', 4, 'cathode'),
]
const A = DEMO_AMPS.map(a => a.id)

type State = 'checked-in' | 'on-bench' | 'waiting-parts' | 'soak' | 'ready' | 'handed-back' | 'closed' | 'cancelled'
export interface DemoJob {
  id: string, customerId: string, ampId: string, complaint: string, accessories: string, promisedFor: number | null,
  assignedTo: string | null, priority: 'low' | 'normal' | 'rush', daysAgo: number, path: State[]
}
const job = (n: number, customerId: string, ampId: string, complaint: string, daysAgo: number, path: State[], extra: Partial<DemoJob> = {}): DemoJob =>
  ({ id: idOf('003', n), customerId, ampId, complaint, accessories: '', promisedFor: null, assignedTo: TECH!, priority: 'normal', daysAgo, path, ...extra })

export const DEMO_JOBS: DemoJob[] = [
  job(1, C[0]!, A[0]!, 'Crackles and cuts out when warm; rectifier glows unevenly.', 6, ['checked-in', 'on-bench', 'soak', 'ready'], { accessories: 'Footswitch, cover', promisedFor: 0 }),
  job(2, C[1]!, A[1]!, 'Hum at idle, one power tube glows red.', 3, ['checked-in', 'on-bench'], { priority: 'rush', promisedFor: 2 }),
  job(3, C[1]!, A[2]!, 'Retube and bias before a tour; spare quad in the case.', 1, ['checked-in'], { assignedTo: null, accessories: 'Spare matched quad 6L6GC', promisedFor: 5 }),
  job(4, C[2]!, A[3]!, 'No sound; fuse blows at switch-on.', 5, ['checked-in', 'on-bench', 'waiting-parts'], { promisedFor: 7 }),
  job(5, C[3]!, A[4]!, 'Intermittent volume drop; scratchy pot.', 4, ['checked-in', 'on-bench', 'soak']),
  job(6, C[4]!, A[5]!, 'Full service: caps, tubes, bias.', 7, ['checked-in', 'on-bench', 'ready', 'handed-back'], { priority: 'low' }),
  job(7, C[5]!, A[6]!, 'Loses output after twenty minutes.', 7, ['checked-in', 'on-bench', 'soak', 'ready', 'handed-back', 'closed']),
  job(8, C[2]!, A[7]!, 'Check over before selling.', 2, ['checked-in', 'cancelled'], { assignedTo: null }),
]
const J = DEMO_JOBS.map(j => j.id)

export const DEMO_PARTS = [
  { id: idOf('004', 1), jobId: J[0]!, description: 'Matched pair EL84', quantity: 1, unitCostCents: 3100, unitPriceCents: 5200 },
  { id: idOf('004', 2), jobId: J[0]!, description: 'EZ81 rectifier', quantity: 1, unitCostCents: 1900, unitPriceCents: 3200 },
  { id: idOf('004', 3), jobId: J[1]!, description: 'Matched pair 6V6GT', quantity: 1, unitCostCents: 3800, unitPriceCents: 6400 },
  { id: idOf('004', 4), jobId: J[3]!, description: 'Output transformer (on order)', quantity: 1, unitCostCents: 9500, unitPriceCents: 14500 },
  { id: idOf('004', 5), jobId: J[5]!, description: 'Filter capacitor 47 µF 450 V', quantity: 4, unitCostCents: 350, unitPriceCents: 700 },
  { id: idOf('004', 6), jobId: J[6]!, description: 'Screen resistor 470 Ω 5 W', quantity: 4, unitCostCents: 60, unitPriceCents: 150 },
]

export const DEMO_LABOUR = [
  { id: idOf('005', 1), jobId: J[0]!, description: 'Diagnose, retube, check cathode bias', minutes: 90, rateCents: 9000, techId: TECH! },
  { id: idOf('005', 2), jobId: J[1]!, description: 'Diagnose hum', minutes: 45, rateCents: 9000, techId: TECH! },
  { id: idOf('005', 3), jobId: J[5]!, description: 'Recap, retube, set bias', minutes: 150, rateCents: 9000, techId: TECH! },
  { id: idOf('005', 4), jobId: J[6]!, description: 'Find and fix thermal fault', minutes: 120, rateCents: 9000, techId: TECH! },
]

/** Dana's ready job carries a sent invoice (number 1). */
export const DEMO_INVOICE = { id: idOf('006', 1), jobId: J[0]!, number: 1, createdBy: DESK! }
export const demoEventId = (jobIndex: number, step: number) => idOf('007', jobIndex * 100 + step)

/**
 * Job 6's full service: the caps drained and verified, then the bias set on its 6L6GC pair.
 * Invented demo readings (SI; idle dissipation as a fraction of the rating).
 */
export interface DemoRun {
  id: string, gateId: string, jobId: string, procedureId: string, variant: string, tubeCount: number, capCount: number,
  /** Hours after the job was checked in. */
  hoursIn: number
  values: Record<string, number>
}
export const DEMO_RUNS: DemoRun[] = [
  {
    id: idOf('008', 1), gateId: idOf('009', 1), jobId: J[5]!, procedureId: 'drain-and-verify-caps', variant: '', tubeCount: 2, capCount: 4, hoursIn: 4,
    values: { 'drain-time': 48.3, 'verify:1': 2.1, 'verify:2': 1.8, 'verify:3': 3.0, 'verify:4': 2.4, 'recheck': 4.2 },
  },
  {
    id: idOf('008', 2), gateId: idOf('009', 2), jobId: J[5]!, procedureId: 'set-fixed-bias', variant: 'sense-resistor', tubeCount: 2, capCount: 3, hoursIn: 9,
    values: { 'measure-initial:1': 0.43, 'measure-initial:2': 0.45, 'measure-final:1': 0.62, 'measure-final:2': 0.64 },
  },
]

/**
 * The shop's tube stock: two invented lots read on the shop's tester, and one matched quad of
 * 6L6GC in stock (the four closest readings of lot 1). Readings in SI.
 */
const stockTube = (n: number, lotId: string, label: string, plateVolts: number, gridVolts: number, mA: number, gm: number | null, setId: string | null = null) =>
  ({ id: idOf('021', n), lotId, label, plateVolts, gridVolts, amps: mA / 1000, transconductance: gm === null ? null : gm / 1000, testedOn: '', testedBy: 'Owen Pryde', setId })
export const DEMO_LOTS = [
  { id: idOf('020', 1), tubeType: '6l6gc', maker: 'Generic 6L6GC, grey plates', receivedOn: '', costCents: 2400, notes: 'Burned in for an hour before reading.', daysAgo: 9 },
  { id: idOf('020', 2), tubeType: 'el84', maker: 'Generic EL84', receivedOn: '', costCents: 1300, notes: '', daysAgo: 4 },
]
const SET_1 = idOf('022', 1)
export const DEMO_STOCK_TUBES = [
  stockTube(1, DEMO_LOTS[0]!.id, 'L1-01', 400, -45, 41.2, 5.6, SET_1),
  stockTube(2, DEMO_LOTS[0]!.id, 'L1-02', 400, -45, 41.8, 5.7, SET_1),
  stockTube(3, DEMO_LOTS[0]!.id, 'L1-03', 400, -45, 42.1, 5.7, SET_1),
  stockTube(4, DEMO_LOTS[0]!.id, 'L1-04', 400, -45, 42.5, 5.8, SET_1),
  stockTube(5, DEMO_LOTS[0]!.id, 'L1-05', 400, -45, 45.2, 6.0),
  stockTube(6, DEMO_LOTS[0]!.id, 'L1-06', 400, -45, 38.9, 5.3),
  stockTube(7, DEMO_LOTS[1]!.id, 'L2-01', 250, -7.3, 31.0, null),
  stockTube(8, DEMO_LOTS[1]!.id, 'L2-02', 250, -7.3, 33.4, null),
  stockTube(9, DEMO_LOTS[1]!.id, 'L2-03', 250, -7.3, 29.1, null),
  stockTube(10, DEMO_LOTS[1]!.id, 'L2-04', 250, -7.3, 36.8, null),
]
export const DEMO_SETS = [
  { id: SET_1, tubeType: '6l6gc', label: 'S-1', tubeIds: DEMO_STOCK_TUBES.filter(t => t.setId === SET_1).map(t => t.id), size: 4 as const },
]
// The players' own rigs, kept in their personal spaces. Invented numbers for the demo only.
const [, , , DANA, SAM] = DEMO_USERS.map(u => u.id)
export const DEMO_PERSONAL_SPACES = [
  { id: idOf('011', 1), name: 'My rigs', kind: 'personal' as const, personalOf: DANA! },
  { id: idOf('011', 2), name: 'My rigs', kind: 'personal' as const, personalOf: SAM! },
]
const tubes = (...spec: [string, string][]) => spec.map(([position, type]) => ({ position, type }))
export interface DemoRig {
  id: string, player: string, description: string, serial: string, tubes: { position: string, type: string }[], biasMode: BiasMode,
  speakerLoadOhms: number, outputTapOhms: number, retubeHours: number | null, retubeMonths: number | null, notes: string
  /** Power-tube sets: days ago fitted (and retired), base mA per position, plate volts, readings taken on these days ago. */
  sets: { n: number, fittedDaysAgo: number, retiredDaysAgo?: number, spare?: boolean, fittedBy: string, type: string, base: Record<string, number>, plateVolts: number | null, readDaysAgo: number[] }[]
  /** Gigs: every `every` days from `fromDaysAgo`, `hours` long. */
  gigs: { fromDaysAgo: number, every: number, hours: number }
  /** Shared with the demo shop. */
  shared: boolean
}
export const DEMO_RIGS: DemoRig[] = [
  {
    id: DANA_COMBO_RIG, player: DANA!, description: '18 W two-EL84 combo, cathode biased', serial: 'LAW-0412',
    tubes: tubes(['V1', '12AX7'], ['V2', '12AX7'], ['V3', '12AX7'], ['V4', 'EL84'], ['V5', 'EL84'], ['V6', 'EZ81']),
    biasMode: 'cathode', speakerLoadOhms: 8, outputTapOhms: 8, retubeHours: 120, retubeMonths: 12, notes: 'Gigging combo; spare pair in the back pocket.',
    sets: [
      { n: 1, fittedDaysAgo: 420, retiredDaysAgo: 160, fittedBy: 'Larkspur Amp Works', type: 'EL84', base: { V4: 36, V5: 38 }, plateVolts: 285, readDaysAgo: [420, 330, 240, 165] },
      { n: 2, fittedDaysAgo: 160, fittedBy: 'Larkspur Amp Works', type: 'EL84', base: { V4: 34, V5: 35 }, plateVolts: 290, readDaysAgo: [160, 110, 60, 12] },
      { n: 3, fittedDaysAgo: 160, spare: true, fittedBy: 'Larkspur Amp Works', type: 'EL84', base: { V4: 34, V5: 34 }, plateVolts: null, readDaysAgo: [160] },
    ],
    gigs: { fromDaysAgo: 158, every: 9, hours: 3 },
    shared: true,
  },
  {
    id: idOf('010', 2), player: DANA!, description: '50 W two-EL34 head, fixed bias', serial: 'HD-2291',
    tubes: tubes(['V1', '12AX7'], ['V2', '12AX7'], ['V3', '12AX7'], ['V4', 'EL34'], ['V5', 'EL34']),
    biasMode: 'fixed', speakerLoadOhms: 16, outputTapOhms: 16, retubeHours: 400, retubeMonths: 18, notes: 'Studio head.',
    sets: [
      { n: 4, fittedDaysAgo: 300, fittedBy: 'Dana (matched pair from a dealer)', type: 'EL34', base: { V4: 38, V5: 37 }, plateVolts: 430, readDaysAgo: [300, 200, 100, 20] },
    ],
    gigs: { fromDaysAgo: 290, every: 30, hours: 4 },
    shared: false,
  },
  {
    id: idOf('010', 3), player: SAM!, description: 'two-6V6 combo, fixed bias', serial: 'LAW-0419',
    tubes: tubes(['V1', '12AX7'], ['V2', '12AX7'], ['V3', '12AT7'], ['V4', '6V6GT'], ['V5', '6V6GT']),
    biasMode: 'fixed', speakerLoadOhms: 8, outputTapOhms: 8, retubeHours: 300, retubeMonths: 12, notes: '',
    sets: [
      { n: 5, fittedDaysAgo: 380, fittedBy: 'Sam', type: '6V6GT', base: { V4: 22, V5: 24 }, plateVolts: 340, readDaysAgo: [380, 270, 180, 90, 10] },
    ],
    gigs: { fromDaysAgo: 370, every: 7, hours: 2.5 },
    shared: false,
  },
]
export const demoRigSetId = (n: number) => idOf('012', n)
export const demoRigGigId = (rig: number, n: number) => idOf('013', rig * 1000 + n)
export const demoRigShareId = (rig: number) => idOf('014', rig)
/** The shop's retube suggestion for Dana's shared combo (invented); Dana has not adopted it. */
export const DEMO_RIG_SUGGESTION = {
  id: idOf('015', 1), rigId: DANA_COMBO_RIG, by: TECH!, suggestedBy: 'Owen Pryde', retubeHours: 150, retubeMonths: 12,
  note: 'Played hard, four nights a week: have the power tubes checked at 150 h.',
}
