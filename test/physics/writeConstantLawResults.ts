/**
 * Writes fixtures/constant-law-results.json: the analysis of every request in constantLawRequests.ts, as computed
 * by the code at the time of writing (`npx tsx test/physics/writeConstantLawResults.ts <commit>`). Rewrite it only
 * on purpose: constantLawUnchanged.test.ts holds every later version of the code to it.
 */
import { writeFileSync } from 'node:fs';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import { constantLawRequests, resultJson } from './constantLawRequests';

const commit = process.argv[2] ?? 'unknown';
// Each request is stored beside its result: some are made with the code's own integrators (particleSeries.ts), and the
// check is of the analysis, not of how its inputs were made.
const results = constantLawRequests().map(({ name, request }) => ({ name, request, result: JSON.parse(resultJson(analyzeSeries(request))) as unknown }));
writeFileSync(new URL('./fixtures/constant-law-results.json', import.meta.url), `${JSON.stringify({ computed_by_commit: commit, results }, null, 1)}\n`);
console.log(`${results.length} results written`);
