import type { RigTube } from '#shared/utils/rigs/index'

/**
 * "V1 12AX7, V4 6L6GC" (commas, semicolons or new lines between sockets; position then type)
 * as the rig's tube list; a socket written without a type is an error naming it.
 */
export function parseTubeList(text: string): { tubes: RigTube[], error: string } {
  const tubes: RigTube[] = []
  for (const part of text.split(/[,;\n]+/).map(s => s.trim()).filter(Boolean)) {
    const [position, ...rest] = part.split(/\s+/)
    const type = rest.join(' ')
    if (!position || !type) return { tubes, error: `"${part}": write the socket then the tube, like "V4 6L6GC"` }
    tubes.push({ position, type })
  }
  return { tubes, error: '' }
}

export const tubeListText = (tubes: readonly RigTube[]) => tubes.map(t => `${t.position} ${t.type}`).join(', ')

/** Power tubes: the positions whose type is in the built-in list of output tubes (what readings are taken on). */
const OUTPUT_TYPES = /^(6V6|6L6|5881|EL84|EL34|KT66|KT77|KT88|6550|6CA7|7027)/i
export const powerTubes = (tubes: readonly RigTube[]) => tubes.filter(t => OUTPUT_TYPES.test(t.type))
