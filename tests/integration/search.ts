import type { startSearchStandin } from '../../docker/standins/search';

type SearchStandin = Awaited<ReturnType<typeof startSearchStandin>>;
let current: SearchStandin | null = null;

export function setSearchStandin(standin: SearchStandin) {
	current = standin;
}

/** This file's search stand-in, to stop and start again around a test of the fallback. */
export function searchStandin(): SearchStandin {
	if (!current) throw new Error('No search stand-in: only integration files with a server have one');
	return current;
}
