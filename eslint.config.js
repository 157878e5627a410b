// Type-aware lint for TypeScript and Svelte; prettier owns formatting, so no stylistic rules here.
import js from '@eslint/js';
import svelte from 'eslint-plugin-svelte';
import globals from 'globals';
import ts from 'typescript-eslint';
import svelteConfig from './svelte.config.js';

export default ts.config(
	{ ignores: ['build/', '.svelte-kit/', '.data/', 'node_modules/', 'test-results/', 'playwright-report/', 'drizzle/'] },
	js.configs.recommended,
	...ts.configs.recommendedTypeChecked,
	...svelte.configs.recommended,
	...svelte.configs.prettier,
	{
		languageOptions: {
			globals: { ...globals.browser, ...globals.node },
			parserOptions: {
				projectService: true,
				tsconfigRootDir: import.meta.dirname,
				extraFileExtensions: ['.svelte']
			}
		}
	},
	{
		files: ['**/*.svelte', '**/*.svelte.ts', '**/*.svelte.js'],
		languageOptions: {
			parserOptions: { parser: ts.parser, svelteConfig }
		}
	},
	{
		rules: {
			// TypeScript already refuses undefined names, and knows the ambient ones eslint cannot see.
			'no-undef': 'off',
			'@typescript-eslint/no-unused-vars': [
				'error',
				{ argsIgnorePattern: '^_', varsIgnorePattern: '^_', ignoreRestSiblings: true }
			],
			// The app has no base path (`kit.paths.base` is empty), so plain links and goto() need no resolve().
			'svelte/no-navigation-without-resolve': 'off'
		}
	},
	{
		// Tests read JSON bodies (typed `any`) and poke at them; the unsafe-any rules only add noise there.
		files: ['tests/**/*.ts', '**/*.spec.ts'],
		rules: {
			'@typescript-eslint/no-unsafe-argument': 'off',
			'@typescript-eslint/no-unsafe-assignment': 'off',
			'@typescript-eslint/no-unsafe-call': 'off',
			'@typescript-eslint/no-unsafe-member-access': 'off',
			'@typescript-eslint/no-unsafe-return': 'off'
		}
	},
	{
		// Configuration files outside the TypeScript project.
		files: ['*.js', '*.cjs', 'server/**/*.js', 'scripts/**/*.mjs'],
		ignores: ['svelte.config.js'],
		...ts.configs.disableTypeChecked
	}
);
