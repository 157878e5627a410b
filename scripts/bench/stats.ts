/** Small statistics for the bench: medians over rounds, and per-round ratios. */
export function median(values: number[]) {
	const finite = values.filter((v) => Number.isFinite(v)).sort((a, b) => a - b);
	if (!finite.length) return NaN;
	const middle = Math.floor(finite.length / 2);
	return finite.length % 2 ? finite[middle] : (finite[middle - 1] + finite[middle]) / 2;
}

/** Rows of cells as an aligned text table, numbers right-aligned. */
export function table(rows: string[][]) {
	const widths = rows[0].map((_, col) => Math.max(...rows.map((r) => r[col].length)));
	return rows
		.map((row) =>
			row.map((cell, col) => (col === 0 ? cell.padEnd(widths[col]) : cell.padStart(widths[col]))).join('  ')
		)
		.join('\n');
}
