import type { Executor } from './client';

/**
 * A statement built once per database handle and sent as a named prepared statement: the hot reads of
 * signed-in pages skip Drizzle's query building on every request, and PostgreSQL parses each once per
 * connection. `build` must give the same SQL text every time (values go in through `sql.placeholder`),
 * since a statement's name stands for its text on every connection of the pool.
 *
 * Kept per handle (weakly): the app's pool lives as long as the process; a transaction's handle, and the
 * statement built on it, go when the transaction does.
 */
export function preparedPer<T>(build: (db: Executor) => T): (db: Executor) => T {
	const built = new WeakMap<Executor, T>();
	return (db) => {
		let statement = built.get(db);
		if (!statement) {
			statement = build(db);
			built.set(db, statement);
		}
		return statement;
	};
}
