// ESLint as `sv create` sets it up for a TypeScript SvelteKit app (eslint-plugin-svelte,
// typescript-eslint, eslint-config-prettier so formatting is left to Prettier), ignoring what
// .gitignore and .prettierignore name.
import { fileURLToPath } from 'node:url';
import { includeIgnoreFile } from '@eslint/compat';
import js from '@eslint/js';
import prettier from 'eslint-config-prettier';
import svelte from 'eslint-plugin-svelte';
import { defineConfig } from 'eslint/config';
import globals from 'globals';
import ts from 'typescript-eslint';
import svelteConfig from './svelte.config.js';

const gitignorePath = fileURLToPath(new URL('./.gitignore', import.meta.url));
const prettierignorePath = fileURLToPath(new URL('./.prettierignore', import.meta.url));

export default defineConfig(
	includeIgnoreFile(gitignorePath),
	includeIgnoreFile(prettierignorePath),
	// The bare one-page app the load script compares against: not part of this project's code.
	{ ignores: ['scripts/bare/**'] },
	js.configs.recommended,
	...ts.configs.recommended,
	...svelte.configs.recommended,
	prettier,
	...svelte.configs.prettier,
	{
		languageOptions: {
			globals: { ...globals.browser, ...globals.node }
		},
		rules: {
			// typescript-eslint strongly recommend that you do not use the no-undef lint rule on TypeScript projects.
			// see: https://typescript-eslint.io/troubleshooting/faqs/eslint/#i-get-errors-from-the-no-undef-rule-about-global-variables-not-being-defined-even-though-there-are-no-typescript-errors
			'no-undef': 'off',
			// A leading underscore marks a binding kept on purpose: a field left out of a rest copy, an
			// unused parameter before a used one.
			'@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', destructuredArrayIgnorePattern: '^_' }],
			// The app is served from the root (no `paths.base`), so a plain href is already the right
			// URL; calls to goto() and history changes are still checked.
			'svelte/no-navigation-without-resolve': ['error', { ignoreLinks: true }],
			// `{' '}` is how the markup keeps a space Svelte would trim at the start of a block or line.
			'svelte/no-useless-mustaches': 'off',
			// State is runes ($state, $derived) and `$app/state`, never stores: the imports are refused
			// below, so the rule that asks the type checker whether each identifier is a store (three
			// quarters of the lint's rule time, 29 s a run) has nothing to find.
			'svelte/require-store-reactive-access': 'off',
			'no-restricted-imports': [
				'error',
				{
					paths: [
						{ name: 'svelte/store', message: 'Hold state in runes ($state, $derived) or a .svelte.ts class.' },
						{ name: '$app/stores', message: 'Read $app/state instead.' }
					]
				}
			]
		}
	},
	{
		// The code computePlan runs on every keystroke builds its objects field by field: with an
		// object spread there, about 67 kB of each finished run stayed reachable through the next
		// young-generation collection, doubling what every scavenge copied (docs/performance.md,
		// Engine, sixth pass). The pour log and reminders copy a plan with a spread on purpose.
		files: ['src/lib/plan/**/*.ts'],
		ignores: [
			'src/lib/plan/**/*.spec.ts',
			'src/lib/plan/pour-log.ts',
			'src/lib/plan/reminders.ts',
			'src/lib/plan/*.arbitraries.ts',
			'src/lib/plan/test-plans.ts'
		],
		rules: {
			'no-restricted-syntax': [
				'error',
				{
					selector: 'ObjectExpression > SpreadElement',
					message: 'Name the fields: an object spread in the engine keeps the last run alive (docs/performance.md).'
				}
			]
		}
	},
	{
		files: ['**/*.svelte', '**/*.svelte.ts', '**/*.svelte.js'],
		languageOptions: {
			parserOptions: {
				projectService: true,
				extraFileExtensions: ['.svelte'],
				parser: ts.parser,
				svelteConfig
			}
		}
	}
);
