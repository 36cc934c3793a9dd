// npm run soak: the full convergence soak (3 devices, 2,000 changes, lossy network); prints its counts.
import { startThrowawayStack } from './lib/stack.mjs'

const stack = await startThrowawayStack({ log: () => {} })
Object.assign(process.env, stack.testEnv)
const { runSoak } = await import('../tests/api/helpers/soak')
try {
  const mutations = Number(process.argv[2] ?? 2000)
  const r = await runSoak({ clients: 3, mutations, seed: Number(process.argv[3] ?? 1) })
  console.log('\nConvergence soak')
  for (const [k, v] of Object.entries(r)) if (k !== 'shopId') console.log(`  ${k.padEnd(26)} ${v}`)
  const ok = r.converged && r.loggedUuids === mutations && r.duplicateRows === 0 && r.outboxLeft === 0 && r.conflictsWithLosingValue === r.conflicts && r.notesOnServer === r.noteCreatesApplied
  console.log(ok ? '\nPASS: every device equals the server; every change logged once; no losing value dropped.' : '\nFAIL')
  process.exitCode = ok ? 0 : 1
}
finally {
  await stack.stop()
}
