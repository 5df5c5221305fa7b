/**
 * Runs the app's analysis: small diagrams on the main thread (results within the same frame,
 * no messaging), larger ones in three Web Workers, one per part (analysis-steps.ts), so that
 * the verdict on a planned-set edit is never queued behind the sets or the claims. The verdict
 * worker answers twice: the verdict first, then the exact path count and listing.
 *
 * Each part is cached by the key of what it depends on and recomputed only when that key
 * changes: a planned-set edit recomputes the verdict alone, a question edit the verdict and
 * the sets, a structural edit all three. When the verdict is wanted, the other parts start
 * only once it is back: on two cores the verdict worker otherwise shares them with the sets
 * and claims workers and the page's redraw (a 1,000-variable U edit was measured at about
 * twice the verdict's own time that way). Results of a part started for an earlier diagram are
 * dropped; a worker still busy with a part that is no longer wanted is terminated and
 * replaced (a running computation cannot be interrupted otherwise). Nothing computed is sent
 * back to a worker: the claims stay on the page. Each part runs on its own job runner
 * (job-runner.ts), which drops stale replies and, without a Worker, runs the same steps on the
 * main thread.
 */
import type { Diagram } from '../graph/diagram';
import {
	analysisKeys,
	analysisPartSteps,
	combine,
	DEFAULT_LIMITS,
	type AnalysisLimits,
	type AnalysisPart,
	type AnalysisProgress,
	type AppAnalysis,
	type ClaimsPart,
	type SetsPart,
	type VerdictPart
} from './analysis-steps';
import { JobRunner, type Where } from './job-runner';
import type { PartJob, PartProgress, PartResult } from './protocol';

export interface RunnerEvents {
	/** The analysis of the latest diagram, each time a part of it arrives. */
	result(a: AppAnalysis, info: { where: Where; ms: number; busy: boolean }): void;
	progress(p: AnalysisProgress): void;
	failed(message: string): void;
	cancelled(): void;
}

export interface RunnerOptions {
	/** Diagrams up to this many variables (and twice as many arrows) run on the main thread. */
	mainThreadVariables?: number;
	limits?: AnalysisLimits;
	createWorker?: () => Worker;
}

/** Main-thread runs slower than this move diagrams of that size to the workers. */
const SLOW_MAIN_MS = 30;

const PARTS: readonly AnalysisPart[] = ['verdict', 'sets', 'claims'];

const STAGE: Record<AnalysisPart, string> = {
	verdict: 'Verdict and paths',
	sets: 'Adjustment sets and roles',
	claims: 'Listing the claims'
};

function defaultWorker(): Worker {
	return new Worker(new URL('./analysis.worker.ts', import.meta.url), { type: 'module' });
}

type Cached = { verdict: { key: string; value: VerdictPart; first?: true } | null; sets: { key: string; value: SetsPart } | null; claims: { key: string; value: ClaimsPart } | null };

interface PartHandlers {
	progress(channel: PartChannel, key: string, p: PartProgress): void;
	done(channel: PartChannel, key: string, result: PartResult, info: { where: Where; ms: number }): void;
	failed(channel: PartChannel, key: string, message: string): void;
}

/** One job runner computing one part at a time, with the key of the diagram it works on. */
class PartChannel {
	readonly jobs: JobRunner<PartJob, PartProgress, PartResult>;
	/** Key of the part being computed, null when idle. */
	busyKey: string | null = null;
	fraction = 0;

	constructor(
		readonly part: AnalysisPart,
		create: () => Worker,
		private readonly handlers: PartHandlers
	) {
		this.jobs = new JobRunner({ steps: () => analysisPartSteps, createWorker: create, crashed: (message) => `The analysis stopped: ${message}` });
	}

	start(d: Diagram, key: string, limits: AnalysisLimits, where: Where): void {
		this.busyKey = key;
		this.fraction = 0;
		const { handlers } = this;
		// A worker sends the verdict before counting its paths; on the main thread both come at once.
		this.jobs.run(
			{ part: this.part, diagram: d, limits, early: where === 'worker' },
			{
				progress: (p) => handlers.progress(this, key, p),
				done: (result, info) => {
					this.busyKey = null;
					handlers.done(this, key, result, info);
				},
				failed: (message) => {
					this.busyKey = null;
					handlers.failed(this, key, message);
				}
			},
			{ where }
		);
	}

	stop(): void {
		this.jobs.terminate();
		this.busyKey = null;
	}
}

export class AnalysisRunner {
	#events: RunnerEvents;
	#mainLimit: number;
	#limits: AnalysisLimits;
	#channels: Record<AnalysisPart, PartChannel>;
	#cache: Cached = { verdict: null, sets: null, claims: null };
	#latest: { diagram: Diagram; keys: Record<AnalysisPart, string> } | null = null;
	/** Smallest variable count whose main-thread run proved slow. */
	#slowFrom = Infinity;
	/** Parts of the latest diagram waiting for its verdict before they start. */
	#deferred: AnalysisPart[] = [];
	/** Set while the parts run together on the main thread: one result at the end. */
	#batch: { failed: string | null } | null = null;

	constructor(events: RunnerEvents, opts: RunnerOptions = {}) {
		this.#events = events;
		this.#mainLimit = opts.mainThreadVariables ?? 20;
		this.#limits = opts.limits ?? DEFAULT_LIMITS;
		const create = opts.createWorker ?? defaultWorker;
		const handlers: PartHandlers = {
			progress: (c, key, p) => this.#onProgress(c, key, p),
			done: (c, key, result, info) => this.#onDone(key, result, info),
			failed: (c, key, message) => this.#onFailed(c, key, message)
		};
		const channel = (part: AnalysisPart) => new PartChannel(part, create, handlers);
		this.#channels = { verdict: channel('verdict'), sets: channel('sets'), claims: channel('claims') };
	}

	/** True when a diagram of this size is analysed in the workers. */
	usesWorker(d: Diagram): boolean {
		const n = d.variables.length;
		return n > this.#mainLimit || d.arrows.length > 2 * this.#mainLimit || n >= this.#slowFrom;
	}

	/** True while some part of the latest diagram's analysis is being computed. */
	get busy(): boolean {
		return this.#deferred.length > 0 || PARTS.some((p) => this.#channels[p].busyKey !== null && this.#channels[p].busyKey === this.#latest?.keys[p]);
	}

	/**
	 * Analyses `d` unless it differs from the last request only in what the analysis ignores
	 * (positions, labels, notes, title). Returns false when skipped.
	 */
	request(d: Diagram, force = false): boolean {
		const keys = analysisKeys(d);
		if (!force && this.#latest?.keys.verdict === keys.verdict) {
			this.#latest = { diagram: d, keys };
			return false;
		}
		this.#latest = { diagram: d, keys };
		// A verdict whose paths are still being counted is not done yet either.
		const needed = PARTS.filter((p) => this.#cache[p]?.key !== keys[p] || (p === 'verdict' && this.#cache.verdict?.first));
		this.#deferred = [];
		if (!this.usesWorker(d)) {
			for (const p of PARTS) if (this.#channels[p].busyKey !== null) this.#channels[p].stop();
			this.#runOnMainThread(d, needed);
			return true;
		}
		const verdictFirst = needed.includes('verdict');
		const startNow: AnalysisPart[] = [];
		for (const p of PARTS) {
			const channel = this.#channels[p];
			if (channel.busyKey !== null && channel.busyKey !== keys[p]) channel.stop(); // working on something no longer wanted
			if (!needed.includes(p) || channel.busyKey === keys[p]) continue;
			if (p !== 'verdict' && verdictFirst) this.#deferred.push(p);
			else startNow.push(p);
		}
		// Started once the deferred parts are known: without a Worker the verdict answers at once.
		for (const p of startNow) this.#channels[p].start(d, keys[p], this.#limits, 'worker');
		if (!needed.includes('verdict')) this.#emit('worker', 0);
		else this.#reportProgress();
		return true;
	}

	/** Runs the missing parts of the last diagram again (after a cancel or a failure). */
	retry(): void {
		if (this.#latest) this.request(this.#latest.diagram, true);
	}

	/** Stops the running parts; what is already computed stays on screen. */
	cancel(): void {
		if (!this.busy) return;
		this.#deferred = [];
		for (const p of PARTS) if (this.#channels[p].busyKey !== null) this.#channels[p].stop();
		this.#events.cancelled();
	}

	dispose(): void {
		this.#deferred = [];
		for (const p of PARTS) this.#channels[p].stop();
	}

	/** The needed parts one after the other on the main thread, then one result. */
	#runOnMainThread(d: Diagram, needed: readonly AnalysisPart[]): void {
		const keys = analysisKeys(d);
		const started = performance.now();
		const batch: { failed: string | null } = { failed: null };
		this.#batch = batch;
		try {
			for (const p of needed) if (batch.failed === null) this.#channels[p].start(d, keys[p], this.#limits, 'main');
		} finally {
			this.#batch = null;
		}
		if (batch.failed !== null) {
			this.#events.failed(batch.failed);
			return;
		}
		const ms = performance.now() - started;
		if (ms > SLOW_MAIN_MS) this.#slowFrom = Math.min(this.#slowFrom, d.variables.length);
		this.#emit('main', ms);
	}

	#onProgress(channel: PartChannel, key: string, p: PartProgress): void {
		if (p.kind === 'fraction') {
			channel.fraction = p.fraction;
			this.#reportProgress();
			return;
		}
		// The verdict before its paths are counted: shown at once; the counting goes on.
		this.#cache.verdict = { key, value: p.value, first: true };
		this.#startDeferred(key);
		if (this.#latest?.keys.verdict === key) this.#emit(channel.jobs.where ?? 'worker', p.ms);
	}

	#onDone(key: string, result: PartResult, info: { where: Where; ms: number }): void {
		if (result.part === 'verdict') this.#cache.verdict = { key, value: result.value };
		else if (result.part === 'sets') this.#cache.sets = { key, value: result.value };
		else this.#cache.claims = { key, value: result.value };
		if (this.#batch) return;
		if (result.part === 'verdict') this.#startDeferred(key);
		if (this.#latest?.keys[result.part] === key) this.#emit(info.where, info.ms);
	}

	#onFailed(channel: PartChannel, key: string, message: string): void {
		if (this.#batch) {
			this.#batch.failed = message;
			return;
		}
		if (channel.part === 'verdict') this.#startDeferred(key);
		this.#events.failed(message);
	}

	/** Starts the parts that waited for the latest diagram's verdict, now that it is back. */
	#startDeferred(verdictKey: string): void {
		const latest = this.#latest;
		if (!latest || latest.keys.verdict !== verdictKey) return;
		const parts = this.#deferred;
		this.#deferred = [];
		for (const p of parts) this.#channels[p].start(latest.diagram, latest.keys[p], this.#limits, 'worker');
	}

	/** The analysis of the latest diagram from the cached parts, once its verdict is known. */
	#emit(where: Where, ms: number): void {
		const latest = this.#latest;
		if (!latest) return;
		const { verdict, sets, claims } = this.#cache;
		if (verdict?.key !== latest.keys.verdict) return;
		const a = combine(verdict.value, sets?.key === latest.keys.sets ? sets.value : null, claims?.key === latest.keys.claims ? claims.value : null);
		const busy = this.busy;
		this.#events.result(a, { where, ms, busy });
		if (busy) this.#reportProgress();
	}

	#reportProgress(): void {
		const latest = this.#latest;
		if (!latest) return;
		const running = PARTS.filter((p) => this.#channels[p].busyKey !== null && this.#channels[p].busyKey === latest.keys[p]);
		if (running.length === 0) return;
		// The first part still running names the stage; the claims give a fraction.
		const part = running[0];
		const stage = part === 'verdict' && this.#cache.verdict?.key === latest.keys.verdict ? 'Counting the paths' : STAGE[part];
		this.#events.progress({ stage, fraction: part === 'claims' ? this.#channels.claims.fraction : 0 });
	}
}
