/**
 * The analysis shown in the column: the latest result (its parts arrive one by one for large
 * diagrams), progress, and cancel/retry. Wraps the AnalysisRunner (main thread or workers).
 */
import type { Diagram } from '../graph/diagram';
import type { Role } from '../causal';
import { AnalysisRunner, type RunnerOptions } from '../workers/analysis-client';
import type { AnalysisProgress, AppAnalysis } from '../workers/analysis-steps';

export type AnalysisStatus = 'idle' | 'working' | 'cancelled' | 'failed';

const NO_ROLES: ReadonlyMap<string, readonly Role[]> = new Map();

export class AnalysisState {
	analysis = $state.raw<AppAnalysis | null>(null);
	status = $state<AnalysisStatus>('idle');
	progress = $state.raw<AnalysisProgress | null>(null);
	error = $state<string | null>(null);
	where = $state<'main' | 'worker' | null>(null);
	lastMs = $state(0);
	/** Counts the results shown (each edit's first result included), for benchmarks and tests. */
	serial = $state(0);

	/**
	 * Roles for the canvas badges: the latest computed, kept while the roles of a changed
	 * structure are still being computed (the badges do not blink off and on at every edit;
	 * the Adjustment section says the sets are being updated meanwhile).
	 */
	roles = $state.raw<ReadonlyMap<string, readonly Role[]>>(NO_ROLES);
	/** The engine's list the roles map was made from: a planned-set edit brings the same list. */
	#rolesFrom: unknown = null;

	#runner: AnalysisRunner;

	constructor(opts: RunnerOptions = {}) {
		this.#runner = new AnalysisRunner(
			{
				result: (a, info) => {
					this.analysis = a;
					this.serial++;
					if (!a.ready) {
						this.roles = NO_ROLES;
						this.#rolesFrom = null;
					} else if (!a.setsPending && a.roles !== this.#rolesFrom) {
						// A new map only for new roles, so the canvas is not redrawn for nothing.
						this.roles = new Map(a.roles.map((r) => [r.id, r.roles]));
						this.#rolesFrom = a.roles;
					}
					this.status = info.busy ? 'working' : 'idle';
					if (!info.busy) this.progress = null;
					this.error = null;
					this.where = info.where;
					this.lastMs = info.ms;
				},
				progress: (p) => {
					this.progress = p;
					this.status = 'working';
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
		if (this.#runner.request(d) && this.#runner.usesWorker(d) && this.#runner.busy) {
			this.status = 'working';
			this.progress ??= { stage: 'Starting', fraction: 0 };
			this.where = 'worker';
		}
	}

	cancel(): void {
		this.#runner.cancel();
	}

	retry(): void {
		this.status = 'working';
		this.#runner.retry();
		if (!this.#runner.busy && this.status === 'working') this.status = 'idle';
	}

	dispose(): void {
		this.#runner.dispose();
	}
}
