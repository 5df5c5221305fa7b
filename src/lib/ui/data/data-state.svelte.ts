/**
 * The Data section's state: the loaded table (its description; the rows stay in the data
 * worker) or summary matrix, the user's column mapping and kinds, the latest report and the
 * diagram it belongs to, load/check progress and messages. A bad file, a refused column kind
 * or a cancel leaves the earlier data, choices and report in place.
 */
import type { Diagram } from '../../graph/diagram';
import type { ColumnKind, ParseProgress, SummaryStatistics, TableError } from '../../stats';
import { parseSummaryMatrix, runSummaryChecks, type DataCheckProgress, type DataCheckReport, type TableInfo } from '../../datacheck';
import { DataRunner } from '../../workers/data-client';
import type { DataPart, DataSource } from '../../workers/data-protocol';
import { structureKey } from '../../workers/analysis-steps';

export type DataStatus = 'empty' | 'loading' | 'checking' | 'ready';

/** What the checks depend on in the diagram: structure, labels (name matching) and the question. */
export function dataKey(d: Diagram): string {
	return JSON.stringify([structureKey(d), d.variables.map((v) => v.label), d.exposures, d.outcomes, d.adjusted]);
}

export function describeTableError(e: TableError): string {
	return e.message;
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
	/** A refused file or choice, shown until the next action. */
	error = $state<string | null>(null);
	mapping = $state.raw<Record<string, string | null>>({});
	types = $state.raw<Record<string, ColumnKind>>({});
	lastMs = $state(0);
	/** Parts of the shown report still being computed (claims take longest on large tables). */
	pending = $state.raw<readonly DataPart[]>([]);

	#runner: DataRunner;
	#diagram: Diagram | null = null;
	#key: string | null = null;
	#good: { mapping: Record<string, string | null>; types: Record<string, ColumnKind> } = { mapping: {}, types: {} };
	#timer: ReturnType<typeof setTimeout> | null = null;

	constructor(createWorker?: () => Worker) {
		this.#runner = new DataRunner(
			{
				loadProgress: (p) => (this.loadProgress = p),
				loaded: (info) => {
					this.info = info;
					this.summary = null;
					this.mapping = {};
					this.types = {};
					this.#good = { mapping: {}, types: {} };
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
					this.#good = { mapping: this.mapping, types: this.types };
					this.checkProgress = null;
					this.lastMs = ms;
					if (this.status === 'checking') this.status = 'ready';
				},
				checkFailed: (message) => this.#refused(message)
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
		this.loadProgress = { characters: 0, rows: 0, fraction: 0 };
		this.status = 'loading';
		this.#runner.load(source);
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
	loadSummary(name: string, text: string): void {
		this.error = null;
		let stats: SummaryStatistics;
		try {
			stats = parseSummaryMatrix(text);
		} catch (e) {
			this.error = `${name} was not loaded — ${e instanceof Error ? e.message : String(e)}`;
			return;
		}
		this.#runner.clear();
		this.info = null;
		this.summary = { name, stats };
		this.mapping = {};
		this.types = {};
		this.#good = { mapping: {}, types: {} };
		this.report = null;
		this.status = 'checking';
		this.#run();
	}

	clear(): void {
		this.#runner.clear();
		this.info = null;
		this.summary = null;
		this.report = null;
		this.reportKey = null;
		this.mapping = {};
		this.types = {};
		this.error = null;
		this.status = 'empty';
	}

	/** Link a variable to a column (null: no data for it; undefined: back to matching by name). */
	setMapping(variableId: string, column: string | null | undefined): void {
		const next = { ...this.mapping };
		if (column === undefined) delete next[variableId];
		else next[variableId] = column;
		this.mapping = next;
		this.error = null;
		this.#schedule(0);
	}

	setType(column: string, kind: ColumnKind | undefined): void {
		const next = { ...this.types };
		if (kind === undefined) delete next[column];
		else next[column] = kind;
		this.types = next;
		this.error = null;
		this.#schedule(0);
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

	#schedule(ms: number): void {
		if (this.#timer) clearTimeout(this.#timer);
		this.#timer = setTimeout(() => {
			this.#timer = null;
			this.#run();
		}, ms);
	}

	#refused(message: string): void {
		this.error = `Not applied — ${message}`;
		this.pending = [];
		this.mapping = this.#good.mapping;
		this.types = this.#good.types;
		this.checkProgress = null;
		this.status = this.hasData ? 'ready' : 'empty';
	}

	/** The user's links that still apply: variables deleted or marked unmeasured since are dropped. */
	#mappingFor(d: Diagram): Record<string, string | null> {
		const measured = new Set(d.variables.filter((v) => v.measured).map((v) => v.id));
		const kept = Object.fromEntries(Object.entries(this.mapping).filter(([id]) => measured.has(id)));
		if (Object.keys(kept).length !== Object.keys(this.mapping).length) this.mapping = kept;
		return kept;
	}

	#run(): void {
		const d = this.#diagram;
		if (!d || !this.hasData) return;
		this.#key = dataKey(d);
		const mapping = this.#mappingFor(d);
		if (this.summary) {
			try {
				this.report = runSummaryChecks(d, this.summary.stats, { mapping });
				this.reportKey = this.#key;
				this.#good = { mapping: this.mapping, types: this.types };
				this.status = 'ready';
			} catch (e) {
				this.#refused(e instanceof Error ? e.message : String(e));
			}
			return;
		}
		if (this.status !== 'loading') this.status = 'checking';
		this.checkProgress = { stage: 'arrows', fraction: 0 };
		this.#runner.check({ diagram: d, mapping: { ...mapping }, types: { ...this.types } });
	}
}
