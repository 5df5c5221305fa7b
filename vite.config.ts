import { sveltekit } from '@sveltejs/kit/vite';
import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

/** Modules replaced at build time (see each file's header for why). */
export const buildAliases = {
	'@stdlib/assert-has-generator-support': fileURLToPath(new URL('./src/lib/stats/shims/has-generator-support.cjs', import.meta.url))
};

export default defineConfig({
	plugins: [sveltekit()],
	resolve: { alias: buildAliases },
	test: {
		include: ['tests/unit/**/*.test.ts'],
		environment: 'node',
		testTimeout: 60_000,
		hookTimeout: 60_000,
		setupFiles: ['tests/unit/fast-check-seed.ts']
	}
});
