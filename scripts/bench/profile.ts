/** A text summary of a V8 `.cpuprofile` (from `node --cpu-prof`): where the samples landed, by function and by package. */
import { readFileSync } from 'node:fs';

type ProfileNode = {
	id: number;
	callFrame: { functionName: string; url: string; lineNumber: number };
	hitCount?: number;
	children?: number[];
};
type Profile = { nodes: ProfileNode[]; startTime: number; endTime: number; samples: number[] };

/** node_modules/<package>, our server chunks, Node's own internals, or the idle/GC pseudo-frames. */
function packageOf(url: string, functionName: string) {
	if (!url) return `(${functionName || 'native'})`;
	const modules = url.lastIndexOf('node_modules/');
	if (modules >= 0) {
		const rest = url.slice(modules + 'node_modules/'.length).split('/');
		return rest[0].startsWith('@') ? `${rest[0]}/${rest[1]}` : rest[0];
	}
	if (url.startsWith('node:')) return 'node internals';
	const build = url.indexOf('/build/');
	return build >= 0 ? `build/${url.slice(build + 7).split('/')[0]}` : url;
}

function shortUrl(url: string) {
	const cut = Math.max(url.lastIndexOf('node_modules/'), url.lastIndexOf('/build/'));
	return cut >= 0 ? url.slice(cut) : url.replace(/^file:\/\//, '');
}

export function summariseProfile(file: string, top = 25) {
	const profile = JSON.parse(readFileSync(file, 'utf8')) as Profile;
	const totalMs = (profile.endTime - profile.startTime) / 1000;
	const totalSamples = profile.samples.length || 1;
	const byFunction = new Map<string, number>();
	const byPackage = new Map<string, number>();
	const inclusive = new Map<string, number>();
	const parents = new Map<number, ProfileNode>();
	for (const node of profile.nodes) for (const child of node.children ?? []) parents.set(child, node);
	const nameOf = ({ callFrame: { functionName, url, lineNumber } }: ProfileNode) =>
		`${functionName || '(anonymous)'} ${url ? `${shortUrl(url)}:${lineNumber + 1}` : ''}`.trim();
	for (const node of profile.nodes) {
		const hits = node.hitCount ?? 0;
		if (!hits) continue;
		const { functionName, url } = node.callFrame;
		const name = nameOf(node);
		byFunction.set(name, (byFunction.get(name) ?? 0) + hits);
		// Every function on the stack once, however often it recurs.
		const onStack = new Set<string>();
		for (let at: ProfileNode | undefined = node; at; at = parents.get(at.id)) onStack.add(nameOf(at));
		for (const frame of onStack) inclusive.set(frame, (inclusive.get(frame) ?? 0) + hits);
		const pkg = packageOf(url, functionName);
		byPackage.set(pkg, (byPackage.get(pkg) ?? 0) + hits);
	}
	const lines = [`${totalSamples} samples over ${(totalMs / 1000).toFixed(1)} s`];
	const share = (hits: number) => `${((100 * hits) / totalSamples).toFixed(1).padStart(5)} %`;
	lines.push('', 'self time by package:');
	for (const [name, hits] of [...byPackage].sort((a, b) => b[1] - a[1]).slice(0, 15))
		lines.push(`  ${share(hits)}  ${name}`);
	lines.push('', `self time, top ${top} functions:`);
	for (const [name, hits] of [...byFunction].sort((a, b) => b[1] - a[1]).slice(0, top))
		lines.push(`  ${share(hits)}  ${name}`);
	lines.push('', `total time (self and callees), top ${top} functions:`);
	for (const [name, hits] of [...inclusive].sort((a, b) => b[1] - a[1]).slice(0, top))
		lines.push(`  ${share(hits)}  ${name}`);
	return lines.join('\n');
}
