// The seeded generator moved to shared/random/mulberry32.ts; this re-export keeps the benchmarks'
// imports working until they import it from there.
export { mulberry32 } from '../shared/random/mulberry32.js';
