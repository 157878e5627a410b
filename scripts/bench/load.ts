/** One slice of load with autocannon, with the server's (and the database's) CPU read around it. */
import autocannon from 'autocannon';
import { childrenCpuMicros, childrenCpuSince, processCpuMicros } from './cpu';

export type SliceRequest = {
	url: string;
	method: 'GET' | 'POST';
	headers: Record<string, string>;
	body?: string;
	connections: number;
	seconds: number;
	serverPid: number;
	postmasterPid: number;
	/** The answer the scenario expects (200 unless it loads a 404 on purpose). */
	status: number;
	/** How many requests in a row each simulated client (address) sends before the next one takes over. */
	requestsPerAddress?: number;
	/** A body of its own for the n-th request (else every request sends `body`). */
	bodyFor?: (n: number) => string;
};

export type Slice = {
	requestsPerSecond: number;
	p50: number;
	p99: number;
	serverCpuMicrosPerRequest: number;
	databaseCpuMicrosPerRequest: number;
	requests: number;
	/** Answers other than the expected status, connection errors and timeouts together. */
	failures: number;
	statusCodes: Record<string, number>;
};

/**
 * Simulated clients: each sends `requestsPerAddress` requests in a row from one of these documentation-range
 * addresses, then the next takes over, so per-address limits stay far away.
 */
const addresses = Array.from({ length: 4096 }, (_, i) => `198.18.${i >> 8}.${(i & 255) + 1}`);
let sent = 0;

export async function slice(request: SliceRequest): Promise<Slice> {
	const serverBefore = processCpuMicros(request.serverPid);
	const databaseBefore = childrenCpuMicros(request.postmasterPid);
	const result = await autocannon({
		url: request.url,
		method: request.method,
		headers: request.headers,
		body: request.body,
		connections: request.connections,
		duration: request.seconds,
		requests: [
			{
				setupRequest: (req) => {
					const n = sent++;
					const address = addresses[Math.floor(n / (request.requestsPerAddress ?? 1)) % addresses.length];
					const headers = { ...req.headers, 'x-forwarded-for': address };
					return request.bodyFor ? { ...req, headers, body: request.bodyFor(n) } : { ...req, headers };
				}
			}
		]
	});
	const serverCpu = processCpuMicros(request.serverPid) - serverBefore;
	const databaseCpu = childrenCpuSince(databaseBefore, childrenCpuMicros(request.postmasterPid));
	const requests = result.requests.total;
	const statusCodes = Object.fromEntries(
		Object.entries(result.statusCodeStats ?? {}).map(([code, stat]) => [code, (stat as { count: number }).count])
	);
	return {
		requestsPerSecond: requests / result.duration,
		p50: result.latency.p50,
		p99: result.latency.p99,
		serverCpuMicrosPerRequest: requests ? serverCpu / requests : NaN,
		databaseCpuMicrosPerRequest: requests ? databaseCpu / requests : NaN,
		requests,
		failures: requests - (statusCodes[request.status] ?? 0) + result.errors + result.timeouts,
		statusCodes
	};
}
