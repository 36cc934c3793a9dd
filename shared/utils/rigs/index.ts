export * from './types'
export * from './reminders'
export * from './readings'
