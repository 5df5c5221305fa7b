/**
 * Runs the analysis for the app: small diagrams on the main thread (results within the same
 * frame, no messaging), larger ones in a Web Worker with progress, partial results and
 * cancellation. A newer request supersedes an older one; a worker still busy with a stale
 * diagram is terminated and replaced, since a running computation cannot be interrupted.
 */
import type { Diagram } from '../graph/diagram';
import { analysisKey, claimsKey, DEFAULT_LIMITS, runAnalysis, type AnalysisLimits, type AnalysisProgress, type AppAnalysis } from './analysis-steps';
import type { AnalyseRequest, WorkerReply } from './protocol';

export interface RunnerEvents {
	/** A finished analysis for the latest request. */
	result(a: AppAnalysis, info: { where: 'main' | 'worker'; ms: number }): void;
	/** The question-dependent part, while the claims are still being listed. */
	partial(a: AppAnalysis): void;
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

/** Main-thread runs slower than this move diagrams of that size to the worker. */
const SLOW_MAIN_MS = 30;

function defaultWorker(): Worker {
	return new Worker(new URL('./analysis.worker.ts', import.meta.url), { type: 'module' });
}

export class AnalysisRunner {
	#events: RunnerEvents;
	#mainLimit: number;
	#limits: AnalysisLimits;
	#createWorker: () => Worker;
	#worker: Worker | null = null;
	#busy = false;
	#latest = 0;
	#lastDiagram: Diagram | null = null;
	/** Smallest variable count whose main-thread run proved slow. */
	#slowFrom = Infinity;
	/** Key of the diagram last analysed or being analysed; a repeat request is skipped. */
	#lastKey: string | null = null;
	/** Claims of the last complete result, by structure. */
	#claimsCache: { key: string; claims: AppAnalysis['claims']; truncated: boolean } | null = null;
	#pendingClaimsKey = '';

	constructor(events: RunnerEvents, opts: RunnerOptions = {}) {
		this.#events = events;
		this.#mainLimit = opts.mainThreadVariables ?? 20;
		this.#limits = opts.limits ?? DEFAULT_LIMITS;
		this.#createWorker = opts.createWorker ?? defaultWorker;
	}

	/** True when a diagram of this size is analysed in the worker. */
	usesWorker(d: Diagram): boolean {
		const n = d.variables.length;
		return n > this.#mainLimit || d.arrows.length > 2 * this.#mainLimit || n >= this.#slowFrom;
	}

	/**
	 * Analyses `d` unless it differs from the last request only in what the analysis ignores
	 * (positions, labels, notes, title). Returns false when skipped.
	 */
	request(d: Diagram, force = false): boolean {
		const key = analysisKey(d);
		if (!force && key === this.#lastKey) return false;
		this.#lastKey = key;
		this.#lastDiagram = d;
		const id = ++this.#latest;
		const cKey = claimsKey(d);
		this.#pendingClaimsKey = cKey;
		const known = this.#claimsCache?.key === cKey ? { claims: this.#claimsCache.claims, truncated: this.#claimsCache.truncated } : undefined;
		if (!this.usesWorker(d)) {
			if (this.#busy) this.#stopWorker();
			const started = performance.now();
			try {
				const a = runAnalysis(d, this.#limits, undefined, known);
				this.#claimsCache = { key: cKey, claims: a.claims, truncated: a.claimsTruncated };
				const ms = performance.now() - started;
				if (ms > SLOW_MAIN_MS) this.#slowFrom = Math.min(this.#slowFrom, d.variables.length);
				this.#events.result(a, { where: 'main', ms });
			} catch (e) {
				this.#events.failed(e instanceof Error ? e.message : String(e));
			}
			return true;
		}
		if (this.#busy) this.#stopWorker();
		const worker = this.#ensureWorker();
		this.#busy = true;
		const message: AnalyseRequest = { id, diagram: d, limits: this.#limits, knownClaims: known };
		worker.postMessage(message);
		return true;
	}

	/** Runs the last diagram again (after a cancel). */
	retry(): void {
		if (this.#lastDiagram) this.request(this.#lastDiagram, true);
	}

	/** Stops a running analysis; the last results stay on screen. */
	cancel(): void {
		if (!this.#busy) return;
		this.#stopWorker();
		this.#latest++;
		this.#lastKey = null;
		this.#events.cancelled();
	}

	get busy(): boolean {
		return this.#busy;
	}

	dispose(): void {
		this.#stopWorker();
	}

	#ensureWorker(): Worker {
		if (this.#worker) return this.#worker;
		const worker = this.#createWorker();
		worker.onmessage = (e: MessageEvent<WorkerReply>) => this.#onReply(e.data);
		worker.onerror = (e: ErrorEvent) => {
			this.#busy = false;
			this.#events.failed(`The analysis stopped: ${e.message || 'the worker failed'}`);
			this.#stopWorker();
		};
		this.#worker = worker;
		return worker;
	}

	#stopWorker(): void {
		this.#worker?.terminate();
		this.#worker = null;
		this.#busy = false;
	}

	#onReply(reply: WorkerReply): void {
		if (reply.id !== this.#latest) return; // a stale run's message
		switch (reply.kind) {
			case 'progress':
				if (reply.partial) this.#events.partial(reply.partial);
				this.#events.progress(reply.progress);
				break;
			case 'done':
				this.#busy = false;
				this.#claimsCache = { key: this.#pendingClaimsKey, claims: reply.analysis.claims, truncated: reply.analysis.claimsTruncated };
				this.#events.result(reply.analysis, { where: 'worker', ms: reply.ms });
				break;
			case 'failed':
				this.#busy = false;
				this.#events.failed(reply.message);
				break;
		}
	}
}
