// Review before the first fill: finding identity, approval rules, mentions, comment pins and what a
// change between versions does to the quantities. Pure TypeScript.
export * from './findingKeys'
export * from './approval'
export * from './mentions'
export * from './markers'
export * from './quantityChanges'
