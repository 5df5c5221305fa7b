/**
 * The analysis shown in the column: the latest result, partial results while the claims are
 * listed, progress, and cancel/retry. Wraps the AnalysisRunner (main thread or worker).
 */
import type { Diagram } from '../graph/diagram';
import type { Role } from '../causal';
import { AnalysisRunner, type RunnerOptions } from '../workers/analysis-client';
import type { AnalysisProgress, AppAnalysis } from '../workers/analysis-steps';

export type AnalysisStatus = 'idle' | 'working' | 'cancelled' | 'failed';

export class AnalysisState {
	analysis = $state.raw<AppAnalysis | null>(null);
	status = $state<AnalysisStatus>('idle');
	progress = $state.raw<AnalysisProgress | null>(null);
	error = $state<string | null>(null);
	where = $state<'main' | 'worker' | null>(null);
	lastMs = $state(0);
	/** The diagram the shown analysis belongs to. */
	analysed = $state.raw<Diagram | null>(null);

	readonly roles: ReadonlyMap<string, readonly Role[]> = $derived(new Map((this.analysis?.roles ?? []).map((r) => [r.id, r.roles])));

	#runner: AnalysisRunner;
	#pending: Diagram | null = null;

	constructor(opts: RunnerOptions = {}) {
		this.#runner = new AnalysisRunner(
			{
				result: (a, info) => {
					this.analysis = a;
					this.analysed = this.#pending;
					this.status = 'idle';
					this.progress = null;
					this.error = null;
					this.where = info.where;
					this.lastMs = info.ms;
				},
				partial: (a) => {
					this.analysis = a;
					this.analysed = this.#pending;
				},
				progress: (p) => {
					this.progress = p;
				},
				failed: (message) => {
					this.status = 'failed';
					this.error = message;
					this.progress = null;
				},
				cancelled: () => {
					this.status = 'cancelled';
					this.progress = null;
				}
			},
			opts
		);
	}

	request(d: Diagram): void {
		const previous = this.#pending;
		this.#pending = d;
		const worker = this.#runner.usesWorker(d);
		if (this.#runner.request(d)) {
			if (worker) {
				this.status = 'working';
				this.progress = { stage: 'Starting', fraction: 0 };
				this.where = 'worker';
			}
		} else {
			// Same analysis as before: the results stand for the new diagram too.
			if (this.analysed === previous) this.analysed = d;
		}
	}

	cancel(): void {
		this.#runner.cancel();
	}

	retry(): void {
		this.status = 'working';
		this.#runner.retry();
	}

	dispose(): void {
		this.#runner.dispose();
	}
}
