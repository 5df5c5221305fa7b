import { defineConfig } from '@playwright/test';

// Browser tests drive Debian's Chromium (/usr/bin/chromium); Playwright's own browser
// download cannot run on our machines. CHROMIUM_PATH overrides the location.
const executablePath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
// E2E_PORT lets two checkouts run their browser tests at the same time on one machine.
const port = Number(process.env.E2E_PORT ?? 4173);

export default defineConfig({
	testDir: 'tests/e2e',
	testMatch: '**/*.e2e.ts',
	timeout: 60_000,
	fullyParallel: false,
	workers: 1,
	reporter: [['list']],
	use: {
		baseURL: `http://127.0.0.1:${port}`,
		viewport: { width: 1280, height: 800 },
		launchOptions: {
			executablePath,
			args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run']
		}
	},
	webServer: {
		command: `npx vite preview --host 127.0.0.1 --port ${port} --strictPort`,
		url: `http://127.0.0.1:${port}`,
		reuseExistingServer: false,
		timeout: 60_000
	}
});
