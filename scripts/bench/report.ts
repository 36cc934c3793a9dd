// One line per figure: what was measured, the figure, its reference, the budget, PASS or FAIL.
export interface Row { group: string, what: string, value: string, reference?: string, budget: string, pass: boolean | null }

export const rows: Row[] = []

export function record(row: Row) {
  rows.push(row)
  const mark = row.pass === null ? 'info' : row.pass ? 'PASS' : 'FAIL'
  console.log(`  ${mark.padEnd(4)}  ${row.what}: ${row.value}${row.reference ? ` (reference: ${row.reference})` : ''}; budget ${row.budget}`)
}

export function summary() {
  const judged = rows.filter(r => r.pass !== null)
  const failed = judged.filter(r => !r.pass)
  console.log(`\n${judged.length - failed.length} of ${judged.length} budgets pass.`)
  for (const r of failed) console.log(`  FAIL  ${r.group}: ${r.what}: ${r.value}; budget ${r.budget}`)
  return failed.length
}

export const kb = (bytes: number) => `${(bytes / 1024).toFixed(1)} KB`
export const ms = (n: number) => `${Math.round(n)} ms`
export const perSecond = (n: number) => `${Math.round(n).toLocaleString('en')} /s`
export const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b)
  const m = Math.floor(s.length / 2)
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2
}
