export * from './auth'
export * from './notebook'
export * from './sync'
export * from './blobs'
