/** Copies of a template database: each integration test file gets its own, made in a fraction of a second. */
import { randomBytes } from 'node:crypto';
import pg from 'pg';

/** The same cluster's maintenance database: a template may not have connections while it is copied. */
function maintenanceUrl(url: string) {
	const parsed = new URL(url);
	parsed.pathname = '/postgres';
	return parsed.toString();
}

function databaseName(url: string) {
	return decodeURIComponent(new URL(url).pathname.slice(1));
}

function quoteName(name: string) {
	return `"${name.replaceAll('"', '""')}"`;
}

async function onMaintenance<T>(url: string, work: (client: pg.Client) => Promise<T>) {
	const client = new pg.Client({ connectionString: maintenanceUrl(url) });
	await client.connect();
	try {
		return await work(client);
	} finally {
		await client.end();
	}
}

/** Creates `<template>_<suffix>` from the template database and returns its URL. */
export async function copyDatabase(templateUrl: string, suffix = randomBytes(4).toString('hex')) {
	const name = `${databaseName(templateUrl)}_${suffix}`;
	await onMaintenance(templateUrl, (client) =>
		client.query(`create database ${quoteName(name)} template ${quoteName(databaseName(templateUrl))}`)
	);
	const url = new URL(templateUrl);
	url.pathname = `/${name}`;
	return url.toString();
}

export async function dropDatabase(url: string) {
	await onMaintenance(url, (client) =>
		client.query(`drop database if exists ${quoteName(databaseName(url))} with (force)`)
	);
}
