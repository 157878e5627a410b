/**
 * The search stand-in in a process of its own, for `npm run bench:search`: in the bench's own process it
 * would share one event loop with the load generator and measure that instead of the app.
 * Usage: node --import tsx scripts/bench/search-standin.ts PORT MASTER_KEY
 */
import { startSearchStandin } from '../../docker/standins/search';

const [port, masterKey] = process.argv.slice(2);
const standin = await startSearchStandin({ port: Number(port), masterKey });
console.log(`search stand-in ready at ${standin.env.MEILI_HOST}`);
process.on('SIGTERM', () => void standin.stop().then(() => process.exit(0)));
