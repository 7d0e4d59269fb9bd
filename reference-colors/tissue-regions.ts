// The tissue regions moved to shared/colour/tissue-regions.ts; this re-export keeps the
// benchmarks' imports working until they import them from there.
export { inTissueRegion, onHueArc, sampleRegion, TISSUE_REGIONS, TISSUE_REGIONS_V2, type TissueRegion } from '../shared/colour/tissue-regions.js';
