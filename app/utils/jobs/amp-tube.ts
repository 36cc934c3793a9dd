// Which library tube an amp's power stage uses, from its tube complement ("2 x 12AX7, 2 x 6V6GT").
/** The named tube with the largest plate rating, so preamp and rectifier tubes are passed over. */
export function powerTubeOf<T extends { id: string, name: string, maxPlateWatts: number }>(complement: string, library: readonly T[]): T | undefined {
  const names = complement.split(/[,;/+]/).map(part => part.replace(/^\s*\d+\s*[x×]\s*/i, '').trim().toUpperCase()).filter(Boolean)
  const found = [...library].filter(t => names.includes(t.name.toUpperCase()))
  return found.sort((a, b) => b.maxPlateWatts - a.maxPlateWatts)[0]
}
