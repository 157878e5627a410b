/** CPU time of processes, read from /proc (Linux): the server under load, and PostgreSQL's backends. */
import { execFileSync } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';

const ticksPerSecond = Number(execFileSync('getconf', ['CLK_TCK'], { encoding: 'utf8' }).trim()) || 100;

function statFields(pid: number): string[] | null {
	try {
		const text = readFileSync(`/proc/${pid}/stat`, 'utf8');
		// The command name may hold spaces; the fields after its closing parenthesis are fixed.
		return text.slice(text.lastIndexOf(')') + 2).split(' ');
	} catch {
		return null;
	}
}

/** User + system CPU of the process (all its threads), in microseconds. */
export function processCpuMicros(pid: number) {
	const fields = statFields(pid);
	if (!fields) return 0;
	// utime and stime are fields 14 and 15 of /proc/PID/stat; fields[0] here is field 3.
	return ((Number(fields[11]) + Number(fields[12])) * 1e6) / ticksPerSecond;
}

/** CPU of each child of a process (PostgreSQL's backends are the postmaster's children), in microseconds by pid. */
export function childrenCpuMicros(parentPid: number) {
	const byPid = new Map<number, number>();
	for (const entry of readdirSync('/proc')) {
		if (!/^\d+$/.test(entry)) continue;
		const fields = statFields(Number(entry));
		if (fields && Number(fields[1]) === parentPid) byPid.set(Number(entry), processCpuMicros(Number(entry)));
	}
	return byPid;
}

/** CPU the children used between two readings; one that ended in between loses only its last stretch. */
export function childrenCpuSince(before: Map<number, number>, after: Map<number, number>) {
	let total = 0;
	for (const [pid, micros] of after) total += micros - (before.get(pid) ?? 0);
	return total;
}
