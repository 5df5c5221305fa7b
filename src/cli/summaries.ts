/**
 * One line per command for `causeway --help`. The commands beyond the core ones are loaded only
 * when called (main.ts, esbuild code splitting), so their summaries live here, where the help
 * can print them without loading the commands' code; each command module takes its own line
 * from this table.
 */
export const SUMMARY = {
	test: "check the diagram's arrows and implied independencies against data",
	estimate: 'crude vs adjusted estimates of the effect, for each sufficient set and the planned set',
	export: 'export the figure, tables or the protocol report',
	code: 'analysis code (R, Stata, SAS, Python) for an adjustment set, from the diagram and the data settings',
	review: 'review a stated adjustment set: verdict, reasons, fixes (exit 1 when not sufficient)',
	robust: 'stress-test the planned set against single changes to the diagram (exit 1 when the set is not sufficient to begin with)',
	diff: 'compare two diagrams: variables, arrows, minimal sets and the verdict on the planned set',
	instruments: 'list conditional instruments for the exposure with their conditioning sets'
} as const;

export type LazyName = keyof typeof SUMMARY;
