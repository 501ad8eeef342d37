/** `npm run bench`: the engine benchmark, then the search API under load. Prints figures and ratios. */
import { runEngineBench } from './engine';
import { runApiLoadBench } from './api-load';

await runEngineBench();
console.log('');
await runApiLoadBench();
