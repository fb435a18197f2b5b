// Drizzle schema: the one description of Hosewright's tables, split by area. Migrations in drizzle/
// are generated from it with `npm run db:generate`; never edit them by hand.
export * from './core'
export * from './graph'
export * from './library'
export * from './review'
export * from './shop'
