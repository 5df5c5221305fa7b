/** Result shapes shared by the association, conditional-independence and regression modules. */

/** An effect size, with a 95 % confidence interval when one is computed. */
export interface EffectSize {
	/** e.g. "odds ratio", "Cramér's V", "Pearson r", "eta squared". */
	name: string;
	value: number;
	ci?: readonly [number, number];
	/** How it was computed when that needs saying (e.g. a zero-cell correction). */
	note?: string;
}

/** One hypothesis test. */
export interface TestResult {
	/** Test name, e.g. "Pearson chi-square test". */
	test: string;
	/** Symbol of the statistic: "X²", "G²", "t", "z", "F", "H", "r" or "" for exact tests. */
	statisticName: string;
	statistic: number;
	/** Degrees of freedom: [] for exact tests, [df] or [df1, df2]. */
	df: number[];
	pValue: number;
	/** Rows used (complete cases). */
	n: number;
	/** Effect sizes; the first is the main one. */
	effects: EffectSize[];
	/** Plain-language notes (corrections, approximations, dropped strata). */
	notes: string[];
	/** Published method. */
	reference: string;
}
