export * from './tool-schemas'
export * from './tool-compute'
export * from './saved-result'
