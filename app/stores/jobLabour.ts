/** Labour booked on jobs (minutes at an hourly rate in cents), on the device, oldest first. */
export const useJobLabourStore = defineEntityStore('jobLabour', { noun: 'labour line', order: oldestFirst }, ({ create }) => ({ add: create }))
