/**
 * The Data section's state: the loaded table (its description; the rows stay in the data
 * worker) or summary matrix, the latest report and the diagram it belongs to, load/check
 * progress and messages. The column links, kinds, reference levels and value labels are not
 * kept here: they are the diagram's (Variable.data), changed through editor commands, so they
 * are undoable, autosaved, saved with the file and read by the command line. A bad file or a
 * cancel leaves the earlier data and report in place.
 *
 * When another diagram replaces the current one (New, Open, a share link) the app asks
 * whether to keep the data (keepFor) or to drop them (clear); a kept table is matched again to
 * the new diagram, and `rematch` then says what changed.
 */
import type { Diagram } from '../../graph/diagram';
import type { ParseProgress, SummaryStatistics, TableError } from '../../stats';
import type { DataCheckProgress, DataCheckReport, Rematch, TableInfo } from '../../datacheck';
import { rematchDifferences } from '../../datacheck/rematch';

/**
 * The checks of a pasted summary matrix run on the page; their code (with the statistics it
 * needs) loads when a matrix is first given, so the app's start-up does not carry it.
 */
type SummaryModule = typeof import('../../datacheck/summary');
let summaryModule: SummaryModule | null = null;
import { DataRunner } from '../../workers/data-client';
import type { DataPart, DataSource } from '../../workers/data-protocol';
import { structureKey } from '../../workers/analysis-steps';

export type DataStatus = 'empty' | 'loading' | 'checking' | 'ready';

/** What the checks depend on in the diagram: structure, labels (name matching), data settings and the question. */
export function dataKey(d: Diagram): string {
	return JSON.stringify([structureKey(d), d.variables.map((v) => [v.label, v.data ?? null]), d.exposures, d.outcomes, d.adjusted]);
}

export function describeTableError(e: TableError): string {
	return e.message;
}

const PART_WORDS: Record<DataPart, string> = { arrows: 'the arrow checks', estimates: 'the estimates and the confounder check', claims: 'the claim checks' };

/** "the estimates and the confounder check and the claim checks" → listed with commas and "and". */
function describeParts(parts: readonly DataPart[]): string {
	const words = parts.map((p) => PART_WORDS[p]);
	return words.length <= 1 ? (words[0] ?? '') : `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

export class DataState {
	info = $state.raw<TableInfo | null>(null);
	summary = $state.raw<{ name: string; stats: SummaryStatistics } | null>(null);
	report = $state.raw<DataCheckReport | null>(null);
	/** The diagram the report was computed for. */
	reportKey = $state<string | null>(null);
	status = $state<DataStatus>('empty');
	loadProgress = $state.raw<ParseProgress | null>(null);
	loadingName = $state<string | null>(null);
	checkProgress = $state.raw<DataCheckProgress | null>(null);
	/** A refused file or a check that could not run, shown until the next action. */
	error = $state<string | null>(null);
	/** After a kept table met another diagram: what the new matching links, and what it lost. */
	rematch = $state.raw<Rematch | null>(null);
	/** The data file's own name (for the report's reproduction commands); null for a pasted matrix. */
	fileName = $state<string | null>(null);
	lastMs = $state(0);
	/** Parts of the shown report still being computed (claims take longest on large tables). */
	pending = $state.raw<readonly DataPart[]>([]);
	/** Parts not computed because the user cancelled the checks (until the next run). */
	cancelled = $state.raw<readonly DataPart[]>([]);

	#runner: DataRunner;
	#diagram: Diagram | null = null;
	#key: string | null = null;
	/** How the table met the diagram before another one came, until the kept table is matched again. */
	#before: { diagram: Diagram; report: DataCheckReport } | null = null;
	#loadingFile: string | null = null;
	#timer: ReturnType<typeof setTimeout> | null = null;

	constructor(createWorker?: () => Worker) {
		this.#runner = new DataRunner(
			{
				loadProgress: (p) => (this.loadProgress = p),
				loaded: (info) => {
					this.info = info;
					this.fileName = this.#loadingFile;
					this.summary = null;
					this.#forgetRematch();
					this.loadProgress = null;
					this.loadingName = null;
					this.error = null;
					this.report = null;
					this.status = 'checking';
					this.#run();
				},
				loadFailed: (e) => {
					this.loadProgress = null;
					this.error = `${this.loadingName ?? 'The file'} was not loaded — ${describeTableError(e)}`;
					this.loadingName = null;
					this.status = this.hasData ? 'ready' : 'empty';
				},
				checkProgress: (p) => (this.checkProgress = p),
				partial: (r, pending) => {
					this.report = r;
					this.reportKey = this.#key;
					this.pending = pending;
				},
				report: (r, ms) => {
					this.pending = [];
					this.report = r;
					this.reportKey = this.#key;
					this.#settleRematch(r);
					this.checkProgress = null;
					this.lastMs = ms;
					if (this.status === 'checking') this.status = 'ready';
				},
				checkFailed: (message) => this.#failed(message),
				checkCancelled: () => {
					const parts: DataPart[] = this.report ? [...this.pending] : ['arrows', 'estimates', 'claims'];
					this.cancelled = parts;
					this.pending = [];
					this.checkProgress = null;
					this.error = `The data checks were cancelled${parts.length ? `; ${describeParts(parts)} ${parts.length === 1 ? 'was' : 'were'} not run` : ''}. They run again when the diagram changes.`;
					this.status = this.hasData ? 'ready' : 'empty';
				}
			},
			createWorker
		);
	}

	get hasData(): boolean {
		return this.info !== null || this.summary !== null;
	}

	get sourceName(): string | null {
		return this.info?.name ?? this.summary?.name ?? null;
	}

	load(source: DataSource): void {
		this.error = null;
		this.loadingName = source.kind === 'file' ? source.file.name : source.name;
		this.#loadingFile = source.kind === 'file' ? source.file.name : decodeURIComponent(source.url.replace(/[?#].*$/, '').replace(/^.*\//, ''));
		this.loadProgress = { characters: 0, rows: 0, fraction: 0 };
		this.status = 'loading';
		this.#runner.load(source);
	}

	/** Stops the running checks at the next check; the parts already shown stay. */
	cancelChecks(): void {
		this.#runner.cancelCheck();
	}

	cancelLoad(): void {
		if (this.#runner.cancelLoad()) {
			this.error = `Reading ${this.loadingName ?? 'the file'} was cancelled; ${this.hasData ? 'the data loaded before are still in use' : 'no data are loaded'}.`;
			this.loadProgress = null;
			this.loadingName = null;
			this.status = this.hasData ? 'ready' : 'empty';
		}
	}

	/** A correlation or covariance matrix (text form in docs/data.md); checked on the page (it is small). */
	async loadSummary(name: string, text: string): Promise<void> {
		this.error = null;
		let stats: SummaryStatistics;
		try {
			summaryModule ??= await import('../../datacheck/summary');
			stats = summaryModule.parseSummaryMatrix(text);
		} catch (e) {
			this.error = `${name} was not loaded — ${e instanceof Error ? e.message : String(e)}`;
			return;
		}
		this.#runner.clear();
		this.info = null;
		this.fileName = null;
		this.summary = { name, stats };
		this.#forgetRematch();
		this.report = null;
		this.status = 'checking';
		this.#run();
	}

	clear(): void {
		this.#runner.clear();
		this.info = null;
		this.fileName = null;
		this.summary = null;
		this.report = null;
		this.reportKey = null;
		this.#forgetRematch();
		this.error = null;
		this.pending = [];
		this.cancelled = [];
		this.status = 'empty';
	}

	/**
	 * Another diagram is about to replace `current` and the user keeps the data: remember how
	 * the table met the current diagram, so the next report can say what changed.
	 */
	keepFor(current: Diagram): void {
		this.rematch = null;
		this.#before = this.report ? { diagram: current, report: this.report } : null;
	}

	dismissRematch(): void {
		this.rematch = null;
	}

	/** The diagram changed: re-check after a short pause (edits come in bursts). */
	follow(d: Diagram): void {
		this.#diagram = d;
		const key = dataKey(d);
		if (key === this.#key) return;
		this.#key = key;
		if (this.hasData) this.#schedule(250);
	}

	dispose(): void {
		if (this.#timer) clearTimeout(this.#timer);
		this.#runner.dispose();
	}

	#forgetRematch(): void {
		this.rematch = null;
		this.#before = null;
	}

	#settleRematch(r: DataCheckReport): void {
		if (!this.#before || !this.#diagram) return;
		this.rematch = rematchDifferences(this.#before.diagram, this.#before.report, this.#diagram, r, this.sourceName ?? 'the data');
		this.#before = null;
	}

	#schedule(ms: number): void {
		if (this.#timer) clearTimeout(this.#timer);
		this.#timer = setTimeout(() => {
			this.#timer = null;
			this.#run();
		}, ms);
	}

	#failed(message: string): void {
		this.error = `The data checks could not run — ${message}`;
		this.pending = [];
		this.checkProgress = null;
		this.status = this.hasData ? 'ready' : 'empty';
	}

	#run(): void {
		const d = this.#diagram;
		if (!d || !this.hasData) return;
		this.#key = dataKey(d);
		if (this.summary && summaryModule) {
			try {
				this.report = summaryModule.runSummaryChecks(d, this.summary.stats, { settingProblems: 'note' });
				this.reportKey = this.#key;
				this.#settleRematch(this.report);
				this.error = null;
				this.status = 'ready';
			} catch (e) {
				this.#failed(e instanceof Error ? e.message : String(e));
			}
			return;
		}
		if (this.status !== 'loading') this.status = 'checking';
		this.error = null;
		this.cancelled = [];
		this.checkProgress = { stage: 'arrows', fraction: 0 };
		this.#runner.check({ diagram: d });
	}
}
