/** Parts fitted on jobs (tubes included), on the device, oldest first. */
export const useJobPartsStore = defineEntityStore('jobParts', { noun: 'part', order: oldestFirst }, ({ create }) => ({ add: create }))
