// What the day overview computes with the physics: the air density of a reading and the C_d of each series.
// Loaded after the overview's first render, so the day shows at once and its figures fill in.
export { analyzeDay, readingAirDensity, seriesVerdict } from '../../../analysis';
